// Assembly: duplicates summed, rows sorted, explicit zeros kept in the pattern (openings rely on it).
import { describe, expect, it } from 'vitest';
import { analyse, ComplexTriplets, factor, findEntry, nnzOf, solve } from '../../../solver/sparse';
import { mathjsSolve, mulberry32, randomVector, relativeDifference, stampBranch } from './helpers';

describe('ComplexTriplets', () => {
  it('sums duplicates and sorts rows within each column, like a plain dictionary accumulation', () => {
    const rng = mulberry32(41);
    const n = 30;
    const t = new ComplexTriplets(n, 4);
    const sums = new Map<string, [number, number]>();
    for (let k = 0; k < 2000; k++) {
      const i = Math.floor(rng() * n);
      const j = Math.floor(rng() * n);
      const re = Math.round(rng() * 8 - 4);
      const im = Math.round(rng() * 8 - 4);
      t.add(i, j, re, im);
      const s = sums.get(`${i},${j}`) ?? [0, 0];
      sums.set(`${i},${j}`, [s[0] + re, s[1] + im]);
    }
    const a = t.toCsc();
    // common practice, no source: summing stamps is how nodal admittance matrices are assembled
    expect(nnzOf(a)).toBe(sums.size);
    for (let j = 0; j < n; j++) {
      for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
        if (p > a.colPtr[j]) expect(a.rowIdx[p]).toBeGreaterThan(a.rowIdx[p - 1]);
        const [re, im] = sums.get(`${a.rowIdx[p]},${j}`) ?? [NaN, NaN];
        expect(Math.abs(a.re[p] - re) + Math.abs(a.im[p] - im)).toBe(0);
      }
    }
  });

  it('keeps entries that cancel to zero and explicit zero stamps in the pattern', () => {
    const t = new ComplexTriplets(3);
    t.add(0, 0, 1, 0);
    t.add(1, 1, 1, 0);
    t.add(2, 2, 1, 0);
    t.add(0, 2, 0.25, -0.5);
    t.add(0, 2, -0.25, 0.5); // cancels
    t.add(2, 1, 0, 0); // explicit zero
    const a = t.toCsc();
    expect(nnzOf(a)).toBe(5);
    expect(findEntry(a, 0, 2)).toBeGreaterThanOrEqual(0);
    expect(a.re[findEntry(a, 0, 2)]).toBe(0);
    expect(findEntry(a, 2, 1)).toBeGreaterThanOrEqual(0);
    expect(findEntry(a, 1, 2)).toBe(-1);
  });

  it('gives the factors the same structure whether an opened branch is zero-valued or not', () => {
    const build = (openedValue: number) => {
      const rng = mulberry32(42); // the same network both times, but for the tie's value
      const t = new ComplexTriplets(40);
      for (let i = 1; i < 40; i++) stampBranch(t, i, Math.floor(rng() * i), [1 + rng(), -2 - rng()]);
      stampBranch(t, 5, 30, [openedValue, -openedValue]); // a tie that may be opened
      for (let i = 0; i < 40; i++) t.add(i, i, 0.1, -0.02);
      return t.toCsc();
    };
    const closed = build(1.5);
    const opened = build(0);
    const luClosed = factor(analyse(closed), closed);
    const luOpened = factor(analyse(opened), opened);
    // common practice, no source: explicit zeros are structural, so the pattern and its fill do not change
    expect(nnzOf(opened)).toBe(nnzOf(closed));
    expect(luOpened.nnzL).toBe(luClosed.nnzL);
    expect(luOpened.nnzU).toBe(luClosed.nnzU);
    const b = randomVector(mulberry32(43), 40);
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(solve(luOpened, b.re, b.im), mathjsSolve(opened, b.re, b.im))).toBeLessThan(1e-9);
  });

  it('rejects stamps outside the matrix or with non-finite values, saying where', () => {
    const t = new ComplexTriplets(4);
    expect(() => t.add(4, 0, 1, 0)).toThrow(/entry \(4, 0\) is outside the 4×4 matrix/);
    expect(() => t.add(0, -1, 1, 0)).toThrow(/outside/);
    expect(() => t.add(1.5, 0, 1, 0)).toThrow(/outside/);
    expect(() => t.add(2, 3, NaN, 0)).toThrow(/entry \(2, 3\) has a non-finite value/);
    expect(() => new ComplexTriplets(-1)).toThrow(/non-negative integer/);
  });
});
