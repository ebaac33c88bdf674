// Who may touch what: a project's members by role; everyone else is told the project does not exist.
import { and, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { projectMember, sheet } from '../../db/schema';
import { roleAtLeast, type Role } from '../../shared/roles';
import { forbidden, notFound } from '../http/errors';

export async function projectRoleOf(db: Database, projectId: string, userId: string): Promise<Role | null> {
  const rows = await db
    .select({ role: projectMember.role })
    .from(projectMember)
    .where(and(eq(projectMember.projectId, projectId), eq(projectMember.userId, userId)))
    .limit(1);
  return rows[0]?.role ?? null;
}

const ACTION_WORDS: Record<Role, string> = {
  owner: 'Only an owner of this project may do that',
  editor: 'Only an editor or owner of this project may do that',
  viewer: 'You need to be a member of this project',
};

/** The caller's role, or 404 for a non-member (never revealing the project exists) and 403 for too low a role. */
export async function requireProjectRole(db: Database, projectId: string, userId: string, needed: Role): Promise<Role> {
  const role = await projectRoleOf(db, projectId, userId);
  if (!role) throw notFound('Project');
  if (!roleAtLeast(role, needed)) throw forbidden(ACTION_WORDS[needed]);
  return role;
}

export async function requireSheetRole(db: Database, sheetId: string, userId: string, needed: Role) {
  const rows = await db
    .select({ sheet, role: projectMember.role })
    .from(sheet)
    .innerJoin(projectMember, and(eq(projectMember.projectId, sheet.projectId), eq(projectMember.userId, userId)))
    .where(eq(sheet.id, sheetId))
    .limit(1);
  const found = rows[0];
  if (!found) throw notFound('Sheet');
  if (!roleAtLeast(found.role, needed)) throw forbidden(ACTION_WORDS[needed]);
  return found;
}
