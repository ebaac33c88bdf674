// /api/outbox: the local mail sink's messages. It exists only while the sink is in use and answers only this
// machine (loopback), because the messages hold password-reset and invitation links.
import { Router, type RequestHandler } from 'express';
import { desc } from 'drizzle-orm';
import type { Database } from '../../../db/client';
import { mailMessage } from '../../../db/schema';
import type { OutboxMessage } from '../../../shared/api';
import { notFound } from '../../http/errors';

const LOOPBACK = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);

export const loopbackOnly: RequestHandler = (req, _res, next) => {
  // The socket's own address, not X-Forwarded-For: a proxy in front must not open the outbox to the world.
  if (!LOOPBACK.has(req.socket.remoteAddress ?? '')) return next(notFound('Outbox'));
  next();
};

export function outboxRouter(db: Database): Router {
  const r = Router();
  r.use(loopbackOnly);
  r.get('/', async (_req, res) => {
    const rows = await db.select().from(mailMessage).orderBy(desc(mailMessage.receivedAt)).limit(200);
    const messages: OutboxMessage[] = rows.map((m) => ({
      id: m.id,
      from: m.fromAddress,
      to: m.toAddresses,
      subject: m.subject,
      text: m.textBody,
      html: m.htmlBody,
      receivedAt: m.receivedAt.toISOString(),
    }));
    res.json({ messages });
  });
  return r;
}
