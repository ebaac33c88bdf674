// The fault study: every bus against every fault type on one factorization, each breaker's and bus's interrupting
// rating against the largest fault current at its location, failures first, and the available fault current of
// each service for its field marking (NEC 110.24).
import type { Sheet, ShuntFaultType } from '../../shared/sheet';
import { SHUNT_FAULT_TYPES } from '../../shared/sheet';
import { pinKey } from '../network/types';
import type { SolveFailure } from '../solve/solve-network';
import type { FaultOptions } from './fault-types';
import { peakFactor } from './peak-factor';
import { clearFaultCaches } from './compensation';
import { faultCase, FAULT_ASSUMPTIONS, motorAssumption, prepareFaults, TRANSFORMER_IMPEDANCE_TOLERANCE } from './solve-fault';

export interface FaultStudyOptions extends FaultOptions {
  faultTypes?: readonly ShuntFaultType[];
  /** Called after each bus with the buses done and the total. */
  onProgress?: (done: number, total: number) => void;
  /** Polled between buses; true stops the study (the result says it was cancelled). */
  shouldCancel?: () => boolean;
}

export interface FaultStudyCase {
  busId: string;
  faultType: ShuntFaultType;
  symmetricalKa?: number;
  peakKa?: number;
  xOverR?: number;
  /** Why the case has no figures (the bus lacks the conductors, or nothing limits the current). */
  problem?: string;
}

export type DutyStatus = 'fails' | 'passes-x-over-r-above-test' | 'passes';

export interface DutyCheck {
  elementId: string;
  elementKind: 'breaker' | 'bus';
  locationBusId: string;
  interruptingKa: number;
  /** The largest symmetrical fault current at the location over every fault type, kA. */
  dutyKa: number;
  faultType: ShuntFaultType;
  xOverR: number;
  /** The X/R of the rating's test circuit (UL 489 test power factor by rating, recalled). */
  testXOverR: number;
  /** The duty scaled by κ(X/R) / κ(test X/R) when the fault's X/R exceeds the test's, kA. */
  adjustedDutyKa: number;
  status: DutyStatus;
  /** 100 × (rating − adjusted duty) / rating. */
  marginPercent: number;
}

export interface ServiceMarking {
  busId: string;
  /** Maximum available fault current at the service, kA symmetrical, for the field marking of NEC 110.24. */
  availableFaultKa: number;
  faultType: ShuntFaultType;
  xOverR: number;
}

export interface FaultStudyResult {
  cases: FaultStudyCase[];
  /** Failures first, then the passes with an X/R above the test's, then the rest; each by margin. */
  duties: DutyCheck[];
  /** Breakers whose line side lands on no bus (not checked). */
  unlocated: string[];
  serviceMarkings: ServiceMarking[];
  cancelled: boolean;
  assumptions: string[];
}

/** UL 489 test power factors (recalled): up to 10 kA 50 %, over 10 to 20 kA 30 %, above 20 kA 20 %. */
export function testXOverR(interruptingKa: number): number {
  const pf = interruptingKa <= 10 ? 0.5 : interruptingKa <= 20 ? 0.3 : 0.2;
  return Math.sqrt(1 - pf * pf) / pf;
}

export function faultStudy(sheet: Sheet, options: FaultStudyOptions = {}): { ok: true; study: FaultStudyResult } | { ok: false; error: SolveFailure } {
  const prepared = prepareFaults(sheet, undefined, options);
  if (!prepared.ok) return prepared;
  const { fs, sheet: duty } = prepared.prepared;
  const types = options.faultTypes ?? SHUNT_FAULT_TYPES;
  const buses = Object.values(duty.elements).filter((e) => e.kind === 'bus');
  const cases: FaultStudyCase[] = [];
  const worstAt = new Map<string, FaultStudyCase>();
  let cancelled = false;
  buses.forEach((bus, k) => {
    if (cancelled) return;
    if (options.shouldCancel?.()) {
      cancelled = true;
      return;
    }
    for (const faultType of types) {
      const c = faultCase(fs, { busId: bus.id, faultType });
      const row: FaultStudyCase = c.ok
        ? { busId: bus.id, faultType, symmetricalKa: c.summary.symmetricalKa, peakKa: c.summary.peakKa, xOverR: c.summary.xOverR }
        : { busId: bus.id, faultType, problem: c.error.message };
      cases.push(row);
      const worst = worstAt.get(bus.id);
      if (row.symmetricalKa !== undefined && (!worst || row.symmetricalKa > worst.symmetricalKa!)) worstAt.set(bus.id, row);
    }
    // The Thevenin columns of one bus serve its fault types only; kept for every bus they would hold n² numbers.
    clearFaultCaches(fs);
    options.onProgress?.(k + 1, buses.length);
  });

  // A breaker's location: the bus its line-side poles are merged with.
  const busOfClass = new Map<number, string>();
  for (const bus of buses) {
    for (const c of ['A', 'B', 'C']) {
      const pin = fs.network.pinIndex.get(pinKey(bus.id, 'bars', c));
      if (pin !== undefined && fs.classes.classOf[pin] >= 0) busOfClass.set(fs.classes.classOf[pin], bus.id);
    }
  }
  const duties: DutyCheck[] = [];
  const unlocated: string[] = [];
  const check = (elementId: string, elementKind: DutyCheck['elementKind'], locationBusId: string, interruptingKa: number) => {
    const worst = worstAt.get(locationBusId);
    if (!worst) return;
    const xOverR = worst.xOverR!;
    const test = testXOverR(interruptingKa);
    const adjusted = xOverR > test ? (worst.symmetricalKa! * peakFactor(xOverR)) / peakFactor(test) : worst.symmetricalKa!;
    const status: DutyStatus = adjusted > interruptingKa ? 'fails' : xOverR > test ? 'passes-x-over-r-above-test' : 'passes';
    duties.push({
      elementId,
      elementKind,
      locationBusId,
      interruptingKa,
      dutyKa: worst.symmetricalKa!,
      faultType: worst.faultType,
      xOverR,
      testXOverR: test,
      adjustedDutyKa: adjusted,
      status,
      marginPercent: (100 * (interruptingKa - adjusted)) / interruptingKa,
    });
  };
  for (const e of Object.values(duty.elements)) {
    if (e.kind === 'bus' && e.interruptingKa !== undefined) check(e.id, 'bus', e.id, e.interruptingKa);
    if (e.kind !== 'breaker') continue;
    const at = (['A', 'B', 'C'] as const)
      .map((p) => fs.network.pinIndex.get(pinKey(e.id, 'line', p)))
      .map((pin) => (pin === undefined ? undefined : busOfClass.get(fs.classes.classOf[pin])))
      .find((b) => b !== undefined);
    if (at === undefined) unlocated.push(e.id);
    else check(e.id, 'breaker', at, e.interruptingKa);
  }
  const rank: Record<DutyStatus, number> = { fails: 0, 'passes-x-over-r-above-test': 1, passes: 2 };
  duties.sort((a, b) => rank[a.status] - rank[b.status] || a.marginPercent - b.marginPercent);
  const serviceMarkings: ServiceMarking[] = buses
    .filter((b) => b.kind === 'bus' && b.role === 'service' && worstAt.has(b.id))
    .map((b) => {
      const w = worstAt.get(b.id)!;
      return { busId: b.id, availableFaultKa: w.symmetricalKa!, faultType: w.faultType, xOverR: w.xOverR! };
    });
  const assumptions = [
    ...FAULT_ASSUMPTIONS,
    'Fault study: a breaker is checked against the largest fault at the bus its line side lands on; a rating is compared after scaling the duty by κ(X/R)/κ(test X/R) where the fault X/R exceeds the test circuit’s (UL 489 test power factors, recalled).',
  ];
  const motors = motorAssumption(prepared.prepared.motorIds);
  if (motors) assumptions.push(motors);
  if (options.transformerTolerance) assumptions.push(`Fault study: transformer impedances at ${(100 * (1 - TRANSFORMER_IMPEDANCE_TOLERANCE)).toFixed(1)} % of nameplate.`);
  return { ok: true, study: { cases, duties, unlocated, serviceMarkings, cancelled, assumptions } };
}
