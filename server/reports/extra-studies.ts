// The hook for studies that live in their own solver modules (loading checks, the break sweep, the voltage
// profile): each registers here with a run function and a table, and then appears in every new revision's results,
// its CSV export and its report without further changes. Register a study by adding it to EXTRA_STUDIES.
import type { Sheet } from '../../shared/sheet';
import { breakSweepStudy } from './break-sweep-study';
import { loadingChecksStudy } from './loading-checks-study';
import { voltageProfileStudy } from './voltage-profile-study';

export interface StudyTable {
  title: string;
  columns: string[];
  rows: (string | number | null)[][];
  /** Relative column widths on the page (equal when omitted). */
  widths?: number[];
  /** Per column; numbers read best right-aligned. */
  align?: ('left' | 'right')[];
  /** Lines printed under the table (method, limits, what was skipped). */
  notes?: string[];
  /** A plot drawn above the table (the voltage profile), as standalone SVG in drawing units. */
  figure?: { svg: string; width: number; height: number };
}

export interface ExtraStudy {
  /** Stable id, e.g. 'loading-checks', 'break-sweep', 'voltage-profile'. */
  id: string;
  title: string;
  /** Runs in the study worker; must be pure (the solver's own rules). */
  run(sheet: Sheet): StudyTable[];
}

export interface ExtraStudyOutcome {
  id: string;
  title: string;
  ok: boolean;
  tables: StudyTable[];
  error?: string;
}

/** Studies known to this build. */
export const EXTRA_STUDIES: ExtraStudy[] = [loadingChecksStudy, breakSweepStudy, voltageProfileStudy];


/** The titles the report names as "not run in this build" while their study is not registered. */
export const PLANNED_STUDIES = [
  { id: 'loading-checks', title: 'Loading checks' },
  { id: 'break-sweep', title: 'Break sweep' },
  { id: 'voltage-profile', title: 'Voltage profile' },
] as const;

export function runExtraStudies(sheet: Sheet, studies: readonly ExtraStudy[] = EXTRA_STUDIES): ExtraStudyOutcome[] {
  return studies.map((s) => {
    try {
      return { id: s.id, title: s.title, ok: true, tables: s.run(sheet) };
    } catch (error) {
      return { id: s.id, title: s.title, ok: false, tables: [], error: (error as Error).message };
    }
  });
}
