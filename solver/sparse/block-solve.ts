// Triangular solves of several right-hand sides at once. The block is interleaved (entry i of column b at
// 2(i·width + b), its imaginary part next to it), so each stored entry of L or U is read once for all the columns
// and the columns it meets sit in one run of memory: on a sheet of a few thousand
// unknowns that halves the cost per column against solving them one at a time, which a sweep of thousands of
// openings feels.
import type { NumericLu } from './lu';

/**
 * Weights by pivot step, and per column the sum Σ_k v_k y_k that the forward substitution forms as it goes. Given
 * v = U⁻ᵀ g (upperTransposeSolve), that sum is g·(U⁻¹ y): the weighted sum of the finished solve, read from the
 * forward result, which for an opening's pair of unit entries is nonzero on a few dozen rows only.
 */
export interface StepWeights {
  re: Float64Array;
  im: Float64Array;
  sumRe: Float64Array;
  sumIm: Float64Array;
}

/**
 * Y ← L⁻¹ Y for an interleaved block of `width` columns; a row that is zero in every column is skipped. Each
 * weighting given gets Σ_j v_j y_j per column, taken while row j is final (see StepWeights). Given the rows where
 * Y starts nonzero, the rows reached are marked as the elimination goes instead of each row being read for zeros
 * (an opening's pair of unit entries reaches a few dozen of thousands).
 */
export function lowerSolveBlockInPlace(
  lu: NumericLu,
  y: Float64Array,
  width: number,
  firstRow = 0,
  weights: readonly StepWeights[] = [],
  seedRows?: readonly number[],
): void {
  const { n, lColPtr, lRowIdx, lRe, lIm } = lu;
  const w2 = 2 * width;
  for (const w of weights) {
    w.sumRe.fill(0, 0, width);
    w.sumIm.fill(0, 0, width);
  }
  let reached: Uint8Array | undefined;
  if (seedRows) {
    reached = new Uint8Array(n);
    for (const r of seedRows) reached[r] = 1;
  }
  for (let j = firstRow; j < n; j++) {
    const jb = j * w2;
    if (reached) {
      if (reached[j] === 0) continue;
    } else {
      let any = false;
      for (let o = 0; o < w2; o++) {
        if (y[jb + o] !== 0) {
          any = true;
          break;
        }
      }
      if (!any) continue;
    }
    for (const w of weights) {
      const wr = w.re[j];
      const wi = w.im[j];
      const { sumRe, sumIm } = w;
      for (let b = 0; b < width; b++) {
        const vr = y[jb + 2 * b];
        const vi = y[jb + 2 * b + 1];
        sumRe[b] += wr * vr - wi * vi;
        sumIm[b] += wr * vi + wi * vr;
      }
    }
    for (let p = lColPtr[j], end = lColPtr[j + 1]; p < end; p++) {
      const row = lRowIdx[p];
      if (reached) reached[row] = 1;
      const rb = row * w2;
      const lr = lRe[p];
      const li = lIm[p];
      for (let o = 0; o < w2; o += 2) {
        const vr = y[jb + o];
        const vi = y[jb + o + 1];
        y[rb + o] -= lr * vr - li * vi;
        y[rb + o + 1] -= lr * vi + li * vr;
      }
    }
  }
}

/** v with Uᵀ v = g (g and v by pivot step): the weights under which a forward result reads g·(U⁻¹ y). */
export function upperTransposeSolve(lu: NumericLu, gRe: Float64Array, gIm: Float64Array): { re: Float64Array; im: Float64Array } {
  const { n, uColPtr, uRowIdx, uRe, uIm, uDiagRe, uDiagIm } = lu;
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  // Column k of U is row k of Uᵀ: its entries above the diagonal meet the v already found.
  for (let k = 0; k < n; k++) {
    let sr = gRe[k];
    let si = gIm[k];
    for (let p = uColPtr[k], end = uColPtr[k + 1]; p < end; p++) {
      const i = uRowIdx[p];
      sr -= uRe[p] * re[i] - uIm[p] * im[i];
      si -= uRe[p] * im[i] + uIm[p] * re[i];
    }
    const dr = uDiagRe[k];
    const di = uDiagIm[k];
    const d2 = dr * dr + di * di;
    re[k] = (sr * dr + si * di) / d2;
    im[k] = (si * dr - sr * di) / d2;
  }
  return { re, im };
}

/** Y ← U⁻¹ Y for an interleaved block of `width` columns (column by column of U from the last). */
export function upperSolveBlockInPlace(lu: NumericLu, y: Float64Array, width: number): void {
  const { n, uColPtr, uRowIdx, uRe, uIm, uDiagRe, uDiagIm } = lu;
  const w2 = 2 * width;
  for (let k = n - 1; k >= 0; k--) {
    const dr = uDiagRe[k];
    const di = uDiagIm[k];
    const d2 = dr * dr + di * di;
    const ir = dr / d2;
    const ii = -di / d2;
    const kb = k * w2;
    for (let o = kb, stop = kb + w2; o < stop; o += 2) {
      const yr = y[o];
      const yi = y[o + 1];
      y[o] = yr * ir - yi * ii;
      y[o + 1] = yr * ii + yi * ir;
    }
    for (let p = uColPtr[k], end = uColPtr[k + 1]; p < end; p++) {
      const rb = uRowIdx[p] * w2;
      const ur = uRe[p];
      const ui = uIm[p];
      for (let o = 0; o < w2; o += 2) {
        const vr = y[kb + o];
        const vi = y[kb + o + 1];
        y[rb + o] -= ur * vr - ui * vi;
        y[rb + o + 1] -= ur * vi + ui * vr;
      }
    }
  }
}
