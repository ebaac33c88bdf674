// Viewer links: made and revoked by owners, looked up by token hash, re-checked on every use.
import { and, desc, eq } from 'drizzle-orm';
import type { Database } from '../../../db/client';
import { viewerLink } from '../../../db/schema';
import { HttpError, notFound } from '../../http/errors';
import { hashToken } from '../tokens';

export type LinkRow = typeof viewerLink.$inferSelect;

export function linkState(link: LinkRow, now = new Date()): 'active' | 'revoked' | 'expired' {
  if (link.revokedAt) return 'revoked';
  if (link.expiresAt && link.expiresAt <= now) return 'expired';
  return 'active';
}

/** The active link for a token: 404 for a token that never existed, 410 for a revoked or expired one. */
export async function requireActiveLink(db: Database, token: string): Promise<LinkRow> {
  const [link] = await db.select().from(viewerLink).where(eq(viewerLink.tokenHash, hashToken(token))).limit(1);
  if (!link) throw notFound('Link');
  const state = linkState(link);
  if (state !== 'active') throw new HttpError(410, 'gone', state === 'revoked' ? 'This link was revoked by the sheet’s owner' : 'This link has expired');
  return link;
}

export async function listLinks(db: Database, sheetId: string) {
  return db.select().from(viewerLink).where(eq(viewerLink.sheetId, sheetId)).orderBy(desc(viewerLink.createdAt));
}

export async function revokeLink(db: Database, sheetId: string, linkId: string): Promise<LinkRow | null> {
  const [row] = await db
    .update(viewerLink)
    .set({ revokedAt: new Date() })
    .where(and(eq(viewerLink.id, linkId), eq(viewerLink.sheetId, sheetId)))
    .returning();
  return row ?? null;
}
