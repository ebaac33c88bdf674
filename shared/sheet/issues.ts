// The one shape of a problem found in a sheet: where (a dotted path into the JSON) and what.
import type { z } from 'zod';

export interface SheetIssue {
  /** Dotted path into the document, e.g. "elements.run-1.lengthFt"; "" for the document itself. */
  path: string;
  message: string;
  /** The element, connection or what-if the issue is about, when there is one. */
  elementId?: string;
}

export function formatPath(path: readonly PropertyKey[]): string {
  return path.map((p) => String(p)).join('.');
}

export function issuesFromZod(error: z.ZodError, prefix: readonly PropertyKey[] = []): SheetIssue[] {
  return error.issues.map((issue) => {
    const full = [...prefix, ...issue.path];
    const elementId = (full[0] === 'elements' || full[0] === 'connections' || full[0] === 'whatIfs') && full.length > 1
      ? String(full[1])
      : undefined;
    return { path: formatPath(full), message: issue.message, ...(elementId ? { elementId } : {}) };
  });
}
