// Demo data for an empty database: three demo users (owner, editor, viewer) and the invented "Larkspur Row" project.
// Passwords are hashed by better-auth; the caller passes its sign-up function so db/ stays free of server code.
import { count } from 'drizzle-orm';
import type { Database } from './client';
import { project, projectMember, sheet, user } from './schema';

export const DEMO_PASSWORD = 'larkspur-demo-2026';

export const DEMO_USERS = [
  { email: 'owner@example.com', name: 'Rosa Almeida', role: 'owner' },
  { email: 'editor@example.com', name: 'Dev Okafor', role: 'editor' },
  { email: 'viewer@example.com', name: 'Ines Marlow', role: 'viewer' },
] as const;

/** Each demo sheet's name and the fixture (solver/fixtures) that holds its drawing. */
export const DEMO_SHEETS = [
  { name: 'Building distribution', fixture: 'larkspur-row.json' },
  { name: 'Farm service, 120/240 V', fixture: 'farm.json' },
] as const;

export const DEMO_PROJECT = {
  name: 'Larkspur Row',
  description:
    'Three-storey mixed-use building on a 150 kVA pad-mount transformer (12.47 kV delta to 208Y/120 V), ' +
    'with a house panel, a café panel and six apartment panels; and a small farm on a 25 kVA pole transformer.',
  sheets: DEMO_SHEETS.map((s) => s.name),
};

export type CreateUser = (input: { email: string; password: string; name: string }) => Promise<string>;

export async function isEmpty(db: Database): Promise<boolean> {
  const [row] = await db.select({ n: count() }).from(user);
  return (row?.n ?? 0) === 0;
}

export interface SeededDemo {
  users: { email: string; role: string }[];
  sheets: { id: string; fixture: string }[];
}

export async function seedDemo(db: Database, createUser: CreateUser): Promise<SeededDemo> {
  const ids: Record<string, string> = {};
  for (const u of DEMO_USERS) ids[u.email] = await createUser({ email: u.email, password: DEMO_PASSWORD, name: u.name });
  const ownerId = ids[DEMO_USERS[0].email];
  const sheets = await db.transaction(async (tx) => {
    const [p] = await tx
      .insert(project)
      .values({ name: DEMO_PROJECT.name, description: DEMO_PROJECT.description, createdBy: ownerId })
      .returning({ id: project.id });
    await tx.insert(projectMember).values(DEMO_USERS.map((u) => ({ projectId: p.id, userId: ids[u.email], role: u.role })));
    const rows = await tx
      .insert(sheet)
      .values(DEMO_SHEETS.map((s) => ({ projectId: p.id, name: s.name, createdBy: ownerId, updatedBy: ownerId })))
      .returning({ id: sheet.id, name: sheet.name });
    return rows.map((r) => ({ id: r.id, fixture: DEMO_SHEETS.find((s) => s.name === r.name)!.fixture }));
  });
  return { users: DEMO_USERS.map((u) => ({ email: u.email, role: u.role })), sheets };
}
