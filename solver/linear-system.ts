// The one door between the solver and the sparse LU: assemble, factor (reusing an analysis of the same pattern),
// solve, and solve an opening as a block update of the base factors. Singular matrices come back as values.
import {
  analyse,
  ComplexTriplets,
  factor,
  relativeResidual,
  samePattern,
  SingularMatrixError,
  solve,
  solveWithBlockUpdate,
  type BlockUpdate,
  type ComplexCsc,
  type NumericLu,
  type SymbolicLu,
} from './sparse';

export type { BlockUpdate, ComplexCsc };

export interface ComplexVector {
  re: Float64Array;
  im: Float64Array;
}

export class MatrixAssembly {
  private readonly triplets: ComplexTriplets;
  constructor(readonly n: number, capacityHint?: number) {
    this.triplets = new ComplexTriplets(n, capacityHint);
  }
  add(row: number, col: number, re: number, im: number): void {
    this.triplets.add(row, col, re, im);
  }
  toMatrix(): ComplexCsc {
    return this.triplets.toCsc();
  }
}

export interface Factorization {
  matrix: ComplexCsc;
  symbolic: SymbolicLu;
  numeric: NumericLu;
  /** True when the symbolic analysis came from an earlier matrix of the same pattern. */
  reusedAnalysis: boolean;
}

export type Outcome<T> = { ok: true; value: T } | { ok: false; column: number; message: string };

function singular(error: unknown): Outcome<never> {
  if (error instanceof SingularMatrixError) return { ok: false, column: error.column, message: error.message };
  return { ok: false, column: -1, message: (error as Error).message };
}

/** Factors the matrix, reusing the analysis of `previous` when the pattern is the same. */
export function factorize(matrix: ComplexCsc, previous?: Pick<Factorization, 'matrix' | 'symbolic'>): Outcome<Factorization> {
  try {
    const reusedAnalysis = previous !== undefined && samePattern(previous.matrix, matrix);
    const symbolic = reusedAnalysis ? previous!.symbolic : analyse(matrix);
    return { ok: true, value: { matrix, symbolic, numeric: factor(symbolic, matrix), reusedAnalysis } };
  } catch (error) {
    return singular(error);
  }
}

export type SolveMethod = 'factor' | 'reused-analysis' | 'low-rank' | 'refactor';

/** Solves repeatedly with one matrix (the load iteration re-solves with new right-hand sides). */
export interface LinearSolver {
  readonly matrix: ComplexCsc;
  method: SolveMethod;
  solve(bRe: Float64Array, bIm: Float64Array): Outcome<ComplexVector>;
}

export function directSolver(f: Factorization): LinearSolver {
  return {
    matrix: f.matrix,
    method: f.reusedAnalysis ? 'reused-analysis' : 'factor',
    solve: (bRe, bIm) => ({ ok: true, value: solve(f.numeric, bRe, bIm) }),
  };
}

/**
 * Solves target = base + Δ (Δ confined to a few nodes) through the base factors. The sparse module checks each
 * answer's residual and refactors when the low-rank answer is not good enough; after one refactor we keep those
 * factors for the remaining solves.
 */
export function updatedSolver(base: Factorization, target: ComplexCsc, update: BlockUpdate): LinearSolver {
  let refactored: Factorization | undefined;
  const solver: LinearSolver = {
    matrix: target,
    method: 'low-rank',
    solve(bRe, bIm) {
      if (refactored) return { ok: true, value: solve(refactored.numeric, bRe, bIm) };
      try {
        const result = solveWithBlockUpdate(base.numeric, base.symbolic, base.matrix, update, bRe, bIm);
        if (result.method === 'refactor') {
          const again = factorize(target, base);
          if (!again.ok) return again;
          refactored = again.value;
          solver.method = 'refactor';
        }
        return { ok: true, value: { re: result.re, im: result.im } };
      } catch (error) {
        return singular(error);
      }
    },
  };
  return solver;
}

/** Δ = target − base over the nodes where they differ (same pattern), or undefined when they do not. */
export function blockDifference(base: ComplexCsc, target: ComplexCsc): BlockUpdate | undefined {
  if (!samePattern(base, target)) return undefined;
  const nodes: number[] = [];
  const where = new Map<number, number>();
  const changed: [number, number, number, number][] = [];
  for (let col = 0; col < base.n; col++) {
    for (let p = base.colPtr[col]; p < base.colPtr[col + 1]; p++) {
      const dRe = target.re[p] - base.re[p];
      const dIm = target.im[p] - base.im[p];
      if (dRe === 0 && dIm === 0) continue;
      const row = base.rowIdx[p];
      for (const node of [row, col]) if (!where.has(node)) where.set(node, nodes.push(node) - 1);
      changed.push([row, col, dRe, dIm]);
    }
  }
  const m = nodes.length;
  const deltaRe = new Float64Array(m * m);
  const deltaIm = new Float64Array(m * m);
  for (const [row, col, dRe, dIm] of changed) {
    const t = where.get(row)! * m + where.get(col)!;
    deltaRe[t] += dRe;
    deltaIm[t] += dIm;
  }
  return { nodes: Int32Array.from(nodes), deltaRe, deltaIm };
}

export function residualOf(matrix: ComplexCsc, x: ComplexVector, bRe: Float64Array, bIm: Float64Array): number {
  return relativeResidual(matrix, x, bRe, bIm);
}
