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
import { matInverse, type ComplexMatrix } from './complex';

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
 * Solves target = base + Δ (Δ confined to a few nodes) through the base factors. The first solve goes through the
 * sparse module's solveWithBlockUpdate, which checks the answer's residual and refactors when the low-rank answer is
 * not good enough. When it is, the Woodbury pieces (G = A⁻¹P and the small capacitance matrix) are kept, so each
 * further right-hand side of the load iteration costs one base solve plus O(n·m); each answer is still checked by
 * its residual on the target, and a bad one falls back to refactoring with the same analysis.
 */
export function updatedSolver(base: Factorization, target: ComplexCsc, update: BlockUpdate, residualTolerance = 1e-10): LinearSolver {
  let refactored: Factorization | undefined;
  let woodbury: Woodbury | undefined;
  const refactor = (bRe: Float64Array, bIm: Float64Array): Outcome<ComplexVector> => {
    if (!refactored) {
      const again = factorize(target, base);
      if (!again.ok) return again;
      refactored = again.value;
      solver.method = 'refactor';
    }
    return { ok: true, value: solve(refactored.numeric, bRe, bIm) };
  };
  const solver: LinearSolver = {
    matrix: target,
    method: 'low-rank',
    solve(bRe, bIm) {
      try {
        if (refactored) return refactor(bRe, bIm);
        if (woodbury) {
          const x = woodbury.solve(bRe, bIm);
          if (x && relativeResidual(target, x, bRe, bIm) <= residualTolerance) return { ok: true, value: x };
          return refactor(bRe, bIm);
        }
        const result = solveWithBlockUpdate(base.numeric, base.symbolic, base.matrix, update, bRe, bIm, { residualTolerance });
        if (result.method === 'refactor') return refactor(bRe, bIm);
        woodbury = prepareWoodbury(base, update);
        return { ok: true, value: { re: result.re, im: result.im } };
      } catch (error) {
        return singular(error);
      }
    },
  };
  return solver;
}

interface Woodbury {
  solve(bRe: Float64Array, bIm: Float64Array): ComplexVector | undefined;
}

/** x = y − G K⁻¹ Δ Pᵀ y with y = A⁻¹ b, G = A⁻¹ P, K = I + Δ Pᵀ G (m×m, inverted once). */
function prepareWoodbury(base: Factorization, update: BlockUpdate): Woodbury | undefined {
  const n = base.matrix.n;
  const m = update.nodes.length;
  const columns: ComplexVector[] = [];
  for (let a = 0; a < m; a++) {
    const eRe = new Float64Array(n);
    eRe[update.nodes[a]] = 1;
    columns.push(solve(base.numeric, eRe, new Float64Array(n)));
  }
  const delta = (a: number, b: number) => ({ re: update.deltaRe[a * m + b], im: update.deltaIm[a * m + b] });
  const k: ComplexMatrix = [];
  for (let a = 0; a < m; a++) {
    k.push([]);
    for (let b = 0; b < m; b++) {
      // (Δ Pᵀ G)[a][b] = Σ_c Δ[a][c] G[node c][b]
      let re = a === b ? 1 : 0;
      let im = 0;
      for (let c = 0; c < m; c++) {
        const d = delta(a, c);
        const gRe = columns[b].re[update.nodes[c]];
        const gIm = columns[b].im[update.nodes[c]];
        re += d.re * gRe - d.im * gIm;
        im += d.re * gIm + d.im * gRe;
      }
      k[a].push({ re, im });
    }
  }
  let kInv: ComplexMatrix;
  try {
    kInv = matInverse(k);
  } catch {
    return undefined;
  }
  return {
    solve(bRe, bIm) {
      const y = solve(base.numeric, bRe, bIm);
      // w = Δ Pᵀ y, z = K⁻¹ w
      const w = Array.from({ length: m }, (_, a) => {
        let re = 0;
        let im = 0;
        for (let c = 0; c < m; c++) {
          const d = delta(a, c);
          const yRe = y.re[update.nodes[c]];
          const yIm = y.im[update.nodes[c]];
          re += d.re * yRe - d.im * yIm;
          im += d.re * yIm + d.im * yRe;
        }
        return { re, im };
      });
      const z = kInv.map((row) => row.reduce((acc, v, b) => ({ re: acc.re + v.re * w[b].re - v.im * w[b].im, im: acc.im + v.re * w[b].im + v.im * w[b].re }), { re: 0, im: 0 }));
      for (let b = 0; b < m; b++) {
        const g = columns[b];
        const zb = z[b];
        for (let i = 0; i < n; i++) {
          y.re[i] -= g.re[i] * zb.re - g.im[i] * zb.im;
          y.im[i] -= g.re[i] * zb.im + g.im[i] * zb.re;
        }
      }
      for (let i = 0; i < n; i++) if (!Number.isFinite(y.re[i]) || !Number.isFinite(y.im[i])) return undefined;
      return y;
    },
  };
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
