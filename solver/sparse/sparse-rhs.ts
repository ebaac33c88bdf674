// Triangular solves whose right-hand side is one unit vector: only the reach of that entry is touched, so a
// column or row of A⁻¹ restricted to a few nodes costs the depth of the elimination tree, not a full solve.
import type { NumericLu, UpperByRows } from './lu';

/** Entries at pivot positions idx[t] with values (re[t], im[t]). */
export interface SparseVector {
  idx: Int32Array;
  re: Float64Array;
  im: Float64Array;
}

export interface SparseWorkspace {
  mark: Int32Array;
  stamp: number;
  stack: Int32Array;
  cursor: Int32Array;
  reach: Int32Array;
  /** Dense scratch values, kept all zero between uses. */
  re: Float64Array;
  im: Float64Array;
}

export function createSparseWorkspace(n: number): SparseWorkspace {
  return {
    mark: new Int32Array(n), // stamps start at 1
    stamp: 0,
    stack: new Int32Array(n),
    cursor: new Int32Array(n),
    reach: new Int32Array(n),
    re: new Float64Array(n),
    im: new Float64Array(n),
  };
}

/** Rows of the strict upper part of U: the graph of Uᵀ for transposed solves. Cached on the factors. */
export function upperByRows(lu: NumericLu): UpperByRows {
  if (lu.upperByRows) return lu.upperByRows;
  const { n, uColPtr, uRowIdx, uRe, uIm } = lu;
  const nnz = uColPtr[n];
  const rowPtr = new Int32Array(n + 1);
  for (let p = 0; p < nnz; p++) rowPtr[uRowIdx[p] + 1]++;
  for (let i = 0; i < n; i++) rowPtr[i + 1] += rowPtr[i];
  const fill = rowPtr.slice(0, n);
  const colIdx = new Int32Array(nnz);
  const re = new Float64Array(nnz);
  const im = new Float64Array(nnz);
  for (let k = 0; k < n; k++) {
    for (let p = uColPtr[k]; p < uColPtr[k + 1]; p++) {
      const d = fill[uRowIdx[p]]++;
      colIdx[d] = k;
      re[d] = uRe[p];
      im[d] = uIm[p];
    }
  }
  lu.upperByRows = { rowPtr, colIdx, re, im };
  return lu.upperByRows;
}

/** Depth-first search from s along edges t → idx[ptr[t]..ptr[t+1]); returns top, the reach in ws.reach[top..n). */
function reachFrom(ptr: Int32Array, idx: Int32Array, s: number, ws: SparseWorkspace): number {
  const { mark, stack, cursor, reach } = ws;
  const stamp = ++ws.stamp;
  let top = reach.length;
  mark[s] = stamp;
  let sp = 0;
  stack[0] = s;
  cursor[0] = ptr[s];
  while (sp >= 0) {
    const t = stack[sp];
    const end = ptr[t + 1];
    let p = cursor[sp];
    while (p < end && mark[idx[p]] === stamp) p++;
    if (p < end) {
      const r = idx[p];
      cursor[sp] = p + 1;
      mark[r] = stamp;
      stack[++sp] = r;
      cursor[sp] = ptr[r];
      continue;
    }
    reach[--top] = t;
    sp--;
  }
  return top;
}

function gather(ws: SparseWorkspace, top: number): SparseVector {
  const count = ws.reach.length - top;
  const idx = ws.reach.slice(top);
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  for (let t = 0; t < count; t++) {
    const i = idx[t];
    re[t] = ws.re[i];
    im[t] = ws.im[i];
    ws.re[i] = 0;
    ws.im[i] = 0;
  }
  return { idx, re, im };
}

/** L⁻¹ e_s. */
export function lowerSolveUnit(lu: NumericLu, ws: SparseWorkspace, s: number): SparseVector {
  const { lColPtr, lRowIdx, lRe, lIm } = lu;
  const top = reachFrom(lColPtr, lRowIdx, s, ws);
  const { reach, re: xRe, im: xIm } = ws;
  xRe[s] = 1;
  for (let t = top; t < reach.length; t++) {
    const j = reach[t];
    const vr = xRe[j];
    const vi = xIm[j];
    if (vr === 0 && vi === 0) continue;
    for (let p = lColPtr[j], end = lColPtr[j + 1]; p < end; p++) {
      const r = lRowIdx[p];
      xRe[r] -= lRe[p] * vr - lIm[p] * vi;
      xIm[r] -= lRe[p] * vi + lIm[p] * vr;
    }
  }
  return gather(ws, top);
}

/** U⁻ᵀ e_k (plain transpose, not conjugate). */
export function upperTransposeSolveUnit(lu: NumericLu, rows: UpperByRows, ws: SparseWorkspace, k: number): SparseVector {
  const { rowPtr, colIdx, re: uRe, im: uIm } = rows;
  const { uDiagRe, uDiagIm } = lu;
  const top = reachFrom(rowPtr, colIdx, k, ws);
  const { reach, re: xRe, im: xIm } = ws;
  xRe[k] = 1;
  for (let t = top; t < reach.length; t++) {
    const j = reach[t];
    const dr = uDiagRe[j];
    const di = uDiagIm[j];
    const d2 = dr * dr + di * di;
    const yr = xRe[j];
    const yi = xIm[j];
    const vr = (yr * dr + yi * di) / d2;
    const vi = (yi * dr - yr * di) / d2;
    xRe[j] = vr;
    xIm[j] = vi;
    if (vr === 0 && vi === 0) continue;
    for (let p = rowPtr[j], end = rowPtr[j + 1]; p < end; p++) {
      const c = colIdx[p];
      xRe[c] -= uRe[p] * vr - uIm[p] * vi;
      xIm[c] -= uRe[p] * vi + uIm[p] * vr;
    }
  }
  return gather(ws, top);
}

/** Σ v[t]·d[v.idx[t]] with d dense (plain product, no conjugation). */
export function sparseDotDense(v: SparseVector, dRe: Float64Array, dIm: Float64Array): { re: number; im: number } {
  let sr = 0;
  let si = 0;
  for (let t = 0; t < v.idx.length; t++) {
    const i = v.idx[t];
    sr += v.re[t] * dRe[i] - v.im[t] * dIm[i];
    si += v.re[t] * dIm[i] + v.im[t] * dRe[i];
  }
  return { re: sr, im: si };
}
