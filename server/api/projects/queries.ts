// Project reads and writes, always through the caller's membership.
import { and, count, desc, eq, sql } from 'drizzle-orm';
import type { Database } from '../../../db/client';
import { project, projectMember, sheet } from '../../../db/schema';
import type { ProjectSummary } from '../../../shared/api';
import type { Role } from '../../../shared/roles';

const sheetCount = sql<number>`(select count(*)::int from ${sheet} where ${sheet.projectId} = ${project.id})`;

function toSummary(row: { project: typeof project.$inferSelect; role: Role; sheetCount: number }): ProjectSummary {
  return {
    id: row.project.id,
    name: row.project.name,
    description: row.project.description,
    role: row.role,
    sheetCount: Number(row.sheetCount),
    createdAt: row.project.createdAt.toISOString(),
    updatedAt: row.project.updatedAt.toISOString(),
  };
}

export async function listProjects(db: Database, userId: string): Promise<ProjectSummary[]> {
  const rows = await db
    .select({ project, role: projectMember.role, sheetCount })
    .from(project)
    .innerJoin(projectMember, and(eq(projectMember.projectId, project.id), eq(projectMember.userId, userId)))
    .orderBy(desc(project.updatedAt));
  return rows.map(toSummary);
}

export async function getProject(db: Database, projectId: string, userId: string): Promise<ProjectSummary | null> {
  const rows = await db
    .select({ project, role: projectMember.role, sheetCount })
    .from(project)
    .innerJoin(projectMember, and(eq(projectMember.projectId, project.id), eq(projectMember.userId, userId)))
    .where(eq(project.id, projectId))
    .limit(1);
  return rows[0] ? toSummary(rows[0]) : null;
}

export async function createProject(
  db: Database,
  userId: string,
  input: { name: string; description?: string },
): Promise<string> {
  return db.transaction(async (tx) => {
    const [created] = await tx
      .insert(project)
      .values({ name: input.name, description: input.description ?? '', createdBy: userId })
      .returning({ id: project.id });
    await tx.insert(projectMember).values({ projectId: created.id, userId, role: 'owner' });
    return created.id;
  });
}

export async function updateProject(db: Database, projectId: string, input: { name?: string; description?: string }) {
  await db.update(project).set(input).where(eq(project.id, projectId));
}

export async function deleteProject(db: Database, projectId: string) {
  await db.delete(project).where(eq(project.id, projectId));
}

export async function countOwners(db: Database, projectId: string): Promise<number> {
  const [row] = await db
    .select({ n: count() })
    .from(projectMember)
    .where(and(eq(projectMember.projectId, projectId), eq(projectMember.role, 'owner')));
  return row?.n ?? 0;
}
