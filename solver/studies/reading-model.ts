// The readings a candidate cause predicts, through the base factors. A cause and its fitted load level change the
// scaled matrix by U D Uᵀ: one column per branch that changes (the run conductors of the cause, each affected load
// element), column = s_a e_a − s_b e_b over the branch's two classes, D the change of their admittances (siemens).
// W = A⁻¹U is solved once per candidate and kept only where it is read (the readings' classes and the columns'
// own), so each trial of the fit costs an m×m solve: x = x0 − W (D w + K⁻¹ D Uᵀ (x0 − W D w)), K = I + D UᵀW.
import type { ComplexVector } from '../linear-system';
import { denseComplexSolveInPlace } from '../sparse/dense-complex';
import type { NumericLu } from '../sparse/lu';
import type { PinClasses } from '../solve/classes';
import { lowerSolveInPlace, permuteColumns, permuteRows, upperSolveInPlace } from '../sparse/solve';

/** A branch between two classes (−1: the reference), with the classes' scales and the offset difference of its ends. */
export interface Branch {
  a: number;
  b: number;
  sa: number;
  sb: number;
  /** Known part of V_a − V_b (an end on an ideal source), for the right-hand side's change. */
  wRe: number;
  wIm: number;
}

/** The branch from pin p to pin q over a network's classes (`scale`: the classes' zone voltages). */
export function branchBetween(classes: PinClasses, scale: Float64Array, p: number, q: number): Branch {
  const a = classes.classOf[p];
  const b = classes.classOf[q];
  return { a, b, sa: a >= 0 ? scale[a] : 0, sb: b >= 0 ? scale[b] : 0, wRe: classes.offsetRe[p] - classes.offsetRe[q], wIm: classes.offsetIm[p] - classes.offsetIm[q] };
}

/** A reading: V = offset + sp x[p] − sq x[q]. */
export interface ReadingRow {
  p: number;
  q: number;
  sp: number;
  sq: number;
  offRe: number;
  offIm: number;
}

const PIVOT_FLOOR = 1e-8;

export class PreparedColumns {
  constructor(
    readonly m: number,
    readonly branches: Branch[],
    /** G = UᵀW, m×m row-major. */
    readonly gRe: Float64Array,
    readonly gIm: Float64Array,
    /** Readings of W: R×m row-major. */
    readonly rwRe: Float64Array,
    readonly rwIm: Float64Array,
    /** Readings of x0 (with their offsets) and Uᵀx0. */
    readonly r0Re: Float64Array,
    readonly r0Im: Float64Array,
    readonly ux0Re: Float64Array,
    readonly ux0Im: Float64Array,
  ) {}

  /**
   * Predicted reading magnitudes for D (m×m row-major) into `out`; false when K is singular (the change leaves part
   * of the network without a reference).
   */
  predict(dRe: Float64Array, dIm: Float64Array, out: Float64Array): boolean {
    const { m, branches, gRe, gIm } = this;
    // t0 = D w
    const t0Re = new Float64Array(m);
    const t0Im = new Float64Array(m);
    for (let a = 0; a < m; a++) {
      for (let c = 0; c < m; c++) {
        const dr = dRe[a * m + c];
        const di = dIm[a * m + c];
        if (dr === 0 && di === 0) continue;
        t0Re[a] += dr * branches[c].wRe - di * branches[c].wIm;
        t0Im[a] += dr * branches[c].wIm + di * branches[c].wRe;
      }
    }
    // Uᵀy = Uᵀx0 − G t0
    const uyRe = new Float64Array(m);
    const uyIm = new Float64Array(m);
    for (let a = 0; a < m; a++) {
      let re = this.ux0Re[a];
      let im = this.ux0Im[a];
      for (let c = 0; c < m; c++) {
        re -= gRe[a * m + c] * t0Re[c] - gIm[a * m + c] * t0Im[c];
        im -= gRe[a * m + c] * t0Im[c] + gIm[a * m + c] * t0Re[c];
      }
      uyRe[a] = re;
      uyIm[a] = im;
    }
    // K = I + D G; z = K⁻¹ D Uᵀy
    const kRe = new Float64Array(m * m);
    const kIm = new Float64Array(m * m);
    const zRe = new Float64Array(m);
    const zIm = new Float64Array(m);
    let termScale = 1;
    for (let a = 0; a < m; a++) {
      for (let c = 0; c < m; c++) {
        const dr = dRe[a * m + c];
        const di = dIm[a * m + c];
        if (dr === 0 && di === 0) continue;
        zRe[a] += dr * uyRe[c] - di * uyIm[c];
        zIm[a] += dr * uyIm[c] + di * uyRe[c];
        const dm = Math.hypot(dr, di);
        for (let b = 0; b < m; b++) {
          const gr = gRe[c * m + b];
          const gi = gIm[c * m + b];
          kRe[a * m + b] += dr * gr - di * gi;
          kIm[a * m + b] += dr * gi + di * gr;
          termScale = Math.max(termScale, dm * Math.hypot(gr, gi));
        }
      }
      kRe[a * m + a] += 1;
    }
    if (!denseComplexSolveInPlace(m, kRe, kIm, zRe, zIm, PIVOT_FLOOR * termScale)) return false;
    // readings = r0 − RW (t0 + z)
    const R = out.length;
    for (let r = 0; r < R; r++) {
      let re = this.r0Re[r];
      let im = this.r0Im[r];
      for (let c = 0; c < m; c++) {
        const tr = t0Re[c] + zRe[c];
        const ti = t0Im[c] + zIm[c];
        re -= this.rwRe[r * m + c] * tr - this.rwIm[r * m + c] * ti;
        im -= this.rwRe[r * m + c] * ti + this.rwIm[r * m + c] * tr;
      }
      out[r] = Math.hypot(re, im);
    }
    return true;
  }
}

/** Solves W = A⁻¹U for a candidate's branches and keeps it where it is read. */
export function prepareColumns(lu: NumericLu, x0: ComplexVector, readings: ReadingRow[], branches: Branch[]): PreparedColumns {
  const n = lu.n;
  const m = branches.length;
  const R = readings.length;
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  const tRe = new Float64Array(n);
  const tIm = new Float64Array(n);
  const wRe = new Float64Array(n);
  const wIm = new Float64Array(n);
  const gRe = new Float64Array(m * m);
  const gIm = new Float64Array(m * m);
  const rwRe = new Float64Array(R * m);
  const rwIm = new Float64Array(R * m);
  const at = (v: Float64Array, i: number) => (i >= 0 ? v[i] : 0);
  branches.forEach((col, b) => {
    if (col.a >= 0) bRe[col.a] += col.sa;
    if (col.b >= 0) bRe[col.b] -= col.sb;
    permuteRows(lu, bRe, bIm, tRe, tIm);
    lowerSolveInPlace(lu, tRe, tIm);
    upperSolveInPlace(lu, tRe, tIm);
    permuteColumns(lu, tRe, tIm, wRe, wIm);
    if (col.a >= 0) bRe[col.a] = 0;
    if (col.b >= 0) bRe[col.b] = 0;
    branches.forEach((row, a) => {
      gRe[a * m + b] = row.sa * at(wRe, row.a) - row.sb * at(wRe, row.b);
      gIm[a * m + b] = row.sa * at(wIm, row.a) - row.sb * at(wIm, row.b);
    });
    readings.forEach((r, k) => {
      rwRe[k * m + b] = r.sp * at(wRe, r.p) - r.sq * at(wRe, r.q);
      rwIm[k * m + b] = r.sp * at(wIm, r.p) - r.sq * at(wIm, r.q);
    });
  });
  const r0Re = Float64Array.from(readings, (r) => r.offRe + r.sp * at(x0.re, r.p) - r.sq * at(x0.re, r.q));
  const r0Im = Float64Array.from(readings, (r) => r.offIm + r.sp * at(x0.im, r.p) - r.sq * at(x0.im, r.q));
  const ux0Re = Float64Array.from(branches, (c) => c.sa * at(x0.re, c.a) - c.sb * at(x0.re, c.b));
  const ux0Im = Float64Array.from(branches, (c) => c.sa * at(x0.im, c.a) - c.sb * at(x0.im, c.b));
  return new PreparedColumns(m, branches, gRe, gIm, rwRe, rwIm, r0Re, r0Im, ux0Re, ux0Im);
}
