// The record of membership changes (who, what, when), shown to owners as the project's activity.
import { desc, eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { membershipEvent, user } from '../../db/schema';
import type { Role } from '../../shared/roles';

export type MembershipAction = 'invited' | 'invitation-resent' | 'invitation-withdrawn' | 'joined' | 'role-changed' | 'removed';

export async function recordMembership(
  db: Pick<Database, 'insert'>,
  e: { projectId: string; actorId: string | null; action: MembershipAction; subject: string; role?: Role | null },
) {
  await db.insert(membershipEvent).values({ projectId: e.projectId, actorId: e.actorId, action: e.action, subject: e.subject, role: e.role ?? null });
}

export async function listActivity(db: Database, projectId: string) {
  const rows = await db
    .select({ e: membershipEvent, actorName: user.name })
    .from(membershipEvent)
    .leftJoin(user, eq(user.id, membershipEvent.actorId))
    .where(eq(membershipEvent.projectId, projectId))
    .orderBy(desc(membershipEvent.createdAt))
    .limit(100);
  return rows.map(({ e, actorName }) => ({
    id: e.id,
    action: e.action,
    subject: e.subject,
    role: e.role,
    actor: actorName ?? null,
    at: e.createdAt.toISOString(),
  }));
}
