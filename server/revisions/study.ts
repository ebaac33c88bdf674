// What the solver makes of a sheet: the base case, each what-if and the fault study, as plain data that a revision
// stores and that the exports and the report read. Runs in a worker thread (server/workers), never on the thread
// that serves requests and talks to PGlite.
import { readSheet, type Sheet } from '../../shared/sheet';
import { faultStudy, SheetSolver, SOLVER_VERSION, type FaultStudyResult, type SolveFailure, type SolveResult } from '../../solver';
import { runExtraStudies, type ExtraStudyOutcome } from '../reports/extra-studies';

export interface CaseOutcome {
  /** null for the base case. */
  whatIfId: string | null;
  name: string;
  ok: boolean;
  result?: SolveResult;
  error?: SolveFailure;
}

export interface StudyResults {
  solverVersion: string;
  /** The document could not be read as a sheet: nothing was solved. */
  invalid?: { issues: { path: string; message: string }[] };
  base: CaseOutcome;
  whatIfs: CaseOutcome[];
  faultStudy: { ok: true; study: FaultStudyResult } | { ok: false; error: SolveFailure } | null;
  /** The further studies registered in server/reports/extra-studies.ts (loading checks, break sweep, voltage profile). */
  extra: ExtraStudyOutcome[];
}

const BASE_NAME = 'Base case';

export interface StudyOptions {
  /** Only the base case (for comparing with the live sheet). */
  baseOnly?: boolean;
}

export function runStudy(document: unknown, options: StudyOptions = {}): StudyResults {
  const read = readSheet(document);
  if (!read.ok) {
    const error: SolveFailure = { code: 'invalid-sheet', message: 'The sheet is not valid', elementIds: [] };
    return {
      solverVersion: SOLVER_VERSION,
      invalid: { issues: read.issues.map((i) => ({ path: i.path, message: i.message })) },
      base: { whatIfId: null, name: BASE_NAME, ok: false, error },
      whatIfs: [],
      faultStudy: null,
      extra: [],
    };
  }
  return studySheet(read.sheet, read.warnings.map((w) => ({ message: w.message, elementId: w.elementId })), options);
}

export function studySheet(sheet: Sheet, readWarnings: { message: string; elementId?: string }[] = [], options: StudyOptions = {}): StudyResults {
  const solver = new SheetSolver(sheet, readWarnings);
  const outcome = (whatIfId: string | null, name: string): CaseOutcome => {
    const o = solver.solve(whatIfId ?? undefined);
    return o.ok ? { whatIfId, name, ok: true, result: o.result } : { whatIfId, name, ok: false, error: o.error };
  };
  const base = outcome(null, BASE_NAME);
  if (options.baseOnly) return { solverVersion: SOLVER_VERSION, base, whatIfs: [], faultStudy: null, extra: [] };
  const whatIfs = Object.values(sheet.whatIfs).map((w) => outcome(w.id, w.name || w.id));
  let fault: StudyResults['faultStudy'] = null;
  if (Object.values(sheet.elements).some((e) => e.kind === 'bus')) {
    try {
      fault = faultStudy(sheet);
    } catch (error) {
      fault = { ok: false, error: { code: 'internal', message: `the fault study failed: ${(error as Error).message}`, elementIds: [] } };
    }
  }
  return { solverVersion: SOLVER_VERSION, base, whatIfs, faultStudy: fault, extra: runExtraStudies(sheet) };
}
