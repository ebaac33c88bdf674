// /api/view/:token: what a viewer link opens, with no account needed: the sheet's name, its document (read-only)
// and its pins. The link is re-checked on every request: revoked or expired links answer 410.
import { Router, type Request, type Response } from 'express';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import type { Database } from '../../../db/client';
import { project, sheet as sheetTable } from '../../../db/schema';
import { docToJson } from '../../../editor/document/sheet-doc';
import { notFound } from '../../http/errors';
import { maybeUser } from '../../http/session';
import type { RoomRegistry } from '../../sync/room-registry';
import { projectRoleOf } from '../access';
import { requireActiveLink } from '../links/queries';
import type { PinAccess } from '../pins/router';

const tokenParam = z.string().min(20, 'Not a valid link').max(200, 'Not a valid link');

export async function linkAccess(db: Database, req: Request, res: Response): Promise<PinAccess> {
  const parsed = tokenParam.safeParse((req.params as Record<string, string>).token);
  if (!parsed.success) throw notFound('Link');
  const link = await requireActiveLink(db, parsed.data);
  const [row] = await db.select({ projectId: sheetTable.projectId }).from(sheetTable).where(eq(sheetTable.id, link.sheetId));
  if (!row) throw notFound('Link');
  const user = maybeUser(res);
  const role = user && !user.isGuest ? await projectRoleOf(db, row.projectId, user.id) : null;
  return { sheetId: link.sheetId, projectId: row.projectId, user, role };
}

export function viewRouter(db: Database, rooms: RoomRegistry): Router {
  const r = Router({ mergeParams: true });

  r.get('/', async (req, res) => {
    const a = await linkAccess(db, req, res);
    const link = await requireActiveLink(db, String((req.params as Record<string, string>).token));
    const [row] = await db
      .select({ sheetName: sheetTable.name, projectName: project.name })
      .from(sheetTable)
      .innerJoin(project, eq(project.id, sheetTable.projectId))
      .where(eq(sheetTable.id, a.sheetId));
    res.json({
      sheet: { id: a.sheetId, name: row.sheetName },
      project: { name: row.projectName },
      link: { expiresAt: link.expiresAt?.toISOString() ?? null },
      you: a.user ? { id: a.user.id, name: a.user.name, guest: a.user.isGuest } : null,
    });
  });

  r.get('/document', async (req, res) => {
    const a = await linkAccess(db, req, res);
    const [row] = await db.select({ sheetName: sheetTable.name }).from(sheetTable).where(eq(sheetTable.id, a.sheetId));
    res.json(await rooms.withRoom(a.sheetId, async (room) => docToJson(room.doc, row?.sheetName ?? '')));
  });

  return r;
}
