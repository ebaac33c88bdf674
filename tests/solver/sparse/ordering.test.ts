// Fill-reducing ordering: AMD against natural order on arrowhead and grid matrices, no fill on trees.
import { describe, expect, it } from 'vitest';
import { slu } from 'mathjs';
import { analyse, approximateMinimumDegree, ComplexTriplets, factor, nnzOf, symmetricAdjacency, type ComplexCsc } from '../../../solver/sparse';
import { fourWireNetwork, mulberry32, randomNetwork, seriesAdmittance, stampBranch, toMathjsSparseReal, uniform } from './helpers';

const fillOf = (a: ComplexCsc, ordering: 'amd' | 'natural' | Int32Array): number => {
  const lu = factor(analyse(a, { ordering }), a);
  return lu.nnzL + lu.nnzU - a.n; // nnz(L+U)
};

function arrowhead(n: number): ComplexCsc {
  // Node 0 is the hub, first in the natural order.
  const t = new ComplexTriplets(n);
  for (let i = 1; i < n; i++) stampBranch(t, 0, i, [1, -2]);
  for (let i = 0; i < n; i++) t.add(i, i, 0.1, 0);
  return t.toCsc();
}

function grid(side: number): ComplexCsc {
  const t = new ComplexTriplets(side * side);
  const id = (r: number, c: number) => r * side + c;
  for (let r = 0; r < side; r++) {
    for (let c = 0; c < side; c++) {
      if (c + 1 < side) stampBranch(t, id(r, c), id(r, c + 1), [1, -1]);
      if (r + 1 < side) stampBranch(t, id(r, c), id(r + 1, c), [1, -1]);
      t.add(id(r, c), id(r, c), 0.01, 0);
    }
  }
  return t.toCsc();
}

describe('approximate minimum degree', () => {
  it('keeps an arrowhead matrix linear where the hub-first natural order fills it completely', () => {
    const n = 200;
    const a = arrowhead(n);
    const natural = fillOf(a, 'natural');
    const amd = fillOf(a, 'amd');
    // common practice, no source: eliminating the hub first couples every remaining pair, so L+U is dense
    expect(natural).toBe(n * n);
    // common practice, no source: leaves first and the hub last gives no fill at all
    expect(amd).toBe(nnzOf(a));
    expect(amd / natural).toBeLessThan(0.02);
  });

  it('fills a 40×40 grid far less than the natural (banded) order', () => {
    const a = grid(40);
    const natural = fillOf(a, 'natural');
    const amd = fillOf(a, 'amd');
    // common practice, no source: a k×k grid in row order fills its band (about k³ per factor); minimum
    // degree orders grow like n log n, so at k = 40 AMD should need well under half of the band's fill
    expect(natural).toBeGreaterThan(2 * 40 * 40 * 39);
    expect(amd / natural).toBeLessThan(0.5);
  });

  it('fills no more than mathjs\'s own AMD ordering (order 1, on A+Aᵀ) does', () => {
    const rng = mulberry32(15);
    for (const a of [grid(30), randomNetwork(rng, { nodes: 600, topology: 'meshed' })]) {
      const theirs = Int32Array.from((slu(toMathjsSparseReal(a), 1, 0.1) as unknown as { q: number[] }).q);
      // source: mathjs slu with order 1 (approximate minimum degree on A+Aᵀ) as an independent ordering
      expect(fillOf(a, 'amd')).toBeLessThanOrEqual(1.1 * fillOf(a, theirs));
    }
  });

  it('orders a shuffled random tree with no fill', () => {
    const rng = mulberry32(11);
    const a = randomNetwork(rng, { nodes: 500, topology: 'radial', unsymmetricShare: 0 });
    // common practice, no source: a tree has a perfect elimination order (leaves first), which minimum degree finds
    expect(fillOf(a, 'amd')).toBe(nnzOf(a));
  });

  it('orders a radial four-conductor network (a tree of 4×4 blocks) with no fill', () => {
    const rng = mulberry32(12);
    const buses = 300;
    const t = new ComplexTriplets(4 * buses);
    const node = (bus: number, c: number) => 4 * bus + c;
    for (let bus = 1; bus < buses; bus++) {
      const parent = Math.floor(rng() * bus);
      for (let c = 0; c < 4; c++) {
        for (let d = 0; d < 4; d++) {
          const y: [number, number] = c === d ? seriesAdmittance(0.1, 0.2) : [-0.01, 0.05];
          t.add(node(bus, c), node(bus, d), y[0], y[1]);
          t.add(node(parent, c), node(parent, d), y[0], y[1]);
          t.add(node(bus, c), node(parent, d), -y[0], -y[1]);
          t.add(node(parent, c), node(bus, d), -y[0], -y[1]);
        }
      }
    }
    for (let i = 0; i < 4 * buses; i++) t.add(i, i, uniform(rng, 0.01, 0.1), 0);
    const a = t.toCsc();
    // common practice, no source: a tree of cliques is chordal; eliminating leaf buses first creates no fill
    expect(fillOf(a, 'amd')).toBe(nnzOf(a));
  });

  it('predicts nnz(L) and nnz(U) exactly for a structurally symmetric matrix pivoted on its diagonal', () => {
    const rng = mulberry32(13);
    const a = randomNetwork(rng, { nodes: 400, topology: 'meshed', unsymmetricShare: 0 });
    const sym = analyse(a);
    const lu = factor(sym, a);
    expect(lu.offDiagonalPivots).toBe(0);
    // common practice, no source: without pivoting, L and Uᵀ have the Cholesky pattern of A (symmetric pattern)
    expect(lu.nnzL).toBe(sym.nnzLEstimate);
    expect(lu.nnzU).toBe(sym.nnzUEstimate);
  });

  it('counts fill per group of indistinguishable conductors exactly as node by node', () => {
    const { a } = fourWireNetwork(mulberry32(16), 120, 12);
    const grouped = analyse(a); // AMD's groups: the four conductors of a bus
    const plain = analyse(a, { ordering: grouped.colOrder }); // the same order, counted node by node
    // common practice, no source: indistinguishable nodes eliminated together share their column structure
    expect(Array.from(grouped.colCounts)).toEqual(Array.from(plain.colCounts));
    expect(Array.from(grouped.etreeParent)).toEqual(Array.from(plain.etreeParent));
    const lu = factor(grouped, a);
    expect(lu.offDiagonalPivots).toBe(0);
    expect(lu.nnzL).toBe(grouped.nnzLEstimate);
  });

  it('returns a permutation for meshed graphs with dense rows', () => {
    const rng = mulberry32(14);
    for (const nodes of [1, 2, 50, 700]) {
      const t = new ComplexTriplets(nodes);
      for (let k = 0; k < 3 * nodes; k++) {
        const i = Math.floor(rng() * nodes);
        const j = Math.floor(rng() * nodes);
        if (i !== j) stampBranch(t, i, j, [1, 0]);
      }
      // Two hubs touching everything become dense rows, ordered last.
      if (nodes > 2) for (let i = 2; i < nodes; i++) { stampBranch(t, 0, i, [1, 0]); stampBranch(t, 1, i, [1, 0]); }
      const order = approximateMinimumDegree(symmetricAdjacency(t.toCsc()));
      // common practice, no source: an ordering must list every node exactly once
      expect(Array.from(order).sort((x, y) => x - y)).toEqual(Array.from({ length: nodes }, (_, i) => i));
      if (nodes > 100) expect(Array.from(order.slice(-2)).sort()).toEqual([0, 1]);
    }
  });
});
