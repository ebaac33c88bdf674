// /api/projects/:projectId/members: who is on a project (any member may look); owners change roles and remove
// members. A project always keeps at least one owner. Changes reach open sync sockets at once.
import { Router } from 'express';
import { and, asc, eq, sql } from 'drizzle-orm';
import { z } from 'zod';
import { idParam, roleSchema, type MemberSummary } from '../../../shared/api';
import type { Role } from '../../../shared/roles';
import type { Database } from '../../../db/client';
import { projectMember, session, sheet, user } from '../../../db/schema';
import { conflict, notFound } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import type { RoomRegistry } from '../../sync/room-registry';
import { requireProjectRole } from '../access';
import { countOwners } from '../projects/queries';
import { recordMembership } from '../membership-events';

const inProject = { params: z.object({ projectId: idParam }) };
const oneMember = { params: z.object({ projectId: idParam, userId: z.string().min(1).max(100) }) };
const changeRole = { params: oneMember.params, body: z.strictObject({ role: roleSchema }) };

export async function listMembers(db: Database, projectId: string): Promise<MemberSummary[]> {
  const rows = await db
    .select({
      userId: user.id,
      name: user.name,
      email: user.email,
      role: projectMember.role,
      joinedAt: projectMember.createdAt,
      // Last active: the newest session activity of the person, anywhere in the product.
      lastActiveAt: sql<string | null>`(select max(${session.updatedAt}) from ${session} where ${session.userId} = ${user.id})`,
    })
    .from(projectMember)
    .innerJoin(user, eq(user.id, projectMember.userId))
    .where(eq(projectMember.projectId, projectId))
    .orderBy(asc(user.name));
  return rows.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString(), lastActiveAt: m.lastActiveAt ? new Date(m.lastActiveAt).toISOString() : null }));
}

const accessOf = (role: Role | null) => (role === null ? 'none' : role === 'viewer' ? 'read' : 'write');

export function membersRouter(db: Database, rooms: RoomRegistry): Router {
  const r = Router({ mergeParams: true });

  const memberRole = async (projectId: string, userId: string) => {
    const [row] = await db
      .select({ role: projectMember.role })
      .from(projectMember)
      .where(and(eq(projectMember.projectId, projectId), eq(projectMember.userId, userId)));
    if (!row) throw notFound('Member');
    return row.role;
  };

  const emailOf = async (userId: string) => (await db.select({ email: user.email }).from(user).where(eq(user.id, userId)))[0]?.email ?? userId;

  const tellRooms = async (projectId: string, userId: string, role: Role | null) => {
    const sheets = await db.select({ id: sheet.id }).from(sheet).where(eq(sheet.projectId, projectId));
    await rooms.setAccess(sheets.map((s) => s.id), userId, accessOf(role));
  };

  r.get('/', validate(inProject), async (_req, res) => {
    const { projectId } = valid(res, inProject).params;
    await requireProjectRole(db, projectId, currentUser(res).id, 'viewer');
    res.json({ members: await listMembers(db, projectId) });
  });

  r.patch('/:userId', validate(changeRole), async (_req, res) => {
    const { params, body } = valid(res, changeRole);
    await requireProjectRole(db, params.projectId, currentUser(res).id, 'owner');
    const before = await memberRole(params.projectId, params.userId);
    if (before === 'owner' && body.role !== 'owner' && (await countOwners(db, params.projectId)) <= 1) {
      throw conflict('A project keeps at least one owner: make someone else an owner first');
    }
    await db
      .update(projectMember)
      .set({ role: body.role })
      .where(and(eq(projectMember.projectId, params.projectId), eq(projectMember.userId, params.userId)));
    await tellRooms(params.projectId, params.userId, body.role);
    await recordMembership(db, { projectId: params.projectId, actorId: currentUser(res).id, action: 'role-changed', subject: await emailOf(params.userId), role: body.role });
    res.json({ members: await listMembers(db, params.projectId) });
  });

  r.delete('/:userId', validate(oneMember), async (_req, res) => {
    const { params } = valid(res, oneMember);
    await requireProjectRole(db, params.projectId, currentUser(res).id, 'owner');
    const before = await memberRole(params.projectId, params.userId);
    if (before === 'owner' && (await countOwners(db, params.projectId)) <= 1) {
      throw conflict('A project keeps at least one owner: the last owner cannot be removed');
    }
    await db
      .delete(projectMember)
      .where(and(eq(projectMember.projectId, params.projectId), eq(projectMember.userId, params.userId)));
    await tellRooms(params.projectId, params.userId, null);
    await recordMembership(db, { projectId: params.projectId, actorId: currentUser(res).id, action: 'removed', subject: await emailOf(params.userId), role: before });
    res.status(204).end();
  });

  return r;
}
