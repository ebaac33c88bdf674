// Pins on a sheet, reached two ways: by members (/api/sheets/:sheetId/pins) and through a viewer link
// (/api/view/:token/pins, where a guest with a name or any signed-in person may comment). New pins and replies
// e-mail the owners and the thread's participants, and reach everyone on the sheet live.
import { Router, type Request, type Response } from 'express';
import { and, eq } from 'drizzle-orm';
import { z } from 'zod';
import { idParam } from '../../../shared/api';
import { roleAtLeast, type Role } from '../../../shared/roles';
import type { Database } from '../../../db/client';
import { pin, pinReply, sheet as sheetTable } from '../../../db/schema';
import type { ServerConfig } from '../../config';
import type { Mailer } from '../../mail/mailer';
import { pinMail } from '../../mail/templates';
import { forbidden, notFound, unauthorized } from '../../http/errors';
import { maybeUser, type SessionUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { projectRoleOf } from '../access';
import { addPin, findPin, listPins, pinMailRecipients } from './queries';
import { judgeAttachment, MAX_ATTACHMENT_BYTES, uploadOne } from './attachments';
import { pinAttachment } from '../../../db/schema';
import { badRequest } from '../../http/errors';
import type { PinEvents } from './events';

const body = z.string().trim().min(1, 'Write something').max(4000, 'At most 4000 characters');
const createPin = z.strictObject({
  body,
  elementId: z.string().min(1).max(120).nullable().optional(),
  x: z.number({ error: 'x must be a number' }).finite().default(0),
  y: z.number({ error: 'y must be a number' }).finite().default(0),
});
const pinParams = z.object({ pinId: idParam });
const reply = { params: pinParams, body: z.strictObject({ body }) };
const resolve = { params: pinParams, body: z.strictObject({ resolved: z.boolean({ error: 'resolved must be true or false' }) }) };

/** Who is asking, for one sheet: a member with a role, or someone who holds a viewer link (role null). */
export interface PinAccess {
  sheetId: string;
  projectId: string;
  user: SessionUser | null;
  role: Role | null;
}

export function pinsRouter(deps: {
  db: Database;
  mailer: Mailer;
  config: ServerConfig;
  events: PinEvents;
  access: (req: Request, res: Response) => Promise<PinAccess>;
  log: (line: string) => void;
}): Router {
  const { db, events } = deps;
  const r = Router({ mergeParams: true });

  const writer = (a: PinAccess): SessionUser => {
    if (!a.user) throw unauthorized();
    return a.user;
  };

  const notify = async (a: PinAccess, pinId: string, number: number, author: SessionUser, text: string, kind: 'pin' | 'reply') => {
    try {
      const to = await pinMailRecipients(db, a.projectId, pinId, author.id);
      if (to.length === 0) return;
      const [s] = await db.select({ name: sheetTable.name }).from(sheetTable).where(eq(sheetTable.id, a.sheetId));
      const url = `${deps.config.publicUrl}/sheets/${a.sheetId}?pin=${number}`;
      await deps.mailer.send({ to, ...pinMail({ kind, author: author.name, sheetName: s?.name ?? 'a sheet', number, text, url }) });
    } catch (err) {
      // A failed notice must not undo the comment; it is logged for the operator.
      deps.log(`pin mail for ${pinId} failed: ${String(err)}`);
    }
  };

  r.get('/', async (req, res) => {
    const a = await deps.access(req, res);
    res.json({ pins: await listPins(db, a.sheetId) });
  });

  r.get('/events', async (req, res) => {
    const a = await deps.access(req, res);
    events.subscribe(a.sheetId, res);
  });

  r.post('/', validate({ body: createPin }), async (req, res) => {
    const a = await deps.access(req, res);
    const author = writer(a);
    const input = valid(res, { body: createPin }).body;
    const id = await addPin(db, a.sheetId, author.id, input);
    const [created] = (await listPins(db, a.sheetId)).filter((p) => p.id === id);
    events.publish(a.sheetId, { type: 'pin-added', pinId: id, number: created.number });
    await notify(a, id, created.number, author, input.body, 'pin');
    res.status(201).json({ pin: created });
  });

  r.post('/:pinId/replies', validate(reply), async (req, res) => {
    const a = await deps.access(req, res);
    const author = writer(a);
    const { params, body: b } = valid(res, reply);
    const found = await findPin(db, a.sheetId, params.pinId);
    if (!found) throw notFound('Pin');
    await db.insert(pinReply).values({ pinId: found.id, authorId: author.id, body: b.body });
    events.publish(a.sheetId, { type: 'reply-added', pinId: found.id, number: found.number });
    await notify(a, found.id, found.number, author, b.body, 'reply');
    res.status(201).json({ pin: (await listPins(db, a.sheetId)).find((p) => p.id === found.id) });
  });

  // Resolving and reopening: the pin's author, an editor or an owner.
  r.patch('/:pinId', validate(resolve), async (req, res) => {
    const a = await deps.access(req, res);
    const actor = writer(a);
    const { params, body: b } = valid(res, resolve);
    const found = await findPin(db, a.sheetId, params.pinId);
    if (!found) throw notFound('Pin');
    const role = a.role ?? (actor.isGuest ? null : await projectRoleOf(db, a.projectId, actor.id));
    if (found.authorId !== actor.id && !(role && roleAtLeast(role, 'editor'))) {
      throw forbidden('Only the pin’s author, an editor or an owner may resolve or reopen it');
    }
    await db
      .update(pin)
      .set(b.resolved ? { resolvedAt: new Date(), resolvedBy: actor.id } : { resolvedAt: null, resolvedBy: null })
      .where(and(eq(pin.id, found.id), eq(pin.sheetId, a.sheetId)));
    events.publish(a.sheetId, { type: b.resolved ? 'pin-resolved' : 'pin-reopened', pinId: found.id, number: found.number });
    res.json({ pin: (await listPins(db, a.sheetId)).find((p) => p.id === found.id) });
  });

  r.post('/:pinId/attachments', (req, res, next) =>
    uploadOne(req, res, (err: unknown) => {
      if (err && typeof err === 'object' && 'code' in err && err.code === 'LIMIT_FILE_SIZE') {
        return next(badRequest(`The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB`, [{ path: 'file', message: 'too large' }]));
      }
      next(err);
    }),
  async (req, res) => {
    const a = await deps.access(req, res);
    const uploader = writer(a);
    const pinId = pinParams.safeParse(req.params);
    if (!pinId.success) throw notFound('Pin');
    const found = await findPin(db, a.sheetId, pinId.data.pinId);
    if (!found) throw notFound('Pin');
    const file = req.file;
    if (!file) throw badRequest('Attach one file in the field "file"', [{ path: 'file', message: 'missing' }]);
    const fileName = file.originalname.replace(/[\\/\r\n"]/g, '_').slice(0, 200) || 'file';
    const mediaType = await judgeAttachment(fileName, file.buffer);
    const [row] = await db
      .insert(pinAttachment)
      .values({ pinId: found.id, uploadedBy: uploader.id, fileName, mediaType, sizeBytes: file.size, content: new Uint8Array(file.buffer) })
      .returning({ id: pinAttachment.id });
    events.publish(a.sheetId, { type: 'reply-added', pinId: found.id, number: found.number });
    res.status(201).json({ attachment: { id: row.id, fileName, mediaType, sizeBytes: file.size } });
  });

  r.get('/:pinId/attachments/:attachmentId', async (req, res) => {
    const a = await deps.access(req, res);
    const ids = z.object({ pinId: idParam, attachmentId: idParam }).safeParse(req.params);
    if (!ids.success) throw notFound('Attachment');
    const found = await findPin(db, a.sheetId, ids.data.pinId);
    if (!found) throw notFound('Attachment');
    const [row] = await db.select().from(pinAttachment).where(and(eq(pinAttachment.id, ids.data.attachmentId), eq(pinAttachment.pinId, found.id)));
    if (!row) throw notFound('Attachment');
    res.setHeader('Content-Type', row.mediaType);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Disposition', `${row.mediaType.startsWith('image/') ? 'inline' : 'attachment'}; filename="${row.fileName}"`);
    res.send(Buffer.from(row.content));
  });

  return r;
}
