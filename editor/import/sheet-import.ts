// Reads a sheet from our own JSON format for an import into an open sheet: the JSON parsed (a syntax error says
// where), its format version checked and migrated, every schema problem with its path. Pure; the caller asks the
// person to confirm and then applies it with SheetCommands.replaceSheet (one transaction, undoable).
import { documentVersion, readSheet, SHEET_FORMAT_VERSION, type Sheet, type SheetIssue } from '../../shared/sheet';

/** The server's limit for a sheet document (server/api/documents/router.ts). */
export const MAX_SHEET_JSON_BYTES = 25 * 1024 * 1024;

export interface SheetImportSummary {
  name: string;
  elements: number;
  connections: number;
  whatIfs: number;
}

export type SheetImportResult =
  | { ok: true; sheet: Sheet; summary: SheetImportSummary; migratedFrom?: number; warnings: SheetIssue[] }
  | { ok: false; issues: SheetIssue[] };

/** Line and column of a character offset (1-based). */
function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let lastBreak = -1;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text[i] === '\n') {
      line++;
      lastBreak = i;
    }
  }
  return { line, column: offset - lastBreak };
}

export function readSheetImport(text: string): SheetImportResult {
  if (text.length > MAX_SHEET_JSON_BYTES) {
    return { ok: false, issues: [{ path: '', message: `the file is too large: at most ${MAX_SHEET_JSON_BYTES / 1024 / 1024} MB` }] };
  }
  if (text.trim() === '') return { ok: false, issues: [{ path: '', message: 'the file is empty' }] };
  let json: unknown;
  try {
    json = JSON.parse(text.replace(/^\uFEFF/, ''));
  } catch (error) {
    const message = (error as Error).message;
    const at = /position (\d+)/.exec(message);
    const where = at ? lineAndColumn(text, Number(at[1])) : null;
    return { ok: false, issues: [{ path: '', message: `not JSON${where ? ` (line ${where.line}, column ${where.column})` : ''}: ${message}` }] };
  }
  if (typeof json === 'object' && json !== null && !Array.isArray(json)) {
    const v = documentVersion(json as Record<string, unknown>);
    if (v !== undefined && v > SHEET_FORMAT_VERSION) {
      return { ok: false, issues: [{ path: 'formatVersion', message: `format version ${v} is newer than this build reads (${SHEET_FORMAT_VERSION}): update Phasewright first` }] };
    }
  }
  const read = readSheet(json);
  if (!read.ok) return { ok: false, issues: read.issues };
  const s = read.sheet;
  return {
    ok: true,
    sheet: s,
    summary: { name: s.name, elements: Object.keys(s.elements).length, connections: Object.keys(s.connections).length, whatIfs: Object.keys(s.whatIfs).length },
    warnings: read.warnings,
    ...(read.migratedFrom !== undefined ? { migratedFrom: read.migratedFrom } : {}),
  };
}
