import { afterAll, beforeAll, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';
import { connectSheet, eventually } from '../support/sync-client';

let server: TestServer;
let a: TestClient;
let sheetId: string;
beforeAll(async () => {
  server = await startTestServer();
  a = new TestClient(server.url);
  await a.signUp('sync-a@example.com');
  const p = (await a.post('/api/projects', { name: 'Sync' })).body.project.id;
  sheetId = (await a.post(`/api/projects/${p}/sheets`, { name: 'S' })).body.sheet.id;
});
afterAll(() => server?.stop());

it('relays edits between two clients of the same user', async () => {
  const c1 = connectSheet(a, sheetId);
  const c2 = connectSheet(a, sheetId);
  await Promise.all([c1.synced(), c2.synced()]);
  c1.doc.getMap('elements').set('x', 1);
  await eventually(() => c2.doc.getMap('elements').get('x') === 1, 'relay');
  c1.destroy();
  c2.destroy();
});

it('gathers a burst of awareness changes into few messages, ending on the latest state', async () => {
  const c1 = connectSheet(a, sheetId);
  const c2 = connectSheet(a, sheetId);
  await Promise.all([c1.synced(), c2.synced()]);
  c1.provider.awareness.setLocalStateField('cursor', { x: 0, y: 0 });
  await eventually(() => (c2.provider.awareness.getStates().get(c1.doc.clientID) as any)?.cursor?.x === 0, 'first cursor');
  let changes = 0;
  c2.provider.awareness.on('change', ({ updated }: { updated: number[] }) => {
    if (updated.includes(c1.doc.clientID)) changes++;
  });
  // 20 cursor moves in one go: each is its own message from c1, relayed one by one they would be 20 changes at c2.
  for (let i = 1; i <= 20; i++) c1.provider.awareness.setLocalStateField('cursor', { x: i, y: i });
  await eventually(() => (c2.provider.awareness.getStates().get(c1.doc.clientID) as any)?.cursor?.x === 20, 'last cursor');
  expect(changes).toBeLessThanOrEqual(5);
  c1.destroy();
  c2.destroy();
});
