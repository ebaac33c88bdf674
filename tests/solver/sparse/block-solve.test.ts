// Triangular solves of a block of right-hand sides against mathjs's dense lusolve, column by column, on random
// radial and meshed networks; sparse unit columns as the sweep gives them, and dense ones.
import { describe, expect, it } from 'vitest';
import { analyse, factor } from '../../../solver/sparse';
import { lowerSolveBlockInPlace, upperSolveBlockInPlace, upperTransposeSolve } from '../../../solver/sparse/block-solve';
import { mathjsSolve, mulberry32, randomNetwork, randomVector, relativeDifference } from './helpers';

describe('block triangular solves agree with mathjs lusolve', () => {
  for (const { nodes, topology, width } of [
    { nodes: 37, topology: 'radial' as const, width: 5 },
    { nodes: 60, topology: 'meshed' as const, width: 16 },
  ]) {
    it(`${topology} network of ${nodes} nodes, ${width} columns`, () => {
      const rng = mulberry32(nodes + width);
      const a = randomNetwork(rng, { nodes, topology, unsymmetricShare: 0.15 });
      const lu = factor(analyse(a), a);
      const columns = Array.from({ length: width }, (_, b) => {
        if (b % 2 === 1) return randomVector(rng, nodes);
        // a pair of unit entries, as an opened conductor's column
        const v = { re: new Float64Array(nodes), im: new Float64Array(nodes) };
        v.re[(7 * b) % nodes] = 1;
        v.re[(7 * b + 3) % nodes] = -1;
        return v;
      });
      const y = new Float64Array(2 * nodes * width);
      columns.forEach((c, b) => {
        for (let i = 0; i < nodes; i++) {
          y[2 * (lu.rowPivot[i] * width + b)] = c.re[i];
          y[2 * (lu.rowPivot[i] * width + b) + 1] = c.im[i];
        }
      });
      // g by pivot step; given U⁻ᵀg as weights, the forward substitution's sums must be Σ_k g_k x_k of each solved column
      const g = { re: Float64Array.from({ length: nodes }, () => rng()), im: Float64Array.from({ length: nodes }, () => rng()) };
      const weight = { ...upperTransposeSolve(lu, g.re, g.im), sumRe: new Float64Array(width), sumIm: new Float64Array(width) };
      // the same forward substitution told where the block starts nonzero must give the same rows, bit for bit
      const seeds: number[] = [];
      for (let i = 0; i < nodes; i++) for (let b = 0; b < width; b++) if (y[2 * (i * width + b)] !== 0 || y[2 * (i * width + b) + 1] !== 0) seeds.push(i);
      const seeded = y.slice();
      lowerSolveBlockInPlace(lu, y, width, 0, [weight]);
      lowerSolveBlockInPlace(lu, seeded, width, 0, [], seeds);
      expect(seeded).toEqual(y);
      upperSolveBlockInPlace(lu, y, width);
      columns.forEach((c, b) => {
        const x = { re: new Float64Array(nodes), im: new Float64Array(nodes) };
        for (let k = 0; k < nodes; k++) {
          x.re[lu.colOrder[k]] = y[2 * (k * width + b)];
          x.im[lu.colOrder[k]] = y[2 * (k * width + b) + 1];
        }
        // source: mathjs lusolve as independent dense reference
        const expected = mathjsSolve(a, c.re, c.im);
        expect(relativeDifference(x, expected), `column ${b}`).toBeLessThan(1e-9);
        let sr = 0;
        let si = 0;
        for (let k = 0; k < nodes; k++) {
          const j = lu.colOrder[k];
          sr += g.re[k] * expected.re[j] - g.im[k] * expected.im[j];
          si += g.re[k] * expected.im[j] + g.im[k] * expected.re[j];
        }
        expect(Math.hypot(weight.sumRe[b] - sr, weight.sumIm[b] - si) / Math.hypot(sr, si), `weighted sum ${b}`).toBeLessThan(1e-9);
      });
    });
  }
});
