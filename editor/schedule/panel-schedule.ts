// A panel's schedule, derived from the sheet and the latest solve: its circuits (the loads on its bars, directly or
// through one breaker each), what each circuit draws from which phase, the phase totals and their imbalance, the
// neutral current the circuits return, and each breaker's loading. Pure: the components only render it.
import type { SolveResult } from '../../solver';
import { loadBehaviour } from '../../solver/network/load';
import {
  terminalConductors,
  type BreakerElement,
  type BusElement,
  type ConductorId,
  type Connection,
  type LoadElement,
  type PhaseId,
  type Sheet,
} from '../../shared/sheet';

export const BEHAVIOURS = ['by-kind', 'impedance', 'current', 'power'] as const;
/** How a circuit's load behaves with voltage: as its kind decides, all one law, or a mix the sheet gives. */
export type BehaviourChoice = (typeof BEHAVIOURS)[number] | 'mix';

export const BEHAVIOUR_LABEL: Record<BehaviourChoice, string> = {
  'by-kind': 'by kind',
  impedance: 'constant impedance',
  current: 'constant current',
  power: 'constant power',
  mix: 'mix',
};

export interface ScheduleBreaker {
  id: string;
  name: string;
  ratingAmperes?: number;
  /** Largest pole current in the case solved. */
  amperes?: number;
  percentOfRating?: number;
}

export interface ScheduleRow {
  loadId: string;
  /** The connection that lands on the load's supply terminal. */
  supplyConnectionId: string;
  /** Where the circuit's phases are chosen: the connection from the bars, and its end away from the bars. */
  phaseConnectionId: string;
  phaseEndId: string;
  /** As written on the load, or its position in the schedule when none is written. */
  circuit: string;
  circuitGiven: boolean;
  description: string;
  /** The panel's phases the circuit takes, in the load's own order. */
  phases: PhaseId[];
  /** The phases it could take on this panel, written "A", "AB" or "ABC". */
  phaseOptions: string[];
  connection: LoadElement['connection'];
  loadKind: LoadElement['loadKind'];
  givenAs: LoadElement['givenAs'];
  kw: number;
  amperesGiven: number;
  powerFactor: number;
  ratedVolts: number;
  /** Connected apparent power from the data entered, kVA. */
  kva: number;
  /** kVA the circuit puts on each of the panel's phases (line-to-line loads split half and half). */
  kvaByPhase: Partial<Record<PhaseId, number>>;
  behaviour: BehaviourChoice;
  behaviourLabel: string;
  breaker: ScheduleBreaker | null;
  /** From the solve: the largest line current of the circuit and the lowest element voltage. */
  solved: { amperes: number; volts: number; kw: number } | null;
}

export interface PhaseTotal {
  kva: number;
  /** Current of the panel's own circuits on this phase bar (phasor sum), from the solve. */
  amperes: number | null;
}

export interface PanelSchedule {
  busId: string;
  name: string;
  phases: PhaseId[];
  hasNeutral: boolean;
  ratingAmperes?: number;
  rows: ScheduleRow[];
  totals: Partial<Record<PhaseId, PhaseTotal>>;
  totalKva: number;
  /** Largest departure of a phase's connected kVA from the phases' average, percent of the average. */
  imbalancePercent: number | null;
  /** The same from the solved phase currents. */
  solvedImbalancePercent: number | null;
  /** Phasor sum of the currents the line-to-neutral circuits return to the neutral bar, from the solve. */
  neutralAmperes: number | null;
  /** The neutral current in the feeder that lands on the bars, when exactly one run does. */
  feederNeutral: { runName: string; amperes: number } | null;
  /** Circuits that could not be read (a phase that the panel lacks). */
  notes: string[];
}

const PHASES: PhaseId[] = ['A', 'B', 'C'];
const isPhase = (c: string): c is PhaseId => c === 'A' || c === 'B' || c === 'C';

/** The other end of a connection that has one end on (elementId, terminal); null when it has neither. */
function otherEnd(c: Connection, elementId: string, terminal: string) {
  if (c.from.elementId === elementId && c.from.terminal === terminal) return { end: c.to, ownToOther: c.conductorMap as Record<string, string> };
  if (c.to.elementId === elementId && c.to.terminal === terminal) {
    const inverse: Record<string, string> = {};
    for (const [f, t] of Object.entries(c.conductorMap)) inverse[t!] = f;
    return { end: c.from, ownToOther: inverse };
  }
  return null;
}

interface Feed {
  load: LoadElement;
  supplyConnectionId: string;
  phaseConnectionId: string;
  phaseEndId: string;
  /** Load conductor → the panel's conductor. */
  toBus: Partial<Record<ConductorId, ConductorId>>;
  breaker: BreakerElement | null;
}

/** Loads on the bus's bars directly, or through a breaker whose load terminal feeds only that load. */
export function panelFeeds(sheet: Sheet, busId: string): Feed[] {
  const feeds: Feed[] = [];
  const connections = Object.values(sheet.connections);
  for (const c of connections) {
    const o = otherEnd(c, busId, 'bars');
    if (!o) continue;
    const target = sheet.elements[o.end.elementId];
    if (!target) continue;
    if (target.kind === 'load' && o.end.terminal === 'supply') {
      const toBus: Partial<Record<ConductorId, ConductorId>> = {};
      for (const [busC, loadC] of Object.entries(o.ownToOther)) toBus[loadC as ConductorId] = busC as ConductorId;
      feeds.push({ load: target, supplyConnectionId: c.id, phaseConnectionId: c.id, phaseEndId: target.id, toBus, breaker: null });
    } else if (target.kind === 'breaker' && o.end.terminal === 'line') {
      const downstream = connections.flatMap((d) => {
        const od = otherEnd(d, target.id, 'load');
        return od ? [{ d, od }] : [];
      });
      if (downstream.length !== 1) continue;
      const { d, od } = downstream[0];
      const load = sheet.elements[od.end.elementId];
      if (load?.kind !== 'load' || od.end.terminal !== 'supply') continue;
      // bus → breaker line (o.ownToOther), breaker passes each conductor through, breaker load → load (od.ownToOther).
      const toBus: Partial<Record<ConductorId, ConductorId>> = {};
      for (const [busC, brkC] of Object.entries(o.ownToOther)) {
        const loadC = od.ownToOther[brkC];
        if (loadC) toBus[loadC as ConductorId] = busC as ConductorId;
      }
      feeds.push({ load, supplyConnectionId: d.id, phaseConnectionId: c.id, phaseEndId: target.id, toBus, breaker: target });
    }
  }
  return feeds;
}

function behaviourOf(load: LoadElement): BehaviourChoice {
  const given = [load.constantImpedanceFraction, load.constantCurrentFraction, load.constantPowerFraction];
  if (given.every((f) => f === undefined)) return 'by-kind';
  const b = loadBehaviour(load);
  if (b.impedance === 1) return 'impedance';
  if (b.current === 1) return 'current';
  if (b.power === 1) return 'power';
  return 'mix';
}

function behaviourLabel(load: LoadElement, choice: BehaviourChoice): string {
  const b = loadBehaviour(load);
  const pct = (f: number) => Math.round(f * 100);
  const mix = [b.impedance && `Z ${pct(b.impedance)} %`, b.current && `I ${pct(b.current)} %`, b.power && `P ${pct(b.power)} %`].filter(Boolean).join(', ');
  if (choice === 'mix') return mix;
  if (choice === 'by-kind') return `by kind (${mix})`;
  return BEHAVIOUR_LABEL[choice];
}

/** Connected kVA from the data entered (kW over power factor, or amperes times volts). */
export function connectedKva(load: LoadElement): number {
  const threePhase = load.connection === 'three-phase-wye' || load.connection === 'three-phase-delta';
  if (load.givenAs === 'amperes') return (load.amperes * load.ratedVolts * (threePhase ? Math.sqrt(3) : 1)) / 1000;
  if (threePhase && load.phaseKw) {
    return PHASES.reduce((sum, p) => sum + (load.phaseKw?.[p] ?? 0) / (load.phasePowerFactor?.[p] ?? load.powerFactor), 0);
  }
  return load.kw / load.powerFactor;
}

/** The kVA each load conductor pair puts on the load's own phases A, B, C (before mapping onto the panel). */
function kvaOnLoadPhases(load: LoadElement): Partial<Record<PhaseId, number>> {
  const total = connectedKva(load);
  switch (load.connection) {
    case 'line-to-neutral':
      return { A: total };
    case 'line-to-line':
      return { A: total / 2, B: total / 2 };
    case 'three-phase-wye': {
      if (load.givenAs === 'kw' && load.phaseKw) {
        const out: Partial<Record<PhaseId, number>> = {};
        for (const p of PHASES) out[p] = (load.phaseKw[p] ?? 0) / (load.phasePowerFactor?.[p] ?? load.powerFactor);
        return out;
      }
      return { A: total / 3, B: total / 3, C: total / 3 };
    }
    case 'three-phase-delta': {
      if (load.givenAs === 'kw' && load.phaseKw) {
        // Delta elements A–B, B–C, C–A: half of each on either phase.
        const e = (p: PhaseId) => (load.phaseKw![p] ?? 0) / (load.phasePowerFactor?.[p] ?? load.powerFactor);
        return { A: (e('A') + e('C')) / 2, B: (e('A') + e('B')) / 2, C: (e('B') + e('C')) / 2 };
      }
      return { A: total / 3, B: total / 3, C: total / 3 };
    }
  }
}

/** Largest departure from the average, percent of the average (common practice for phase loading, no source). */
export function imbalancePercent(values: number[]): number | null {
  if (values.length < 2) return null;
  const mean = values.reduce((a, b) => a + b, 0) / values.length;
  if (!(mean > 0)) return null;
  return (100 * Math.max(...values.map((v) => Math.abs(v - mean)))) / mean;
}

const PAIRS: [PhaseId, PhaseId][] = [
  ['A', 'B'],
  ['B', 'C'],
  ['C', 'A'],
];

/** The phases (or pairs) a circuit of this connection can take on a panel with these phase bars. */
export function phaseOptionsFor(connection: LoadElement['connection'], busPhases: readonly PhaseId[]): string[] {
  if (connection === 'line-to-neutral') return [...busPhases];
  if (connection === 'line-to-line') return PAIRS.filter(([a, b]) => busPhases.includes(a) && busPhases.includes(b)).map((p) => p.join(''));
  return busPhases.length === 3 ? ['ABC'] : [];
}

/** Natural order for circuit labels: "2" before "10", "2,4" by its first number. */
function circuitOrder(a: string, b: string): number {
  return a.localeCompare(b, undefined, { numeric: true });
}

interface Phasor {
  re: number;
  im: number;
}

/** A load element's current phasor from its solved voltage and power: I = conj(S / V). */
function elementCurrent(e: { volts: number; angleDeg: number; kw: number; kvar: number }): Phasor {
  if (!(e.volts > 0)) return { re: 0, im: 0 };
  const theta = (e.angleDeg * Math.PI) / 180;
  const vRe = e.volts * Math.cos(theta);
  const vIm = e.volts * Math.sin(theta);
  const sRe = e.kw * 1000;
  const sIm = e.kvar * 1000;
  // S / V, then conjugate.
  const d = vRe * vRe + vIm * vIm;
  const qRe = (sRe * vRe + sIm * vIm) / d;
  const qIm = (sIm * vRe - sRe * vIm) / d;
  return { re: qRe, im: -qIm };
}

export function panelSchedule(sheet: Sheet, busId: string, result: SolveResult | null): PanelSchedule | null {
  const bus = sheet.elements[busId];
  if (bus?.kind !== 'bus') return null;
  const bars = terminalConductors(bus, 'bars') ?? [];
  const phases = PHASES.filter((p) => bars.includes(p));
  const notes: string[] = [];
  const loadResults = new Map((result?.loads ?? []).map((l) => [l.loadId, l]));
  const breakerResults = new Map((result?.breakers ?? []).map((b) => [b.breakerId, b]));

  const phaseCurrents: Record<string, Phasor> = { A: { re: 0, im: 0 }, B: { re: 0, im: 0 }, C: { re: 0, im: 0 }, N: { re: 0, im: 0 } };
  const add = (c: string, i: Phasor, sign: number) => {
    const at = phaseCurrents[c];
    if (!at) return;
    at.re += sign * i.re;
    at.im += sign * i.im;
  };

  const feeds = panelFeeds(sheet, busId);
  const rows: ScheduleRow[] = feeds.map((f) => {
    const load = f.load;
    const own = kvaOnLoadPhases(load);
    const kvaByPhase: Partial<Record<PhaseId, number>> = {};
    const loadPhases = PHASES.filter((p) => f.toBus[p] !== undefined);
    const busPhases: PhaseId[] = [];
    for (const p of loadPhases) {
      const onBus = f.toBus[p]!;
      if (!isPhase(onBus)) continue;
      busPhases.push(onBus);
      kvaByPhase[onBus] = (kvaByPhase[onBus] ?? 0) + (own[p] ?? 0);
    }
    const solvedLoad = loadResults.get(load.id);
    let solved: ScheduleRow['solved'] = null;
    if (solvedLoad && solvedLoad.elements.length) {
      // Line currents of the circuit, by the load's own conductors (a delta load's line current is the difference
      // of two element currents, Kirchhoff at its terminal).
      const line: Record<string, Phasor> = { A: { re: 0, im: 0 }, B: { re: 0, im: 0 }, C: { re: 0, im: 0 } };
      for (const e of solvedLoad.elements) {
        // Labels name the load's own conductors, "A–N" or "A–B"; the current enters at the first, leaves at the second.
        const [p, q] = e.label.split('–') as [ConductorId, ConductorId];
        const i = elementCurrent(e);
        for (const [c, sign] of [[p, 1], [q, -1]] as const) {
          if (line[c]) {
            line[c].re += sign * i.re;
            line[c].im += sign * i.im;
          }
          const onBus = f.toBus[c];
          if (onBus) add(onBus, i, sign);
        }
      }
      solved = {
        amperes: Math.max(...Object.values(line).map((i) => Math.hypot(i.re, i.im))),
        volts: Math.min(...solvedLoad.elements.map((e) => e.volts)),
        kw: solvedLoad.kw,
      };
    }
    const b = f.breaker;
    const br = b ? breakerResults.get(b.id) : undefined;
    const breaker: ScheduleBreaker | null = b
      ? {
          id: b.id,
          name: b.name || b.id,
          ...(b.ratingAmperes !== undefined ? { ratingAmperes: b.ratingAmperes } : {}),
          ...(br ? { amperes: Math.max(0, ...Object.values(br.poles).map((p) => p!.amperes)) } : {}),
          ...(br?.percentOfRating !== undefined ? { percentOfRating: br.percentOfRating } : {}),
        }
      : null;
    const behaviour = behaviourOf(load);
    if (busPhases.length !== loadPhases.length) notes.push(`${load.name || load.id} lands on a conductor that is not a phase of ${bus.name || bus.id}`);
    return {
      loadId: load.id,
      supplyConnectionId: f.supplyConnectionId,
      phaseConnectionId: f.phaseConnectionId,
      phaseEndId: f.phaseEndId,
      circuit: load.circuit ?? '',
      circuitGiven: load.circuit !== undefined && load.circuit !== '',
      description: load.name || load.id,
      phases: busPhases,
      phaseOptions: phaseOptionsFor(load.connection, phases),
      connection: load.connection,
      loadKind: load.loadKind,
      givenAs: load.givenAs,
      kw: load.kw,
      amperesGiven: load.amperes,
      powerFactor: load.powerFactor,
      ratedVolts: load.ratedVolts,
      kva: connectedKva(load),
      kvaByPhase,
      behaviour,
      behaviourLabel: behaviourLabel(load, behaviour),
      breaker,
      solved,
    };
  });

  // Written circuits first in natural order, then the rest by their place on the drawing (left to right).
  const position = new Map(feeds.map((f) => [f.load.id, f.load.x * 1e6 + f.load.y]));
  rows.sort((a, b) => {
    if (a.circuitGiven !== b.circuitGiven) return a.circuitGiven ? -1 : 1;
    if (a.circuitGiven) return circuitOrder(a.circuit, b.circuit) || a.description.localeCompare(b.description);
    return position.get(a.loadId)! - position.get(b.loadId)! || a.description.localeCompare(b.description);
  });
  let n = 0;
  const used = new Set(rows.filter((r) => r.circuitGiven).map((r) => r.circuit));
  for (const r of rows) {
    if (r.circuitGiven) continue;
    do n++;
    while (used.has(String(n)));
    r.circuit = String(n);
  }

  const solvedAny = rows.some((r) => r.solved);
  const totals: Partial<Record<PhaseId, PhaseTotal>> = {};
  for (const p of phases) {
    const kva = rows.reduce((s, r) => s + (r.kvaByPhase[p] ?? 0), 0);
    totals[p] = { kva, amperes: solvedAny ? Math.hypot(phaseCurrents[p].re, phaseCurrents[p].im) : null };
  }
  const neutral = phaseCurrents.N;

  let feederNeutral: PanelSchedule['feederNeutral'] = null;
  const runsOnBars = Object.values(sheet.connections)
    .map((c) => otherEnd(c, busId, 'bars'))
    .filter((o) => o && sheet.elements[o.end.elementId]?.kind === 'run' && Object.values(o.ownToOther).includes('N'));
  if (runsOnBars.length === 1 && result) {
    const runId = runsOnBars[0]!.end.elementId;
    const rr = result.runs.find((r) => r.runId === runId);
    const n = rr?.conductors.N;
    if (rr && n) feederNeutral = { runName: rr.name || runId, amperes: n.current.magnitude };
  }

  return {
    busId,
    name: bus.name || bus.id,
    phases,
    hasNeutral: bars.includes('N'),
    ...((bus as BusElement).ratingAmperes !== undefined ? { ratingAmperes: bus.ratingAmperes } : {}),
    rows,
    totals,
    totalKva: rows.reduce((s, r) => s + r.kva, 0),
    imbalancePercent: imbalancePercent(phases.map((p) => totals[p]!.kva)),
    solvedImbalancePercent: solvedAny ? imbalancePercent(phases.map((p) => totals[p]!.amperes ?? 0)) : null,
    neutralAmperes: solvedAny && bars.includes('N') ? Math.hypot(neutral.re, neutral.im) : null,
    feederNeutral,
    notes,
  };
}
