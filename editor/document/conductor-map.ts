// Which conductor lands on which when a person connects two terminals: the same conductors by name, except a
// line-to-neutral or line-to-line load (or any two-conductor end) landing on a bus with more phases, which takes
// the phase (or pair) of that bus with the fewest such loads already on it, so loads spread over the phases.
import {
  terminalConductors,
  type ConductorId,
  type Connection,
  type PhaseId,
  type Sheet,
  type SheetElement,
} from '../../shared/sheet';

export interface End {
  element: SheetElement;
  terminal: string;
}

export type MapProposal = { ok: true; conductorMap: Partial<Record<ConductorId, ConductorId>> } | { ok: false; message: string };

const PHASES: PhaseId[] = ['A', 'B', 'C'];
const PAIRS: [PhaseId, PhaseId][] = [
  ['A', 'B'],
  ['B', 'C'],
  ['C', 'A'],
];

const label = (e: SheetElement) => e.name || e.id;

/** How many existing connections take each phase of the bus's bars to a one- or two-phase end. */
function phaseUse(sheet: Sheet, busId: string): Record<PhaseId, number> {
  const use: Record<PhaseId, number> = { A: 0, B: 0, C: 0 };
  for (const c of Object.values(sheet.connections)) {
    const fromBus = c.from.elementId === busId;
    const toBus = c.to.elementId === busId;
    if (!fromBus && !toBus) continue;
    const busSide = fromBus ? Object.keys(c.conductorMap) : Object.values(c.conductorMap);
    const phases = busSide.filter((k): k is PhaseId => PHASES.includes(k as PhaseId));
    if (phases.length === 0 || phases.length === 3) continue;
    for (const p of phases) use[p]++;
  }
  return use;
}

/** A load-like end: two conductors, at most two of them phases (A–N, A–B, single-phase A–N). */
function isBranchEnd(set: ConductorId[]): boolean {
  return set.length === 2 && set.every((c) => c === 'A' || c === 'B' || c === 'N');
}

export function proposeConductorMap(sheet: Sheet, from: End, to: End): MapProposal {
  if (from.element.id === to.element.id) return { ok: false, message: 'A connection needs two different elements' };
  const fromSet = terminalConductors(from.element, from.terminal);
  const toSet = terminalConductors(to.element, to.terminal);
  if (!fromSet) return { ok: false, message: `${label(from.element)} has no terminal '${from.terminal}'` };
  if (!toSet) return { ok: false, message: `${label(to.element)} has no terminal '${to.terminal}'` };

  // A branch (two conductors) onto a bus with more phases: choose the least-used phase or pair.
  for (const [branch, bus, branchIsFrom] of [
    [fromSet, toSet, true],
    [toSet, fromSet, false],
  ] as const) {
    const busEnd = branchIsFrom ? to : from;
    const busPhases = PHASES.filter((p) => bus.includes(p));
    if (!isBranchEnd(branch) || busEnd.element.kind !== 'bus' || busPhases.length < 2) continue;
    const use = phaseUse(sheet, busEnd.element.id);
    let pairing: [ConductorId, ConductorId][];
    if (branch.includes('N')) {
      if (!bus.includes('N')) return { ok: false, message: `${label(busEnd.element)} has no neutral bar for a line-to-neutral load` };
      const phase = [...busPhases].sort((a, b) => use[a] - use[b] || a.localeCompare(b))[0];
      pairing = [
        ['A', phase],
        ['N', 'N'],
      ];
    } else {
      const pairs = PAIRS.filter(([p, q]) => busPhases.includes(p) && busPhases.includes(q));
      const [p, q] = [...pairs].sort((x, y) => use[x[0]] + use[x[1]] - (use[y[0]] + use[y[1]]))[0];
      pairing = [
        ['A', p],
        ['B', q],
      ];
    }
    const map: Partial<Record<ConductorId, ConductorId>> = {};
    for (const [branchConductor, busConductor] of pairing) {
      if (branchIsFrom) map[branchConductor] = busConductor;
      else map[busConductor] = branchConductor;
    }
    return { ok: true, conductorMap: map };
  }

  const map: Partial<Record<ConductorId, ConductorId>> = {};
  for (const c of fromSet) if (toSet.includes(c)) map[c] = c;
  // A grounding electrode lands on the neutral where there is no ground bar (a service without one).
  if (Object.keys(map).length === 0 && fromSet.length === 1 && fromSet[0] === 'PE' && toSet.includes('N')) map.PE = 'N';
  if (Object.keys(map).length === 0 && toSet.length === 1 && toSet[0] === 'PE' && fromSet.includes('N')) map.N = 'PE';
  if (Object.keys(map).length === 0) {
    return {
      ok: false,
      message: `${label(from.element)} (${fromSet.join(', ')}) and ${label(to.element)} (${toSet.join(', ')}) share no conductor`,
    };
  }
  return { ok: true, conductorMap: map };
}

/** The bus phases a load's supply connection takes, in the load's own order (A then B), or undefined. */
export function loadPhases(connection: Connection, loadId: string): PhaseId[] | undefined {
  const entries = Object.entries(connection.conductorMap) as [ConductorId, ConductorId][];
  const loadIsTo = connection.to.elementId === loadId;
  const pairs = entries.map(([f, t]) => (loadIsTo ? { load: t, bus: f } : { load: f, bus: t }));
  const order: ConductorId[] = ['A', 'B', 'C'];
  const phases = pairs
    .filter((p) => order.includes(p.load))
    .sort((a, b) => order.indexOf(a.load) - order.indexOf(b.load))
    .map((p) => p.bus);
  return phases.every((p): p is PhaseId => PHASES.includes(p as PhaseId)) ? (phases as PhaseId[]) : undefined;
}

/** The conductor map that feeds the load from the given bus phases, keeping its neutral and ground. */
export function withLoadPhases(connection: Connection, loadId: string, phases: readonly PhaseId[]): Partial<Record<ConductorId, ConductorId>> {
  const loadIsTo = connection.to.elementId === loadId;
  const pairs: [ConductorId, ConductorId][] = [];
  for (const [f, t] of Object.entries(connection.conductorMap) as [ConductorId, ConductorId][]) {
    const loadSide = loadIsTo ? t : f;
    if (loadSide === 'N' || loadSide === 'PE') pairs.push([f, t]);
  }
  const loadConductors: ConductorId[] = ['A', 'B', 'C'];
  phases.forEach((phase, i) => pairs.push(loadIsTo ? [phase, loadConductors[i]] : [loadConductors[i], phase]));
  return Object.fromEntries(pairs) as Partial<Record<ConductorId, ConductorId>>;
}
