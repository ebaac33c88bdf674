// The load iteration: constant-impedance shares are in the matrix; constant-current and constant-power shares are
// correction currents I_corr = I_wanted(V) − Y V, updated by fixed-point iteration (Anderson-accelerated) and
// re-solved with the same factors; when that does not contract, Newton steps on the corrections with the same
// factors (correction-newton.ts). Below the low-voltage switch a load turns to constant impedance (load-law.ts).
import type { Complex } from '../complex';
import type { BuiltNetwork } from '../network/build-network';
import type { LoadPart } from '../network/types';
import type { LinearSolver } from '../linear-system';
import type { PinClasses } from './classes';
import type { AssembledSystem } from './assemble';
import { AndersonMixer } from './anderson';
import { elementVolts, newtonStep, transferMatrix, type Transfer } from './correction-newton';
import { wantedCurrentInto } from './load-law';

/** Fixed-point passes tried before Newton on the corrections takes over. */
const FIXED_POINT_PASSES = 12;
/** Newton on the corrections needs one solve per load element and a dense system of twice their number. */
const NEWTON_MAX_ELEMENTS = 300;

export type LoadModel = 'constant-impedance' | 'constant-current' | 'constant-power' | 'mix';

export interface PartModel {
  model: LoadModel;
  /** Turned to constant impedance by the low-voltage switch. */
  switched: boolean;
}

export interface PinVoltages {
  re: Float64Array;
  im: Float64Array;
}

export type IterationOutcome =
  | {
      ok: true;
      volts: PinVoltages;
      /** The answer with every load at constant impedance (the first pass), for comparison under an open neutral. */
      constantImpedanceVolts: PinVoltages;
      corrections: Complex[];
      models: PartModel[];
      iterations: number;
      /** Largest load current mismatch as a fraction of that load's rated current. */
      mismatch: number;
      method: 'fixed-point' | 'newton';
    }
  | { ok: false; message: string; elementIds: string[] };

export interface IterationOptions {
  lowVoltageSwitchFraction: number;
  tolerance: number;
  maxIterations: number;
  /** Every load at its rated-voltage impedance (the fault case): one linear solve, no iteration. */
  constantImpedanceOnly?: boolean;
}

export function pinVoltages(network: BuiltNetwork, classes: PinClasses, system: AssembledSystem, x: { re: Float64Array; im: Float64Array }): PinVoltages {
  const count = network.pins.length;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  for (let pin = 0; pin < count; pin++) {
    const cls = classes.classOf[pin];
    re[pin] = classes.offsetRe[pin] + (cls < 0 ? 0 : system.scale[cls] * x.re[cls]);
    im[pin] = classes.offsetIm[pin] + (cls < 0 ? 0 : system.scale[cls] * x.im[cls]);
  }
  return { re, im };
}

function baseModel(part: LoadPart): LoadModel {
  const b = part.behaviour;
  if (b.impedance >= 1) return 'constant-impedance';
  if (b.current >= 1) return 'constant-current';
  if (b.power >= 1) return 'constant-power';
  return 'mix';
}

/**
 * One evaluation of the load laws, entry k of an element at 2k (re) and 2k + 1 (im): typed arrays, because the
 * iteration evaluates every element of a large sheet on every pass.
 */
interface Pass {
  /** The corrections the load law asks for at these voltages. */
  next: Float64Array;
  /** next − the corrections that produced these voltages. */
  residual: Float64Array;
  switched: Uint8Array;
  /** Per element, |residual| as a share of its rated current. */
  share: Float64Array;
  mismatch: number;
}

function evaluate(parts: LoadPart[], vRe: Float64Array, vIm: Float64Array, corrections: Float64Array, ratedAmps: Float64Array, options: IterationOptions): Pass {
  const P = parts.length;
  const pass: Pass = { next: new Float64Array(2 * P), residual: new Float64Array(2 * P), switched: new Uint8Array(P), share: new Float64Array(P), mismatch: 0 };
  const { next, residual, switched, share } = pass;
  const fraction = options.lowVoltageSwitchFraction;
  for (let k = 0; k < P; k++) {
    const part = parts[k];
    const vr = vRe[k];
    const vi = vIm[k];
    switched[k] = wantedCurrentInto(part, vr, vi, fraction, next, 2 * k) ? 1 : 0;
    next[2 * k] -= part.y.re * vr - part.y.im * vi;
    next[2 * k + 1] -= part.y.re * vi + part.y.im * vr;
    const rr = (residual[2 * k] = next[2 * k] - corrections[2 * k]);
    const ri = (residual[2 * k + 1] = next[2 * k + 1] - corrections[2 * k + 1]);
    const m = ratedAmps[k] > 0 ? Math.hypot(rr, ri) / ratedAmps[k] : 0;
    share[k] = m;
    pass.mismatch = Number.isFinite(m) ? Math.max(pass.mismatch, m) : Infinity;
  }
  return pass;
}

/** The elements whose mismatch is above the tolerance. */
const worstOf = (pass: Pass, tolerance: number): number[] => [...pass.share].flatMap((m, k) => (m <= tolerance ? [] : [k]));

const toComplex = (c: Float64Array): Complex[] => Array.from({ length: c.length / 2 }, (_, k) => ({ re: c[2 * k], im: c[2 * k + 1] }));
const fromComplex = (c: Complex[]): Float64Array => {
  const out = new Float64Array(2 * c.length);
  c.forEach((v, k) => {
    out[2 * k] = v.re;
    out[2 * k + 1] = v.im;
  });
  return out;
};

export function iterateLoads(
  network: BuiltNetwork,
  classes: PinClasses,
  system: AssembledSystem,
  solver: LinearSolver,
  options: IterationOptions,
): IterationOutcome {
  const parts = network.loads;
  const P = parts.length;
  const ratedAmps = Float64Array.from(parts, (p) => Math.hypot(p.ratedVa.re, p.ratedVa.im) / p.ratedVolts);
  const weights = new Float64Array(2 * P);
  ratedAmps.forEach((a, k) => (weights[2 * k] = weights[2 * k + 1] = a > 0 ? 1 / a : 1));
  const failure = (message: string): IterationOutcome => ({ ok: false, message, elementIds: [] });
  const vRe = new Float64Array(P);
  const vIm = new Float64Array(P);

  /** Pin voltages for the corrections c, and each element's voltage into vRe, vIm. */
  const solveWith = (c: Float64Array): PinVoltages | string => {
    const bRe = system.rhsRe.slice();
    const bIm = system.rhsIm.slice();
    for (let k = 0; k < P; k++) {
      const cr = c[2 * k];
      const ci = c[2 * k + 1];
      if (cr === 0 && ci === 0) continue;
      // The correction flows p → q through the load: it is drawn from p and returned to q.
      const cp = classes.classOf[parts[k].p];
      const cq = classes.classOf[parts[k].q];
      if (cp >= 0) {
        bRe[cp] -= cr * system.scale[cp];
        bIm[cp] -= ci * system.scale[cp];
      }
      if (cq >= 0) {
        bRe[cq] += cr * system.scale[cq];
        bIm[cq] += ci * system.scale[cq];
      }
    }
    const solved = solver.solve(bRe, bIm);
    if (!solved.ok) return `the network equations are singular (${solved.message})`;
    if (solved.value.re.length !== classes.classCount) return 'the linear solve returned a vector of the wrong size';
    const volts = pinVoltages(network, classes, system, solved.value);
    for (let k = 0; k < P; k++) {
      const { p, q } = parts[k];
      vRe[k] = volts.re[p] - volts.re[q];
      vIm[k] = volts.im[p] - volts.im[q];
    }
    return volts;
  };

  let corrections: Float64Array = new Float64Array(2 * P);
  const first = solveWith(corrections);
  if (typeof first === 'string') return failure(first);
  const constantImpedanceVolts = first;
  let volts = first;
  let pass = evaluate(parts, vRe, vIm, corrections, ratedAmps, options);
  let iteration = 1;
  const done = (method: 'fixed-point' | 'newton'): IterationOutcome => ({
    ok: true,
    volts,
    constantImpedanceVolts,
    corrections: toComplex(corrections),
    models: parts.map((p, k) => ({ model: baseModel(p), switched: pass.switched[k] === 1 })),
    iterations: iteration,
    mismatch: pass.mismatch,
    method,
  });
  if (options.constantImpedanceOnly) {
    return {
      ok: true,
      volts,
      constantImpedanceVolts,
      corrections: toComplex(corrections),
      models: parts.map(() => ({ model: 'constant-impedance' as LoadModel, switched: false })),
      iterations: 1,
      mismatch: 0,
      method: 'fixed-point',
    };
  }
  if (pass.mismatch <= options.tolerance) return done('fixed-point');

  // The fixed point, Anderson-accelerated; a change of switch state changes the map, so the history restarts.
  const mixer = new AndersonMixer(2 * P);
  const fixedPointLimit = P <= NEWTON_MAX_ELEMENTS ? Math.min(FIXED_POINT_PASSES, options.maxIterations) : options.maxIterations;
  let switchedBefore = pass.switched;
  while (iteration < fixedPointLimit && Number.isFinite(pass.mismatch) && pass.mismatch < 1e6) {
    corrections = mixer.next(corrections, pass.next, weights);
    const solved = solveWith(corrections);
    if (typeof solved === 'string') return failure(solved);
    volts = solved;
    iteration++;
    pass = evaluate(parts, vRe, vIm, corrections, ratedAmps, options);
    if (pass.mismatch <= options.tolerance) return done('fixed-point');
    if (!sameStates(pass.switched, switchedBefore)) mixer.reset();
    switchedBefore = pass.switched;
  }

  // Newton on the corrections with the same factors (the network is linear: v = v0 + T c), started again from
  // the constant-impedance answer so that it finds the solution next to it.
  if (P <= NEWTON_MAX_ELEMENTS && iteration < options.maxIterations) {
    const t = transferMatrix(parts, classes, system, solver);
    if (typeof t === 'string') return failure(t);
    const v0 = partVolts(parts, constantImpedanceVolts);
    let c: Complex[] = parts.map(() => ({ re: 0, im: 0 }));
    let v = v0;
    pass = evaluateAt(parts, v, c, ratedAmps, options);
    while (iteration < options.maxIterations && pass.mismatch > options.tolerance) {
      const step = newtonStep(parts, v, toComplex(pass.residual), options.lowVoltageSwitchFraction, t);
      if (!step) break;
      iteration++;
      ({ corrections: c, v, pass } = lineSearch(parts, v0, t, c, step, pass, ratedAmps, options));
    }
    corrections = fromComplex(c);
    const solved = solveWith(corrections);
    if (typeof solved === 'string') return failure(solved);
    volts = solved;
    pass = evaluate(parts, vRe, vIm, corrections, ratedAmps, options);
    if (pass.mismatch <= options.tolerance) return done('newton');
  }

  const ids = [...new Set(worstOf(pass, options.tolerance).map((k) => parts[k].loadId))];
  return {
    ok: false,
    message:
      `the load iteration did not converge in ${iteration} iterations (largest current mismatch ` +
      `${Number.isFinite(pass.mismatch) ? (pass.mismatch * 100).toPrecision(3) + ' %' : 'unbounded'} of rating) at loads ${ids.join(', ')}; ` +
      'the loads are probably more than the supply can carry at constant power',
    elementIds: ids,
  };
}

function sameStates(a: Uint8Array, b: Uint8Array): boolean {
  for (let k = 0; k < a.length; k++) if (a[k] !== b[k]) return false;
  return true;
}

const partVolts = (parts: LoadPart[], volts: PinVoltages): Complex[] =>
  parts.map((p) => ({ re: volts.re[p.p] - volts.re[p.q], im: volts.im[p.p] - volts.im[p.q] }));

/** evaluate() for the Newton path's element voltages and corrections as complex values. */
function evaluateAt(parts: LoadPart[], v: Complex[], c: Complex[], ratedAmps: Float64Array, options: IterationOptions): Pass {
  return evaluate(parts, Float64Array.from(v, (x) => x.re), Float64Array.from(v, (x) => x.im), fromComplex(c), ratedAmps, options);
}

/** Backtracking on the step length until the weighted residual falls (or the step is tiny). */
function lineSearch(
  parts: LoadPart[],
  v0: Complex[],
  t: Transfer,
  corrections: Complex[],
  step: Complex[],
  pass: Pass,
  ratedAmps: Float64Array,
  options: IterationOptions,
): { corrections: Complex[]; v: Complex[]; pass: Pass } {
  const norm = (r: Float64Array) => ratedAmps.reduce((s, a, k) => s + (r[2 * k] * r[2 * k] + r[2 * k + 1] * r[2 * k + 1]) / Math.max(a, 1e-12) ** 2, 0);
  const before = norm(pass.residual);
  let alpha = 1;
  for (;;) {
    const trial = corrections.map((c, k) => ({ re: c.re + alpha * step[k].re, im: c.im + alpha * step[k].im }));
    const v = elementVolts(v0, t, trial);
    const trialPass = evaluateAt(parts, v, trial, ratedAmps, options);
    if (norm(trialPass.residual) < before || alpha < 1 / 64) return { corrections: trial, v, pass: trialPass };
    alpha /= 2;
  }
}
