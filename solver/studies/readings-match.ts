// The readings match: which single cause (an opening, or a connection degraded to a fitted resistance, each with a
// fitted load level for the service it affects) best explains a few measured voltage magnitudes.
import type { Sheet } from '../../shared/sheet';
import type { Reading, ReadingsMatchOptions, ReadingsMatchResult, StudyOutcome } from './study-types';

export function readingsMatchSync(sheet: Sheet, readings: Reading[], options: ReadingsMatchOptions = {}): StudyOutcome<ReadingsMatchResult> {
  void sheet;
  void readings;
  void options;
  return { ok: false, error: { code: 'not-supported', message: 'the readings match is being built', elementIds: [] } };
}

/** The match in slices, yielding to the event loop between candidates; same result as readingsMatchSync. */
export async function readingsMatch(sheet: Sheet, readings: Reading[], options: ReadingsMatchOptions = {}): Promise<StudyOutcome<ReadingsMatchResult>> {
  return readingsMatchSync(sheet, readings, options);
}
