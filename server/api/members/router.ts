// /api/projects/:projectId/members: who is on a project and with which role (any member may look).
import { Router } from 'express';
import { asc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { idParam, type MemberSummary } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { projectMember, user } from '../../../db/schema';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { requireProjectRole } from '../access';

const inProject = { params: z.object({ projectId: idParam }) };

export async function listMembers(db: Database, projectId: string): Promise<MemberSummary[]> {
  const rows = await db
    .select({ userId: user.id, name: user.name, email: user.email, role: projectMember.role, joinedAt: projectMember.createdAt })
    .from(projectMember)
    .innerJoin(user, eq(user.id, projectMember.userId))
    .where(eq(projectMember.projectId, projectId))
    .orderBy(asc(user.name));
  return rows.map((m) => ({ ...m, joinedAt: m.joinedAt.toISOString() }));
}

export function membersRouter(db: Database): Router {
  const r = Router({ mergeParams: true });
  r.get('/', validate(inProject), async (_req, res) => {
    const { projectId } = valid(res, inProject).params;
    await requireProjectRole(db, projectId, currentUser(res).id, 'viewer');
    res.json({ members: await listMembers(db, projectId) });
  });
  return r;
}
