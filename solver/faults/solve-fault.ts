// A shunt fault on a sheet (optionally over a what-if's other changes): build, solve once with every load at
// constant impedance (the pre-fault state, factored once), then compensate at the fault terminals. Further faults
// on the same FaultSystem reuse the factors and the Thevenin columns already found.
import type { Sheet } from '../../shared/sheet';
import type { Complex } from '../complex';
import { buildNetwork } from '../network/build-network';
import type { Modifications } from '../network/modifications';
import { NO_MODIFICATIONS } from '../network/modifications';
import { deriveResults } from '../results/derive';
import type { ResultWarning } from '../results/types';
import { solveBuiltNetwork, type Solution, type SolveFailure } from '../solve/solve-network';
import { faultedVolts, solveFaultCurrents, type FaultSystem } from './compensation';
import { motorContribution, MOTOR_SUBTRANSIENT_DEFAULT_PU } from './motor-contribution';
import { assemble } from '../solve/assemble';
import { directSolver, factorize } from '../linear-system';
import { faultNetwork, faultPhases } from './fault-branches';
import { busFaultTerminals } from './fault-terminals';
import type { FaultOptions, FaultOutcomeSummary, FaultSolveResult, FaultSpec } from './fault-types';
import { summarizeFault } from './summarize-fault';

/** IEEE C57.12 family: the tested impedance may be 7.5 % below nameplate (recalled); the maximum duty uses the low end. */
export const TRANSFORMER_IMPEDANCE_TOLERANCE = 0.075;

export type FaultOutcome = { ok: true; result: FaultSolveResult } | { ok: false; error: SolveFailure };

export interface PreparedFaults {
  sheet: Sheet;
  mods: Modifications;
  solution: Solution;
  fs: FaultSystem;
  /** Motors that feed the fault through their subtransient reactance. */
  motorIds: string[];
}

/** The sheet with every transformer's impedance at the low end of its tolerance (a shallow copy). */
export function withTransformerTolerance(sheet: Sheet): Sheet {
  const elements: Sheet['elements'] = {};
  for (const [id, e] of Object.entries(sheet.elements)) {
    elements[id] = e.kind === 'transformer' ? { ...e, percentImpedance: e.percentImpedance * (1 - TRANSFORMER_IMPEDANCE_TOLERANCE) } : e;
  }
  return { ...sheet, elements };
}

export function prepareFaults(sheet: Sheet, mods: Modifications = NO_MODIFICATIONS, options: FaultOptions = {}): { ok: true; prepared: PreparedFaults } | { ok: false; error: SolveFailure } {
  const duty = options.transformerTolerance ? withTransformerTolerance(sheet) : sheet;
  const network = buildNetwork(duty, mods);
  const outcome = solveBuiltNetwork(network, duty.settings, undefined, { constantImpedanceOnly: true });
  if (!outcome.ok) return outcome;
  const s = outcome.solution;
  const motors = motorContribution(duty, network, s.volts, s.corrections);
  if (!motors) {
    const fs: FaultSystem = { network, classes: s.classes, parts: s.parts, system: s.system, solver: outcome.solver, prefault: s.volts, columns: new Map() };
    // A plain factorization: transfer impedances by sparse unit solves on its factors.
    if (outcome.factorization && outcome.solver.method === 'factor') fs.factors = outcome.factorization.numeric;
    return { ok: true, prepared: { sheet: duty, mods, solution: s, fs, motorIds: [] } };
  }
  // Motors behind X"d: the same pins, classes and parts, a new factorization; the pre-fault voltages are unchanged.
  const system = assemble(motors.network, s.classes, s.parts);
  const factored = factorize(system.matrix);
  if (!factored.ok) return { ok: false, error: { code: 'singular', message: `the fault-time network (motors behind X"d) is singular: ${factored.message}`, elementIds: motors.motorIds } };
  const solver = directSolver(factored.value);
  const solution: Solution = { ...s, network: motors.network, system, corrections: motors.corrections };
  const fs: FaultSystem = { network: motors.network, classes: s.classes, parts: s.parts, system, solver, prefault: s.volts, columns: new Map() };
  return { ok: true, prepared: { sheet: duty, mods, solution, fs, motorIds: motors.motorIds } };
}

export function faultOhmsOf(spec: FaultSpec): Complex | string {
  const z = typeof spec.faultOhms === 'number' ? { re: spec.faultOhms, im: 0 } : spec.faultOhms ?? { re: 0, im: 0 };
  if (!Number.isFinite(z.re) || !Number.isFinite(z.im) || z.re < 0) return `the fault impedance must be finite with a resistance of at least 0 (got ${z.re} + j${z.im} Ω)`;
  return z;
}

type CaseOutcome = { ok: true; summary: FaultOutcomeSummary; currents: ReturnType<typeof solveFaultCurrents> & object } | { ok: false; error: SolveFailure };

/** The fault figures alone (no network-wide results): what the fault study needs. */
export function faultCase(fs: FaultSystem, spec: FaultSpec): CaseOutcome {
  const fail = (message: string): CaseOutcome => ({ ok: false, error: { code: 'not-supported', message: `fault at ${spec.busId}: ${message}`, elementIds: [spec.busId] } });
  const z = faultOhmsOf(spec);
  if (typeof z === 'string') return fail(z);
  const resolved = busFaultTerminals(fs.network, spec);
  if (typeof resolved === 'string') return fail(resolved);
  const phases = faultPhases(spec.faultType, resolved.present, spec.phases);
  if (typeof phases === 'string') return fail(phases);
  const net = faultNetwork(spec.faultType, phases, resolved.terminals, z);
  if (typeof net === 'string') return fail(net);
  const currents = solveFaultCurrents(fs, net);
  if (typeof currents === 'string') return { ok: false, error: { code: 'singular', message: `fault at ${spec.busId}: ${currents}`, elementIds: [spec.busId] } };
  return { ok: true, summary: summarizeFault(fs, spec.faultType, net, resolved.terminals, resolved.returnPath, z, currents), currents };
}

export const FAULT_ASSUMPTIONS = [
  'Faults: loads are constant impedances at their rated-voltage admittance before and during the fault, except motors marked contributesToFaults.',
  'Faults: the asymmetrical peak is IEC 60909-0 κ = 1.02 + 0.98 e^(−3R/X) with R and X of the faulted loop (driving pre-fault voltage over the largest fault current).',
  'Faults: runs have no shunt capacitance, so a ground fault in a part with no path to earth draws no current (charging current is not modelled).',
];

/** The assumption line for motors that feed faults, or undefined when none does. */
export function motorAssumption(motorIds: string[]): string | undefined {
  if (motorIds.length === 0) return undefined;
  return `Faults: ${motorIds.length} motor${motorIds.length > 1 ? 's' : ''} (${motorIds.join(', ')}) feed the fault as sources behind their subtransient reactance X"d (default ${MOTOR_SUBTRANSIENT_DEFAULT_PU} pu on the motor's kVA, common practice), with the internal voltage that gives their pre-fault current; the first-cycle value, no decay.`;
}

/** A fault with the network-wide results during it (bus voltages, conductor currents, sources). */
export function faultResult(prepared: PreparedFaults, spec: FaultSpec, warnings: ResultWarning[] = [], options: FaultOptions = {}): FaultOutcome {
  const { fs, solution, sheet, mods } = prepared;
  const c = faultCase(fs, spec);
  if (!c.ok) return c;
  const volts = faultedVolts(fs, c.currents);
  if (typeof volts === 'string') return { ok: false, error: { code: 'singular', message: volts, elementIds: [spec.busId] } };
  const extraInjections = [...c.currents.drawn].map(([pin, a]) => ({ pin, re: a.re, im: a.im }));
  try {
    const result = deriveResults({ sheet, solution: { ...solution, volts, constantImpedanceVolts: volts }, mods, openNeutral: false, warnings, extraInjections });
    const assumptions = [...result.assumptions, ...FAULT_ASSUMPTIONS];
    const motors = motorAssumption(prepared.motorIds);
    if (motors) assumptions.push(motors);
    if (options.transformerTolerance) assumptions.push(`Faults: transformer impedances at ${(100 * (1 - TRANSFORMER_IMPEDANCE_TOLERANCE)).toFixed(1)} % of nameplate (the −7.5 % tolerance, for the maximum duty).`);
    return { ok: true, result: { ...result, assumptions, fault: { busId: spec.busId, ...c.summary } } };
  } catch (error) {
    return { ok: false, error: { code: 'not-finite', message: `the fault results could not be derived: ${(error as Error).message}`, elementIds: [spec.busId] } };
  }
}

/** Solves one shunt fault at a bus of the sheet. */
export function solveFault(sheet: Sheet, spec: FaultSpec, options: FaultOptions & { mods?: Modifications } = {}): FaultOutcome {
  try {
    if (!sheet.elements[spec.busId] || sheet.elements[spec.busId].kind !== 'bus') {
      return { ok: false, error: { code: 'not-supported', message: `a fault needs a bus: "${spec.busId}" is not a bus of the sheet`, elementIds: [spec.busId] } };
    }
    const prepared = prepareFaults(sheet, options.mods, options);
    if (!prepared.ok) return prepared;
    return faultResult(prepared.prepared, spec, [], options);
  } catch (error) {
    return { ok: false, error: { code: 'internal', message: `the fault solve failed unexpectedly: ${(error as Error).message}`, elementIds: [spec.busId] } };
  }
}
