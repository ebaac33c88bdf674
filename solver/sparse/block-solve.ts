// Triangular solves of several right-hand sides at once. The block is interleaved (entry i of column b at
// i·width + b), so each stored entry of L or U is read once for all the columns: on a sheet of a few thousand
// unknowns that halves the cost per column against solving them one at a time, which a sweep of thousands of
// openings feels.
import type { NumericLu } from './lu';

/** Y ← L⁻¹ Y for an interleaved block of `width` columns; a row that is zero in every column is skipped. */
export function lowerSolveBlockInPlace(lu: NumericLu, yRe: Float64Array, yIm: Float64Array, width: number, firstRow = 0): void {
  const { n, lColPtr, lRowIdx, lRe, lIm } = lu;
  for (let j = firstRow; j < n; j++) {
    const start = lColPtr[j];
    const end = lColPtr[j + 1];
    if (start === end) continue;
    const jb = j * width;
    let any = false;
    for (let b = 0; b < width; b++) {
      if (yRe[jb + b] !== 0 || yIm[jb + b] !== 0) {
        any = true;
        break;
      }
    }
    if (!any) continue;
    for (let p = start; p < end; p++) {
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

/** Weights by pivot step, and per column the sum Σ_k w_k y_k that the back substitution forms as it goes. */
export interface StepWeights {
  re: Float64Array;
  im: Float64Array;
  sumRe: Float64Array;
  sumIm: Float64Array;
}

/**
 * Y ← U⁻¹ Y for an interleaved block of `width` columns (column by column of U from the last). Each weighting
 * given gets Σ_k w_k y_k per column, taken while row k is fresh from its division (a later pass over the block
 * would read it all again).
 */
export function upperSolveBlockInPlace(lu: NumericLu, yRe: Float64Array, yIm: Float64Array, width: number, weights: readonly StepWeights[] = []): void {
  const { n, uColPtr, uRowIdx, uRe, uIm, uDiagRe, uDiagIm } = lu;
  for (const w of weights) {
    w.sumRe.fill(0, 0, width);
    w.sumIm.fill(0, 0, width);
  }
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
    for (const w of weights) {
      const wr = w.re[k];
      const wi = w.im[k];
      const { sumRe, sumIm } = w;
      for (let b = 0; b < width; b++) {
        const vr = yRe[kb + b];
        const vi = yIm[kb + b];
        sumRe[b] += wr * vr - wi * vi;
        sumIm[b] += wr * vi + wi * vr;
      }
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
