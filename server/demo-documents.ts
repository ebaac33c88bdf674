// Writes the demo sheets' drawings (solver/fixtures) into their documents, through each sheet's room like an import.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { readSheet } from '../shared/sheet';
import { writeSheet } from '../editor/document/sheet-doc';
import type { RoomRegistry } from './sync/room-registry';

const fixtures = path.resolve(__dirname, '../solver/fixtures');

export async function seedDemoDocuments(rooms: RoomRegistry, sheets: { id: string; fixture: string }[], ownerId: string | null) {
  for (const s of sheets) {
    const read = readSheet(JSON.parse(readFileSync(path.join(fixtures, s.fixture), 'utf8')));
    if (!read.ok) throw new Error(`demo fixture ${s.fixture} is not a valid sheet: ${read.issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`);
    await rooms.withRoom(s.id, (room) => room.transact((doc) => writeSheet(doc, read.sheet), ownerId));
  }
}
