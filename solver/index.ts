// The solver's public surface: solve a sheet (or one of its what-ifs) and read the results.
export { solveSheet, solveDocument, SheetSolver, type SolveOutcome, type SolveOptions } from './solve/solve-sheet';
export type { SolveFailure, FailureCode } from './solve/solve-network';
export type * from './results/types';
export { buildNetwork } from './network/build-network';
export type { LoadModel } from './solve/load-iteration';
