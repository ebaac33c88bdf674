// The latest solve as the editor shows it: the answers, their mapping onto the drawing for the base case and the
// case on show, and any failure with the elements it names.
import type { SolveFailure, SolveResult } from '../../solver';
import type { SheetIssue } from '../../shared/sheet';
import type { DrawnResults } from '../results/value-tags';

export interface ResultsState {
  /** Grows with each solve answered. */
  serial: number;
  base: SolveResult | null;
  /** The what-if or trial on show, when one is. */
  active: SolveResult | null;
  drawnBase: DrawnResults | null;
  /** What the canvas draws: the case on show. */
  drawn: DrawnResults | null;
  failure: SolveFailure | null;
  /** Elements left out of the solve because a field is invalid. */
  invalid: SheetIssue[];
  solveMs: number | null;
  where: 'main' | 'worker' | null;
  /** From the change that was solved to its answer, milliseconds. */
  changeToAnswerMs: number | null;
}

export function initialResults(): ResultsState {
  return { serial: 0, base: null, active: null, drawnBase: null, drawn: null, failure: null, invalid: [], solveMs: null, where: null, changeToAnswerMs: null };
}
