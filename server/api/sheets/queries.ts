// Sheet metadata reads and writes. (A sheet's drawing lives in its collaborative document, not here.)
import { asc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Database } from '../../../db/client';
import { project, sheet, user } from '../../../db/schema';
import type { SheetSummary } from '../../../shared/api';

const creator = alias(user, 'creator');
const updater = alias(user, 'updater');

const columns = {
  sheet,
  creator: { id: creator.id, name: creator.name },
  updater: { id: updater.id, name: updater.name },
};

type Row = {
  sheet: typeof sheet.$inferSelect;
  creator: { id: string; name: string } | null;
  updater: { id: string; name: string } | null;
};

function toSummary(row: Row): SheetSummary {
  return {
    id: row.sheet.id,
    projectId: row.sheet.projectId,
    name: row.sheet.name,
    createdAt: row.sheet.createdAt.toISOString(),
    updatedAt: row.sheet.updatedAt.toISOString(),
    createdBy: row.creator,
    updatedBy: row.updater,
  };
}

function selectSheets(db: Database) {
  return db
    .select(columns)
    .from(sheet)
    .leftJoin(creator, eq(creator.id, sheet.createdBy))
    .leftJoin(updater, eq(updater.id, sheet.updatedBy));
}

export async function listSheets(db: Database, projectId: string): Promise<SheetSummary[]> {
  const rows = await selectSheets(db).where(eq(sheet.projectId, projectId)).orderBy(asc(sheet.createdAt), asc(sheet.name));
  return rows.map(toSummary);
}

export async function getSheet(db: Database, sheetId: string): Promise<SheetSummary | null> {
  const rows = await selectSheets(db).where(eq(sheet.id, sheetId)).limit(1);
  return rows[0] ? toSummary(rows[0]) : null;
}

export async function createSheet(db: Database, projectId: string, userId: string, name: string): Promise<string> {
  return db.transaction(async (tx) => {
    const [created] = await tx
      .insert(sheet)
      .values({ projectId, name, createdBy: userId, updatedBy: userId })
      .returning({ id: sheet.id });
    await tx.update(project).set({ updatedAt: new Date() }).where(eq(project.id, projectId));
    return created.id;
  });
}

export async function renameSheet(db: Database, sheetId: string, userId: string, name: string) {
  await db.update(sheet).set({ name, updatedBy: userId, updatedAt: new Date() }).where(eq(sheet.id, sheetId));
}

export async function deleteSheet(db: Database, sheetId: string) {
  await db.delete(sheet).where(eq(sheet.id, sheetId));
}
