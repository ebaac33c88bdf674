// One solve request answered: the base case, then the what-if on show (with any trial changes on top) reusing the
// base case's factors. The same function runs on the main thread and in the Web Worker.
import { SheetSolver } from '../../solver';
import type { Sheet } from '../../shared/sheet';
import { TRIAL_WHAT_IF_ID, type SolveReply, type SolveRequest } from './solve-request';

function withTrial(sheet: Sheet, request: SolveRequest): Sheet {
  const shown = request.whatIfId ? sheet.whatIfs[request.whatIfId] : undefined;
  const changes = { ...(shown?.changes ?? {}) };
  request.trialChanges.forEach((c, i) => (changes[`trial-${i}`] = c));
  return {
    ...sheet,
    whatIfs: { ...sheet.whatIfs, [TRIAL_WHAT_IF_ID]: { id: TRIAL_WHAT_IF_ID, name: shown ? `${shown.name} + trial` : 'Trial (not saved)', changes } },
  };
}

export function runSolve(request: SolveRequest, where: 'main' | 'worker'): SolveReply {
  const started = performance.now();
  const trial = request.trialChanges.length > 0;
  const sheet = trial ? withTrial(request.sheet, request) : request.sheet;
  const solver = new SheetSolver(sheet, request.readWarnings);
  const base = solver.solve(undefined);
  const activeId = trial ? TRIAL_WHAT_IF_ID : request.whatIfId;
  const active = activeId !== undefined ? solver.solve(activeId) : undefined;
  return { id: request.id, base, ...(active ? { active } : {}), solveMs: performance.now() - started, where };
}
