// Newton's method on the load correction currents, with the same factorization: the network is linear, so each
// load element's voltage is v = v0 + T c, where column k of T is the response to a unit correction current at
// element k (one solve each). Each Newton step is then a small dense solve in the space of corrections.
// Used when the plain fixed-point iteration does not contract (constant-power loads behind a floating neutral).
import type { Complex } from '../complex';
import type { LoadPart } from '../network/types';
import type { LinearSolver } from '../linear-system';
import type { PinClasses } from './classes';
import type { AssembledSystem } from './assemble';
import { solveDenseReal } from './dense-real';
import { wantedDerivatives } from './load-law';

export interface Transfer {
  /** T[j * P + k]: voltage of element j per ampere of correction at element k. */
  re: Float64Array;
  im: Float64Array;
}

/** The P×P transfer from correction currents to load element voltages, or a message when a solve fails. */
export function transferMatrix(parts: LoadPart[], classes: PinClasses, system: AssembledSystem, solver: LinearSolver): Transfer | string {
  const p = parts.length;
  const n = classes.classCount;
  const re = new Float64Array(p * p);
  const im = new Float64Array(p * p);
  for (let k = 0; k < p; k++) {
    const bRe = new Float64Array(n);
    const bIm = new Float64Array(n);
    const cp = classes.classOf[parts[k].p];
    const cq = classes.classOf[parts[k].q];
    if (cp >= 0) bRe[cp] -= system.scale[cp];
    if (cq >= 0) bRe[cq] += system.scale[cq];
    const solved = solver.solve(bRe, bIm);
    if (!solved.ok) return solved.message;
    const x = solved.value;
    const volts = (pin: number) => {
      const cls = classes.classOf[pin];
      return cls < 0 ? { re: 0, im: 0 } : { re: system.scale[cls] * x.re[cls], im: system.scale[cls] * x.im[cls] };
    };
    for (let j = 0; j < p; j++) {
      const a = volts(parts[j].p);
      const b = volts(parts[j].q);
      re[j * p + k] = a.re - b.re;
      im[j * p + k] = a.im - b.im;
    }
  }
  return { re, im };
}

export function elementVolts(v0: Complex[], t: Transfer, c: Complex[]): Complex[] {
  const p = v0.length;
  return v0.map((base, j) => {
    let re = base.re;
    let im = base.im;
    for (let k = 0; k < p; k++) {
      const tr = t.re[j * p + k];
      const ti = t.im[j * p + k];
      re += tr * c[k].re - ti * c[k].im;
      im += tr * c[k].im + ti * c[k].re;
    }
    return { re, im };
  });
}

/**
 * One Newton step δc for r(c) = w(v) − Y v − c = 0 with v = v0 + T c: (D T − I) δc = −r, D the real 2×2
 * derivative of w − Y v per element. Undefined when the step's matrix is singular.
 */
export function newtonStep(parts: LoadPart[], volts: Complex[], residual: Complex[], switchFraction: number, t: Transfer): Complex[] | undefined {
  const p = parts.length;
  const m = 2 * p;
  const jac = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  for (let j = 0; j < p; j++) {
    const { a, b } = wantedDerivatives(parts[j], volts[j], switchFraction);
    const A = { re: a.re - parts[j].y.re, im: a.im - parts[j].y.im };
    // Real form of δw = A δv + B conj(δv): [[Re(A+B), −Im(A−B)], [Im(A+B), Re(A−B)]].
    const d00 = A.re + b.re;
    const d01 = -(A.im - b.im);
    const d10 = A.im + b.im;
    const d11 = A.re - b.re;
    for (let k = 0; k < p; k++) {
      // δv_j per δc_k is complex multiplication by T_jk: [[tr, −ti], [ti, tr]].
      const tr = t.re[j * p + k];
      const ti = t.im[j * p + k];
      const row0 = 2 * j * m + 2 * k;
      const row1 = (2 * j + 1) * m + 2 * k;
      jac[row0] = d00 * tr + d01 * ti;
      jac[row0 + 1] = -d00 * ti + d01 * tr;
      jac[row1] = d10 * tr + d11 * ti;
      jac[row1 + 1] = -d10 * ti + d11 * tr;
    }
    jac[2 * j * m + 2 * j] -= 1;
    jac[(2 * j + 1) * m + 2 * j + 1] -= 1;
    rhs[2 * j] = -residual[j].re;
    rhs[2 * j + 1] = -residual[j].im;
  }
  const step = solveDenseReal(jac, rhs, m);
  if (!step) return undefined;
  return parts.map((_, k) => ({ re: step[2 * k], im: step[2 * k + 1] }));
}
