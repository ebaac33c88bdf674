// Compaction: a room folds its stored updates into a snapshot when they outweigh it, so a busy sheet rewrites
// itself a few times rather than every N updates; a reload from snapshot + the remaining updates equals the
// live document, and unloading leaves the snapshot alone.
import { afterAll, beforeAll, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import * as Y from 'yjs';
import { sheetSnapshot, sheetUpdate } from '../../db/schema';
import { createDocumentStore, type DocumentStore } from '../../server/sync/document-store';
import { Room } from '../../server/sync/room';
import { SheetCommands } from '../../editor/document/commands';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

let server: TestServer;
let sheetId: string;
beforeAll(async () => {
  server = await startTestServer();
  const owner = new TestClient(server.url);
  await owner.signUp('compaction@example.com');
  const projectId = (await owner.post('/api/projects', { name: 'Compaction' })).body.project.id;
  sheetId = (await owner.post(`/api/projects/${projectId}/sheets`, { name: 'Busy' })).body.sheet.id;
});
afterAll(() => server?.stop());

it('compacts when the updates outweigh the snapshot, and reloads to the same document', async () => {
  const db = server.database.db;
  const real = createDocumentStore(db);
  let compactions = 0;
  const store: DocumentStore = { ...real, compact: (...args) => (compactions++, real.compact(...args)) };
  const room = await Room.load(sheetId, store, { compactEvery: 10 });
  const edits = 300;
  for (let i = 0; i < edits; i++) {
    await room.transact((doc) => new SheetCommands(doc, {}).addElement({ kind: 'bus', id: `bus-${i}`, name: `Panel ${i}`, x: i, y: 0 }), null);
  }
  // Every 10 updates would be 30 rewrites; growing with the document it is a handful (about one per doubling).
  expect(compactions).toBeGreaterThanOrEqual(2);
  expect(compactions).toBeLessThan(12);
  const [{ n: left }] = await db.select({ n: count() }).from(sheetUpdate).where(eq(sheetUpdate.sheetId, sheetId));
  expect(left).toBeLessThan(edits);
  const [snap] = await db.select().from(sheetSnapshot).where(eq(sheetSnapshot.sheetId, sheetId));
  expect(snap).toBeDefined();

  const reloaded = await Room.load(sheetId, real);
  expect([...reloaded.doc.getMap('elements').keys()].sort()).toEqual([...room.doc.getMap('elements').keys()].sort());
  expect(Y.encodeStateVector(reloaded.doc)).toEqual(Y.encodeStateVector(room.doc));
  reloaded.destroy();

  // Unloading compacts whatever is left, whatever its weight.
  await room.compact();
  const [{ n: after }] = await db.select({ n: count() }).from(sheetUpdate).where(eq(sheetUpdate.sheetId, sheetId));
  expect(after).toBe(0);
  room.destroy();
}, 60_000);
