// The messages between the editor and a solve (on the main thread or in the Web Worker): the validated sheet,
// which case to show (the base case, a what-if, and a viewer's unsaved trial changes on top), and the answers.
import type { Sheet, WhatIfChange } from '../../shared/sheet';
import type { ResultWarning, SolveOutcome } from '../../solver';

/** The id under which a trial (unsaved) layer is solved; never written to the document. */
export const TRIAL_WHAT_IF_ID = '__trial__';

export interface SolveRequest {
  id: number;
  sheet: Sheet;
  /** The what-if on show, if any. */
  whatIfId?: string;
  /** Changes tried locally and never saved (a viewer's, or anyone's before they keep them). */
  trialChanges: WhatIfChange[];
  readWarnings: ResultWarning[];
}

export interface SolveReply {
  id: number;
  base: SolveOutcome;
  /** The what-if or trial on show; absent when the base case is on show. */
  active?: SolveOutcome;
  solveMs: number;
  where: 'main' | 'worker';
}
