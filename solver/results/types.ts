// The results of one solve (base case or a what-if), as plain data for the drawing, the tables and the reports.
import type { ConductorId, PhaseId } from '../../shared/sheet';
import type { LoadModel } from '../solve/load-iteration';

export interface PhasorValue {
  re: number;
  im: number;
  magnitude: number;
  angleDeg: number;
}

export type LiveState = 'energised' | 'back-fed' | 'de-energised';

export interface Standing {
  standing: 'normal' | 'tolerable' | 'outside';
  nominalVolts: number;
  normalRange: [number, number];
  tolerableRange: [number, number];
  label: string;
}

export interface BusConductorResult {
  /** Against remote earth. */
  phasor: PhasorValue;
  state: LiveState;
  ungrounded: boolean;
}

export type LineToLine = 'AB' | 'BC' | 'CA';

export interface BusResult {
  busId: string;
  name: string;
  role: string;
  state: LiveState | 'partly-energised';
  /** The bus belongs to a part with no path to earth: phase-to-ground is not defined there. */
  ungrounded: boolean;
  nominal: { lineToNeutralVolts?: number; lineToLineVolts?: number };
  conductors: Partial<Record<ConductorId, BusConductorResult>>;
  lineToNeutralVolts: Partial<Record<PhaseId, number>>;
  lineToLineVolts: Partial<Record<LineToLine, number>>;
  /** N against the bus's PE bar (remote earth when it has none); null without a neutral or when ungrounded. */
  neutralToGroundVolts: number | null;
  phaseToGroundVolts: Partial<Record<PhaseId, number | 'ungrounded'>>;
  /** Three-phase buses only. */
  sequence?: { zero: PhasorValue; positive: PhasorValue; negative: PhasorValue };
  unbalance?: { nemaPercent: number; negativeSequencePercent: number };
  standing: { lineToNeutral: Partial<Record<PhaseId, Standing>>; lineToLine: Partial<Record<LineToLine, Standing>> };
}

export interface LoadElementResult {
  label: string;
  volts: number;
  angleDeg: number;
  ratedVolts: number;
  nominalVolts: number;
  percentOfRating: number;
  kw: number;
  kvar: number;
  amperes: number;
  model: LoadModel;
  /** Turned to constant impedance by the low-voltage switch. */
  switchedToImpedance: boolean;
  standing?: Standing;
  /** Under an open neutral: the voltage with every load at constant impedance, shown beside the answer. */
  constantImpedanceVolts?: number;
}

export interface LoadResult {
  loadId: string;
  name: string;
  loadKind: string;
  connection: string;
  state: LiveState;
  /** The model that produced this result: the load's own mix, or constant impedance where the switch acted. */
  model: LoadModel;
  elements: LoadElementResult[];
  kw: number;
  kvar: number;
  /** Worst element's percent of rating (farthest from 100 %). */
  worstPercentOfRating: number;
}

export interface RunConductorResult {
  /** Current entering the run at its 'from' end. */
  current: PhasorValue;
  open: boolean;
  addedOhms: number;
  ampacityAmperes?: number;
  percentOfAmpacity?: number;
}

export interface RunResult {
  runId: string;
  name: string;
  conductors: Partial<Record<ConductorId, RunConductorResult>>;
  lossKw: number;
  /** Largest drop along the run, in the direction of the supply, of a phase-to-neutral (or line-to-line) voltage, percent of nominal. */
  voltageDropPercent?: number;
  /** 'to' when real power enters the run at its 'to' end (drawn against the supply); absent otherwise. */
  fedFrom?: 'to';
  /** With a neutral and a phase: the system the neutral belongs to, read from the nominal phase angles (NEC 310.15(E)). */
  neutralSystem?: 'wye-4-wire' | 'split-phase' | 'delta';
}

export interface BreakerResult {
  breakerId: string;
  name: string;
  poles: Partial<Record<PhaseId, { state: 'closed' | 'open'; amperes: number }>>;
  ratingAmperes?: number;
  percentOfRating?: number;
}

export interface SourceResult {
  sourceId: string;
  name: string;
  phases: Partial<Record<PhaseId, PhasorValue>>;
  kw: number;
  kvar: number;
}

export interface TransformerResult {
  transformerId: string;
  name: string;
  /** Apparent power out of the secondary. */
  kva: number;
  kw: number;
  kvar: number;
  percentOfRating: number;
  lossKw: number;
}

export interface ElectrodeResult {
  electrodeId: string;
  name: string;
  amperes: number;
  /** Rise of the lead above remote earth. */
  volts: number;
}

export interface BondResult {
  busId: string;
  amperes: number;
  /** A bond belongs at the service and at each separately derived system; anywhere else it is flagged. */
  permitted: boolean;
}

export interface PowerBalance {
  sourceKw: number;
  sourceKvar: number;
  loadKw: number;
  loadKvar: number;
  lossKw: number;
  lossKvar: number;
  /** |S_source − S_loads − S_losses| / |S_source|, percent. */
  mismatchPercent: number;
}

export interface ResultWarning {
  message: string;
  elementId?: string;
}

export interface SolveResult {
  sheetName: string;
  whatIf?: { id: string; name: string };
  standard: { id: string; label: string };
  frequencyHz: number;
  convergence: { iterations: number; mismatch: number; tolerance: number; method: 'fixed-point' | 'newton' };
  /** Largest KCL mismatch at any node over the largest sum of current magnitudes at any node. */
  kclResidual: number;
  powerBalance: PowerBalance;
  linearSolve: { method: string; unknowns: number; nonzeros: number };
  /** A neutral is open or degraded here: each load also carries its constant-impedance answer. */
  openNeutral: boolean;
  buses: BusResult[];
  loads: LoadResult[];
  runs: RunResult[];
  breakers: BreakerResult[];
  sources: SourceResult[];
  transformers: TransformerResult[];
  electrodes: ElectrodeResult[];
  bonds: BondResult[];
  warnings: ResultWarning[];
  assumptions: string[];
  caution: string;
  /** A shunt-fault what-if: the fault's own figures (the rest of the result is the state during the fault). */
  fault?: import('../faults/fault-types').FaultResultSection;
}
