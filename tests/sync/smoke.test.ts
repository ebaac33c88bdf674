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
