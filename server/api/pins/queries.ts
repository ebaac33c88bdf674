// Pins and their replies: numbered per sheet, read with their authors' names.
import { and, asc, eq, inArray, sql } from 'drizzle-orm';
import type { PinThread } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { pin, pinAttachment, pinReply, projectMember, user, userPreference } from '../../../db/schema';

export async function listPins(db: Database, sheetId: string): Promise<PinThread[]> {
  const pins = await db
    .select({ pin, authorName: user.name })
    .from(pin)
    .leftJoin(user, eq(user.id, pin.authorId))
    .where(eq(pin.sheetId, sheetId))
    .orderBy(asc(pin.number));
  if (pins.length === 0) return [];
  const replies = await db
    .select({ reply: pinReply, authorName: user.name })
    .from(pinReply)
    .leftJoin(user, eq(user.id, pinReply.authorId))
    .where(inArray(pinReply.pinId, pins.map((p) => p.pin.id)))
    .orderBy(asc(pinReply.createdAt));
  const files = await db
    .select({ id: pinAttachment.id, pinId: pinAttachment.pinId, fileName: pinAttachment.fileName, mediaType: pinAttachment.mediaType, sizeBytes: pinAttachment.sizeBytes })
    .from(pinAttachment)
    .where(inArray(pinAttachment.pinId, pins.map((p) => p.pin.id)))
    .orderBy(asc(pinAttachment.createdAt));
  return pins.map(({ pin: p, authorName }) => ({
    attachments: files.filter((f) => f.pinId === p.id).map(({ pinId: _pinId, ...rest }) => rest),
    id: p.id,
    number: p.number,
    elementId: p.elementId,
    x: p.x,
    y: p.y,
    author: { id: p.authorId, name: authorName ?? 'Former member' },
    body: p.body,
    createdAt: p.createdAt.toISOString(),
    resolvedAt: p.resolvedAt?.toISOString() ?? null,
    replies: replies
      .filter((r) => r.reply.pinId === p.id)
      .map((r) => ({ id: r.reply.id, author: { id: r.reply.authorId, name: r.authorName ?? 'Former member' }, body: r.reply.body, createdAt: r.reply.createdAt.toISOString() })),
  }));
}

export async function addPin(
  db: Database,
  sheetId: string,
  authorId: string,
  input: { body: string; elementId?: string | null; x: number; y: number },
): Promise<string> {
  return db.transaction(async (tx) => {
    // Numbers are per sheet and never reused; the unique index settles a race between two writers.
    const [{ next }] = await tx.select({ next: sql<number>`coalesce(max(${pin.number}), 0) + 1` }).from(pin).where(eq(pin.sheetId, sheetId));
    const [row] = await tx
      .insert(pin)
      .values({ sheetId, number: Number(next), authorId, body: input.body, elementId: input.elementId ?? null, x: input.x, y: input.y })
      .returning({ id: pin.id });
    return row.id;
  });
}

export async function findPin(db: Database, sheetId: string, pinId: string) {
  const [row] = await db.select().from(pin).where(and(eq(pin.id, pinId), eq(pin.sheetId, sheetId))).limit(1);
  return row ?? null;
}

/** Who hears about a new pin or reply: the project's owners and the thread's participants, minus the author,
 *  guests (their addresses are placeholders) and anyone who turned pin e-mails off. */
export async function pinMailRecipients(db: Database, projectId: string, pinId: string, authorId: string): Promise<string[]> {
  const owners = await db
    .select({ id: projectMember.userId })
    .from(projectMember)
    .where(and(eq(projectMember.projectId, projectId), eq(projectMember.role, 'owner')));
  const [first] = await db.select({ id: pin.authorId }).from(pin).where(eq(pin.id, pinId));
  const repliers = await db.select({ id: pinReply.authorId }).from(pinReply).where(eq(pinReply.pinId, pinId));
  const ids = new Set([...owners, first, ...repliers].map((r) => r?.id).filter((id): id is string => Boolean(id)));
  ids.delete(authorId);
  if (ids.size === 0) return [];
  const rows = await db
    .select({ email: user.email, isAnonymous: user.isAnonymous, pinEmails: userPreference.pinEmails })
    .from(user)
    .leftJoin(userPreference, eq(userPreference.userId, user.id))
    .where(inArray(user.id, [...ids]));
  return rows.filter((r) => !r.isAnonymous && r.pinEmails !== false).map((r) => r.email);
}
