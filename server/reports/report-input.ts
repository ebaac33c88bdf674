// What the report of a revision is made from: names, the revision's record, its frozen document and its results.
import type { RevisionSummary } from '../../shared/revisions';
import type { StudyResults } from '../revisions/study';

export interface ReportInput {
  projectName: string;
  sheetName: string;
  revision: RevisionSummary;
  document: Record<string, unknown>;
  results: StudyResults;
  /** ISO time the report was made. */
  generatedAt: string;
}
