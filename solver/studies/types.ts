// The loading and voltage-drop study's results: plain data for the views, every list sorted worst first.
import type { AwgKcmilSize, ConductorMaterial } from '../../shared/conductor-sizes';
import type { ConductorId, LoadKind, PhaseId } from '../../shared/sheet';
import type { SolveResult } from '../results/types';

export interface LoadingStudyOptions {
  /** Study this what-if instead of the base case. */
  whatIfId?: string;
  /** A result already solved for this sheet (and what-if): it is used as is, not solved again. */
  result?: SolveResult;
  /** Load kinds counted as non-linear for NEC 310.15(E)(3) [electronics]. */
  nonLinearLoadKinds?: LoadKind[];
  /** Share of a four-wire wye circuit's load that makes it "mostly non-linear" [0.5]. */
  nonLinearMajorityFraction?: number;
  /** Voltage-drop guidance per run and in total, percent [3, 5]. */
  runDropLimitPercent?: number;
  totalDropLimitPercent?: number;
  /** A continuous load may use this share of a standard breaker's rating [80]. */
  continuousLoadPercent?: number;
}

export type LoadingStatus = 'ok' | 'high' | 'over' | 'not-rated';

export interface AmpacityRule {
  table: 'NEC 310.16';
  insulationTempC: 60 | 75 | 90;
  tableAmperes: number;
  ambientC: number;
  /** 310.15(B)(1). */
  ambientFactor: number;
  /** Current-carrying conductors in the raceway (each parallel set in its own raceway). */
  currentCarrying: number;
  /** Where the count came from: given on the sheet or counted from the run. */
  countFrom: 'sheet' | 'counted';
  /** 310.15(C)(1). */
  adjustmentFactor: number;
  /** Whether the neutral was counted (310.15(E)); absent when the run has no neutral or the sheet gives the count. */
  neutralCounted?: boolean;
  /** The rule in words, with the figures. */
  text: string;
}

export interface ConductorLoading {
  runId: string;
  runName: string;
  conductor: ConductorId;
  size?: AwgKcmilSize;
  material: ConductorMaterial;
  parallelSets: number;
  amperes: number;
  open: boolean;
  ampacityAmperes?: number;
  percentOfAmpacity?: number;
  /** high: at or above 80 % of the ampacity; over: above it; not-rated: no NEC 310.16 ampacity applies. */
  status: LoadingStatus;
  rule?: AmpacityRule;
  /** 240.4(D): the largest overcurrent device allowed on small conductors, and the breaker upstream of the run. */
  smallConductor?: { limitAmperes: number; breakerId?: string; breakerRatingAmperes?: number; exceeded: boolean };
  /** 240.4(B): the breaker upstream of the run (phases only) against the largest device the ampacity allows. */
  protection?: { breakerId: string; breakerRatingAmperes: number; largestAllowedAmperes: number; exceeded: boolean };
  note?: string;
}

export type BreakerStatus = 'ok' | 'above-continuous' | 'over' | 'no-rating' | 'open';

export interface BreakerLoading {
  breakerId: string;
  name: string;
  device: 'breaker' | 'switch' | 'fuse';
  /** Largest pole current. */
  amperes: number;
  poles: Partial<Record<PhaseId, number>>;
  ratingAmperes?: number;
  percentOfRating?: number;
  status: BreakerStatus;
  note: string;
}

export type DropStatus = 'ok' | 'over-run' | 'over-total' | 'no-data';

export interface VoltageDropEntry {
  runId: string;
  name: string;
  /** feeder: something downstream is a bus; branch: it ends at loads. */
  role: 'feeder' | 'branch';
  dropPercent?: number;
  /** Sum of the drops of the runs from the origin to this run's end (the hand method of adding feeder and branch). */
  cumulativePercent?: number;
  /** The source or transformer whose output starts this run's voltage zone. */
  originId?: string;
  /** The runs from the origin to this one, in order (this one last). */
  path: string[];
  status: DropStatus;
}

export interface BondFinding {
  busId: string;
  name: string;
  role: string;
  permitted: boolean;
  /** Current in the bond: for a misplaced bond, the neutral current it diverts onto the equipment ground. */
  bondAmperes: number;
  /** PE current of the runs that feed the bus. */
  groundConductorAmperes: { runId: string; amperes: number }[];
  status: 'ok' | 'flagged';
  message: string;
}

export interface LoadingStudy {
  whatIf?: { id: string; name: string };
  conductors: ConductorLoading[];
  breakers: BreakerLoading[];
  voltageDrop: VoltageDropEntry[];
  bonds: BondFinding[];
  summary: {
    conductorsOver: number;
    conductorsHigh: number;
    /** Runs whose breaker is larger than 240.4(B) or 240.4(D) allows for them. */
    runsUnprotected: number;
    breakersOver: number;
    breakersAboveContinuous: number;
    runsOverDrop: number;
    pathsOverTotalDrop: number;
    bondsFlagged: number;
  };
  /** The rules applied, said once. */
  notes: string[];
  caution: string;
}
