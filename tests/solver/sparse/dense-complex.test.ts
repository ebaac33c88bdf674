// The small dense complex solve (a low-rank update's capacitance system) against mathjs lusolve: factored once and
// used for several right-hand sides, and in one call; a singular matrix is refused, not answered.
import { complex, lusolve, matrix, type Complex as MComplex, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { denseComplexFactor, denseComplexSolveFactored, denseComplexSolveInPlace } from '../../../solver/sparse/dense-complex';
import { mulberry32 } from './helpers';

describe('dense complex solve', () => {
  const m = 6;
  const rng = mulberry32(61);
  // a first column of zeros above the last row forces row swaps
  const re = Float64Array.from({ length: m * m }, (_, t) => (t % m === 0 && t < m * (m - 1) ? 0 : rng() - 0.5));
  const im = Float64Array.from({ length: m * m }, (_, t) => (t % m === 0 && t < m * (m - 1) ? 0 : rng() - 0.5));
  const dense = matrix(Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, j) => complex(re[i * m + j], im[i * m + j]))));

  it('matches mathjs for three right-hand sides through one factorization, and in one call', () => {
    const fRe = re.slice();
    const fIm = im.slice();
    const pivots = denseComplexFactor(m, fRe, fIm, 1e-12);
    expect(pivots).toBeDefined();
    expect([...pivots!].some((p, k) => p !== k)).toBe(true);
    for (let r = 0; r < 3; r++) {
      const bRe = Float64Array.from({ length: m }, () => rng());
      const bIm = Float64Array.from({ length: m }, () => rng());
      // source: mathjs lusolve, an independent dense LU
      const x = lusolve(dense, matrix([...bRe].map((v, i) => [complex(v, bIm[i])]))) as Matrix;
      const zRe = bRe.slice();
      const zIm = bIm.slice();
      denseComplexSolveFactored(m, fRe, fIm, pivots!, zRe, zIm);
      const oRe = bRe.slice();
      const oIm = bIm.slice();
      expect(denseComplexSolveInPlace(m, re.slice(), im.slice(), oRe, oIm, 1e-12)).toBe(true);
      for (let i = 0; i < m; i++) {
        const v = x.get([i, 0]) as MComplex;
        expect(Math.hypot(zRe[i] - v.re, zIm[i] - v.im), `factored ${i}: ${zRe[i]} ${zIm[i]} vs ${v.re} ${v.im}`).toBeLessThan(1e-10);
        expect(Math.hypot(oRe[i] - v.re, oIm[i] - v.im), `one call ${i}`).toBeLessThan(1e-10);
      }
    }
  });

  it('refuses a matrix whose rows are dependent', () => {
    const sRe = re.slice();
    const sIm = im.slice();
    for (let j = 0; j < m; j++) {
      sRe[(m - 1) * m + j] = 2 * sRe[(m - 2) * m + j];
      sIm[(m - 1) * m + j] = 2 * sIm[(m - 2) * m + j];
    }
    expect(denseComplexFactor(m, sRe.slice(), sIm.slice(), 1e-9)).toBeUndefined();
    expect(denseComplexSolveInPlace(m, sRe, sIm, new Float64Array(m), new Float64Array(m), 1e-9)).toBe(false);
  });
});
