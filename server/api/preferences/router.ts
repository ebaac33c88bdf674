// /api/me/preferences: each person's own choices (for now: whether pin e-mails are wanted).
import { Router } from 'express';
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import type { Database } from '../../../db/client';
import { userPreference } from '../../../db/schema';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';

const patch = { body: z.strictObject({ pinEmails: z.boolean({ error: 'pinEmails must be true or false' }) }) };

export function preferencesRouter(db: Database): Router {
  const r = Router();
  const read = async (userId: string) => {
    const [row] = await db.select().from(userPreference).where(eq(userPreference.userId, userId));
    return { pinEmails: row?.pinEmails ?? true };
  };
  r.get('/preferences', async (_req, res) => {
    res.json({ preferences: await read(currentUser(res).id) });
  });
  r.patch('/preferences', validate(patch), async (_req, res) => {
    const userId = currentUser(res).id;
    const { pinEmails } = valid(res, patch).body;
    await db.insert(userPreference).values({ userId, pinEmails }).onConflictDoUpdate({ target: userPreference.userId, set: { pinEmails } });
    res.json({ preferences: await read(userId) });
  });
  return r;
}
