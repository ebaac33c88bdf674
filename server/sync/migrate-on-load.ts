// Rooms bring documents up to the current format as they load, as one server-side edit: an old format version is
// migrated, and a brand-new (empty) document is stamped with the current version so every document carries one.
import type * as Y from 'yjs';
import { readSheet, SHEET_FORMAT_VERSION } from '../../shared/sheet';
import { docFormatVersion, docToJson, needsMigration, sheetMeta, writeSheet } from '../../editor/document/sheet-doc';

export function migrateOnLoad(doc: Y.Doc): ((doc: Y.Doc) => void) | null {
  if (docFormatVersion(doc) === undefined) return (target) => sheetMeta(target).set('formatVersion', SHEET_FORMAT_VERSION);
  if (!needsMigration(doc)) return null;
  return (target) => {
    const read = readSheet(docToJson(target));
    // A document that cannot be migrated is left as it is: its readers report the problems, nothing is lost.
    if (read.ok) writeSheet(target, read.sheet);
  };
}
