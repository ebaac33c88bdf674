// What a shunt fault is (where, which conductors, through what) and what its solution reports.
import type { PhaseId, ShuntFaultType } from '../../shared/sheet';
import type { Complex } from '../complex';
import type { PhasorValue, SolveResult } from '../results/types';

export type FaultReturn = 'PE' | 'N' | 'earth';

/** A shunt fault at a bus. The fault impedance is in ohms (complex: a reactive fault path is allowed here). */
export interface FaultSpec {
  busId: string;
  faultType: ShuntFaultType;
  /** Which phases are involved; defaults: A (one phase), B–C (two), A B C (three) among the bus's phases. */
  phases?: PhaseId[];
  /** Where a line-to-ground fault returns: the bus's PE bar (remote earth when the bus has none), N, or remote earth. */
  to?: FaultReturn;
  faultOhms?: number | Complex;
}

export interface FaultOptions {
  /** Apply the transformer impedance tolerance (nameplate × (1 − 0.075)) for the maximum duty. */
  transformerTolerance?: boolean;
}

/** The terminals a fault lands on: one pin per conductor, 0 (remote earth) for the return when it goes to earth. */
export interface FaultTerminals {
  phases: Partial<Record<PhaseId, number>>;
  neutral?: number;
  ground?: number;
}

export type FaultTerminalName = PhaseId | 'N' | 'PE' | 'earth';

export interface FaultOutcomeSummary {
  faultType: ShuntFaultType;
  phases: PhaseId[];
  /** The return conductor the fault actually went to (the bus's PE falls back to earth when it has none). */
  returnPath?: FaultReturn;
  faultOhms: Complex;
  /** Pre-fault voltage of each faulted phase against the fault's return (or against remote earth), volts. */
  prefaultVolts: Partial<Record<PhaseId, PhasorValue>>;
  /** How the pre-fault voltages were found. */
  prefaultBasis: string;
  /** Symmetrical (RMS) current into the fault at each terminal, amperes (the return carries the sum). */
  currents: Partial<Record<FaultTerminalName, PhasorValue>>;
  /** Fortescue components of the phase currents into the fault (phase A reference), when the bus has A, B and C. */
  sequenceCurrents?: { zero: PhasorValue; positive: PhasorValue; negative: PhasorValue };
  /** Largest phase current into the fault, kA symmetrical. */
  symmetricalKa: number;
  /** X/R of the loop the largest current flows in (driving pre-fault voltage over that current). */
  xOverR: number;
  peakFactor: number;
  /** Asymmetrical peak, kA instantaneous (IEC 60909 κ √2 I). */
  peakKa: number;
  /** True when the faulted conductors sit in a part with no path to earth and the fault gives none: no current. */
  ungroundedPart: boolean;
}

export interface FaultResultSection extends FaultOutcomeSummary {
  busId: string;
}

export interface FaultSolveResult extends SolveResult {
  fault: FaultResultSection;
}
