// The probed residual against the exact one: mathjs forms A x − b densely (an independent product), and the
// probes' reading must follow it: small for a true answer, and far above the sweep's tolerance for an answer with
// one wrong entry.
import { complex, multiply, subtract, abs, type Complex as MComplex, matrix, zeros, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { ResidualProbes } from '../../solver/studies/residual-probes';
import { OPENING_RESIDUAL_TOLERANCE } from '../../solver/studies/opening-solver';
import { analyse } from '../../solver/sparse/symbolic';
import { factor } from '../../solver/sparse/lu';
import { solve } from '../../solver/sparse/solve';
import type { ComplexCsc } from '../../solver/linear-system';

/** A small admittance-like matrix (a ring with shunts), our own figures. */
function ring(n: number): ComplexCsc {
  const cols: { r: number; re: number; im: number }[][] = Array.from({ length: n }, () => []);
  for (let j = 0; j < n; j++) {
    const k = (j + 1) % n;
    cols[j].push({ r: j, re: 3 + 0.1 * j, im: -4 });
    cols[j].push({ r: k, re: -1, im: 2 });
    cols[k].push({ r: j, re: -1, im: 2 });
  }
  const colPtr = new Int32Array(n + 1);
  const entries = cols.map((c) => c.sort((a, b) => a.r - b.r));
  entries.forEach((c, j) => (colPtr[j + 1] = colPtr[j] + c.length));
  const flat = entries.flat();
  return { n, colPtr, rowIdx: Int32Array.from(flat, (e) => e.r), re: Float64Array.from(flat, (e) => e.re), im: Float64Array.from(flat, (e) => e.im) };
}

function exactResidual(a: ComplexCsc, x: { re: Float64Array; im: Float64Array }, bRe: Float64Array, bIm: Float64Array): number {
  const dense = zeros(a.n, a.n) as Matrix;
  for (let j = 0; j < a.n; j++) for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) dense.set([a.rowIdx[p], j], complex(a.re[p], a.im[p]));
  const xv = matrix([...x.re].map((re, i) => [complex(re, x.im[i])]));
  const bv = matrix([...bRe].map((re, i) => [complex(re, bIm[i])]));
  const r = subtract(multiply(dense, xv), bv) as Matrix;
  let worst = 0;
  r.forEach((v) => (worst = Math.max(worst, abs(v as MComplex) as unknown as number)));
  return worst;
}

describe('residual probes', () => {
  const n = 40;
  const a = ring(n);
  const lu = factor(analyse(a), a);
  const bRe = Float64Array.from({ length: n }, (_, i) => Math.sin(i));
  const bIm = Float64Array.from({ length: n }, (_, i) => Math.cos(2 * i));
  const x0 = solve(lu, bRe, bIm);
  const probes = new ResidualProbes(a, lu, bRe, bIm, x0, 1);
  const rowSums = new Float64Array(n);
  for (let p = 0; p < a.colPtr[n]; p++) rowSums[a.rowIdx[p]] += Math.hypot(a.re[p], a.im[p]);
  const aNorm = Math.max(...rowSums);
  const xMax = Math.max(...[...x0.re].map((re, i) => Math.hypot(re, x0.im[i])));
  const none = () => ({ re: 0, im: 0 });
  const dotsOf = (w: { re: Float64Array; im: Float64Array }) => {
    // g·W for one column W, as the block's forward substitution forms it: the weights are U⁻ᵀg by pivot step and
    // meet the forward result L⁻¹u = U W (W by pivot step)
    const y = { re: new Float64Array(n), im: new Float64Array(n) };
    lu.colOrder.forEach((c, k) => {
      y.re[k] = w.re[c];
      y.im[k] = w.im[c];
    });
    const uw = { re: new Float64Array(n), im: new Float64Array(n) };
    for (let k = 0; k < n; k++) {
      uw.re[k] += lu.uDiagRe[k] * y.re[k] - lu.uDiagIm[k] * y.im[k];
      uw.im[k] += lu.uDiagRe[k] * y.im[k] + lu.uDiagIm[k] * y.re[k];
      for (let p = lu.uColPtr[k]; p < lu.uColPtr[k + 1]; p++) {
        const i = lu.uRowIdx[p];
        uw.re[i] += lu.uRe[p] * y.re[k] - lu.uIm[p] * y.im[k];
        uw.im[i] += lu.uRe[p] * y.im[k] + lu.uIm[p] * y.re[k];
      }
    }
    const weights = probes.weights();
    for (const v of weights) {
      v.sumRe[0] = 0;
      v.sumIm[0] = 0;
      for (let k = 0; k < n; k++) {
        v.sumRe[0] += v.re[k] * uw.re[k] - v.im[k] * uw.im[k];
        v.sumIm[0] += v.re[k] * uw.im[k] + v.im[k] * uw.re[k];
      }
    }
    return weights;
  };

  it('reads a true answer as small', () => {
    const zero = { re: new Float64Array(n), im: new Float64Array(n) };
    const reading = probes.relativeResidual(dotsOf(zero), 0, 1, new Float64Array(1), new Float64Array(1), xMax, aNorm, none);
    expect(reading).toBeLessThan(1e-14);
    expect(exactResidual(a, x0, bRe, bIm)).toBeLessThan(1e-12);
  });

  it('reads an answer off by 1e-6 in one entry far above the tolerance, and near the exact residual', () => {
    // x = x0 − W t with W = e_17 and t = 1e-6: one entry wrong
    const w = { re: new Float64Array(n), im: new Float64Array(n) };
    w.re[17] = 1;
    const t = Float64Array.of(1e-6);
    const reading = probes.relativeResidual(dotsOf(w), 0, 1, t, new Float64Array(1), xMax, aNorm, none);
    const x = { re: x0.re.slice(), im: x0.im.slice() };
    x.re[17] -= 1e-6;
    const exact = exactResidual(a, x, bRe, bIm) / (aNorm * xMax + Math.max(...[...bRe].map((re, i) => Math.hypot(re, bIm[i]))));
    expect(reading).toBeGreaterThan(100 * OPENING_RESIDUAL_TOLERANCE);
    // one standard-normal probe pair reads ||r||₂ within a factor of a few hundred either way with near certainty
    expect(reading / exact).toBeGreaterThan(1 / 300);
    expect(reading / exact).toBeLessThan(300);
  });
});
