// Small and degenerate systems: empty and 1×1 matrices, an empty update, a pattern the analysis did not see.
import { describe, expect, it } from 'vitest';
import { analyse, ComplexTriplets, factor, relativeResidual, solve, solveWithBlockUpdate } from '../../../solver/sparse';
import { mathjsSolve, mulberry32, randomNetwork, randomVector, relativeDifference } from './helpers';

describe('edge cases', () => {
  it('solves a 0×0 and a 1×1 system', () => {
    const empty = new ComplexTriplets(0).toCsc();
    expect(solve(factor(analyse(empty), empty), new Float64Array(0), new Float64Array(0)).re.length).toBe(0);
    const t = new ComplexTriplets(1);
    t.add(0, 0, 3, 4);
    const one = t.toCsc();
    const x = solve(factor(analyse(one), one), Float64Array.of(25), Float64Array.of(0));
    // common practice, no source: 25 / (3 + 4i) = 3 − 4i
    expect(x.re[0]).toBeCloseTo(3, 14);
    expect(x.im[0]).toBeCloseTo(-4, 14);
  });

  it('returns the base solution for an update over no nodes', () => {
    const rng = mulberry32(61);
    const a = randomNetwork(rng, { nodes: 30, topology: 'meshed' });
    const sym = analyse(a);
    const lu = factor(sym, a);
    const b = randomVector(rng, 30);
    const none = { nodes: new Int32Array(0), deltaRe: new Float64Array(0), deltaIm: new Float64Array(0) };
    const result = solveWithBlockUpdate(lu, sym, a, none, b.re, b.im);
    expect(result.method).toBe('low-rank');
    expect(relativeDifference(result, solve(lu, b.re, b.im))).toBeLessThan(1e-14);
  });

  it('factors a matrix whose pattern differs from the analysed one (the order is only a hint)', () => {
    const rng = mulberry32(62);
    const analysed = randomNetwork(rng, { nodes: 90, topology: 'radial' });
    const other = randomNetwork(rng, { nodes: 90, topology: 'meshed' });
    const lu = factor(analyse(analysed), other);
    const b = randomVector(rng, 90);
    const x = solve(lu, b.re, b.im);
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(x, mathjsSolve(other, b.re, b.im))).toBeLessThan(1e-9);
    expect(relativeResidual(other, x, b.re, b.im)).toBeLessThan(1e-13);
  });
});
