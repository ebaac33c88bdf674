// A change of Y confined to a few nodes (an opened or degraded conductor changes its run's whole block):
// Woodbury over the base factors, checked by its residual on base+Δ, refactoring with the same analysis if needed.
import { findEntry, nnzOf, samePattern, type ComplexCsc } from './csc';
import { capacitanceMatrix, denseComplexSolveInPlace } from './dense-complex';
import { factor, type FactorOptions, type NumericLu } from './lu';
import { cachedRowAbsSums, multiplyInto, relativeResidual, scaledResidual, vectorNormInf } from './residual';
import { permuteColumns, permuteRows, lowerSolveInPlace, upperSolveInPlace, solve, assertVector } from './solve';
import {
  createSparseWorkspace,
  lowerSolveUnit,
  type SparseWorkspace,
  sparseDotDense,
  upperByRows,
  upperTransposeSolveUnit,
  type SparseVector,
} from './sparse-rhs';
import { analyse, type SymbolicLu } from './symbolic';
import { ComplexTriplets } from './triplets';

/** ΔY over m distinct nodes, row-major: delta[a·m + b] is added to Y(nodes[a], nodes[b]). */
export interface BlockUpdate {
  nodes: Int32Array;
  deltaRe: Float64Array;
  deltaIm: Float64Array;
}

export interface BlockSolveOptions {
  /** Largest accepted relative residual of the low-rank answer on base+Δ; default 1e-10. */
  residualTolerance?: number;
  /** Used when refactoring. */
  factorOptions?: FactorOptions;
}

export interface BlockSolveResult {
  re: Float64Array;
  im: Float64Array;
  residual: number;
  method: 'low-rank' | 'refactor';
}

export function assertBlockUpdate(n: number, update: BlockUpdate): void {
  const m = update.nodes.length;
  if (update.deltaRe.length !== m * m || update.deltaIm.length !== m * m) {
    throw new RangeError(`block update over ${m} nodes needs ${m * m} delta values, got ${update.deltaRe.length}/${update.deltaIm.length}`);
  }
  const seen = new Set<number>();
  for (let a = 0; a < m; a++) {
    const node = update.nodes[a];
    if (node < 0 || node >= n) throw new RangeError(`block update node ${node} (position ${a}) is outside 0..${n - 1}`);
    if (seen.has(node)) throw new RangeError(`block update lists node ${node} twice`);
    seen.add(node);
  }
  for (let t = 0; t < m * m; t++) {
    if (!Number.isFinite(update.deltaRe[t]) || !Number.isFinite(update.deltaIm[t])) {
      throw new RangeError(`block update delta at (${Math.floor(t / m)}, ${t % m}) is not finite`);
    }
  }
}

/**
 * base + P Δ Pᵀ. When every nonzero of Δ falls on the base pattern the result shares base's colPtr and rowIdx
 * (so samePattern is O(1) and the symbolic analysis applies); entries that cancel stay as explicit zeros.
 */
export function addBlock(base: ComplexCsc, update: BlockUpdate): ComplexCsc {
  const n = base.n;
  assertBlockUpdate(n, update);
  const { nodes, deltaRe, deltaIm } = update;
  const m = nodes.length;
  const positions = new Int32Array(m * m).fill(-1);
  let covered = true;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const t = a * m + b;
      if (deltaRe[t] === 0 && deltaIm[t] === 0) continue;
      positions[t] = findEntry(base, nodes[a], nodes[b]);
      if (positions[t] < 0) covered = false;
    }
  }
  if (covered) {
    const re = base.re.slice(0, nnzOf(base));
    const im = base.im.slice(0, nnzOf(base));
    for (let t = 0; t < m * m; t++) {
      if (positions[t] < 0) continue;
      re[positions[t]] += deltaRe[t];
      im[positions[t]] += deltaIm[t];
    }
    return { n, colPtr: base.colPtr, rowIdx: base.rowIdx, re, im };
  }
  const triplets = new ComplexTriplets(n, nnzOf(base) + m * m);
  for (let j = 0; j < n; j++) {
    for (let p = base.colPtr[j]; p < base.colPtr[j + 1]; p++) triplets.add(base.rowIdx[p], j, base.re[p], base.im[p]);
  }
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const t = a * m + b;
      if (deltaRe[t] !== 0 || deltaIm[t] !== 0) triplets.add(nodes[a], nodes[b], deltaRe[t], deltaIm[t]);
    }
  }
  return triplets.toCsc();
}

/** Relative residual of x on base+Δ, computed as A x + P Δ Pᵀ x without building base+Δ. */
export function blockResidual(
  base: ComplexCsc,
  update: BlockUpdate,
  x: { re: Float64Array; im: Float64Array },
  bRe: Float64Array,
  bIm: Float64Array,
  scratch?: { re: Float64Array; im: Float64Array },
): number {
  const { nodes, deltaRe, deltaIm } = update;
  const m = nodes.length;
  const r = scratch ?? { re: new Float64Array(base.n), im: new Float64Array(base.n) };
  multiplyInto(base, x.re, x.im, r.re, r.im);
  const sums = cachedRowAbsSums(base);
  // ||base+Δ||∞: rows outside the block keep their sums; the block's rows swap |A_ij| for |A_ij + Δ_ij|.
  const inBlock = new Set<number>(nodes);
  let norm = 0;
  for (let i = 0; i < sums.length; i++) if (sums[i] > norm && !inBlock.has(i)) norm = sums[i];
  for (let a = 0; a < m; a++) {
    const row = nodes[a];
    let sr = 0;
    let si = 0;
    let rowSum = sums[row];
    for (let b = 0; b < m; b++) {
      const t = a * m + b;
      const col = nodes[b];
      sr += deltaRe[t] * x.re[col] - deltaIm[t] * x.im[col];
      si += deltaRe[t] * x.im[col] + deltaIm[t] * x.re[col];
      const p = findEntry(base, row, col);
      const ar = p >= 0 ? base.re[p] : 0;
      const ai = p >= 0 ? base.im[p] : 0;
      rowSum += Math.hypot(ar + deltaRe[t], ai + deltaIm[t]) - Math.hypot(ar, ai);
    }
    if (rowSum > norm) norm = rowSum;
    r.re[row] += sr;
    r.im[row] += si;
  }
  for (let i = 0; i < base.n; i++) {
    r.re[i] -= bRe[i];
    r.im[i] -= bIm[i];
  }
  return scaledResidual(vectorNormInf(r.re, r.im), norm, x, bRe, bIm);
}

/**
 * Solves (base + P Δ Pᵀ) x = b with base's factors: x = A⁻¹(b − P z), (I + Δ G) z = Δ Pᵀ A⁻¹ b, G = Pᵀ A⁻¹ P.
 * G and Pᵀ A⁻¹ b come from unit-vector solves that only touch the reach of each node, so the whole update costs
 * about one full solve plus work proportional to the depth of the nodes in the elimination tree.
 */
export function solveWithBlockUpdate(
  lu: NumericLu,
  sym: SymbolicLu,
  base: ComplexCsc,
  update: BlockUpdate,
  bRe: Float64Array,
  bIm: Float64Array,
  options: BlockSolveOptions = {},
): BlockSolveResult {
  const n = lu.n;
  if (base.n !== n || sym.n !== n) throw new RangeError(`factors (n = ${n}), analysis (n = ${sym.n}) and base (n = ${base.n}) differ in size`);
  assertBlockUpdate(n, update);
  assertVector(n, bRe, bIm, 'right-hand side');
  const tolerance = options.residualTolerance ?? 1e-10;
  const { nodes, deltaRe, deltaIm } = update;

  const ws = createSparseWorkspace(n);
  const x = lowRankSolve(lu, ws, nodes, deltaRe, deltaIm, bRe, bIm);
  if (x) {
    const residual = blockResidual(base, update, x, bRe, bIm, ws); // ws's dense arrays are free again
    if (residual <= tolerance) return { re: x.re, im: x.im, residual, method: 'low-rank' };
  }

  const next = addBlock(base, update);
  const nextSym = samePattern(next, base) ? sym : analyse(next);
  const nextLu = factor(nextSym, next, options.factorOptions);
  const refactored = solve(nextLu, bRe, bIm);
  return { ...refactored, residual: relativeResidual(next, refactored, bRe, bIm), method: 'refactor' };
}

/** Below this share of its terms' size a pivot of I + ΔG has lost too many digits: refactor instead. */
const CAPACITANCE_PIVOT_FLOOR = 1e-8;

/** The Woodbury answer, or null when the m×m capacitance matrix is singular to working precision. */
function lowRankSolve(
  lu: NumericLu,
  ws: SparseWorkspace,
  nodes: Int32Array,
  deltaRe: Float64Array,
  deltaIm: Float64Array,
  bRe: Float64Array,
  bIm: Float64Array,
): { re: Float64Array; im: Float64Array } | null {
  const n = lu.n;
  const m = nodes.length;
  const rows = upperByRows(lu);
  const columns: SparseVector[] = []; // L⁻¹ P e_node: forward halves of A⁻¹ e_node
  const rowsOfInverse: SparseVector[] = []; // U⁻ᵀ e_k: x[node] = v · (U x) picks one unknown
  for (let a = 0; a < m; a++) {
    columns.push(lowerSolveUnit(lu, ws, lu.rowPivot[nodes[a]]));
    rowsOfInverse.push(upperTransposeSolveUnit(lu, rows, ws, lu.colOrderInverse[nodes[a]]));
  }

  // G[a][b] = (A⁻¹)(nodes[a], nodes[b]) = v_a · y_b.
  const gRe = new Float64Array(m * m);
  const gIm = new Float64Array(m * m);
  for (let b = 0; b < m; b++) {
    const y = columns[b];
    for (let t = 0; t < y.idx.length; t++) {
      ws.re[y.idx[t]] = y.re[t];
      ws.im[y.idx[t]] = y.im[t];
    }
    for (let a = 0; a < m; a++) {
      const g = sparseDotDense(rowsOfInverse[a], ws.re, ws.im);
      gRe[a * m + b] = g.re;
      gIm[a * m + b] = g.im;
    }
    for (let t = 0; t < y.idx.length; t++) {
      ws.re[y.idx[t]] = 0;
      ws.im[y.idx[t]] = 0;
    }
  }

  // c = L⁻¹ P b, and the base solution at the nodes, x0[nodes[a]] = v_a · c. The scratch arrays, all zero
  // after the unit solves, hold c (permuteRows writes every entry).
  const cRe = ws.re;
  const cIm = ws.im;
  permuteRows(lu, bRe, bIm, cRe, cIm);
  lowerSolveInPlace(lu, cRe, cIm);
  const x0Re = new Float64Array(m);
  const x0Im = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    const v = sparseDotDense(rowsOfInverse[a], cRe, cIm);
    x0Re[a] = v.re;
    x0Im[a] = v.im;
  }

  // (I + Δ G) z = Δ x0. Scale: the size of the terms before they cancel; a change that leaves part of the network
  // floating makes S singular by cancellation, and its Woodbury answer would be huge yet have a tiny residual.
  const { kRe: sRe, kIm: sIm, termScale } = capacitanceMatrix(m, deltaRe, deltaIm, gRe, gIm);
  const zRe = new Float64Array(m);
  const zIm = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      const dr = deltaRe[a * m + b];
      const di = deltaIm[a * m + b];
      zRe[a] += dr * x0Re[b] - di * x0Im[b];
      zIm[a] += dr * x0Im[b] + di * x0Re[b];
    }
  }
  if (!denseComplexSolveInPlace(m, sRe, sIm, zRe, zIm, CAPACITANCE_PIVOT_FLOOR * termScale)) return null;

  // x = U⁻¹ (c − Σ z_b y_b), then back to the original numbering.
  for (let b = 0; b < m; b++) {
    const y = columns[b];
    const zr = zRe[b];
    const zi = zIm[b];
    for (let t = 0; t < y.idx.length; t++) {
      const i = y.idx[t];
      cRe[i] -= zr * y.re[t] - zi * y.im[t];
      cIm[i] -= zr * y.im[t] + zi * y.re[t];
    }
  }
  upperSolveInPlace(lu, cRe, cIm);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  permuteColumns(lu, cRe, cIm, re, im);
  return { re, im };
}
