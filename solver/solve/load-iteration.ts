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
import { wantedCurrent } from './load-law';

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

interface Pass {
  /** The corrections the load law asks for at these voltages. */
  next: Complex[];
  /** next − the corrections that produced these voltages. */
  residual: Complex[];
  switched: boolean[];
  mismatch: number;
  worst: number[];
}

function evaluate(parts: LoadPart[], volts: Complex[], corrections: Complex[], ratedAmps: number[], options: IterationOptions): Pass {
  const pass: Pass = { next: [], residual: [], switched: [], mismatch: 0, worst: [] };
  parts.forEach((part, k) => {
    const v = volts[k];
    const { current, switched } = wantedCurrent(part, v, options.lowVoltageSwitchFraction);
    const yv = { re: part.y.re * v.re - part.y.im * v.im, im: part.y.re * v.im + part.y.im * v.re };
    const next = { re: current.re - yv.re, im: current.im - yv.im };
    const r = { re: next.re - corrections[k].re, im: next.im - corrections[k].im };
    const m = ratedAmps[k] > 0 ? Math.hypot(r.re, r.im) / ratedAmps[k] : 0;
    pass.mismatch = Number.isFinite(m) ? Math.max(pass.mismatch, m) : Infinity;
    if (!(m <= options.tolerance)) pass.worst.push(k);
    pass.next.push(next);
    pass.residual.push(r);
    pass.switched.push(switched);
  });
  return pass;
}

const partVolts = (parts: LoadPart[], volts: PinVoltages): Complex[] =>
  parts.map((p) => ({ re: volts.re[p.p] - volts.re[p.q], im: volts.im[p.p] - volts.im[p.q] }));

export function iterateLoads(
  network: BuiltNetwork,
  classes: PinClasses,
  system: AssembledSystem,
  solver: LinearSolver,
  options: IterationOptions,
): IterationOutcome {
  const parts = network.loads;
  const P = parts.length;
  const ratedAmps = parts.map((p) => Math.hypot(p.ratedVa.re, p.ratedVa.im) / p.ratedVolts);
  const weights = new Float64Array(2 * P);
  ratedAmps.forEach((a, k) => (weights[2 * k] = weights[2 * k + 1] = a > 0 ? 1 / a : 1));
  const failure = (message: string): IterationOutcome => ({ ok: false, message, elementIds: [] });

  const solveWith = (c: Complex[]): PinVoltages | string => {
    const bRe = system.rhsRe.slice();
    const bIm = system.rhsIm.slice();
    parts.forEach((part, k) => {
      const corr = c[k];
      if (corr.re === 0 && corr.im === 0) return;
      // The correction flows p → q through the load: it is drawn from p and returned to q.
      const cp = classes.classOf[part.p];
      const cq = classes.classOf[part.q];
      if (cp >= 0) {
        bRe[cp] -= corr.re * system.scale[cp];
        bIm[cp] -= corr.im * system.scale[cp];
      }
      if (cq >= 0) {
        bRe[cq] += corr.re * system.scale[cq];
        bIm[cq] += corr.im * system.scale[cq];
      }
    });
    const solved = solver.solve(bRe, bIm);
    if (!solved.ok) return `the network equations are singular (${solved.message})`;
    if (solved.value.re.length !== classes.classCount) return 'the linear solve returned a vector of the wrong size';
    return pinVoltages(network, classes, system, solved.value);
  };

  let corrections: Complex[] = parts.map(() => ({ re: 0, im: 0 }));
  const first = solveWith(corrections);
  if (typeof first === 'string') return failure(first);
  const constantImpedanceVolts = first;
  let volts = first;
  let pass = evaluate(parts, partVolts(parts, volts), corrections, ratedAmps, options);
  let iteration = 1;
  const done = (method: 'fixed-point' | 'newton'): IterationOutcome => ({
    ok: true,
    volts,
    constantImpedanceVolts,
    corrections,
    models: parts.map((p, k) => ({ model: baseModel(p), switched: pass.switched[k] })),
    iterations: iteration,
    mismatch: pass.mismatch,
    method,
  });
  if (options.constantImpedanceOnly) {
    return {
      ok: true,
      volts,
      constantImpedanceVolts,
      corrections,
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
  let switchedBefore = pass.switched.join();
  while (iteration < fixedPointLimit && Number.isFinite(pass.mismatch) && pass.mismatch < 1e6) {
    const x = new Float64Array(2 * P);
    const g = new Float64Array(2 * P);
    corrections.forEach((c, k) => {
      x[2 * k] = c.re;
      x[2 * k + 1] = c.im;
      g[2 * k] = pass.next[k].re;
      g[2 * k + 1] = pass.next[k].im;
    });
    const mixed = mixer.next(x, g, weights);
    corrections = parts.map((_, k) => ({ re: mixed[2 * k], im: mixed[2 * k + 1] }));
    const solved = solveWith(corrections);
    if (typeof solved === 'string') return failure(solved);
    volts = solved;
    iteration++;
    pass = evaluate(parts, partVolts(parts, volts), corrections, ratedAmps, options);
    if (pass.mismatch <= options.tolerance) return done('fixed-point');
    const switchedNow = pass.switched.join();
    if (switchedNow !== switchedBefore) mixer.reset();
    switchedBefore = switchedNow;
  }

  // Newton on the corrections with the same factors (the network is linear: v = v0 + T c), started again from
  // the constant-impedance answer so that it finds the solution next to it.
  if (P <= NEWTON_MAX_ELEMENTS && iteration < options.maxIterations) {
    const t = transferMatrix(parts, classes, system, solver);
    if (typeof t === 'string') return failure(t);
    const v0 = partVolts(parts, constantImpedanceVolts);
    corrections = parts.map(() => ({ re: 0, im: 0 }));
    let v = v0;
    pass = evaluate(parts, v, corrections, ratedAmps, options);
    while (iteration < options.maxIterations && pass.mismatch > options.tolerance) {
      const step = newtonStep(parts, v, pass.residual, options.lowVoltageSwitchFraction, t);
      if (!step) break;
      iteration++;
      ({ corrections, v, pass } = lineSearch(parts, v0, t, corrections, step, pass, ratedAmps, options));
    }
    const solved = solveWith(corrections);
    if (typeof solved === 'string') return failure(solved);
    volts = solved;
    pass = evaluate(parts, partVolts(parts, volts), corrections, ratedAmps, options);
    if (pass.mismatch <= options.tolerance) return done('newton');
  }

  const ids = [...new Set(pass.worst.map((k) => parts[k].loadId))];
  return {
    ok: false,
    message:
      `the load iteration did not converge in ${iteration} iterations (largest current mismatch ` +
      `${Number.isFinite(pass.mismatch) ? (pass.mismatch * 100).toPrecision(3) + ' %' : 'unbounded'} of rating) at loads ${ids.join(', ')}; ` +
      'the loads are probably more than the supply can carry at constant power',
    elementIds: ids,
  };
}

/** Backtracking on the step length until the weighted residual falls (or the step is tiny). */
function lineSearch(
  parts: LoadPart[],
  v0: Complex[],
  t: Transfer,
  corrections: Complex[],
  step: Complex[],
  pass: Pass,
  ratedAmps: number[],
  options: IterationOptions,
): { corrections: Complex[]; v: Complex[]; pass: Pass } {
  const norm = (r: Complex[]) => r.reduce((s, x, k) => s + (x.re * x.re + x.im * x.im) / Math.max(ratedAmps[k], 1e-12) ** 2, 0);
  const before = norm(pass.residual);
  let alpha = 1;
  for (;;) {
    const trial = corrections.map((c, k) => ({ re: c.re + alpha * step[k].re, im: c.im + alpha * step[k].im }));
    const v = elementVolts(v0, t, trial);
    const trialPass = evaluate(parts, v, trial, ratedAmps, options);
    if (norm(trialPass.residual) < before || alpha < 1 / 64) return { corrections: trial, v, pass: trialPass };
    alpha /= 2;
  }
}
