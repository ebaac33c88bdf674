// Types of the two studies over single faults in conductors: the break sweep (open each run conductor in turn and
// rank by what the loads see) and the readings match (which cause best explains a few measured voltages).
import type { ConductorId, WhatIfChange } from '../../shared/sheet';
import type { SolveFailure } from '../solve/solve-network';

export type StudyOutcome<T> = { ok: true; value: T } | { ok: false; error: SolveFailure };

/** Progress of a long study: cases done of the total. */
export interface StudyProgress {
  done: number;
  total: number;
}

export interface StudyRunOptions {
  /** Aborting stops the study between cases; the result says `cancelled` and holds the cases done so far. */
  signal?: AbortSignal;
  onProgress?: (progress: StudyProgress) => void;
  /** The async forms yield to the event loop after about this much work (default 12 ms), so a UI stays responsive. */
  sliceMs?: number;
}

export type BreakRanking = 'severity' | 'over' | 'under';

/** How the loads behave in a study's cases. */
export type StudyLoadModel = 'constant-impedance' | 'sheet';

/** One load element's voltage in a case and how far it is outside the sheet's standard. */
export interface LoadExcursion {
  loadId: string;
  loadName: string;
  /** The load's element, e.g. "A–N". */
  element: string;
  volts: number;
  nominalVolts: number;
  percentOfNominal: number;
  /**
   * Volts beyond the normal range (ANSI C84.1 Range A utilization, or the IEC 60038 band): above its top for an
   * over-voltage, below its bottom for an under-voltage; zero or negative when inside.
   */
  beyondVolts: number;
  /** beyondVolts as a percentage of nominal. */
  beyondPercent: number;
  standing: 'normal' | 'tolerable' | 'outside';
}

export interface BreakSweepOptions extends StudyRunOptions {
  /** Open every run conductor (default) or only the neutrals. */
  conductors?: 'all' | 'neutrals';
  /**
   * 'constant-impedance' (default): every case with the loads at their rated-voltage impedance, exact through the
   * base factors (the series-divider answer of common practice); the worst `refineWorst` cases are then solved
   * again with the sheet's load laws. 'sheet': every case with the sheet's load laws (slower).
   */
  loadModel?: StudyLoadModel;
  /** Rank by the larger excursion (default), by the over-voltage alone, or by the under-voltage alone. */
  rankBy?: BreakRanking;
  /** With the constant-impedance model: how many of the worst cases to solve again with the sheet's load laws (default 10). */
  refineWorst?: number;
  /** Sweep only every count-th case from the index-th (a share of a sweep split across threads; see shared-sweep.ts). */
  share?: SweepShare;
}

/** Which share of the cases a sweep takes: case i of the full list when i mod count = index. */
export interface SweepShare {
  index: number;
  count: number;
}

export interface BreakCase {
  runId: string;
  runName: string;
  conductor: ConductorId;
  /** The what-if change that shows this case on the drawing. */
  change: Extract<WhatIfChange, { kind: 'open-conductor' }>;
  /** The highest load voltage relative to its normal range (undefined when no load has voltage). */
  worstOver?: LoadExcursion;
  /** The lowest, among loads that still have voltage. */
  worstUnder?: LoadExcursion;
  /** Load elements outside the tolerable range (ANSI Range B; IEC: the band). */
  loadsOutside: number;
  /** Load elements outside the normal range but inside the tolerable one. */
  loadsTolerable: number;
  /** Load elements left with less than 5 % of nominal: supply lost, not an abnormal voltage. */
  loadsWithoutVoltage: number;
  /** The ranking key: max(worstOver.beyondPercent, worstUnder.beyondPercent, 0). */
  severityPercent: number;
  loadModel: StudyLoadModel;
  /** 'low-rank': through the base factors; 'full-solve': the case changed the live parts and was solved afresh. */
  method: 'low-rank' | 'full-solve';
  /** Relative residual of the answer through the base factors (a full solve checks itself). */
  residual?: number;
  /** Why the case has no figures (the solve failed). */
  problem?: string;
  /** Why solving again with the sheet's load laws failed (the constant-impedance figures stand). */
  refineProblem?: string;
}

export interface BreakSweepResult {
  /** Worst first by the chosen ranking (severity by default), then loads outside, then loads without voltage. */
  cases: BreakCase[];
  /** The base case's extremes, for comparison. */
  base: Pick<BreakCase, 'worstOver' | 'worstUnder' | 'loadsOutside' | 'loadsTolerable' | 'loadsWithoutVoltage' | 'severityPercent'>;
  /** Conductors in the sweep (cases done is cases.length). */
  total: number;
  cancelled: boolean;
  /** The standard the loads are judged by. */
  standard: string;
  assumptions: string[];
}

/** Where a reading was taken. */
export type ReadingPoint =
  /** Across a load's element (its label as in the results, e.g. "A–N"; the first element when omitted). */
  | { kind: 'load'; loadId: string; element?: string }
  /** Between two bars of a bus (e.g. A to N); `to` 'earth' is against remote earth. */
  | { kind: 'bus'; busId: string; from: ConductorId; to: ConductorId | 'earth' };

export interface Reading {
  at: ReadingPoint;
  volts: number;
}

/**
 * A candidate cause; 'none' is the sound network with a fitted load level. A degraded conductor is a resistance in
 * series with one conductor of a run: a failing lug at either end of it or a bad splice along it (the readings
 * cannot tell those apart: they are one series path). A load's supply connection (single-element loads:
 * line-to-neutral and line-to-line) can be open or degraded too.
 */
export type CandidateCause =
  | { kind: 'none' }
  | { kind: 'open-conductor'; runId: string; conductor: ConductorId }
  | { kind: 'degrade-conductor'; runId: string; conductor: ConductorId; ohms: number }
  /** A load's own supply connection (conductor: the connection's from-side key, as in what-if changes). */
  | { kind: 'open-connection'; connectionId: string; conductor: ConductorId; loadId: string }
  | { kind: 'degrade-connection'; connectionId: string; conductor: ConductorId; loadId: string; ohms: number };

export interface ReadingsMatchOptions extends StudyRunOptions {
  /** Candidate conductors: all (default) or only neutrals. */
  conductors?: 'all' | 'neutrals';
  /** Which kinds of cause to try (all by default). */
  causes?: { openings?: boolean; degradations?: boolean };
  /**
   * Readings the meter cannot tell apart, as a percentage of each reading (default 1 %): two candidates whose
   * predicted readings all agree within it are one group.
   */
  tolerancePercent?: number;
  /** Range of the fitted load level, a factor on the rated loads of the affected service (default 0.1 to 3). */
  loadLevelRange?: [number, number];
  /** Range of a degraded conductor's fitted resistance, ohms (default 0.01 to 100). */
  ohmsRange?: [number, number];
  /**
   * How many of the best fits by the constant-impedance model are fitted again with the sheet's load laws (full
   * solves; default 10, 0 for none). Far from rated voltage (an open neutral) the load laws decide the readings.
   */
  refineBest?: number;
  /**
   * How the refit's trials are solved: through the base factors and a low-rank update (default), or each by a
   * fresh build and factorization of the changed sheet (slower; the check of the default).
   */
  refit?: 'low-rank' | 'fresh-solves';
}

export interface MatchCandidate {
  cause: CandidateCause;
  /** Plain words, e.g. "neutral of run apt-4-feeder open". */
  description: string;
  /** The loads whose level was fitted (those downstream of the cause; every load for 'none'), and the factor. */
  loadLevel: { elementId?: string; factor: number; loadCount: number };
  /** The model's voltage at each reading, in the readings' order. */
  predictedVolts: number[];
  rmsVolts: number;
  /** RMS of the residuals as percentages of the readings. */
  rmsPercent: number;
  /** What-if changes that show this candidate on the drawing (the cause and the fitted load level). */
  changes: Record<string, WhatIfChange>;
  /** The loads' model of the fit: constant impedance (through the base factors) or the sheet's load laws (refined). */
  loadModel: StudyLoadModel;
  /** Why fitting again with the sheet's load laws failed (the constant-impedance fit stands). */
  refineProblem?: string;
}

export interface CandidateGroup {
  /** Best first inside the group. */
  candidates: MatchCandidate[];
  rmsVolts: number;
  rmsPercent: number;
}

export interface ReadingsMatchResult {
  /** Best first; the candidates of a group predict the same readings within the tolerance. */
  groups: CandidateGroup[];
  best?: MatchCandidate;
  /** How well the best fits: RMS residual, and whether every reading is within the tolerance. */
  fit: { rmsVolts: number; rmsPercent: number; withinTolerance: boolean };
  /**
   * How sure the ranking is: the next group's RMS residual over the best's (gap in volts too). 'clear' when the
   * best fits within the tolerance, the next group's RMS is more than twice the tolerance and its best group
   * names one place; 'ambiguous' when the next group also fits or the best group names several places; 'poor-fit'
   * when even the best does not fit.
   */
  certainty: {
    gapVolts: number;
    ratio: number;
    /** Distinct places among the best group's candidates (a run, a connection, or none): more than one is ambiguous. */
    locationsInBestGroup: number;
    verdict: 'clear' | 'likely' | 'ambiguous' | 'poor-fit';
  };
  candidatesTried: number;
  /** Of them, the best fits fitted again with the sheet's load laws. */
  candidatesRefined: number;
  cancelled: boolean;
  assumptions: string[];
}
