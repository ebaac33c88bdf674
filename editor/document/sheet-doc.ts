// The sheet document on Yjs: the layout of the shared Y.Doc and its conversion to and from the sheet JSON format.
//
// Layout: map "sheet" { formatVersion }, map "settings" { leaf fields }, maps "elements", "connections" and
// "whatIfs", each keyed by id with one Y.Map per entry (nested plain objects are nested Y.Maps).
//
// The sheet's name is not in the document: it is the name in the project's sheet list (the database, renamed
// through the API), the one name every screen, export and report shows. The JSON view gets it from the caller; a
// name in an imported file is not kept, and one left in an older document is not read.
import * as Y from 'yjs';
import { readSheet, SHEET_FORMAT_VERSION, type ReadResult, type Sheet, type SheetInput } from '../../shared/sheet';
import { assignPlain, fromY, type Plain } from './y-values';

export const COLLECTIONS = ['elements', 'connections', 'whatIfs'] as const;
export type Collection = (typeof COLLECTIONS)[number];

export const sheetMeta = (doc: Y.Doc) => doc.getMap<unknown>('sheet');
export const settingsMap = (doc: Y.Doc) => doc.getMap<unknown>('settings');
export const collection = (doc: Y.Doc, name: Collection) => doc.getMap<Y.Map<unknown>>(name);

/** The format version the document declares (version 0 called the field "version"); a new document has none. */
export function docFormatVersion(doc: Y.Doc): number | undefined {
  const meta = sheetMeta(doc);
  const v = meta.get('formatVersion') ?? meta.get('version');
  return typeof v === 'number' ? v : undefined;
}

/** True when the document was written in an older format and must be migrated before use. */
export function needsMigration(doc: Y.Doc): boolean {
  const v = docFormatVersion(doc);
  return v !== undefined && v < SHEET_FORMAT_VERSION;
}

export function isEmptyDoc(doc: Y.Doc): boolean {
  return sheetMeta(doc).size === 0 && COLLECTIONS.every((c) => collection(doc, c).size === 0) && settingsMap(doc).size === 0;
}

/**
 * The document as plain JSON in the sheet format, as stored (not validated), named `name` (the sheet's name in its
 * project's list). An empty document is an empty sheet.
 */
export function docToJson(doc: Y.Doc, name = ''): Record<string, Plain> {
  const { name: _unused, ...meta } = fromY(sheetMeta(doc)) as Record<string, Plain>;
  const declared = docFormatVersion(doc) !== undefined;
  return {
    ...(declared ? {} : { formatVersion: SHEET_FORMAT_VERSION }),
    name,
    ...meta,
    settings: fromY(settingsMap(doc)),
    ...Object.fromEntries(COLLECTIONS.map((c) => [c, fromY(collection(doc, c))])),
  };
}

/** The document read through the sheet schema: migrated, validated, dangling references reported as warnings. */
export function readDoc(doc: Y.Doc): ReadResult {
  return readSheet(docToJson(doc));
}

/**
 * Makes the document hold `sheet` (call inside a transaction). Only differing fields are written, so replacing a
 * sheet with a slightly changed copy is a small update that merges with concurrent edits. The sheet's `name` is
 * not written (the sheet list holds it), and a name an older document carries is removed.
 */
export function writeSheet(doc: Y.Doc, sheet: Sheet | SheetInput): void {
  const json = JSON.parse(JSON.stringify(sheet)) as Record<string, Plain>;
  const { settings, elements, connections, whatIfs, name: _listed, ...meta } = json;
  assignPlain(sheetMeta(doc), { ...meta, formatVersion: SHEET_FORMAT_VERSION });
  assignPlain(settingsMap(doc), (settings ?? {}) as Record<string, Plain>);
  const groups = { elements, connections, whatIfs } as Record<Collection, Plain | undefined>;
  for (const name of COLLECTIONS) assignPlain(collection(doc, name) as Y.Map<unknown>, (groups[name] ?? {}) as Record<string, Plain>);
}

/** A new Y.Doc holding the sheet (for seeds, fixtures and tests). */
export function docFromSheet(sheet: Sheet | SheetInput): Y.Doc {
  const doc = new Y.Doc();
  doc.transact(() => writeSheet(doc, sheet));
  return doc;
}
