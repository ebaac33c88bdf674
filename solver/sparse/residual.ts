// Products and residuals: every solve reports ||A x − b||∞ / (||A||∞ ||x||∞ + ||b||∞).
import type { ComplexCsc } from './csc';
import type { ComplexVector } from './solve';

export function multiply(a: ComplexCsc, xRe: Float64Array, xIm: Float64Array): ComplexVector {
  const re = new Float64Array(a.n);
  const im = new Float64Array(a.n);
  multiplyInto(a, xRe, xIm, re, im);
  return { re, im };
}

/** out = A x, into caller's arrays (overwritten). */
export function multiplyInto(a: ComplexCsc, xRe: Float64Array, xIm: Float64Array, re: Float64Array, im: Float64Array): void {
  const { n, colPtr, rowIdx, re: aRe, im: aIm } = a;
  re.fill(0, 0, n);
  im.fill(0, 0, n);
  for (let j = 0; j < n; j++) {
    const xr = xRe[j];
    const xi = xIm[j];
    if (xr === 0 && xi === 0) continue;
    for (let p = colPtr[j], end = colPtr[j + 1]; p < end; p++) {
      const i = rowIdx[p];
      re[i] += aRe[p] * xr - aIm[p] * xi;
      im[i] += aRe[p] * xi + aIm[p] * xr;
    }
  }
}

// Row sums of a base matrix, kept by the identity of its arrays: every what-if over one base checks its residual
// against the same ||A||∞. Matrices are treated as immutable once built (edit values in place and this is stale).
const rowSumCache = new WeakMap<Float64Array, { im: Float64Array; rowIdx: Int32Array; sums: Float64Array }>();

/** Absolute row sums of A, shared between calls for the same arrays: do not modify the result. */
export function cachedRowAbsSums(a: ComplexCsc): Float64Array {
  const hit = rowSumCache.get(a.re);
  if (hit && hit.im === a.im && hit.rowIdx === a.rowIdx && hit.sums.length === a.n) return hit.sums;
  const sums = rowAbsSums(a);
  rowSumCache.set(a.re, { im: a.im, rowIdx: a.rowIdx, sums });
  return sums;
}

/** Absolute row sums of A (their maximum is ||A||∞). */
export function rowAbsSums(a: ComplexCsc): Float64Array {
  const sums = new Float64Array(a.n);
  const { colPtr, rowIdx, re, im } = a;
  for (let p = 0, nnz = colPtr[a.n]; p < nnz; p++) sums[rowIdx[p]] += Math.sqrt(re[p] * re[p] + im[p] * im[p]);
  return sums;
}

export function vectorNormInf(re: Float64Array, im: Float64Array): number {
  let m = 0;
  for (let i = 0; i < re.length; i++) {
    const v = re[i] * re[i] + im[i] * im[i];
    if (v > m) m = v;
  }
  return Math.sqrt(m);
}

export function maxOf(values: Float64Array): number {
  let m = 0;
  for (let i = 0; i < values.length; i++) if (values[i] > m) m = values[i];
  return m;
}

/** ||r||∞ / (||A||∞ ||x||∞ + ||b||∞), with r = A x − b already formed; 0 for a zero system. */
export function scaledResidual(rNormInf: number, aNormInf: number, x: ComplexVector, bRe: Float64Array, bIm: Float64Array): number {
  const denominator = aNormInf * vectorNormInf(x.re, x.im) + vectorNormInf(bRe, bIm);
  if (denominator === 0) return rNormInf === 0 ? 0 : Infinity;
  return rNormInf / denominator;
}

export function relativeResidual(a: ComplexCsc, x: ComplexVector, bRe: Float64Array, bIm: Float64Array): number {
  const ax = multiply(a, x.re, x.im);
  for (let i = 0; i < a.n; i++) {
    ax.re[i] -= bRe[i];
    ax.im[i] -= bIm[i];
  }
  return scaledResidual(vectorNormInf(ax.re, ax.im), maxOf(rowAbsSums(a)), x, bRe, bIm);
}
