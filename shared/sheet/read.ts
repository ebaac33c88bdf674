// The tolerant reader: migrates any known version, validates, and reports dangling references as warnings.
import { migrateSheet } from './migrate';
import { validateSheet } from './validate';
import { findReferenceProblems } from './references';
import type { Sheet } from './schema';
import type { SheetIssue } from './issues';

export type ReadResult =
  | { ok: true; sheet: Sheet; warnings: SheetIssue[]; migratedFrom?: number }
  | { ok: false; issues: SheetIssue[] };

export function readSheet(json: unknown): ReadResult {
  const migrated = migrateSheet(json);
  if (!migrated.ok) return migrated;
  const validated = validateSheet(migrated.document);
  if (!validated.ok) return validated;
  return {
    ok: true,
    sheet: validated.sheet,
    warnings: findReferenceProblems(validated.sheet),
    ...(migrated.steps > 0 ? { migratedFrom: migrated.fromVersion } : {}),
  };
}
