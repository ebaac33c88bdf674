// Invitations: an owner invites by e-mail and role; the e-mail's link expires in 7 days and works once.
// Accepting (signed in as the invited address) adds the person with that role. Pending ones can be resent or withdrawn.
import { Router } from 'express';
import { and, desc, eq, isNull } from 'drizzle-orm';
import { z } from 'zod';
import { idParam, roleSchema } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { invitation, project, projectMember, user } from '../../../db/schema';
import type { ServerConfig } from '../../config';
import type { Mailer } from '../../mail/mailer';
import { invitationMail } from '../../mail/templates';
import { conflict, forbidden, HttpError, notFound } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { requireProjectRole } from '../access';
import { recordMembership } from '../membership-events';
import { hashToken, newToken } from '../tokens';

const WEEK_MS = 7 * 86_400_000;
const inProject = { params: z.object({ projectId: idParam }) };
const create = {
  params: inProject.params,
  body: z.strictObject({ email: z.string().trim().toLowerCase().email('Give a valid e-mail address'), role: roleSchema }),
};
const oneInvitation = { params: z.object({ projectId: idParam, invitationId: idParam }) };
const byToken = { params: z.object({ token: z.string().min(20, 'Not a valid invitation').max(200, 'Not a valid invitation') }) };

type InvitationRow = typeof invitation.$inferSelect;
const state = (i: InvitationRow) =>
  i.acceptedAt ? 'accepted' : i.withdrawnAt ? 'withdrawn' : i.expiresAt <= new Date() ? 'expired' : 'pending';
const summary = (i: InvitationRow) => ({
  id: i.id,
  email: i.email,
  role: i.role,
  state: state(i),
  sentAt: i.sentAt.toISOString(),
  expiresAt: i.expiresAt.toISOString(),
});

export function invitationsRouter(db: Database, mailer: Mailer, config: ServerConfig) {
  const owners = Router({ mergeParams: true });

  const send = async (projectId: string, inviter: string, email: string, role: string, token: string) => {
    const [p] = await db.select({ name: project.name }).from(project).where(eq(project.id, projectId));
    await mailer.send({ to: email, ...invitationMail({ inviter, projectName: p?.name ?? 'a project', role, url: `${config.publicUrl}/invite/${token}` }) });
  };

  owners.get('/', validate(inProject), async (_req, res) => {
    const { projectId } = valid(res, inProject).params;
    await requireProjectRole(db, projectId, currentUser(res).id, 'owner');
    const rows = await db.select().from(invitation).where(eq(invitation.projectId, projectId)).orderBy(desc(invitation.createdAt));
    res.json({ invitations: rows.map(summary) });
  });

  owners.post('/', validate(create), async (_req, res) => {
    const me = currentUser(res);
    const { params, body } = valid(res, create);
    await requireProjectRole(db, params.projectId, me.id, 'owner');
    const [member] = await db
      .select({ id: user.id })
      .from(projectMember)
      .innerJoin(user, eq(user.id, projectMember.userId))
      .where(and(eq(projectMember.projectId, params.projectId), eq(user.email, body.email)));
    if (member) throw conflict(`${body.email} is already a member of this project`);
    // A new invitation to the same address replaces a pending one.
    await db
      .update(invitation)
      .set({ withdrawnAt: new Date() })
      .where(and(eq(invitation.projectId, params.projectId), eq(invitation.email, body.email), isNull(invitation.acceptedAt), isNull(invitation.withdrawnAt)));
    const token = newToken();
    const [row] = await db
      .insert(invitation)
      .values({ projectId: params.projectId, email: body.email, role: body.role, tokenHash: hashToken(token), invitedBy: me.id, expiresAt: new Date(Date.now() + WEEK_MS) })
      .returning();
    await send(params.projectId, me.name, body.email, body.role, token);
    await recordMembership(db, { projectId: params.projectId, actorId: me.id, action: 'invited', subject: body.email, role: body.role });
    res.status(201).json({ invitation: summary(row) });
  });

  owners.post('/:invitationId/resend', validate(oneInvitation), async (_req, res) => {
    const me = currentUser(res);
    const { params } = valid(res, oneInvitation);
    await requireProjectRole(db, params.projectId, me.id, 'owner');
    const [found] = await db.select().from(invitation).where(and(eq(invitation.id, params.invitationId), eq(invitation.projectId, params.projectId)));
    if (!found) throw notFound('Invitation');
    if (found.acceptedAt || found.withdrawnAt) throw conflict('Only a pending or expired invitation can be sent again');
    // A fresh token and a fresh week: the old link stops working.
    const token = newToken();
    const [row] = await db
      .update(invitation)
      .set({ tokenHash: hashToken(token), sentAt: new Date(), expiresAt: new Date(Date.now() + WEEK_MS) })
      .where(eq(invitation.id, found.id))
      .returning();
    await send(params.projectId, me.name, found.email, found.role, token);
    await recordMembership(db, { projectId: params.projectId, actorId: me.id, action: 'invitation-resent', subject: found.email, role: found.role });
    res.json({ invitation: summary(row) });
  });

  owners.delete('/:invitationId', validate(oneInvitation), async (_req, res) => {
    const me = currentUser(res);
    const { params } = valid(res, oneInvitation);
    await requireProjectRole(db, params.projectId, me.id, 'owner');
    const [row] = await db
      .update(invitation)
      .set({ withdrawnAt: new Date() })
      .where(and(eq(invitation.id, params.invitationId), eq(invitation.projectId, params.projectId), isNull(invitation.acceptedAt)))
      .returning();
    if (!row) throw notFound('Invitation');
    await recordMembership(db, { projectId: params.projectId, actorId: me.id, action: 'invitation-withdrawn', subject: row.email, role: row.role });
    res.json({ invitation: summary(row) });
  });

  // Reading an invitation needs no session (the accept page shows it before sign-in); accepting does.
  const byTokenRouter = Router();
  const findByToken = async (token: string) => {
    const [row] = await db
      .select({ i: invitation, projectName: project.name, inviter: user.name })
      .from(invitation)
      .innerJoin(project, eq(project.id, invitation.projectId))
      .leftJoin(user, eq(user.id, invitation.invitedBy))
      .where(eq(invitation.tokenHash, hashToken(token)));
    if (!row) throw notFound('Invitation');
    const s = state(row.i);
    if (s !== 'pending') throw new HttpError(410, 'gone', s === 'accepted' ? 'This invitation was already used' : s === 'expired' ? 'This invitation has expired: ask for a new one' : 'This invitation was withdrawn');
    return row;
  };

  byTokenRouter.get('/:token', validate(byToken), async (_req, res) => {
    const row = await findByToken(valid(res, byToken).params.token);
    res.json({ invitation: { email: row.i.email, role: row.i.role, projectName: row.projectName, inviter: row.inviter, expiresAt: row.i.expiresAt.toISOString() } });
  });

  return { owners, byTokenRouter, findByToken };
}

export function acceptRouter(db: Database, findByToken: ReturnType<typeof invitationsRouter>['findByToken']) {
  const r = Router();
  r.post('/:token/accept', validate(byToken), async (_req, res) => {
    const me = currentUser(res);
    const row = await findByToken(valid(res, byToken).params.token);
    if (me.email.toLowerCase() !== row.i.email.toLowerCase()) {
      throw forbidden(`This invitation is for ${row.i.email}; sign in with that address to accept it`);
    }
    await db.transaction(async (tx) => {
      await tx
        .insert(projectMember)
        .values({ projectId: row.i.projectId, userId: me.id, role: row.i.role })
        .onConflictDoNothing();
      await tx.update(invitation).set({ acceptedAt: new Date(), acceptedBy: me.id }).where(eq(invitation.id, row.i.id));
      await recordMembership(tx, { projectId: row.i.projectId, actorId: me.id, action: 'joined', subject: me.email, role: row.i.role });
    });
    res.json({ projectId: row.i.projectId, role: row.i.role });
  });
  return r;
}
