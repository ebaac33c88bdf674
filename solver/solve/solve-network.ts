// One solve of a built network: merge ties, find the live parts, assemble, factor (or update the base factors),
// iterate the loads. Every failure comes back as a value naming what is involved.
import type { SheetSettings } from '../../shared/sheet';
import type { BuiltNetwork } from '../network/build-network';
import { blockDifference, directSolver, factorize, updatedSolver, type Factorization, type LinearSolver, type SolveMethod } from '../linear-system';
import { assemble, type AssembledSystem } from './assemble';
import { mergeTies, type PinClasses } from './classes';
import { iterateLoads, type PartModel, type PinVoltages } from './load-iteration';
import { findParts, type Parts } from './parts';
import type { Complex } from '../complex';

export interface Solution {
  network: BuiltNetwork;
  classes: PinClasses;
  parts: Parts;
  system: AssembledSystem;
  volts: PinVoltages;
  constantImpedanceVolts: PinVoltages;
  corrections: Complex[];
  models: PartModel[];
  iterations: number;
  mismatch: number;
  /** How the load iteration converged: the fixed point, or Newton on the corrections. */
  iterationMethod: 'fixed-point' | 'newton';
  linear: { method: SolveMethod; unknowns: number; nonzeros: number };
}

export type FailureCode = 'unknown-what-if' | 'not-supported' | 'source-conflict' | 'singular' | 'not-converged' | 'not-finite' | 'invalid-sheet' | 'internal';

export interface SolveFailure {
  code: FailureCode;
  message: string;
  elementIds: string[];
}

export type NetworkOutcome = { ok: true; solution: Solution; factorization?: Factorization; solver: LinearSolver } | { ok: false; error: SolveFailure };

/** A block update is worth it while it touches few nodes compared with the whole system. */
export function blockUpdateIsCheaper(nodes: number, unknowns: number): boolean {
  return nodes > 0 && nodes <= 24 && 4 * nodes <= unknowns;
}

function emptySolver(): LinearSolver {
  const matrix = { n: 0, colPtr: new Int32Array(1), rowIdx: new Int32Array(0), re: new Float64Array(0), im: new Float64Array(0) };
  return { matrix, method: 'factor', solve: () => ({ ok: true, value: { re: new Float64Array(0), im: new Float64Array(0) } }) };
}

function chooseSolver(system: AssembledSystem, base?: Factorization): { ok: true; solver: LinearSolver; factorization?: Factorization } | { ok: false; error: SolveFailure } {
  if (system.matrix.n === 0) return { ok: true, solver: emptySolver() };
  if (base) {
    const delta = blockDifference(base.matrix, system.matrix);
    if (delta && delta.nodes.length === 0) return { ok: true, solver: { ...directSolver(base), method: 'reused-analysis' }, factorization: base };
    if (delta && blockUpdateIsCheaper(delta.nodes.length, system.matrix.n)) return { ok: true, solver: updatedSolver(base, system.matrix, delta) };
  }
  const factored = factorize(system.matrix, base);
  if (!factored.ok) {
    return { ok: false, error: { code: 'singular', message: `the network equations are singular at unknown ${factored.column}: ${factored.message}`, elementIds: [] } };
  }
  return { ok: true, solver: directSolver(factored.value), factorization: factored.value };
}

export function solveBuiltNetwork(network: BuiltNetwork, settings: SheetSettings, base?: Factorization, options: { constantImpedanceOnly?: boolean } = {}): NetworkOutcome {
  const merged = mergeTies(network);
  if (!merged.ok) return { ok: false, error: { code: 'source-conflict', message: merged.message, elementIds: merged.elementIds } };
  const classes = merged.classes;
  const parts = findParts(network, classes);
  const system = assemble(network, classes, parts);
  const chosen = chooseSolver(system, base);
  if (!chosen.ok) return chosen;
  const iteration = iterateLoads(network, classes, system, chosen.solver, {
    lowVoltageSwitchFraction: settings.lowVoltageSwitchFraction,
    tolerance: settings.loadMismatchTolerance,
    // During a fault every load is a constant impedance: the first pass alone.
    maxIterations: options.constantImpedanceOnly ? 1 : settings.maxLoadIterations,
    constantImpedanceOnly: options.constantImpedanceOnly,
  });
  if (!iteration.ok) {
    const code = iteration.message.includes('singular') ? 'singular' : 'not-converged';
    return { ok: false, error: { code, message: iteration.message, elementIds: iteration.elementIds } };
  }
  for (let pin = 0; pin < network.pins.length; pin++) {
    if (!Number.isFinite(iteration.volts.re[pin]) || !Number.isFinite(iteration.volts.im[pin])) {
      const p = network.pins[pin];
      return { ok: false, error: { code: 'not-finite', message: `the solve gave no finite voltage at ${p.elementId} ${p.terminal} ${p.conductor}`, elementIds: [p.elementId] } };
    }
  }
  return {
    ok: true,
    factorization: chosen.factorization,
    solver: chosen.solver,
    solution: {
      network,
      classes,
      parts,
      system,
      volts: iteration.volts,
      constantImpedanceVolts: iteration.constantImpedanceVolts,
      corrections: iteration.corrections,
      models: iteration.models,
      iterations: iteration.iterations,
      mismatch: iteration.mismatch,
      iterationMethod: iteration.method,
      linear: { method: chosen.solver.method, unknowns: system.matrix.n, nonzeros: system.matrix.colPtr[system.matrix.n] },
    },
  };
}
