// The solver's entry: a sheet (and optionally one of its what-ifs) in, results or a clear failure out.
// A SheetSolver keeps the base case's factors so that what-ifs of the same pattern reuse the analysis and an
// opening confined to a few nodes is solved as a block update of the base factors.
import type { Sheet } from '../../shared/sheet';
import { readSheet } from '../../shared/sheet';
import { buildNetwork } from '../network/build-network';
import type { Factorization } from '../linear-system';
import { deriveResults } from '../results/derive';
import type { ResultWarning, SolveResult } from '../results/types';
import { applyWhatIf } from './apply-what-if';
import { solveBuiltNetwork, type SolveFailure } from './solve-network';
import { faultResult, prepareFaults } from '../faults/solve-fault';

export type SolveOutcome = { ok: true; result: SolveResult } | { ok: false; error: SolveFailure };

export interface SolveOptions {
  whatIfId?: string;
  /** Warnings from reading the sheet (dangling references), carried into the results. */
  readWarnings?: ResultWarning[];
}

export class SheetSolver {
  private base?: Factorization;

  constructor(readonly sheet: Sheet, private readonly readWarnings: ResultWarning[] = []) {}

  solve(whatIfId?: string): SolveOutcome {
    try {
      return this.solveOnce(whatIfId);
    } catch (error) {
      // A safety net: whatever goes wrong inside comes back as a failure, never as an exception.
      return { ok: false, error: { code: 'internal', message: `the solver failed unexpectedly: ${(error as Error).message}`, elementIds: [] } };
    }
  }

  private solveOnce(whatIfId?: string): SolveOutcome {
    if (whatIfId !== undefined && !this.base) this.solveOnce(undefined); // the base factors, for reuse
    const applied = applyWhatIf(this.sheet, whatIfId);
    if (!applied.ok) return { ok: false, error: { code: applied.code, message: applied.message, elementIds: applied.elementIds } };
    if (applied.fault) {
      // A shunt fault: every load at constant impedance, compensated at the fault terminals.
      const prepared = prepareFaults(this.sheet, applied.mods);
      if (!prepared.ok) return prepared;
      return faultResult(prepared.prepared, applied.fault, [...this.readWarnings.map((w) => ({ ...w })), ...applied.warnings]);
    }
    const network = buildNetwork(this.sheet, applied.mods);
    const outcome = solveBuiltNetwork(network, this.sheet.settings, whatIfId === undefined ? undefined : this.base);
    if (!outcome.ok) return outcome;
    if (whatIfId === undefined && outcome.factorization) this.base = outcome.factorization;
    const openNeutral =
      applied.touchesNeutral || network.runs.some((r) => r.conductors.some((k) => k.conductor === 'N' && (k.open || k.addedOhms > 0)));
    try {
      const result = deriveResults({
        sheet: this.sheet,
        solution: outcome.solution,
        mods: applied.mods,
        openNeutral,
        warnings: [...this.readWarnings.map((w) => ({ ...w })), ...applied.warnings],
      });
      return { ok: true, result };
    } catch (error) {
      return { ok: false, error: { code: 'not-finite', message: `the results could not be derived: ${(error as Error).message}`, elementIds: [] } };
    }
  }
}

export function solveSheet(sheet: Sheet, options: SolveOptions = {}): SolveOutcome {
  return new SheetSolver(sheet, options.readWarnings).solve(options.whatIfId);
}

/** Reads (migrates, validates) a JSON document and solves it; schema problems come back as an invalid-sheet failure. */
export function solveDocument(json: unknown, options: Omit<SolveOptions, 'readWarnings'> = {}): SolveOutcome & { issues?: { path: string; message: string }[] } {
  const read = readSheet(json);
  if (!read.ok) {
    return {
      ok: false,
      error: { code: 'invalid-sheet', message: read.issues.map((i) => `${i.path || '(document)'}: ${i.message}`).join('; '), elementIds: [] },
      issues: read.issues,
    };
  }
  return solveSheet(read.sheet, { ...options, readWarnings: read.warnings.map((w) => ({ message: w.message, elementId: w.elementId })) });
}
