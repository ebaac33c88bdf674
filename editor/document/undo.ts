// Undo and redo of this user's own commands only: a Y.UndoManager over every part of the sheet that tracks the
// commands' origin and nothing else, so a colleague's edits (remote origins) are never undone. Each command is one
// transaction and one step (no time-based merging): a drag, a paste or an inspector save undoes whole.
import * as Y from 'yjs';
import { collection, COLLECTIONS, settingsMap, sheetMeta } from './sheet-doc';

export function createUndoManager(doc: Y.Doc, origin: object): Y.UndoManager {
  return new Y.UndoManager([sheetMeta(doc), settingsMap(doc), ...COLLECTIONS.map((c) => collection(doc, c))], {
    trackedOrigins: new Set([origin]),
    captureTimeout: 0,
  });
}
