// Solving with the factors: permute, forward substitution with L, back substitution with U, permute back.
import type { NumericLu } from './lu';

export interface ComplexVector {
  re: Float64Array;
  im: Float64Array;
}

/** y = P b: row i of b goes to its pivot position. */
export function permuteRows(lu: NumericLu, bRe: Float64Array, bIm: Float64Array, yRe: Float64Array, yIm: Float64Array): void {
  const pivot = lu.rowPivot;
  for (let i = 0; i < lu.n; i++) {
    const k = pivot[i];
    yRe[k] = bRe[i];
    yIm[k] = bIm[i];
  }
}

/** y ← L⁻¹ y (L unit lower triangular, column by column). */
export function lowerSolveInPlace(lu: NumericLu, yRe: Float64Array, yIm: Float64Array): void {
  const { n, lColPtr, lRowIdx, lRe, lIm } = lu;
  for (let j = 0; j < n; j++) {
    const vr = yRe[j];
    const vi = yIm[j];
    if (vr === 0 && vi === 0) continue;
    for (let p = lColPtr[j], end = lColPtr[j + 1]; p < end; p++) {
      const r = lRowIdx[p];
      const lr = lRe[p];
      const li = lIm[p];
      yRe[r] -= lr * vr - li * vi;
      yIm[r] -= lr * vi + li * vr;
    }
  }
}

/** y ← U⁻¹ y (column by column from the last). */
export function upperSolveInPlace(lu: NumericLu, yRe: Float64Array, yIm: Float64Array): void {
  const { n, uColPtr, uRowIdx, uRe, uIm, uDiagRe, uDiagIm } = lu;
  for (let k = n - 1; k >= 0; k--) {
    const dr = uDiagRe[k];
    const di = uDiagIm[k];
    const d2 = dr * dr + di * di;
    const yr = yRe[k];
    const yi = yIm[k];
    const vr = (yr * dr + yi * di) / d2;
    const vi = (yi * dr - yr * di) / d2;
    yRe[k] = vr;
    yIm[k] = vi;
    if (vr === 0 && vi === 0) continue;
    for (let p = uColPtr[k], end = uColPtr[k + 1]; p < end; p++) {
      const r = uRowIdx[p];
      const ur = uRe[p];
      const ui = uIm[p];
      yRe[r] -= ur * vr - ui * vi;
      yIm[r] -= ur * vi + ui * vr;
    }
  }
}

/** x = Q y: pivot step k holds original unknown colOrder[k]. */
export function permuteColumns(lu: NumericLu, yRe: Float64Array, yIm: Float64Array, xRe: Float64Array, xIm: Float64Array): void {
  const q = lu.colOrder;
  for (let k = 0; k < lu.n; k++) {
    xRe[q[k]] = yRe[k];
    xIm[q[k]] = yIm[k];
  }
}

export function assertVector(n: number, re: Float64Array, im: Float64Array, what: string): void {
  if (re.length !== n || im.length !== n) {
    throw new RangeError(`${what} has lengths ${re.length}/${im.length}, expected ${n}`);
  }
  for (let i = 0; i < n; i++) {
    if (!Number.isFinite(re[i]) || !Number.isFinite(im[i])) throw new RangeError(`${what}[${i}] is not finite`);
  }
}

/** Solves A x = b with the factors of A. */
export function solve(lu: NumericLu, bRe: Float64Array, bIm: Float64Array): ComplexVector {
  const n = lu.n;
  assertVector(n, bRe, bIm, 'right-hand side');
  const yRe = new Float64Array(n);
  const yIm = new Float64Array(n);
  permuteRows(lu, bRe, bIm, yRe, yIm);
  lowerSolveInPlace(lu, yRe, yIm);
  upperSolveInPlace(lu, yRe, yIm);
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  permuteColumns(lu, yRe, yIm, re, im);
  return { re, im };
}
