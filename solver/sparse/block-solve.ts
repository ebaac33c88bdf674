// Triangular solves of several right-hand sides at once. The block is interleaved (entry i of column b at
// i·width + b), so each stored entry of L or U is read once for all the columns: on a sheet of a few thousand
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
 * weighting given gets Σ_j v_j y_j per column, taken while row j is final (see StepWeights).
 */
export function lowerSolveBlockInPlace(
  lu: NumericLu,
  yRe: Float64Array,
  yIm: Float64Array,
  width: number,
  firstRow = 0,
  weights: readonly StepWeights[] = [],
): void {
  const { n, lColPtr, lRowIdx, lRe, lIm } = lu;
  for (const w of weights) {
    w.sumRe.fill(0, 0, width);
    w.sumIm.fill(0, 0, width);
  }
  for (let j = firstRow; j < n; j++) {
    const jb = j * width;
    let any = false;
    for (let b = 0; b < width; b++) {
      if (yRe[jb + b] !== 0 || yIm[jb + b] !== 0) {
        any = true;
        break;
      }
    }
    if (!any) continue;
    for (const w of weights) {
      const wr = w.re[j];
      const wi = w.im[j];
      const { sumRe, sumIm } = w;
      for (let b = 0; b < width; b++) {
        const vr = yRe[jb + b];
        const vi = yIm[jb + b];
        sumRe[b] += wr * vr - wi * vi;
        sumIm[b] += wr * vi + wi * vr;
      }
    }
    for (let p = lColPtr[j], end = lColPtr[j + 1]; p < end; p++) {
      const rb = lRowIdx[p] * width;
      const lr = lRe[p];
      const li = lIm[p];
      for (let b = 0; b < width; b++) {
        const vr = yRe[jb + b];
        const vi = yIm[jb + b];
        yRe[rb + b] -= lr * vr - li * vi;
        yIm[rb + b] -= lr * vi + li * vr;
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
export function upperSolveBlockInPlace(lu: NumericLu, yRe: Float64Array, yIm: Float64Array, width: number): void {
  const { n, uColPtr, uRowIdx, uRe, uIm, uDiagRe, uDiagIm } = lu;
  for (let k = n - 1; k >= 0; k--) {
    const dr = uDiagRe[k];
    const di = uDiagIm[k];
    const d2 = dr * dr + di * di;
    const ir = dr / d2;
    const ii = -di / d2;
    const kb = k * width;
    for (let b = 0; b < width; b++) {
      const yr = yRe[kb + b];
      const yi = yIm[kb + b];
      yRe[kb + b] = yr * ir - yi * ii;
      yIm[kb + b] = yr * ii + yi * ir;
    }
    for (let p = uColPtr[k], end = uColPtr[k + 1]; p < end; p++) {
      const rb = uRowIdx[p] * width;
      const ur = uRe[p];
      const ui = uIm[p];
      for (let b = 0; b < width; b++) {
        const vr = yRe[kb + b];
        const vi = yIm[kb + b];
        yRe[rb + b] -= ur * vr - ui * vi;
        yIm[rb + b] -= ur * vi + ui * vr;
      }
    }
  }
}
