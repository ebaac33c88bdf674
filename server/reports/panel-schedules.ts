// A simple schedule of each panel's circuits, read from the sheet's topology: from the panel's bus, through its
// breakers and runs, to each load it feeds (stopping at the next bus). One row per load.
import type { Sheet, SheetElement } from '../../shared/sheet';
import type { SolveResult } from '../../solver';

export interface ScheduleRow {
  circuit: string;
  description: string;
  phases: string;
  load: string;
  powerFactor: string;
  behaviour: string;
  breaker: string;
}

export interface PanelSchedule {
  busId: string;
  name: string;
  rows: ScheduleRow[];
}

const PANEL_ROLES = new Set(['service', 'panel', 'switchboard', 'separately-derived']);

function neighbours(sheet: Sheet): Map<string, { other: string; phases: string[] }[]> {
  const out = new Map<string, { other: string; phases: string[] }[]>();
  const add = (a: string, b: string, phases: string[]) => out.set(a, [...(out.get(a) ?? []), { other: b, phases }]);
  for (const c of Object.values(sheet.connections)) {
    const fromPhases = Object.keys(c.conductorMap).filter((k) => k === 'A' || k === 'B' || k === 'C');
    const toPhases = Object.values(c.conductorMap).filter((k): k is 'A' | 'B' | 'C' => k === 'A' || k === 'B' || k === 'C');
    add(c.from.elementId, c.to.elementId, toPhases);
    add(c.to.elementId, c.from.elementId, fromPhases);
  }
  return out;
}

const fmt = (v: number, digits = 3) => String(Number(v.toPrecision(digits)));

function behaviourOf(load: Extract<SheetElement, { kind: 'load' }>, result?: SolveResult): string {
  const z = load.constantImpedanceFraction;
  const i = load.constantCurrentFraction;
  const p = load.constantPowerFraction;
  if (z !== undefined || i !== undefined || p !== undefined) {
    return [z ? `Z ${fmt(z * 100)}%` : '', i ? `I ${fmt(i * 100)}%` : '', p ? `P ${fmt(p * 100)}%` : ''].filter(Boolean).join(' ') || 'constant impedance';
  }
  const model = result?.loads.find((l) => l.loadId === load.id)?.model;
  return model ? `${model.replace(/-/g, ' ')} (by kind)` : `by kind (${load.loadKind})`;
}

export function panelSchedules(sheet: Sheet, base?: SolveResult): PanelSchedule[] {
  const adj = neighbours(sheet);
  const schedules: PanelSchedule[] = [];
  for (const bus of Object.values(sheet.elements)) {
    if (bus.kind !== 'bus' || !PANEL_ROLES.has(bus.role)) continue;
    const rows: ScheduleRow[] = [];
    const seen = new Set<string>([bus.id]);
    // Walk out of the panel, each path remembering the first breaker it passed.
    const queue: { id: string; breaker?: SheetElement; phases: string[] }[] = (adj.get(bus.id) ?? []).map((n) => ({ id: n.other, phases: n.phases }));
    while (queue.length > 0) {
      const step = queue.shift()!;
      if (seen.has(step.id)) continue;
      seen.add(step.id);
      const e = sheet.elements[step.id];
      if (!e || e.kind === 'bus' || e.kind === 'source' || e.kind === 'transformer' || e.kind === 'electrode') continue;
      if (e.kind === 'load') {
        const amount = e.givenAs === 'amperes' ? `${fmt(e.amperes)} A` : `${fmt(e.phaseKw ? Object.values(e.phaseKw).reduce((a, b) => a + (b ?? 0), 0) : e.kw)} kW`;
        const brk = step.breaker && step.breaker.kind === 'breaker' ? step.breaker : undefined;
        rows.push({
          circuit: brk ? brk.name || brk.id : String(rows.length + 1),
          description: e.name || e.id,
          phases: step.phases.length > 0 ? [...new Set(step.phases)].sort().join('') : e.connection,
          load: amount,
          powerFactor: `${fmt(e.powerFactor, 2)}${e.leading ? ' lead' : ''}`,
          behaviour: behaviourOf(e, base),
          breaker: brk ? `${brk.ratingAmperes ? `${fmt(brk.ratingAmperes)} A` : '—'} ${brk.device}` : '—',
        });
        continue;
      }
      const breaker = step.breaker ?? (e.kind === 'breaker' ? e : undefined);
      for (const n of adj.get(e.id) ?? []) if (!seen.has(n.other)) queue.push({ id: n.other, breaker, phases: n.phases.length > 0 ? n.phases : step.phases });
    }
    if (rows.length > 0) schedules.push({ busId: bus.id, name: bus.name || bus.id, rows });
  }
  return schedules;
}
