// The sparse LU against mathjs's dense complex LU on random networks, radial and meshed, 10 to 300 nodes.
import { describe, expect, it } from 'vitest';
import { analyse, factor, relativeResidual, solve } from '../../../solver/sparse';
import { mathjsSolve, mulberry32, randomNetwork, randomVector, relativeDifference } from './helpers';

describe('sparse LU agrees with mathjs lusolve', () => {
  const cases: Array<{ nodes: number; topology: 'radial' | 'meshed'; seed: number }> = [];
  for (const nodes of [10, 37, 100, 300]) {
    for (const topology of ['radial', 'meshed'] as const) cases.push({ nodes, topology, seed: nodes * 7 + (topology === 'radial' ? 1 : 2) });
  }

  it.each(cases)('$topology network of $nodes nodes (seed $seed)', ({ nodes, topology, seed }) => {
    const rng = mulberry32(seed);
    const a = randomNetwork(rng, { nodes, topology, unsymmetricShare: 0.15 });
    const b = randomVector(rng, nodes);
    const x = solve(factor(analyse(a), a), b.re, b.im);
    // source: mathjs lusolve as independent dense reference, agreement to 1e-9 relative
    expect(relativeDifference(x, mathjsSolve(a, b.re, b.im))).toBeLessThan(1e-9);
    // common practice, no source: LU with threshold pivoting is backward stable, residual near machine precision
    expect(relativeResidual(a, x, b.re, b.im)).toBeLessThan(1e-13);
  });
});
