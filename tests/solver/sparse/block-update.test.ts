// Low-rank (Woodbury) re-solves for changes confined to a few nodes, against a full refactor and mathjs.
import { describe, expect, it } from 'vitest';
import {
  addBlock,
  analyse,
  ComplexTriplets,
  factor,
  findEntry,
  samePattern,
  SingularMatrixError,
  solve,
  solveWithBlockUpdate,
  type BlockUpdate,
} from '../../../solver/sparse';
import {
  conductorNode,
  fourWireNetwork,
  mathjsSolve,
  mulberry32,
  openConductorUpdate,
  randomNetwork,
  randomVector,
  relativeDifference,
  stampBranch,
  uniform,
} from './helpers';

describe('solveWithBlockUpdate', () => {
  it('opens the neutral of one four-wire run: the 8×8 update equals a full refactor and mathjs', () => {
    const rng = mulberry32(31);
    const { a, branches } = fourWireNetwork(rng, 40, 4);
    const b = randomVector(rng, a.n);
    const sym = analyse(a);
    const lu = factor(sym, a);
    const branch = branches[25];
    const update = openConductorUpdate(branch, 3);

    const result = solveWithBlockUpdate(lu, sym, a, update, b.re, b.im);
    expect(result.method).toBe('low-rank');
    // common practice, no source: the update is exact algebra, so its residual is near machine precision
    expect(result.residual).toBeLessThan(1e-12);

    const updated = addBlock(a, update);
    expect(updated.rowIdx).toBe(a.rowIdx); // same pattern, shared: the analysis is reused
    // the opened neutral's mutual entry between the two buses is a numeric zero that stays in the pattern
    const p = findEntry(updated, conductorNode(branch.to, 3), conductorNode(branch.from, 3));
    expect(p).toBeGreaterThanOrEqual(0);
    expect(Math.abs(updated.re[p]) + Math.abs(updated.im[p])).toBeLessThan(1e-12 * Math.abs(a.re[p]));

    const refactored = solve(factor(sym, updated), b.re, b.im);
    // common practice, no source: Woodbury over the base factors equals factorising base+Δ
    expect(relativeDifference(result, refactored)).toBeLessThan(1e-10);
    // source: mathjs lusolve as independent dense reference on the updated matrix
    expect(relativeDifference(result, mathjsSolve(updated, b.re, b.im))).toBeLessThan(1e-9);
    // the opening matters: the answer moved well away from the base case
    expect(relativeDifference(solve(lu, b.re, b.im), result)).toBeGreaterThan(1e-4);
  });

  it('agrees with mathjs for random blocks of 1 to 6 nodes on random meshed networks', () => {
    const rng = mulberry32(32);
    for (let trial = 0; trial < 8; trial++) {
      const a = randomNetwork(rng, { nodes: 80 + 10 * trial, topology: trial % 2 ? 'meshed' : 'radial' });
      const sym = analyse(a);
      const lu = factor(sym, a);
      const m = 1 + (trial % 6);
      const nodes = new Set<number>();
      while (nodes.size < m) nodes.add(Math.floor(rng() * a.n));
      const update: BlockUpdate = {
        nodes: Int32Array.from(nodes),
        deltaRe: Float64Array.from({ length: m * m }, () => uniform(rng, -0.3, 0.3)),
        deltaIm: Float64Array.from({ length: m * m }, () => uniform(rng, -0.3, 0.3)),
      };
      const b = randomVector(rng, a.n);
      const result = solveWithBlockUpdate(lu, sym, a, update, b.re, b.im);
      expect(result.method).toBe('low-rank');
      // source: mathjs lusolve as independent dense reference on base+Δ (built here by addBlock)
      expect(relativeDifference(result, mathjsSolve(addBlock(a, update), b.re, b.im))).toBeLessThan(1e-9);
    }
  });

  it('falls back to refactoring when the residual is not accepted, with the same answer', () => {
    const rng = mulberry32(33);
    const { a, branches } = fourWireNetwork(rng, 30);
    const sym = analyse(a);
    const lu = factor(sym, a);
    const update = openConductorUpdate(branches[10], 1);
    const b = randomVector(rng, a.n);
    const result = solveWithBlockUpdate(lu, sym, a, update, b.re, b.im, { residualTolerance: 0 });
    expect(result.method).toBe('refactor');
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(result, mathjsSolve(addBlock(a, update), b.re, b.im))).toBeLessThan(1e-9);
  });

  it('handles a change off the pattern (a new tie): addBlock rebuilds, both paths agree with mathjs', () => {
    const rng = mulberry32(34);
    const t = new ComplexTriplets(50);
    for (let i = 1; i < 50; i++) stampBranch(t, i, i - 1, [2, -4]);
    for (let i = 0; i < 50; i++) t.add(i, i, 0.05, -0.01);
    const a = t.toCsc();
    const sym = analyse(a);
    const lu = factor(sym, a);
    const update: BlockUpdate = { nodes: Int32Array.of(3, 40), deltaRe: Float64Array.of(1, -1, -1, 1), deltaIm: Float64Array.of(-3, 3, 3, -3) };
    const updated = addBlock(a, update);
    expect(samePattern(updated, a)).toBe(false);
    expect(findEntry(updated, 3, 40)).toBeGreaterThanOrEqual(0);
    const b = randomVector(rng, 50);
    const reference = mathjsSolve(updated, b.re, b.im);
    const lowRank = solveWithBlockUpdate(lu, sym, a, update, b.re, b.im);
    expect(lowRank.method).toBe('low-rank');
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(lowRank, reference)).toBeLessThan(1e-9);
    const refactor = solveWithBlockUpdate(lu, sym, a, update, b.re, b.im, { residualTolerance: 0 });
    expect(refactor.method).toBe('refactor');
    expect(relativeDifference(refactor, reference)).toBeLessThan(1e-9);
  });

  it('throws SingularMatrixError when the change leaves the network floating (its only shunt removed)', () => {
    const t = new ComplexTriplets(6);
    for (let i = 1; i < 6; i++) stampBranch(t, i, i - 1, [1, -3]);
    t.add(0, 0, 0.5, -0.2); // the only path to ground
    const a = t.toCsc();
    const sym = analyse(a);
    const lu = factor(sym, a);
    const update: BlockUpdate = { nodes: Int32Array.of(0), deltaRe: Float64Array.of(-0.5), deltaIm: Float64Array.of(0.2) };
    const b = randomVector(mulberry32(35), 6);
    // common practice, no source: a network with no path to ground has a singular admittance matrix
    expect(() => solveWithBlockUpdate(lu, sym, a, update, b.re, b.im)).toThrow(SingularMatrixError);
  });

  it('rejects a malformed update with a clear message', () => {
    const a = randomNetwork(mulberry32(36), { nodes: 10, topology: 'radial' });
    const sym = analyse(a);
    const lu = factor(sym, a);
    const b = randomVector(mulberry32(37), 10);
    const twice: BlockUpdate = { nodes: Int32Array.of(2, 2), deltaRe: new Float64Array(4), deltaIm: new Float64Array(4) };
    expect(() => solveWithBlockUpdate(lu, sym, a, twice, b.re, b.im)).toThrow(/node 2 twice/);
    const short: BlockUpdate = { nodes: Int32Array.of(1, 2), deltaRe: new Float64Array(3), deltaIm: new Float64Array(4) };
    expect(() => addBlock(a, short)).toThrow(/needs 4 delta values/);
    const outside: BlockUpdate = { nodes: Int32Array.of(10), deltaRe: new Float64Array(1), deltaIm: new Float64Array(1) };
    expect(() => addBlock(a, outside)).toThrow(/node 10 \(position 0\) is outside 0..9/);
  });
});
