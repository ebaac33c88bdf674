// /api/sheets/:sheetId/links: an owner makes read-only links to a sheet (optionally expiring), lists and revokes them.
import { Router } from 'express';
import { z } from 'zod';
import { idParam } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { viewerLink } from '../../../db/schema';
import type { ServerConfig } from '../../config';
import { notFound } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import type { RoomRegistry } from '../../sync/room-registry';
import { requireSheetRole } from '../access';
import { newToken, hashToken } from '../tokens';
import { linkState, listLinks, revokeLink, type LinkRow } from './queries';

const bySheet = { params: z.object({ sheetId: idParam }) };
const create = {
  params: bySheet.params,
  body: z.strictObject({
    label: z.string().trim().max(120, 'Label must be at most 120 characters').optional(),
    expiresInDays: z.number().int('Whole days only').min(1, 'At least 1 day').max(365, 'At most 365 days').optional(),
  }),
};
const oneLink = { params: z.object({ sheetId: idParam, linkId: idParam }) };

const summary = (l: LinkRow) => ({
  id: l.id,
  label: l.label,
  createdAt: l.createdAt.toISOString(),
  expiresAt: l.expiresAt?.toISOString() ?? null,
  revokedAt: l.revokedAt?.toISOString() ?? null,
  state: linkState(l),
});

export function linksRouter(db: Database, rooms: RoomRegistry, config: ServerConfig): Router {
  const r = Router();

  r.get('/:sheetId/links', validate(bySheet), async (_req, res) => {
    const { sheetId } = valid(res, bySheet).params;
    await requireSheetRole(db, sheetId, currentUser(res).id, 'owner');
    res.json({ links: (await listLinks(db, sheetId)).map(summary) });
  });

  r.post('/:sheetId/links', validate(create), async (_req, res) => {
    const user = currentUser(res);
    const { params, body } = valid(res, create);
    await requireSheetRole(db, params.sheetId, user.id, 'owner');
    const token = newToken();
    const expiresAt = body.expiresInDays ? new Date(Date.now() + body.expiresInDays * 86_400_000) : null;
    const [row] = await db
      .insert(viewerLink)
      .values({ sheetId: params.sheetId, tokenHash: hashToken(token), label: body.label ?? '', createdBy: user.id, expiresAt })
      .returning();
    // The token is shown this once; only its hash is kept.
    res.status(201).json({ link: summary(row), token, url: `${config.publicUrl}/view/${token}` });
  });

  r.delete('/:sheetId/links/:linkId', validate(oneLink), async (_req, res) => {
    const { params } = valid(res, oneLink);
    await requireSheetRole(db, params.sheetId, currentUser(res).id, 'owner');
    const row = await revokeLink(db, params.sheetId, params.linkId);
    if (!row) throw notFound('Link');
    rooms.closeLink(params.sheetId, row.id);
    res.json({ link: summary(row) });
  });

  return r;
}
