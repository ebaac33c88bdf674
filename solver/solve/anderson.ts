// Anderson acceleration of a fixed-point iteration x ← g(x): the next iterate mixes the last few g values so that
// their residuals f = g(x) − x cancel in the least-squares sense. For a linear map it behaves like GMRES, so it
// often converges where the plain iteration oscillates.
import { solveDenseReal } from './dense-real';

export class AndersonMixer {
  private readonly dx: Float64Array[] = [];
  private readonly df: Float64Array[] = [];
  private lastX?: Float64Array;
  private lastF?: Float64Array;

  constructor(private readonly dim: number, private readonly depth = 6) {}

  reset(): void {
    this.dx.length = 0;
    this.df.length = 0;
    this.lastX = undefined;
    this.lastF = undefined;
  }

  /** The next iterate from the current x and g(x); weights scale each entry of the residual for the fit. */
  next(x: Float64Array, g: Float64Array, weights?: Float64Array): Float64Array {
    const n = this.dim;
    const f = new Float64Array(n);
    for (let i = 0; i < n; i++) f[i] = (g[i] - x[i]) * (weights ? weights[i] : 1);
    if (this.lastX && this.lastF) {
      const dx = new Float64Array(n);
      const df = new Float64Array(n);
      for (let i = 0; i < n; i++) {
        dx[i] = x[i] - this.lastX[i];
        df[i] = f[i] - this.lastF[i];
      }
      this.dx.push(dx);
      this.df.push(df);
      if (this.dx.length > this.depth) {
        this.dx.shift();
        this.df.shift();
      }
    }
    this.lastX = Float64Array.from(x);
    this.lastF = f;
    const m = this.df.length;
    const out = Float64Array.from(g);
    if (m === 0) return out;
    // Normal equations (ΔFᵀΔF) γ = ΔFᵀ f with a little regularisation.
    const a = new Float64Array(m * m);
    const b = new Float64Array(m);
    let trace = 0;
    for (let i = 0; i < m; i++) {
      for (let j = 0; j <= i; j++) {
        let s = 0;
        for (let k = 0; k < n; k++) s += this.df[i][k] * this.df[j][k];
        a[i * m + j] = s;
        a[j * m + i] = s;
      }
      trace += a[i * m + i];
      let s = 0;
      for (let k = 0; k < n; k++) s += this.df[i][k] * f[k];
      b[i] = s;
    }
    if (!(trace > 0)) return out;
    for (let i = 0; i < m; i++) a[i * m + i] += 1e-10 * trace;
    const gamma = solveDenseReal(a, b, m);
    if (!gamma) {
      this.reset();
      return out;
    }
    // x_next = g − Σ γ_j (Δx_j + Δg_j), with Δg = Δx + Δf (unweighted Δf).
    for (let j = 0; j < m; j++) {
      for (let k = 0; k < n; k++) {
        const dfRaw = this.df[j][k] / (weights ? weights[k] : 1);
        out[k] -= gamma[j] * (this.dx[j][k] + dfRaw);
      }
    }
    return out;
  }
}
