// A residual estimated from random probes instead of a product with the matrix. For z with independent standard
// normal entries, z·r has mean 0 and variance ||r||₂², so |z·r| reads ||r||₂ (never less than ||r||∞ on average)
// at the cost of a dot product, given g = Aᵀz formed once: z·(A x − b) = g·x − z·b. This is Freivalds' idea for
// checking a product, used for a residual. With two probes, both read below a hundredth of a real residual with a
// chance of about 6e-5 (P(|N(0,1)| < 0.01)² for the worst, purely real r); the probes are seeded, so a run is
// repeatable. With v = U⁻ᵀg also formed once, g·W of an opening's column W = U⁻¹L⁻¹u is v·(L⁻¹u), read from the
// forward result, nonzero on a few dozen rows; a product with A per opening cost as much as the solve itself.
import type { ComplexCsc, ComplexVector } from '../linear-system';
import { upperTransposeSolve, type StepWeights } from '../sparse/block-solve';
import type { NumericLu } from '../sparse/lu';

const SEED = 0x5eed_2026;

interface Probe {
  z: Float64Array;
  /** g = Aᵀz by pivot step (entry k for unknown colOrder[k]), to run along a block of columns in its own order. */
  gRe: Float64Array;
  gIm: Float64Array;
  gx0Re: number;
  gx0Im: number;
  zbRe: number;
  zbIm: number;
}

/** z·(ΔA x − Δb) of an opening: its low-rank part of the residual. */
export type ProbeTerm = (z: Float64Array) => { re: number; im: number };

export class ResidualProbes {
  private readonly probes: [Probe, Probe];
  private readonly weightings: StepWeights[];
  private readonly bMax: number;

  constructor(
    matrix: ComplexCsc,
    lu: NumericLu,
    private readonly bRe: Float64Array,
    private readonly bIm: Float64Array,
    private readonly x0: ComplexVector,
    /** The widest block whose sums the weights hold. */
    blockWidth: number,
  ) {
    const n = matrix.n;
    const colOrder = lu.colOrder;
    const normal = gaussian(SEED);
    const probe = (): Probe => {
      const z = Float64Array.from({ length: n }, normal);
      const gRe = new Float64Array(n);
      const gIm = new Float64Array(n);
      const { colPtr, rowIdx, re, im } = matrix;
      let gx0Re = 0;
      let gx0Im = 0;
      for (let k = 0; k < n; k++) {
        // g_j = Σ_i A_ij z_i: column j of A against z.
        const j = colOrder[k];
        let sr = 0;
        let si = 0;
        for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
          sr += re[p] * z[rowIdx[p]];
          si += im[p] * z[rowIdx[p]];
        }
        gRe[k] = sr;
        gIm[k] = si;
        gx0Re += sr * x0.re[j] - si * x0.im[j];
        gx0Im += sr * x0.im[j] + si * x0.re[j];
      }
      let zbRe = 0;
      let zbIm = 0;
      for (let i = 0; i < n; i++) {
        zbRe += z[i] * bRe[i];
        zbIm += z[i] * bIm[i];
      }
      return { z, gRe, gIm, gx0Re, gx0Im, zbRe, zbIm };
    };
    this.probes = [probe(), probe()];
    this.weightings = this.probes.map((p) => ({ ...upperTransposeSolve(lu, p.gRe, p.gIm), sumRe: new Float64Array(blockWidth), sumIm: new Float64Array(blockWidth) }));
    let bMax = 0;
    for (let i = 0; i < n; i++) bMax = Math.max(bMax, bRe[i] * bRe[i] + bIm[i] * bIm[i]);
    this.bMax = Math.sqrt(bMax);
  }

  isFor(bRe: Float64Array, bIm: Float64Array, x0: ComplexVector): boolean {
    return bRe === this.bRe && bIm === this.bIm && x0 === this.x0;
  }

  /**
   * The probes as weights for a block's forward substitution (U⁻ᵀg, for lowerSolveBlockInPlace), which then forms
   * g·W_b of every column b; the sums are reused by the next block, so read them (relativeResidual) before solving again.
   */
  weights(): StepWeights[] {
    return this.weightings;
  }

  /**
   * The larger probe reading of ||(A + ΔA) x − (b + Δb)|| for x = x0 − Σ_b W_b t_b (columns offset.. of the block
   * whose dots are given), relative to ||A||∞ ||x||∞ + ||b||∞ (the base b's, which errs strict when Δb adds to b).
   */
  relativeResidual(dots: readonly StepWeights[], offset: number, m: number, tRe: Float64Array, tIm: Float64Array, xMax: number, aNorm: number, change: ProbeTerm): number {
    let worst = 0;
    this.probes.forEach((probe, i) => {
      let re = probe.gx0Re - probe.zbRe;
      let im = probe.gx0Im - probe.zbIm;
      for (let b = 0; b < m; b++) {
        const dr = dots[i].sumRe[offset + b];
        const di = dots[i].sumIm[offset + b];
        re -= dr * tRe[b] - di * tIm[b];
        im -= dr * tIm[b] + di * tRe[b];
      }
      const c = change(probe.z);
      worst = Math.max(worst, Math.hypot(re + c.re, im + c.im));
    });
    const denominator = aNorm * xMax + this.bMax;
    if (denominator === 0) return worst === 0 ? 0 : Infinity;
    return worst / denominator;
  }
}

/** Standard normal draws from a seeded generator (mulberry32 and Box–Muller). */
function gaussian(seed: number): () => number {
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => {
    const u = 1 - uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
}
