// One-parameter minimisers on a log scale for the readings match's fits: a grid over the whole range (so that a
// far minimum is not missed), then either golden section around the best point (a fixed count of trials) or
// Brent's method (parabolic steps through the last three points, golden section when a parabola is not trusted),
// which reaches the same bracket in far fewer trials when each trial is a solve.

export interface LogMinimum {
  at: number;
  value: number;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** The grid over [lo, hi] (log scale): each point's log and value, and the best. */
function grid(f: (v: number) => number, a: number, b: number, points: number): { xs: number[]; fs: number[]; best: number } {
  const xs: number[] = [];
  const fs: number[] = [];
  let best = 0;
  for (let i = 0; i < points; i++) {
    const x = points === 1 ? a : a + ((b - a) * i) / (points - 1);
    xs.push(x);
    fs.push(f(Math.exp(x)));
    if (fs[i] < fs[best]) best = i;
  }
  return { xs, fs, best };
}

/** Minimum of f over [lo, hi] on a log scale: a grid, then golden section around the best point. */
export function minimiseLogGolden(f: (v: number) => number, lo: number, hi: number, points: number, steps: number): LogMinimum {
  const a = Math.log(lo);
  const b = Math.log(hi);
  const { xs, fs, best } = grid(f, a, b, points);
  const bestValue = fs[best];
  if (!Number.isFinite(bestValue)) return { at: Math.exp(xs[best]), value: Infinity };
  let left = xs[Math.max(0, best - 1)];
  let right = xs[Math.min(points - 1, best + 1)];
  let x1 = right - GOLDEN * (right - left);
  let x2 = left + GOLDEN * (right - left);
  let f1 = f(Math.exp(x1));
  let f2 = f(Math.exp(x2));
  for (let i = 0; i < steps; i++) {
    if (f1 <= f2) {
      right = x2;
      x2 = x1;
      f2 = f1;
      x1 = right - GOLDEN * (right - left);
      f1 = f(Math.exp(x1));
    } else {
      left = x1;
      x1 = x2;
      f1 = f2;
      x2 = left + GOLDEN * (right - left);
      f2 = f(Math.exp(x2));
    }
  }
  const [at, value] = f1 <= f2 ? [x1, f1] : [x2, f2];
  return value <= bestValue ? { at: Math.exp(at), value } : { at: Math.exp(xs[best]), value: bestValue };
}

/**
 * Minimum of f over [lo, hi] on a log scale: a grid of `points` (or, with `around`, the three points a grid step
 * either side of it within the range), then Brent's method in the bracket of the best point's neighbours until the
 * bracket is within `tolerance` (in log units) or `maxTrials` more trials are spent.
 */
export function minimiseLogBrent(
  f: (v: number) => number,
  lo: number,
  hi: number,
  points: number,
  tolerance: number,
  maxTrials: number,
  around?: number,
): LogMinimum {
  const a0 = Math.log(lo);
  const b0 = Math.log(hi);
  let xs: number[];
  let fs: number[];
  let best: number;
  if (around !== undefined && points > 1) {
    const step = (b0 - a0) / (points - 1);
    const c = Math.min(b0, Math.max(a0, Math.log(around)));
    xs = [...new Set([Math.max(a0, c - step), c, Math.min(b0, c + step)])];
    fs = xs.map((x) => f(Math.exp(x)));
    best = fs.indexOf(Math.min(...fs));
    if (best < 0) best = 0;
  } else {
    ({ xs, fs, best } = grid(f, a0, b0, points));
  }
  if (!Number.isFinite(fs[best]) || xs.length < 2) return { at: Math.exp(xs[best]), value: fs[best] };
  let a = xs[Math.max(0, best - 1)];
  let b = xs[Math.min(xs.length - 1, best + 1)];
  // x: the best so far; w: the second best; v: the one before w. Seeded with the bracket's ends.
  let x = xs[best];
  let fx = fs[best];
  const left = Math.max(0, best - 1);
  const right = Math.min(xs.length - 1, best + 1);
  const [second, third] = fs[left] <= fs[right] ? [left, right] : [right, left];
  let w = xs[second];
  let fw = fs[second];
  let v = xs[third];
  let fv = fs[third];
  let d = 0;
  let e = b - a; // lets the first step be parabolic
  for (let trials = 0; trials < maxTrials; trials++) {
    const middle = (a + b) / 2;
    if (Math.abs(x - middle) <= 2 * tolerance - (b - a) / 2) break;
    let golden = true;
    if (Math.abs(e) > tolerance) {
      const r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      const previous = e;
      if (Number.isFinite(p) && Number.isFinite(q) && q !== 0 && Math.abs(p) < Math.abs(0.5 * q * previous) && p > q * (a - x) && p < q * (b - x)) {
        e = d;
        d = p / q;
        golden = false;
        const u = x + d;
        if (u - a < 2 * tolerance || b - u < 2 * tolerance) d = middle >= x ? tolerance : -tolerance;
      }
    }
    if (golden) {
      e = x >= middle ? a - x : b - x;
      d = (1 - GOLDEN) * e;
    }
    const u = Math.abs(d) >= tolerance ? x + d : x + (d >= 0 ? tolerance : -tolerance);
    const fu = f(Math.exp(u));
    if (fu <= fx) {
      if (u >= x) a = x;
      else b = x;
      [v, fv, w, fw, x, fx] = [w, fw, x, fx, u, fu];
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        [v, fv, w, fw] = [w, fw, u, fu];
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return { at: Math.exp(x), value: fx };
}
