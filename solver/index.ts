// The solver's public surface: solve a sheet (or one of its what-ifs) and read the results.
export { solveSheet, solveDocument, SheetSolver, type SolveOutcome, type SolveOptions } from './solve/solve-sheet';
export type { SolveFailure, FailureCode } from './solve/solve-network';
export type * from './results/types';
export { buildNetwork } from './network/build-network';
export { loadElementLabels } from './network/load';
export type { LoadModel } from './solve/load-iteration';
export { solveFault, prepareFaults, faultResult, faultCase, withTransformerTolerance, TRANSFORMER_IMPEDANCE_TOLERANCE, type FaultOutcome } from './faults/solve-fault';
export { peakFactor, asymmetricalPeakAmperes } from './faults/peak-factor';
export type * from './faults/fault-types';
export { faultStudy, testXOverR, type FaultStudyOptions, type FaultStudyResult, type FaultStudyCase, type DutyCheck, type DutyStatus, type ServiceMarking } from './faults/fault-study';
export { loadingStudy, loadingStudyOf, LOADING_STUDY_NOTES } from './studies';
export type * from './studies/types';
export { SOLVER_VERSION } from './version';
export { breakSweep, breakSweepSync } from './studies/break-sweep';
export { breakSweepInShares, shareOptions, type ShareRunner } from './studies/shared-sweep';
export { readingsMatch, readingsMatchSync } from './studies/readings-match';
export type * from './studies/study-types';
