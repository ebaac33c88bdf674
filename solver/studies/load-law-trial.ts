// One trial of the readings match's refit with the sheet's load laws, through one factorization: the cause and the
// fitted load level change the matrix by U D Uᵀ (the same branches as reading-model.ts), solved by the base factors
// and Woodbury (as OpeningSolver.linearSolver, but U spans every affected load element, so W = A⁻¹U is kept per
// candidate and K = I + D UᵀW factored once per trial), and the load iteration runs on the scaled load elements.
// The same answer as building and solving the changed sheet afresh, for a few base solves instead of a build and a
// factorization; a change that cuts part of the network off (K singular) is left to the fresh solve.
import type { SheetSettings } from '../../shared/sheet';
import type { Complex } from '../complex';
import type { BuiltNetwork } from '../network/build-network';
import type { LoadPart } from '../network/types';
import type { AssembledSystem } from '../solve/assemble';
import type { PinClasses } from '../solve/classes';
import { iterateLoads, type PinVoltages } from '../solve/load-iteration';
import type { ComplexCsc, LinearSolver } from '../linear-system';
import { analyse } from '../sparse/symbolic';
import { factor, type NumericLu } from '../sparse/lu';
import { cachedRowAbsSums, maxOf, multiplyInto } from '../sparse/residual';
import { lowerSolveInPlace, permuteColumns, permuteRows, upperSolveInPlace } from '../sparse/solve';
import { withoutExplicitZeros } from './opening-solver';
import { capacitanceMatrix, denseComplexFactor, denseComplexSolveFactored } from '../sparse/dense-complex';
import type { Branch } from './reading-model';

export type TrialOutcome = { ok: true; volts: PinVoltages } | { ok: false; message: string; /** A fresh build and solve may still answer. */ fresh: boolean };

/** A load element at a level: its rated power and its stamped admittance scaled alike (as the scale-loads what-if). */
export function scaledPart(part: LoadPart, level: number): LoadPart {
  if (level === 1) return part;
  const scale = (z: Complex): Complex => ({ re: z.re * level, im: z.im * level });
  return { ...part, ratedVa: scale(part.ratedVa), y: scale(part.y) };
}

/** W = A⁻¹U over every unknown and G = UᵀW, for one candidate's branches (U does not change between its trials). */
export interface CandidateColumns {
  branches: Branch[];
  wRe: Float64Array[];
  wIm: Float64Array[];
  gRe: Float64Array;
  gIm: Float64Array;
}

/** Largest accepted relative residual of an answer through the base factors (as the break sweep's). */
const RESIDUAL_TOLERANCE = 1e-10;
/** Below this share of its terms a pivot of K has lost too many digits (as reading-model.ts). */
const PIVOT_FLOOR = 1e-8;

/** Holds one network's factors for every trial of the candidates solved on it. */
export class LoadLawTrials {
  readonly matrix: ComplexCsc;
  private readonly lu: NumericLu;
  private readonly aNorm: number;
  private readonly n: number;

  constructor(
    readonly network: BuiltNetwork,
    readonly classes: PinClasses,
    readonly system: AssembledSystem,
    private readonly settings: SheetSettings,
    /** The factors of this system's matrix (without its explicit zeros) when the caller has them already. */
    factored?: { matrix: ComplexCsc; lu: NumericLu },
  ) {
    this.matrix = factored?.matrix ?? withoutExplicitZeros(system.matrix);
    this.lu = factored?.lu ?? factor(analyse(this.matrix), this.matrix);
    this.n = this.matrix.n;
    this.aNorm = maxOf(cachedRowAbsSums(this.matrix));
  }

  private baseSolve(bRe: Float64Array, bIm: Float64Array): { re: Float64Array; im: Float64Array } {
    const lu = this.lu;
    const tRe = new Float64Array(this.n);
    const tIm = new Float64Array(this.n);
    const x = { re: new Float64Array(this.n), im: new Float64Array(this.n) };
    permuteRows(lu, bRe, bIm, tRe, tIm);
    lowerSolveInPlace(lu, tRe, tIm);
    upperSolveInPlace(lu, tRe, tIm);
    permuteColumns(lu, tRe, tIm, x.re, x.im);
    return x;
  }

  columns(branches: Branch[]): CandidateColumns {
    const m = branches.length;
    const bRe = new Float64Array(this.n);
    const bIm = new Float64Array(this.n);
    const wRe: Float64Array[] = [];
    const wIm: Float64Array[] = [];
    const gRe = new Float64Array(m * m);
    const gIm = new Float64Array(m * m);
    branches.forEach((col, b) => {
      if (col.a >= 0) bRe[col.a] += col.sa;
      if (col.b >= 0) bRe[col.b] -= col.sb;
      const w = this.baseSolve(bRe, bIm);
      bRe.fill(0);
      wRe.push(w.re);
      wIm.push(w.im);
      branches.forEach((row, a) => {
        gRe[a * m + b] = project(row, w.re);
        gIm[a * m + b] = project(row, w.im);
      });
    });
    return { branches, wRe, wIm, gRe, gIm };
  }

  /**
   * The pin voltages with the change U D Uᵀ (D m×m row-major over the columns' branches; no columns: the network as
   * it is) and the load elements `loads` with their laws.
   */
  solve(cols: CandidateColumns | undefined, dRe: Float64Array, dIm: Float64Array, loads: LoadPart[]): TrialOutcome {
    const { system, classes } = this;
    const solver = cols ? this.updatedSolver(cols, dRe, dIm) : this.plainSolver();
    if (!solver) return { ok: false, message: 'the change leaves part of the network without a reference', fresh: true };
    let rhsRe = system.rhsRe;
    let rhsIm = system.rhsIm;
    if (cols) {
      // The known voltages' share moves by −U D w.
      rhsRe = rhsRe.slice();
      rhsIm = rhsIm.slice();
      const { branches } = cols;
      const m = branches.length;
      const t = times(m, dRe, dIm, Float64Array.from(branches, (b) => b.wRe), Float64Array.from(branches, (b) => b.wIm));
      addU(branches, t.re, t.im, -1, rhsRe, rhsIm);
    }
    const s = this.settings;
    const iteration = iterateLoads({ ...this.network, loads }, classes, { ...system, rhsRe, rhsIm }, solver, {
      lowVoltageSwitchFraction: s.lowVoltageSwitchFraction,
      tolerance: s.loadMismatchTolerance,
      maxIterations: s.maxLoadIterations,
    });
    if (iteration.ok) return { ok: true, volts: iteration.volts };
    return { ok: false, message: iteration.message, fresh: iteration.message.includes('singular') };
  }

  private plainSolver(): LinearSolver {
    return { matrix: this.matrix, method: 'factor', solve: (bRe, bIm) => ({ ok: true, value: this.baseSolve(bRe, bIm) }) };
  }

  /** (A + U D Uᵀ)⁻¹ by Woodbury with K = I + D G factored once; each answer checked by its residual. */
  private updatedSolver(cols: CandidateColumns, dRe: Float64Array, dIm: Float64Array): LinearSolver | undefined {
    const { branches, gRe, gIm, wRe, wIm } = cols;
    const m = branches.length;
    const { kRe, kIm, termScale } = capacitanceMatrix(m, dRe, dIm, gRe, gIm);
    const pivots = denseComplexFactor(m, kRe, kIm, PIVOT_FLOOR * termScale);
    if (!pivots) return undefined;
    const n = this.n;
    const rRe = new Float64Array(n);
    const rIm = new Float64Array(n);
    return {
      matrix: this.matrix,
      method: 'low-rank',
      solve: (bRe, bIm) => {
        const x = this.baseSolve(bRe, bIm);
        const y = { re: Float64Array.from(branches, (b) => project(b, x.re)), im: Float64Array.from(branches, (b) => project(b, x.im)) };
        const z = times(m, dRe, dIm, y.re, y.im);
        denseComplexSolveFactored(m, kRe, kIm, pivots, z.re, z.im);
        for (let b = 0; b < m; b++) {
          const tr = z.re[b];
          const ti = z.im[b];
          if (tr === 0 && ti === 0) continue;
          const cr = wRe[b];
          const ci = wIm[b];
          for (let i = 0; i < n; i++) {
            x.re[i] -= cr[i] * tr - ci[i] * ti;
            x.im[i] -= cr[i] * ti + ci[i] * tr;
          }
        }
        // Residual on (A + U D Uᵀ) x = b.
        multiplyInto(this.matrix, x.re, x.im, rRe, rIm);
        const ux = { re: Float64Array.from(branches, (b) => project(b, x.re)), im: Float64Array.from(branches, (b) => project(b, x.im)) };
        const dux = times(m, dRe, dIm, ux.re, ux.im);
        addU(branches, dux.re, dux.im, 1, rRe, rIm);
        let worst = 0;
        let xMax = 0;
        let bMax = 0;
        for (let i = 0; i < n; i++) {
          worst = Math.max(worst, Math.hypot(rRe[i] - bRe[i], rIm[i] - bIm[i]));
          xMax = Math.max(xMax, Math.hypot(x.re[i], x.im[i]));
          bMax = Math.max(bMax, Math.hypot(bRe[i], bIm[i]));
        }
        const denominator = this.aNorm * xMax + bMax;
        const residual = denominator === 0 ? (worst === 0 ? 0 : Infinity) : worst / denominator;
        if (!(residual <= RESIDUAL_TOLERANCE)) {
          return { ok: false, column: -1, message: `singular: the update through the base factors left a residual of ${residual.toExponential(2)}` };
        }
        return { ok: true, value: x };
      },
    };
  }
}

/** (Uᵀ v) for one branch. */
function project(b: Branch, v: Float64Array): number {
  return (b.a >= 0 ? b.sa * v[b.a] : 0) - (b.b >= 0 ? b.sb * v[b.b] : 0);
}

/** into += sign · U t. */
function addU(branches: Branch[], tRe: Float64Array, tIm: Float64Array, sign: number, intoRe: Float64Array, intoIm: Float64Array): void {
  branches.forEach((b, a) => {
    const tr = sign * tRe[a];
    const ti = sign * tIm[a];
    if (b.a >= 0) {
      intoRe[b.a] += b.sa * tr;
      intoIm[b.a] += b.sa * ti;
    }
    if (b.b >= 0) {
      intoRe[b.b] -= b.sb * tr;
      intoIm[b.b] -= b.sb * ti;
    }
  });
}

/** D v for an m-vector v. */
function times(m: number, dRe: Float64Array, dIm: Float64Array, vRe: Float64Array, vIm: Float64Array): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(m);
  const im = new Float64Array(m);
  for (let a = 0; a < m; a++) {
    for (let c = 0; c < m; c++) {
      const dr = dRe[a * m + c];
      const di = dIm[a * m + c];
      if (dr === 0 && di === 0) continue;
      re[a] += dr * vRe[c] - di * vIm[c];
      im[a] += dr * vIm[c] + di * vRe[c];
    }
  }
  return { re, im };
}
