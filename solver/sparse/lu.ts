// Numeric LU, left-looking (Gilbert–Peierls): each column is a sparse triangular solve with the columns of L
// found so far, its pattern given by a depth-first search; threshold partial pivoting prefers the diagonal.
import { assertCsc, type ComplexCsc } from './csc';
import { SingularMatrixError } from './errors';
import { rowsInOrder, type SymbolicLu } from './symbolic';

/**
 * P A Q = L U. L is unit lower triangular (strict part stored), U upper triangular (strict part stored,
 * diagonal apart); both are indexed by pivot position. nnzL and nnzU count their diagonals, as is usual,
 * so nnz(L+U) = nnzL + nnzU − n.
 */
export interface NumericLu {
  n: number;
  /** colOrder[k] = original column of pivot step k (from the symbolic analysis). */
  colOrder: Int32Array;
  colOrderInverse: Int32Array;
  /** rowPivot[i] = pivot step of original row i (the row permutation P as an inverse). */
  rowPivot: Int32Array;
  lColPtr: Int32Array;
  lRowIdx: Int32Array;
  lRe: Float64Array;
  lIm: Float64Array;
  uColPtr: Int32Array;
  uRowIdx: Int32Array;
  uRe: Float64Array;
  uIm: Float64Array;
  uDiagRe: Float64Array;
  uDiagIm: Float64Array;
  nnzL: number;
  nnzU: number;
  /** Steps whose pivot row is not the column's own row (0 for a diagonally dominant admittance matrix). */
  offDiagonalPivots: number;
  /** Bytes held by the L and U arrays. */
  bytes: number;
  /** Rows of U, built on first use by the low-rank update and kept with the factors. */
  upperByRows?: UpperByRows;
}

export interface UpperByRows {
  rowPtr: Int32Array;
  colIdx: Int32Array;
  re: Float64Array;
  im: Float64Array;
}

export interface FactorOptions {
  /**
   * A diagonal candidate is kept when |a_jj| ≥ pivotTolerance·max|a_ij| over the unpivoted rows. Default 0.1:
   * admittance matrices are diagonally dominant, so the diagonal is accepted and AMD's predicted fill holds,
   * while a stamp that is not (zero diagonal of a constraint row, strong unsymmetric coupling) still gets a
   * pivot whose growth is bounded by 1 + 1/0.1 = 11 per step rather than 1001 with 1e-3.
   */
  pivotTolerance?: number;
  /**
   * A column whose largest candidate pivot is at most singularTolerance·max|a_ij| (over the columns factorised so
   * far, this one included) is numerically singular. Default 1e-13: cancellation leaves about n·1e-16 relative.
   */
  singularTolerance?: number;
}

export const DEFAULT_PIVOT_TOLERANCE = 0.1;
export const DEFAULT_SINGULAR_TOLERANCE = 1e-13;

export function factor(sym: SymbolicLu, a: ComplexCsc, options: FactorOptions = {}): NumericLu {
  const analysedPattern = a.colPtr === sym.colPtr && a.rowIdx === sym.rowIdx;
  if (!analysedPattern) assertCsc(a); // the analysis validated its own pattern
  const n = a.n;
  if (sym.n !== n) throw new RangeError(`symbolic analysis is for n = ${sym.n}, matrix has n = ${n}`);
  const tol = options.pivotTolerance ?? DEFAULT_PIVOT_TOLERANCE;
  if (!(tol > 0 && tol <= 1)) throw new RangeError(`pivotTolerance must be in (0, 1], got ${tol}`);
  const singularTol = options.singularTolerance ?? DEFAULT_SINGULAR_TOLERANCE;
  if (!(singularTol >= 0)) throw new RangeError(`singularTolerance must be ≥ 0, got ${singularTol}`);

  const { colPtr: aP, rowIdx: aI, re: aRe, im: aIm } = a;
  const q = sym.colOrder;
  // Rows renamed to pivot-order positions, so that the work of nearby pivots lands on nearby memory and the
  // diagonal candidate of step k is row k. Precomputed by the analysis when the pattern arrays are the same.
  const rows = aI === sym.rowIdx ? sym.rowInOrder : rowsInOrder(a, sym.colOrderInverse);

  // Largest |a_ij| met so far (this column included): the scale of the singularity test, kept while scattering
  // rather than by a pass of its own over A, which would cost a tenth of the factorization.
  let maxAbs2 = 0;
  const singularTol2 = singularTol * singularTol;
  const tol2 = tol * tol;

  // Workspaces, once per call.
  const xRe = new Float64Array(n);
  const xIm = new Float64Array(n);
  const pivotOf = new Int32Array(n).fill(-1); // pivot step of each row (pivot-order numbering), -1 before
  const reach = new Int32Array(n); // reach[top..n) = the column's pattern in topological order
  const stack = new Int32Array(n);
  const cursor = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);

  let lCap = Math.max(16, sym.nnzLEstimate - n + (n >> 3));
  let uCap = Math.max(16, sym.nnzUEstimate - n + (n >> 3));
  const lColPtr = new Int32Array(n + 1);
  const uColPtr = new Int32Array(n + 1);
  let lRowIdx: Int32Array = new Int32Array(lCap);
  let lRe: Float64Array = new Float64Array(lCap);
  let lIm: Float64Array = new Float64Array(lCap);
  let uRowIdx: Int32Array = new Int32Array(uCap);
  let uRe: Float64Array = new Float64Array(uCap);
  let uIm: Float64Array = new Float64Array(uCap);
  const uDiagRe = new Float64Array(n);
  const uDiagIm = new Float64Array(n);
  let lnz = 0;
  let unz = 0;
  let offDiagonalPivots = 0;

  for (let k = 0; k < n; k++) {
    const col = q[k];

    // Pattern of L⁻¹·A(:,col): depth-first search from each row of the column through the columns of L.
    // While factorising, rows are numbered by their place in the column order (row i as colOrderInverse[i]),
    // becoming pivot steps at the end; a row not yet pivoted is a leaf of the search.
    let top = n;
    for (let p = aP[col]; p < aP[col + 1]; p++) {
      const start = rows[p];
      if (mark[start] === k) continue;
      mark[start] = k;
      const j0 = pivotOf[start];
      if (j0 < 0) {
        reach[--top] = start;
        continue;
      }
      let sp = 0;
      stack[0] = start;
      cursor[0] = lColPtr[j0];
      while (sp >= 0) {
        const i = stack[sp];
        const j = pivotOf[i];
        if (j >= 0) {
          const end = lColPtr[j + 1];
          let pp = cursor[sp];
          while (pp < end && mark[lRowIdx[pp]] === k) pp++;
          if (pp < end) {
            const r = lRowIdx[pp];
            cursor[sp] = pp + 1;
            mark[r] = k;
            stack[++sp] = r;
            const jr = pivotOf[r];
            cursor[sp] = jr >= 0 ? lColPtr[jr] : 0;
            continue;
          }
        }
        reach[--top] = i;
        sp--;
      }
    }

    // Grow L and U when this column could overflow them (its pattern bounds both parts).
    const patternSize = n - top;
    if (lnz + patternSize > lCap) {
      lCap = Math.max(2 * lCap, lnz + patternSize);
      lRowIdx = growInt(lRowIdx, lCap);
      lRe = growFloat(lRe, lCap);
      lIm = growFloat(lIm, lCap);
    }
    if (unz + patternSize > uCap) {
      uCap = Math.max(2 * uCap, unz + patternSize);
      uRowIdx = growInt(uRowIdx, uCap);
      uRe = growFloat(uRe, uCap);
      uIm = growFloat(uIm, uCap);
    }

    // Numeric sparse triangular solve; x is zero on the pattern before the scatter and after the column.
    for (let p = aP[col]; p < aP[col + 1]; p++) {
      const vr = aRe[p];
      const vi = aIm[p];
      const m2 = vr * vr + vi * vi;
      if (m2 > maxAbs2) maxAbs2 = m2;
      else if (!(m2 < Infinity)) throw new RangeError(`entry (${aI[p]}, ${col}) is not finite`);
      xRe[rows[p]] = vr;
      xIm[rows[p]] = vi;
    }
    if (!(maxAbs2 < Infinity)) throw new RangeError(`column ${col} has a non-finite entry`);
    for (let t = top; t < n; t++) {
      const i = reach[t];
      const j = pivotOf[i];
      if (j < 0) continue;
      const ur = xRe[i];
      const ui = xIm[i];
      xRe[i] = 0;
      xIm[i] = 0;
      uRowIdx[unz] = j;
      uRe[unz] = ur;
      uIm[unz] = ui;
      unz++;
      if (ur === 0 && ui === 0) continue;
      for (let pp = lColPtr[j], end = lColPtr[j + 1]; pp < end; pp++) {
        const r = lRowIdx[pp];
        const lr = lRe[pp];
        const li = lIm[pp];
        xRe[r] -= lr * ur - li * ui;
        xIm[r] -= lr * ui + li * ur;
      }
    }

    // Pivot: the largest unpivoted candidate, unless the diagonal is within the threshold of it.
    let pivotRow = -1;
    let best2 = -1;
    for (let t = top; t < n; t++) {
      const i = reach[t];
      if (pivotOf[i] >= 0) continue;
      const m2 = xRe[i] * xRe[i] + xIm[i] * xIm[i];
      if (m2 > best2) {
        best2 = m2;
        pivotRow = i;
      }
    }
    if (pivotRow === -1) throw new SingularMatrixError(col, 'structural', 'no unpivoted row has an entry in it');
    if (!(best2 > singularTol2 * maxAbs2)) {
      throw new SingularMatrixError(col, 'numerical', `largest candidate pivot is ${Math.sqrt(best2)}`);
    }
    if (pivotRow !== k && pivotOf[k] < 0 && mark[k] === k) {
      const d2 = xRe[k] * xRe[k] + xIm[k] * xIm[k];
      if (d2 >= tol2 * best2) pivotRow = k;
    }
    if (pivotRow !== k) offDiagonalPivots++;
    const pr = xRe[pivotRow];
    const pi = xIm[pivotRow];
    const pm2 = pr * pr + pi * pi;
    const invRe = pr / pm2;
    const invIm = -pi / pm2;
    uDiagRe[k] = pr;
    uDiagIm[k] = pi;
    pivotOf[pivotRow] = k;
    xRe[pivotRow] = 0;
    xIm[pivotRow] = 0;
    for (let t = top; t < n; t++) {
      const i = reach[t];
      if (pivotOf[i] >= 0) continue;
      const vr = xRe[i];
      const vi = xIm[i];
      lRowIdx[lnz] = i;
      lRe[lnz] = vr * invRe - vi * invIm;
      lIm[lnz] = vr * invIm + vi * invRe;
      lnz++;
      xRe[i] = 0;
      xIm[i] = 0;
    }
    lColPtr[k + 1] = lnz;
    uColPtr[k + 1] = unz;
  }

  // Rows of L to pivot steps, so that solves need no permutation inside the loops; P as original row → step.
  for (let p = 0; p < lnz; p++) lRowIdx[p] = pivotOf[lRowIdx[p]];
  const rowPivot = new Int32Array(n);
  for (let i = 0; i < n; i++) rowPivot[i] = pivotOf[sym.colOrderInverse[i]];

  const lu: NumericLu = {
    n,
    colOrder: q,
    colOrderInverse: sym.colOrderInverse,
    rowPivot,
    lColPtr,
    lRowIdx: trimInt(lRowIdx, lnz),
    lRe: trimFloat(lRe, lnz),
    lIm: trimFloat(lIm, lnz),
    uColPtr,
    uRowIdx: trimInt(uRowIdx, unz),
    uRe: trimFloat(uRe, unz),
    uIm: trimFloat(uIm, unz),
    uDiagRe,
    uDiagIm,
    nnzL: lnz + n,
    nnzU: unz + n,
    offDiagonalPivots,
    bytes: 0,
  };
  lu.bytes =
    lu.lRowIdx.byteLength + lu.lRe.byteLength + lu.lIm.byteLength + lColPtr.byteLength +
    lu.uRowIdx.byteLength + lu.uRe.byteLength + lu.uIm.byteLength + uColPtr.byteLength +
    uDiagRe.byteLength + uDiagIm.byteLength + rowPivot.byteLength;
  return lu;
}

function growInt(a: Int32Array, cap: number): Int32Array {
  const b = new Int32Array(cap);
  b.set(a);
  return b;
}

function growFloat(a: Float64Array, cap: number): Float64Array {
  const b = new Float64Array(cap);
  b.set(a);
  return b;
}

// Give slack back only when it is worth a copy.
function trimInt(a: Int32Array, used: number): Int32Array {
  return a.length > used + (used >> 3) + 64 ? a.slice(0, used) : a;
}

function trimFloat(a: Float64Array, used: number): Float64Array {
  return a.length > used + (used >> 3) + 64 ? a.slice(0, used) : a;
}
