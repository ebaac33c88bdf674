// Writes the demo sheets' drawings (solver/fixtures) into their documents, through each sheet's room like an import,
// and issues a first revision of each.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { readSheet } from '../shared/sheet';
import { writeSheet } from '../editor/document/sheet-doc';
import { eq } from 'drizzle-orm';
import type { Database } from '../db/client';
import { user } from '../db/schema';
import { DEMO_USERS } from '../db/seed';
import { issueRevision } from './revisions/issue';
import type { RoomRegistry } from './sync/room-registry';
import type { WorkerPool } from './workers/worker-pool';

const fixtures = path.resolve(__dirname, '../solver/fixtures');

export async function seedDemoDocuments(rooms: RoomRegistry, sheets: { id: string; fixture: string }[], ownerId: string | null) {
  for (const s of sheets) {
    const read = readSheet(JSON.parse(readFileSync(path.join(fixtures, s.fixture), 'utf8')));
    if (!read.ok) throw new Error(`demo fixture ${s.fixture} is not a valid sheet: ${read.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    await rooms.withRoom(s.id, (room) => room.transact((doc) => writeSheet(doc, read.sheet), ownerId));
  }
}

/** Each demo sheet gets one issued revision by the demo owner, so that its report can be opened at once. */
export async function seedDemoRevisions(deps: { db: Database; rooms: RoomRegistry; workers: WorkerPool }, sheets: { id: string }[]) {
  const [owner] = await deps.db.select({ id: user.id, name: user.name }).from(user).where(eq(user.email, DEMO_USERS[0].email));
  if (!owner) return;
  for (const s of sheets) await issueRevision(deps, s.id, owner, DEMO_REVISION_NOTE);
}

export const DEMO_REVISION_NOTE = 'Issued for review: base case, what-ifs and fault study';
