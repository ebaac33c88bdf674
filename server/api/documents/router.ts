// /api/sheets/:sheetId/document: the sheet's JSON view, derived from its live room document, and imports (PUT),
// applied as one server-side transaction in the room. Nothing writes sheet content around the room.
import express, { Router } from 'express';
import { z } from 'zod';
import { idParam } from '../../../shared/api';
import { readSheet } from '../../../shared/sheet';
import type { Database } from '../../../db/client';
import { docToJson, writeSheet } from '../../../editor/document/sheet-doc';
import { badRequest } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import type { RoomRegistry } from '../../sync/room-registry';
import { requireSheetRole } from '../access';

const bySheet = { params: z.object({ sheetId: idParam }) };

/** Sheets can be large: their import gets its own body limit, parsed before the API's default one. */
export const documentBodyParser = express.json({ limit: '25mb' });

/**
 * Validates a sheet JSON document and makes the room hold it, as one server-side transaction (imports, restores).
 * An invalid document changes nothing and answers 400 with the path of each problem.
 */
export async function applySheetDocument(rooms: RoomRegistry, sheetId: string, json: unknown, userId: string) {
  const read = readSheet(json);
  if (!read.ok) {
    throw badRequest(
      'The sheet is not valid; nothing was changed',
      read.issues.map((i) => ({ path: i.path ? `body.${i.path}` : 'body', message: i.message })),
    );
  }
  await rooms.withRoom(sheetId, (room) => room.transact((doc) => writeSheet(doc, read.sheet), userId));
  return read;
}

export function documentsRouter(db: Database, rooms: RoomRegistry): Router {
  const r = Router();

  r.get('/:sheetId/document', validate(bySheet), async (_req, res) => {
    const { sheetId } = valid(res, bySheet).params;
    const { sheet } = await requireSheetRole(db, sheetId, currentUser(res).id, 'viewer');
    res.json(await rooms.withRoom(sheetId, async (room) => docToJson(room.doc, sheet.name)));
  });

  r.put('/:sheetId/document', validate(bySheet), async (req, res) => {
    const user = currentUser(res);
    const { sheetId } = valid(res, bySheet).params;
    await requireSheetRole(db, sheetId, user.id, 'editor');
    const read = await applySheetDocument(rooms, sheetId, req.body, user.id);
    res.json({
      ok: true,
      warnings: read.warnings,
      ...(read.migratedFrom !== undefined ? { migratedFrom: read.migratedFrom } : {}),
    });
  });

  return r;
}
