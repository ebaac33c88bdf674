// Rooms bring documents of older format versions up to the current one as they load, as one server-side edit.
import type * as Y from 'yjs';
import { readSheet } from '../../shared/sheet';
import { docToJson, needsMigration, writeSheet } from '../../editor/document/sheet-doc';

export function migrateOnLoad(doc: Y.Doc): ((doc: Y.Doc) => void) | null {
  if (!needsMigration(doc)) return null;
  return (target) => {
    const read = readSheet(docToJson(target));
    // A document that cannot be migrated is left as it is: its readers report the problems, nothing is lost.
    if (read.ok) writeSheet(target, read.sheet);
  };
}
