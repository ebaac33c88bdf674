// One symbolic analysis, many numeric factorizations: new values on the same pattern.
import { describe, expect, it } from 'vitest';
import { analyse, factor, solve, type ComplexCsc } from '../../../solver/sparse';
import { mathjsSolve, mulberry32, randomNetwork, randomVector, relativeDifference, uniform } from './helpers';

/** Same pattern arrays, each value scaled by a random complex factor. */
function newValues(a: ComplexCsc, rng: () => number): ComplexCsc {
  const re = new Float64Array(a.re.length);
  const im = new Float64Array(a.im.length);
  for (let p = 0; p < re.length; p++) {
    const fr = uniform(rng, 0.5, 2);
    const fi = uniform(rng, -0.3, 0.3);
    re[p] = a.re[p] * fr - a.im[p] * fi;
    im[p] = a.re[p] * fi + a.im[p] * fr;
  }
  return { n: a.n, colPtr: a.colPtr, rowIdx: a.rowIdx, re, im };
}

describe('refactorization with the same analysis', () => {
  it('solves new values on the same pattern, repeatedly', () => {
    const rng = mulberry32(51);
    const a = randomNetwork(rng, { nodes: 150, topology: 'meshed' });
    const sym = analyse(a);
    for (let round = 0; round < 3; round++) {
      const next = newValues(a, rng);
      const b = randomVector(rng, a.n);
      const x = solve(factor(sym, next), b.re, b.im);
      // source: mathjs lusolve as independent dense reference
      expect(relativeDifference(x, mathjsSolve(next, b.re, b.im))).toBeLessThan(1e-9);
    }
  });

  it('still pivots correctly when the new values make some diagonals far too small', () => {
    const rng = mulberry32(52);
    const a = randomNetwork(rng, { nodes: 80, topology: 'radial' });
    const sym = analyse(a);
    const next = newValues(a, rng);
    for (let j = 0; j < a.n; j += 9) {
      for (let p = next.colPtr[j]; p < next.colPtr[j + 1]; p++) {
        if (next.rowIdx[p] === j) {
          // (exact zeros can make a random tree singular: two zero-diagonal leaves on one bus)
          next.re[p] *= 1e-3;
          next.im[p] *= 1e-3;
        }
      }
    }
    const lu = factor(sym, next);
    expect(lu.offDiagonalPivots).toBeGreaterThan(0);
    const b = randomVector(rng, a.n);
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(solve(lu, b.re, b.im), mathjsSolve(next, b.re, b.im))).toBeLessThan(1e-9);
  });

  it('refuses an analysis made for another size', () => {
    const rng = mulberry32(53);
    const a = randomNetwork(rng, { nodes: 20, topology: 'radial' });
    const b = randomNetwork(rng, { nodes: 21, topology: 'radial' });
    expect(() => factor(analyse(a), b)).toThrow(/symbolic analysis is for n = 20, matrix has n = 21/);
  });
});
