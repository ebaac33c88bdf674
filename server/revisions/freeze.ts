// The room's document as it is at one moment (its Yjs state and JSON view), and the names a revision is filed under.
import * as Y from 'yjs';
import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { project, sheet as sheetTable } from '../../db/schema';
import { docToJson } from '../../editor/document/sheet-doc';
import { notFound } from '../http/errors';
import type { RoomRegistry } from '../sync/room-registry';

/** Takes the room's document as it is now: its Yjs state and its JSON view, named as the sheet list names it. */
export async function freezeDocument(rooms: RoomRegistry, sheetId: string, sheetName: string) {
  return rooms.withRoom(sheetId, async (room) => {
    await room.flushed();
    const state = Y.encodeStateAsUpdate(room.doc);
    const json = docToJson(room.doc, sheetName) as Record<string, unknown>;
    return { state, json };
  });
}

export async function sheetNames(db: Database, sheetId: string) {
  const [row] = await db
    .select({ sheetName: sheetTable.name, projectName: project.name })
    .from(sheetTable)
    .innerJoin(project, eq(project.id, sheetTable.projectId))
    .where(eq(sheetTable.id, sheetId));
  if (!row) throw notFound('Sheet');
  return row;
}

