// The break sweep: open each run conductor (or each neutral) in turn through the base factors and rank the cases
// by the worst over- and under-voltage any load sees against the sheet's standard.
import type { Sheet } from '../../shared/sheet';
import type { BreakSweepOptions, BreakSweepResult, StudyOutcome } from './study-types';

/** The whole sweep in one go (Node, a worker thread, a Web Worker). */
export function breakSweepSync(sheet: Sheet, options: BreakSweepOptions = {}): StudyOutcome<BreakSweepResult> {
  void sheet;
  void options;
  return { ok: false, error: { code: 'not-supported', message: 'the break sweep is being built', elementIds: [] } };
}

/** The sweep in slices, yielding to the event loop between them (for a UI thread); same result as breakSweepSync. */
export async function breakSweep(sheet: Sheet, options: BreakSweepOptions = {}): Promise<StudyOutcome<BreakSweepResult>> {
  return breakSweepSync(sheet, options);
}
