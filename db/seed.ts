// Demo data for an empty database: three demo users (owner, editor, viewer) and the invented "Larkspur Row" project.
// Passwords are hashed by better-auth; the caller passes its sign-up function so db/ stays free of server code.
import { count } from 'drizzle-orm';
import type { Database } from './client';
import { pin, project, projectMember, sheet, user } from './schema';

export const DEMO_PASSWORD = 'larkspur-demo-2026';

export const DEMO_USERS = [
  { email: 'owner@example.com', name: 'Rosa Almeida', role: 'owner' },
  { email: 'editor@example.com', name: 'Dev Okafor', role: 'editor' },
  { email: 'viewer@example.com', name: 'Ines Marlow', role: 'viewer' },
] as const;

/** A pin on a demo sheet: on an element of its fixture (at that element's place on the drawing), by a demo user. */
export interface DemoPin {
  elementId: string;
  x: number;
  y: number;
  author: (typeof DEMO_USERS)[number]['email'];
  body: string;
}

/** Each demo sheet's name, the fixture (solver/fixtures) that holds its drawing, and its pins. */
export const DEMO_SHEETS: readonly { name: string; fixture: string; pins: readonly DemoPin[] }[] = [
  {
    name: 'Building distribution',
    fixture: 'larkspur-row.json',
    pins: [
      {
        elementId: 'apt-4-feeder',
        x: 480,
        y: 860,
        author: 'editor@example.com',
        body: 'Apartment 4 reports lights flaring when the range is on. Compare with the what-if “Open neutral on the apartment 4 feeder” and check this feeder’s neutral at both ends.',
      },
      {
        elementId: 'cafe-panel',
        x: -800,
        y: 980,
        author: 'owner@example.com',
        body: 'Before the café adds a second espresso machine: see the panel schedule (phase B carries the most) and the fault what-if against the 10 kA rating.',
      },
    ],
  },
  {
    name: 'Farm service, 120/240 V',
    fixture: 'farm.json',
    pins: [
      {
        elementId: 'service-drop',
        x: 0,
        y: 600,
        author: 'viewer@example.com',
        body: 'The owner says the house lights dim and the barn lights brighten when the well pump runs. Is it the drop’s neutral splice?',
      },
    ],
  },
];

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
    const pins = rows.flatMap((r) =>
      DEMO_SHEETS.find((s) => s.name === r.name)!.pins.map((p, i) => ({
        sheetId: r.id,
        number: i + 1,
        elementId: p.elementId,
        x: p.x,
        y: p.y,
        authorId: ids[p.author],
        body: p.body,
      })),
    );
    if (pins.length) await tx.insert(pin).values(pins);
    return rows.map((r) => ({ id: r.id, fixture: DEMO_SHEETS.find((s) => s.name === r.name)!.fixture }));
  });
  return { users: DEMO_USERS.map((u) => ({ email: u.email, role: u.role })), sheets };
}
