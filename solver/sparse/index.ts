// Sparse complex LU for nodal admittance matrices: assemble, analyse once per pattern, factor, solve, update.
export { type ComplexCsc, nnzOf, findEntry, samePattern, assertCsc } from './csc';
export { ComplexTriplets } from './triplets';
export { SingularMatrixError } from './errors';
export { type AdjacencyGraph, symmetricAdjacency } from './adjacency';
export { approximateMinimumDegree, type AmdOptions } from './amd';
export { analyse, type SymbolicLu, type AnalyseOptions, type Ordering } from './symbolic';
export {
  factor,
  type NumericLu,
  type FactorOptions,
  DEFAULT_PIVOT_TOLERANCE,
  DEFAULT_SINGULAR_TOLERANCE,
} from './lu';
export {
  solve,
  permuteRows,
  lowerSolveInPlace,
  upperSolveInPlace,
  permuteColumns,
  type ComplexVector,
} from './solve';
export { multiply, relativeResidual, rowAbsSums, vectorNormInf } from './residual';
export {
  solveWithBlockUpdate,
  addBlock,
  blockResidual,
  type BlockUpdate,
  type BlockSolveOptions,
  type BlockSolveResult,
} from './block-update';
