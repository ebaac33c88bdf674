// Opening one conductor of a run, solved through the base factors. A run is a two-port [[Y, −Y], [−Y, Y]] over its
// from and to pins, so opening conductor k changes the scaled matrix by U D Uᵀ, with D = Y_open − Y (c×c, one
// entry for a run without mutual coupling) and column i of U = s_f e_f − s_t e_t (the classes of conductor i's two
// ends, scaled by their zone voltages). The known voltages on the right-hand side move by −U D w, w_i the difference
// of the two ends' offsets. Woodbury: with W = A⁻¹U and K = I + D UᵀW, (A + U D Uᵀ)⁻¹ b = A⁻¹b − W K⁻¹ D Uᵀ A⁻¹b.
// Every answer is checked by its residual on the opened system. K singular means the opening leaves part of the
// network floating or cut off (it would need a reference tie): the caller solves that case afresh.
import type { BuiltNetwork } from '../network/build-network';
import { runAdmittance } from '../network/run';
import type { RunLayout } from '../network/types';
import type { ComplexCsc, LinearSolver, Outcome, ComplexVector } from '../linear-system';
import { analyse } from '../sparse/symbolic';
import { factor, type NumericLu } from '../sparse/lu';
import { cachedRowAbsSums, maxOf, multiplyInto } from '../sparse/residual';
import { lowerSolveInPlace, permuteColumns, permuteRows, upperSolveInPlace } from '../sparse/solve';
import { lowerSolveBlockInPlace, upperSolveBlockInPlace, type StepWeights } from '../sparse/block-solve';
import { ResidualProbes } from './residual-probes';
import { CutOffSides } from './cut-off-sides';
import { capacitanceMatrix, denseComplexSolveInPlace } from '../sparse/dense-complex';
import type { PinClasses } from '../solve/classes';
import type { AssembledSystem } from '../solve/assemble';

/** Largest accepted relative residual of an answer through the base factors (as the what-if machinery). */
export const OPENING_RESIDUAL_TOLERANCE = 1e-10;
/** Below this share of its terms a pivot of K has lost too many digits (as solveWithBlockUpdate). */
const PIVOT_FLOOR = 1e-8;
/** Columns of W solved together in one pass over the factors (the gain levels off beyond about 16). */
export const BLOCK_COLUMNS = 16;

/** The update of one opening: m columns of U and the m×m D, row-major. */
export interface OpeningUpdate {
  m: number;
  fromClass: Int32Array;
  toClass: Int32Array;
  fromScale: Float64Array;
  toScale: Float64Array;
  dRe: Float64Array;
  dIm: Float64Array;
  /** Offsets of the ends, V_f − V_t of the known parts. */
  wRe: Float64Array;
  wIm: Float64Array;
  /** Set when the last column is a tie holding this class at the reference (see withTie). */
  tieClass?: number;
}

interface Capacitance {
  kRe: Float64Array;
  kIm: Float64Array;
  termScale: number;
}

export type OpeningOutcome = { ok: true; residual: number } | { ok: false; reason: 'singular' | 'residual'; residual?: number };

/** One opening in a block: x = x0 − W[:, offset .. offset+m) t. */
export interface BlockCase {
  update: OpeningUpdate;
  offset: number;
  /** Absent when K is singular (the opening cuts a part off). */
  tRe?: Float64Array;
  tIm?: Float64Array;
  /** The class a tie holds (the update's last column), or −1. */
  tieClass: number;
}

/**
 * Openings solved together: W interleaved by pivot step (step k of column b at 2(k·width + b), real then
 * imaginary), x0 by step; both have a last row n, zero, for the reference.
 */
export interface OpeningBlock {
  width: number;
  values: Float64Array;
  /** Class → pivot step. */
  place: Int32Array;
  x0Re: Float64Array;
  x0Im: Float64Array;
  cases: BlockCase[];
  /** Per probe, g·W of each column (see residual-probes.ts), valid until the next block is solved. */
  dots: readonly StepWeights[];
  probes: ResidualProbes;
}

/** What every block over one base right-hand side shares. */
interface BlockBase {
  x0: ComplexVector;
  /** x0 by pivot step, entry n the reference's zero. */
  x0Re: Float64Array;
  x0Im: Float64Array;
  probes: ResidualProbes;
}

/** W[c, column] (zero for the reference, c = −1). */
function blockValueOfColumn(block: OpeningBlock, c: number, column: number): { re: number; im: number } {
  if (c < 0) return { re: 0, im: 0 };
  const p = 2 * (block.place[c] * block.width + column);
  return { re: block.values[p], im: block.values[p + 1] };
}

/** x[c] of one opening of a block (zero for the reference). */
export function blockValue(block: OpeningBlock, c: BlockCase, cls: number): { re: number; im: number } {
  if (cls < 0 || !c.tRe || !c.tIm) return { re: 0, im: 0 };
  const k = block.place[cls];
  let re = block.x0Re[k];
  let im = block.x0Im[k];
  const w = block.values;
  for (let b = 0, p = 2 * (k * block.width + c.offset); b < c.update.m; b++, p += 2) {
    re -= w[p] * c.tRe[b] - w[p + 1] * c.tIm[b];
    im -= w[p] * c.tIm[b] + w[p + 1] * c.tRe[b];
  }
  return { re, im };
}

/** Holds the base factors and scratch space for every opening of a sweep: no allocation per case beyond tiny arrays. */
export class OpeningSolver {
  readonly n: number;
  private readonly maxM: number;
  private readonly wRe: Float64Array[];
  private readonly wIm: Float64Array[];
  private readonly tmpRe: Float64Array;
  private readonly tmpIm: Float64Array;
  private readonly unitRe: Float64Array;
  private readonly unitIm: Float64Array;
  private readonly rRe: Float64Array;
  private readonly rIm: Float64Array;
  private readonly bRe: Float64Array;
  private readonly bIm: Float64Array;
  private readonly aNorm: number;
  /** The base matrix without its explicit zeros, and its own factors (sparser: see the constructor). */
  readonly matrix: ComplexCsc;
  private readonly lu: NumericLu;
  private readonly blockValues: Float64Array;

  constructor(
    readonly network: BuiltNetwork,
    readonly classes: PinClasses,
    readonly system: AssembledSystem,
  ) {
    // The assembled pattern keeps explicit zeros (the uncoupled entries of every run block) so that what-ifs reuse
    // one analysis; here no pattern is reused, so they go, and the factors, products and solves get cheaper.
    this.matrix = withoutExplicitZeros(system.matrix);
    this.lu = factor(analyse(this.matrix), this.matrix);
    this.n = this.matrix.n;
    // One more column than the widest run: the tie that holds a cut-off part (see withTie).
    this.maxM = network.runs.reduce((m, r) => Math.max(m, r.conductors.length), 1) + 1;
    const arrays = () => Array.from({ length: this.maxM }, () => new Float64Array(this.n));
    this.wRe = arrays();
    this.wIm = arrays();
    [this.tmpRe, this.tmpIm, this.unitRe, this.unitIm, this.rRe, this.rIm, this.bRe, this.bIm] = Array.from({ length: 8 }, () => new Float64Array(this.n));
    this.aNorm = maxOf(cachedRowAbsSums(this.matrix));
    // One more row than unknowns: the reference's, always zero, so that a reader needs no test for it.
    this.blockValues = new Float64Array(2 * (this.n + 1) * BLOCK_COLUMNS);
  }

  /** The update that opens conductor `index` of a run, or undefined when it is open already or changes nothing. */
  update(layout: RunLayout, index: number): OpeningUpdate | undefined {
    const conductors = layout.conductors;
    if (conductors[index].open) return undefined;
    const stamp = this.network.stamps[layout.stampIndex];
    const c = conductors.length;
    // D = Y_open − Y over the run's conductors; without mutual coupling Y is diagonal and only (index, index) changes.
    let rows: number[];
    let d: (i: number, j: number) => { re: number; im: number };
    if (!layout.mutualCoupling) {
      rows = [index];
      const y = stamp.y[index][index];
      d = () => ({ re: -y.re, im: -y.im });
    } else {
      const open = conductors.map((k, i) => k.open || i === index);
      const yOpen = runAdmittance(layout.impedanceOhms, open, conductors.map((k) => k.addedOhms));
      rows = [...Array(c).keys()];
      d = (i, j) => ({ re: yOpen[i][j].re - stamp.y[i][j].re, im: yOpen[i][j].im - stamp.y[i][j].im });
    }
    const { classOf, offsetRe, offsetIm } = this.classes;
    const scale = this.system.scale;
    // Conductors whose two ends are one class (or both earth) contribute nothing.
    const used = rows.filter((i) => classOf[conductors[i].fromPin] !== classOf[conductors[i].toPin]);
    const m = used.length;
    if (m === 0) return undefined;
    const u: OpeningUpdate = {
      m,
      fromClass: new Int32Array(m),
      toClass: new Int32Array(m),
      fromScale: new Float64Array(m),
      toScale: new Float64Array(m),
      dRe: new Float64Array(m * m),
      dIm: new Float64Array(m * m),
      wRe: new Float64Array(m),
      wIm: new Float64Array(m),
    };
    used.forEach((i, a) => {
      const { fromPin, toPin } = conductors[i];
      const cf = classOf[fromPin];
      const ct = classOf[toPin];
      u.fromClass[a] = cf;
      u.toClass[a] = ct;
      u.fromScale[a] = cf >= 0 ? scale[cf] : 0;
      u.toScale[a] = ct >= 0 ? scale[ct] : 0;
      u.wRe[a] = offsetRe[fromPin] - offsetRe[toPin];
      u.wIm[a] = offsetIm[fromPin] - offsetIm[toPin];
      used.forEach((j, b) => {
        const v = d(i, j);
        u.dRe[a * m + b] = v.re;
        u.dIm[a * m + b] = v.im;
      });
    });
    let any = false;
    for (let t = 0; t < m * m; t++) if (u.dRe[t] !== 0 || u.dIm[t] !== 0) any = true;
    return any ? u : undefined;
  }

  /** The base answer A⁻¹ b (a new vector). */
  solveBase(bRe: Float64Array, bIm: Float64Array): ComplexVector {
    const x = { re: new Float64Array(this.n), im: new Float64Array(this.n) };
    this.baseSolve(bRe, bIm, x.re, x.im);
    return x;
  }

  /** out = A⁻¹ b with the base factors, through the scratch arrays. */
  private baseSolve(bRe: Float64Array, bIm: Float64Array, outRe: Float64Array, outIm: Float64Array): void {
    const lu = this.lu;
    permuteRows(lu, bRe, bIm, this.tmpRe, this.tmpIm);
    lowerSolveInPlace(lu, this.tmpRe, this.tmpIm);
    upperSolveInPlace(lu, this.tmpRe, this.tmpIm);
    permuteColumns(lu, this.tmpRe, this.tmpIm, outRe, outIm);
  }

  /**
   * W = A⁻¹ U into the column scratch. Each column has two nonzeros, so the forward substitution skips almost
   * everything (it passes over zero entries); the back substitution is dense.
   */
  private columns(u: OpeningUpdate): void {
    const lu = this.lu;
    const { tmpRe, tmpIm } = this;
    for (let a = 0; a < u.m; a++) {
      tmpRe.fill(0);
      tmpIm.fill(0);
      if (u.fromClass[a] >= 0) tmpRe[lu.rowPivot[u.fromClass[a]]] += u.fromScale[a];
      if (u.toClass[a] >= 0) tmpRe[lu.rowPivot[u.toClass[a]]] -= u.toScale[a];
      lowerSolveInPlace(lu, tmpRe, tmpIm);
      upperSolveInPlace(lu, tmpRe, tmpIm);
      permuteColumns(lu, tmpRe, tmpIm, this.wRe[a], this.wIm[a]);
    }
  }

  /** (Uᵀ v)_a. */
  private static project(u: OpeningUpdate, a: number, vRe: Float64Array, vIm: Float64Array): { re: number; im: number } {
    const cf = u.fromClass[a];
    const ct = u.toClass[a];
    let re = 0;
    let im = 0;
    if (cf >= 0) {
      re += u.fromScale[a] * vRe[cf];
      im += u.fromScale[a] * vIm[cf];
    }
    if (ct >= 0) {
      re -= u.toScale[a] * vRe[ct];
      im -= u.toScale[a] * vIm[ct];
    }
    return { re, im };
  }

  /** K = I + D UᵀW (row-major), with the scale of its terms for the pivot floor. */
  private capacitance(u: OpeningUpdate): Capacitance {
    const m = u.m;
    const gRe = new Float64Array(m * m);
    const gIm = new Float64Array(m * m);
    for (let b = 0; b < m; b++) {
      for (let a = 0; a < m; a++) {
        const g = OpeningSolver.project(u, a, this.wRe[b], this.wIm[b]);
        gRe[a * m + b] = g.re;
        gIm[a * m + b] = g.im;
      }
    }
    return capacitanceMatrix(u.m, u.dRe, u.dIm, gRe, gIm);
  }

  /** z = K⁻¹ D Uᵀ y, or undefined when K is singular to working precision. */
  private static correction(u: OpeningUpdate, k: Capacitance, yRe: Float64Array, yIm: Float64Array) {
    const m = u.m;
    const py = OpeningSolver.projectAll(u, yRe, yIm);
    const { re: zRe, im: zIm } = OpeningSolver.dTimes(u, py.re, py.im);
    const ok = denseComplexSolveInPlace(m, k.kRe.slice(), k.kIm.slice(), zRe, zIm, PIVOT_FLOOR * k.termScale);
    return ok ? { zRe, zIm } : undefined;
  }

  /** D v for an m-vector v. */
  private static dTimes(u: OpeningUpdate, vRe: ArrayLike<number>, vIm: ArrayLike<number>): { re: Float64Array; im: Float64Array } {
    const m = u.m;
    const re = new Float64Array(m);
    const im = new Float64Array(m);
    for (let a = 0; a < m; a++) {
      for (let c = 0; c < m; c++) {
        const dr = u.dRe[a * m + c];
        const di = u.dIm[a * m + c];
        re[a] += dr * vRe[c] - di * vIm[c];
        im[a] += dr * vIm[c] + di * vRe[c];
      }
    }
    return { re, im };
  }

  /** into += sign · U t. */
  private static addU(u: OpeningUpdate, t: { re: Float64Array; im: Float64Array }, sign: number, intoRe: Float64Array, intoIm: Float64Array): void {
    for (let a = 0; a < u.m; a++) {
      const tr = sign * t.re[a];
      const ti = sign * t.im[a];
      if (tr === 0 && ti === 0) continue;
      const cf = u.fromClass[a];
      const ct = u.toClass[a];
      if (cf >= 0) {
        intoRe[cf] += u.fromScale[a] * tr;
        intoIm[cf] += u.fromScale[a] * ti;
      }
      if (ct >= 0) {
        intoRe[ct] -= u.toScale[a] * tr;
        intoIm[ct] -= u.toScale[a] * ti;
      }
    }
  }

  /** Uᵀ v as an m-vector. */
  private static projectAll(u: OpeningUpdate, vRe: Float64Array, vIm: Float64Array): { re: Float64Array; im: Float64Array } {
    const re = new Float64Array(u.m);
    const im = new Float64Array(u.m);
    for (let a = 0; a < u.m; a++) {
      const p = OpeningSolver.project(u, a, vRe, vIm);
      re[a] = p.re;
      im[a] = p.im;
    }
    return { re, im };
  }

  /** b + Δb of the opened system (Δb = −U D w) into `into`. */
  openedRhs(u: OpeningUpdate, bRe: Float64Array, bIm: Float64Array, intoRe: Float64Array, intoIm: Float64Array): void {
    intoRe.set(bRe);
    intoIm.set(bIm);
    OpeningSolver.addU(u, OpeningSolver.dTimes(u, u.wRe, u.wIm), -1, intoRe, intoIm);
  }

  /** Relative residual of x on (A + U D Uᵀ) x = b (b already the opened right-hand side). */
  residual(u: OpeningUpdate, x: ComplexVector, bRe: Float64Array, bIm: Float64Array): number {
    const { rRe, rIm } = this;
    multiplyInto(this.matrix, x.re, x.im, rRe, rIm);
    const n = this.n;
    const px = OpeningSolver.projectAll(u, x.re, x.im);
    OpeningSolver.addU(u, OpeningSolver.dTimes(u, px.re, px.im), 1, rRe, rIm);
    // One pass for ||r||∞, ||x||∞ and ||b||∞; ||A + UDUᵀ||∞ is taken as the base's (an opening lowers a few entries).
    let worst = 0;
    let xMax = 0;
    let bMax = 0;
    for (let i = 0; i < n; i++) {
      const vr = rRe[i] - bRe[i];
      const vi = rIm[i] - bIm[i];
      const v = vr * vr + vi * vi;
      if (v > worst) worst = v;
      const xv = x.re[i] * x.re[i] + x.im[i] * x.im[i];
      if (xv > xMax) xMax = xv;
      const bv = bRe[i] * bRe[i] + bIm[i] * bIm[i];
      if (bv > bMax) bMax = bv;
    }
    const denominator = this.aNorm * Math.sqrt(xMax) + Math.sqrt(bMax);
    if (denominator === 0) return worst === 0 ? 0 : Infinity;
    return Math.sqrt(worst) / denominator;
  }

  /**
   * W and K for an opening. When K is singular the opening cut a part off from every source (a PE bar and those
   * beyond it, say); the fresh solve pins such a part at zero with a tie on each class, so the same answer comes
   * from one tie on the cut-off side's end of the conductor: try each end. The caller checks that the tie carries
   * nothing (x there is zero), which is what makes it the same answer.
   */
  private prepareUpdate(u: OpeningUpdate): { u: OpeningUpdate; k: Capacitance; tieClass: number } | undefined {
    this.columns(u);
    const k = this.capacitance(u);
    if (OpeningSolver.nonsingular(u, k)) return { u, k, tieClass: -1 };
    for (const c of new Set([u.toClass[0], u.fromClass[0]])) {
      if (c < 0) continue;
      const tied = this.withTie(u, c);
      this.columns(tied);
      const kt = this.capacitance(tied);
      if (OpeningSolver.nonsingular(tied, kt)) return { u: tied, k: kt, tieClass: c };
    }
    return undefined;
  }

  private static nonsingular(u: OpeningUpdate, k: Capacitance): boolean {
    return denseComplexSolveInPlace(u.m, k.kRe.slice(), k.kIm.slice(), new Float64Array(u.m), new Float64Array(u.m), PIVOT_FLOOR * k.termScale);
  }

  /** The update plus a tie of the class's own diagonal size from class c to the reference. */
  private withTie(u: OpeningUpdate, c: number): OpeningUpdate {
    const m = u.m + 1;
    const grow = (a: Float64Array, extra: number) => Float64Array.from([...a, extra]);
    const dRe = new Float64Array(m * m);
    const dIm = new Float64Array(m * m);
    for (let a = 0; a < u.m; a++) {
      for (let b = 0; b < u.m; b++) {
        dRe[a * m + b] = u.dRe[a * u.m + b];
        dIm[a * m + b] = u.dIm[a * u.m + b];
      }
    }
    const diagonal = this.diagonal(c);
    dRe[m * m - 1] = diagonal > 0 ? diagonal : 1;
    return {
      m,
      fromClass: Int32Array.from([...u.fromClass, c]),
      toClass: Int32Array.from([...u.toClass, -1]),
      fromScale: grow(u.fromScale, 1),
      toScale: grow(u.toScale, 0),
      dRe,
      dIm,
      wRe: grow(u.wRe, 0),
      wIm: grow(u.wIm, 0),
      tieClass: c,
    };
  }

  private diagonal(c: number): number {
    const a = this.matrix;
    for (let p = a.colPtr[c]; p < a.colPtr[c + 1]; p++) if (a.rowIdx[p] === c) return Math.hypot(a.re[p], a.im[p]);
    return 0;
  }

  /** A tie's class must sit at zero (to the last digits) for the tied answer to be the opened network's. */
  private static tieCarriesNothing(tieClass: number, x: ComplexVector): boolean {
    if (tieClass < 0) return true;
    let largest = 0;
    for (let i = 0; i < x.re.length; i++) largest = Math.max(largest, Math.abs(x.re[i]), Math.abs(x.im[i]));
    return Math.hypot(x.re[tieClass], x.im[tieClass]) <= 1e-9 * largest;
  }

  /**
   * The opened system's answer for the base right-hand side b whose base answer x0 = A⁻¹ b is known:
   * x = x0 − W (D w + K⁻¹ D Uᵀ (x0 − W D w)). One base solve per column of U.
   */
  solveFromBase(opening: OpeningUpdate, bRe: Float64Array, bIm: Float64Array, x0: ComplexVector, out: ComplexVector): OpeningOutcome {
    const prepared = this.prepareUpdate(opening);
    if (!prepared) return { ok: false, reason: 'singular' };
    const { u, k, tieClass } = prepared;
    const m = u.m;
    // t0 = D w; y = x0 − W t0 (formed in out).
    const { re: t0Re, im: t0Im } = OpeningSolver.dTimes(u, u.wRe, u.wIm);
    out.re.set(x0.re);
    out.im.set(x0.im);
    this.subtractColumns(m, t0Re, t0Im, out);
    const z = OpeningSolver.correction(u, k, out.re, out.im);
    if (!z) return { ok: false, reason: 'singular' };
    this.subtractColumns(m, z.zRe, z.zIm, out);
    if (!OpeningSolver.tieCarriesNothing(tieClass, out)) return { ok: false, reason: 'singular' };
    this.openedRhs(u, bRe, bIm, this.bRe, this.bIm);
    const residual = this.residual(u, out, this.bRe, this.bIm);
    return residual <= OPENING_RESIDUAL_TOLERANCE ? { ok: true, residual } : { ok: false, reason: 'residual', residual };
  }

  /** out ← out − W t. */
  private subtractColumns(m: number, tRe: Float64Array, tIm: Float64Array, out: ComplexVector): void {
    const n = this.n;
    for (let b = 0; b < m; b++) {
      const tr = tRe[b];
      const ti = tIm[b];
      if (tr === 0 && ti === 0) continue;
      const gRe = this.wRe[b];
      const gIm = this.wIm[b];
      for (let i = 0; i < n; i++) {
        out.re[i] -= gRe[i] * tr - gIm[i] * ti;
        out.im[i] -= gRe[i] * ti + gIm[i] * tr;
      }
    }
  }

  /**
   * Openings answered together against the base right-hand side b (base answer x0 = A⁻¹ b): their columns of W
   * solved as one block (at most BLOCK_COLUMNS columns in all), and for each its t of x = x0 − W t, with
   * t = D w + K⁻¹ D (Uᵀx0 − G D w), G = UᵀW. No n-vector is formed per opening: the reader takes x where it needs
   * it (see blockValue and LoadWatch.fromBlock), then verify() checks the answer by its probed residual. An
   * opening whose K is singular (a part cut off) gets no t: tiedUpdate() gives the update that holds the part.
   */
  solveBlock(updates: readonly OpeningUpdate[], bRe: Float64Array, bIm: Float64Array, x0: ComplexVector): OpeningBlock {
    const base = this.baseFor(bRe, bIm, x0);
    const width = updates.reduce((w, u) => w + u.m, 0);
    if (width > BLOCK_COLUMNS) throw new RangeError(`a block holds at most ${BLOCK_COLUMNS} columns, not ${width}`);
    const { lu, blockValues } = this;
    blockValues.fill(0, 0, 2 * (this.n + 1) * width);
    let column = 0;
    let firstRow = this.n;
    const seeds: number[] = [];
    for (const u of updates) {
      for (let a = 0; a < u.m; a++, column++) {
        if (u.fromClass[a] >= 0) {
          const row = lu.rowPivot[u.fromClass[a]];
          blockValues[2 * (row * width + column)] += u.fromScale[a];
          firstRow = Math.min(firstRow, row);
          seeds.push(row);
        }
        if (u.toClass[a] >= 0) {
          const row = lu.rowPivot[u.toClass[a]];
          blockValues[2 * (row * width + column)] -= u.toScale[a];
          firstRow = Math.min(firstRow, row);
          seeds.push(row);
        }
      }
    }
    const dots = base.probes.weights();
    lowerSolveBlockInPlace(lu, blockValues, width, firstRow, dots, seeds);
    upperSolveBlockInPlace(lu, blockValues, width);
    const block: OpeningBlock = {
      width,
      values: blockValues,
      place: lu.colOrderInverse,
      x0Re: base.x0Re,
      x0Im: base.x0Im,
      cases: [],
      dots,
      probes: base.probes,
    };
    let offset = 0;
    for (const u of updates) {
      block.cases.push(this.blockCase(block, u, offset, x0));
      offset += u.m;
    }
    return block;
  }

  /** One opening's t from its columns of the block, or none when K is singular. */
  private blockCase(block: OpeningBlock, u: OpeningUpdate, offset: number, x0: ComplexVector): BlockCase {
    const m = u.m;
    const gRe = new Float64Array(m * m);
    const gIm = new Float64Array(m * m);
    for (let a = 0; a < m; a++) {
      for (let b = 0; b < m; b++) {
        const from = blockValueOfColumn(block, u.fromClass[a], offset + b);
        const to = blockValueOfColumn(block, u.toClass[a], offset + b);
        gRe[a * m + b] = u.fromScale[a] * from.re - u.toScale[a] * to.re;
        gIm[a * m + b] = u.fromScale[a] * from.im - u.toScale[a] * to.im;
      }
    }
    const k = capacitanceMatrix(u.m, u.dRe, u.dIm, gRe, gIm);
    const t0 = OpeningSolver.dTimes(u, u.wRe, u.wIm);
    const y = OpeningSolver.projectAll(u, x0.re, x0.im);
    for (let a = 0; a < m; a++) {
      for (let b = 0; b < m; b++) {
        const gr = gRe[a * m + b];
        const gi = gIm[a * m + b];
        y.re[a] -= gr * t0.re[b] - gi * t0.im[b];
        y.im[a] -= gr * t0.im[b] + gi * t0.re[b];
      }
    }
    const z = OpeningSolver.dTimes(u, y.re, y.im);
    const tieClass = u.tieClass ?? -1;
    if (!denseComplexSolveInPlace(m, k.kRe, k.kIm, z.re, z.im, PIVOT_FLOOR * k.termScale)) return { update: u, offset, tieClass };
    for (let b = 0; b < m; b++) {
      z.re[b] += t0.re[b];
      z.im[b] += t0.im[b];
    }
    return { update: u, offset, tRe: z.re, tIm: z.im, tieClass };
  }

  /**
   * The check of a block answer: a tie must carry nothing, and the probed residual of the opened system must be
   * within tolerance. `xMax` is the largest |x| its reader met (it reads nearly every unknown; one it missed can only
   * make the check stricter).
   */
  verify(block: OpeningBlock, index: number, xMax: number): OpeningOutcome {
    const c = block.cases[index];
    if (!c.tRe || !c.tIm) return { ok: false, reason: 'singular' };
    const u = c.update;
    const m = u.m;
    if (c.tieClass >= 0) {
      const at = blockValue(block, c, c.tieClass);
      if (Math.hypot(at.re, at.im) > 1e-9 * xMax) return { ok: false, reason: 'singular' };
    }
    // z·r = g·x + (Uᵀz)·D (Uᵀx + w) − z·b, with g·x = g·x0 − Σ t_b g·W_b.
    const ux = { re: new Float64Array(m), im: new Float64Array(m) };
    for (let a = 0; a < m; a++) {
      const from = blockValue(block, c, u.fromClass[a]);
      const to = blockValue(block, c, u.toClass[a]);
      ux.re[a] = u.fromScale[a] * from.re - u.toScale[a] * to.re + u.wRe[a];
      ux.im[a] = u.fromScale[a] * from.im - u.toScale[a] * to.im + u.wIm[a];
    }
    const v = OpeningSolver.dTimes(u, ux.re, ux.im);
    const residual = block.probes.relativeResidual(block.dots, c.offset, m, c.tRe, c.tIm, xMax, this.aNorm, (zv) => {
      let re = 0;
      let im = 0;
      for (let a = 0; a < m; a++) {
        const zu = (u.fromClass[a] >= 0 ? u.fromScale[a] * zv[u.fromClass[a]] : 0) - (u.toClass[a] >= 0 ? u.toScale[a] * zv[u.toClass[a]] : 0);
        re += zu * v.re[a];
        im += zu * v.im[a];
      }
      return { re, im };
    });
    return residual <= OPENING_RESIDUAL_TOLERANCE ? { ok: true, residual } : { ok: false, reason: 'residual', residual };
  }

  /** The update plus a tie that holds the part an opening cuts off (at the conductor's far end, else its near end). */
  tiedUpdate(u: OpeningUpdate): OpeningUpdate | undefined {
    const c = u.toClass[0] >= 0 ? u.toClass[0] : u.fromClass[0];
    return c >= 0 ? this.withTie(u, c) : undefined;
  }

  private cutOff?: CutOffSides;

  /**
   * The update as a block should first try it: with its tie already when the opening removes the only coupling
   * across a bridge of the network (a PE run with only a ground bar beyond, say), else as it is.
   */
  likelyUpdate(u: OpeningUpdate): OpeningUpdate {
    if (u.m !== 1 || (u.fromClass[0] < 0 && u.toClass[0] < 0)) return u;
    this.cutOff ??= new CutOffSides(this.matrix, this.system.scale);
    if (u.fromClass[0] < 0 || u.toClass[0] < 0) {
      // A conductor from the reference (an earthed bar) to one class: the opening takes −D = y off its shunt.
      const c = Math.max(u.fromClass[0], u.toClass[0]);
      const held = this.cutOff.sideCutOffFromReference(c, -u.dRe[0], -u.dIm[0]);
      return held >= 0 ? this.withTie(u, held) : u;
    }
    const side = this.cutOff.sideCutOff(u.fromClass[0], u.toClass[0]);
    if (side < 0) return u;
    // The opening must take the entry between the two classes to zero (nothing else couples them).
    const before = this.cutOff.entry(u.fromClass[0], u.toClass[0]);
    const f = u.fromScale[0] * u.toScale[0];
    const after = Math.hypot(before.re - f * u.dRe[0], before.im - f * u.dIm[0]);
    return after <= 1e-9 * Math.hypot(before.re, before.im) ? this.withTie(u, side) : u;
  }

  private base?: BlockBase;

  /** x0 in pivot order and the probes, kept while the same base is asked for. */
  private baseFor(bRe: Float64Array, bIm: Float64Array, x0: ComplexVector): BlockBase {
    if (this.base?.probes.isFor(bRe, bIm, x0)) return this.base;
    const order = this.lu.colOrder;
    // By pivot step, with the reference's zero as entry n (see the block's extra row).
    const x0Re = new Float64Array(this.n + 1);
    const x0Im = new Float64Array(this.n + 1);
    order.forEach((c, k) => {
      x0Re[k] = x0.re[c];
      x0Im[k] = x0.im[c];
    });
    this.base = { x0, x0Re, x0Im, probes: new ResidualProbes(this.matrix, this.lu, bRe, bIm, x0, BLOCK_COLUMNS) };
    return this.base;
  }

  /**
   * A LinearSolver for the opened system (for the load iteration), or undefined when K is singular. It keeps its
   * own copy of W; each answer is checked by its residual and a bad one is an error, not a silent value.
   */
  linearSolver(opening: OpeningUpdate): { solver: LinearSolver; update: OpeningUpdate } | undefined {
    const prepared = this.prepareUpdate(opening);
    if (!prepared) return undefined;
    const { u, k, tieClass } = prepared;
    const m = u.m;
    const wRe = this.wRe.slice(0, m).map((w) => w.slice());
    const wIm = this.wIm.slice(0, m).map((w) => w.slice());
    const solver: LinearSolver = {
      matrix: this.matrix,
      method: 'low-rank',
      solve: (bRe, bIm): Outcome<ComplexVector> => {
        const x = { re: new Float64Array(this.n), im: new Float64Array(this.n) };
        this.baseSolve(bRe, bIm, x.re, x.im);
        const z = OpeningSolver.correction(u, k, x.re, x.im);
        if (!z) return { ok: false, column: -1, message: 'singular: the opening leaves part of the network without a reference' };
        for (let b = 0; b < m; b++) {
          const tr = z.zRe[b];
          const ti = z.zIm[b];
          for (let i = 0; i < this.n; i++) {
            x.re[i] -= wRe[b][i] * tr - wIm[b][i] * ti;
            x.im[i] -= wRe[b][i] * ti + wIm[b][i] * tr;
          }
        }
        if (!OpeningSolver.tieCarriesNothing(tieClass, x)) return { ok: false, column: -1, message: 'singular: the tie of a cut-off part carries current' };
        const residual = this.residual(u, x, bRe, bIm);
        if (!(residual <= OPENING_RESIDUAL_TOLERANCE)) {
          return { ok: false, column: -1, message: `singular: the update through the base factors left a residual of ${residual.toExponential(2)}` };
        }
        return { ok: true, value: x };
      },
    };
    return { solver, update: u };
  }
}

/** The same matrix without entries that are exactly zero (diagonals kept). */
export function withoutExplicitZeros(a: ComplexCsc): ComplexCsc {
  const n = a.n;
  const colPtr = new Int32Array(n + 1);
  let count = 0;
  for (let j = 0; j < n; j++) {
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) if (a.re[p] !== 0 || a.im[p] !== 0 || a.rowIdx[p] === j) count++;
    colPtr[j + 1] = count;
  }
  const rowIdx = new Int32Array(count);
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  let q = 0;
  for (let j = 0; j < n; j++) {
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
      if (a.re[p] === 0 && a.im[p] === 0 && a.rowIdx[p] !== j) continue;
      rowIdx[q] = a.rowIdx[p];
      re[q] = a.re[p];
      im[q++] = a.im[p];
    }
  }
  return { n, colPtr, rowIdx, re, im };
}

