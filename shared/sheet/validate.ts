// Strict validation of a version-1 sheet: either the parsed sheet (defaults filled in) or every schema issue.
import { sheetSchema, type Sheet } from './schema';
import { issuesFromZod, type SheetIssue } from './issues';

export type ValidationResult = { ok: true; sheet: Sheet } | { ok: false; issues: SheetIssue[] };

const GROUPS = ['elements', 'connections', 'whatIfs'] as const;

/** Ids that differ from their keys, read from the raw document (zod skips the sheet-level check when items fail). */
function idKeyIssues(json: unknown): SheetIssue[] {
  if (typeof json !== 'object' || json === null) return [];
  const out: SheetIssue[] = [];
  for (const group of GROUPS) {
    const map = (json as Record<string, unknown>)[group];
    if (typeof map !== 'object' || map === null) continue;
    for (const [key, value] of Object.entries(map)) {
      const id = (value as { id?: unknown } | null)?.id;
      if (typeof id === 'string' && id !== key) {
        out.push({ path: `${group}.${key}.id`, message: `id "${id}" differs from its key "${key}"`, elementId: key });
      }
    }
  }
  return out;
}

export function validateSheet(json: unknown): ValidationResult {
  const parsed = sheetSchema.safeParse(json);
  if (parsed.success) return { ok: true, sheet: parsed.data };
  const issues = issuesFromZod(parsed.error);
  for (const extra of idKeyIssues(json)) if (!issues.some((i) => i.path === extra.path)) issues.push(extra);
  return { ok: false, issues };
}
