// Durability: the server is killed with SIGKILL in the middle of a burst of edits; after a restart, every update
// that any client had received from it is in the reloaded document. (ARCHITECTURE.md: stored before relayed.)
import { rmSync } from 'node:fs';
import { afterAll, expect, it } from 'vitest';
import { SheetCommands } from '../../editor/document/commands';
import { freePort } from '../support/free-port';
import { freshDataDir } from '../support/test-server';
import { TestClient } from '../support/http-client';
import { connectSheet } from '../support/sync-client';
import { spawnServer, type ServerProcess } from '../support/server-process';

const dataDir = freshDataDir();
let running: ServerProcess | null = null;
afterAll(async () => {
  await running?.kill('SIGKILL');
  rmSync(dataDir, { recursive: true, force: true });
});

it('loses nothing a client saw relayed when the server is killed mid-burst', async () => {
  const port = await freePort();
  running = await spawnServer({ DATA_DIR: dataDir }, port);
  const writer = new TestClient(running.url);
  await writer.signUp('crash-writer@example.com');
  const projectId = (await writer.post('/api/projects', { name: 'Crash' })).body.project.id;
  const sheetId = (await writer.post(`/api/projects/${projectId}/sheets`, { name: 'Burst' })).body.sheet.id;

  const a = connectSheet(writer, sheetId);
  const b = connectSheet(writer, sheetId);
  await Promise.all([a.synced(), b.synced()]);
  // What b was shown by the server: keys that arrived through its provider.
  const seenByB = new Set<string>();
  b.doc.getMap('elements').observe((event) => {
    if (event.transaction.origin !== b.provider) return;
    for (const key of event.keysChanged) seenByB.add(key);
  });

  const cmd = new SheetCommands(a.doc, { writer: 'a' });
  let sent = 0;
  const killAt = 150;
  for (; sent < 400; sent++) {
    cmd.addElement({ kind: 'bus', id: `bus-${sent}`, name: `Panel ${sent}`, x: sent, y: 0 });
    if (sent % 10 === 0) await new Promise((r) => setTimeout(r, 2));
    if (sent === killAt) void running.kill('SIGKILL');
  }
  await new Promise((r) => setTimeout(r, 300));
  a.destroy();
  b.destroy();
  await running.kill('SIGKILL');
  expect(seenByB.size).toBeGreaterThan(0);

  running = await spawnServer({ DATA_DIR: dataDir }, port);
  const reader = new TestClient(running.url);
  expect((await reader.signIn('crash-writer@example.com')).status).toBe(200);
  const view = await reader.get(`/api/sheets/${sheetId}/document`);
  expect(view.status).toBe(200);
  const stored = new Set(Object.keys(view.body.elements));
  const missing = [...seenByB].filter((k) => !stored.has(k));
  expect(missing).toEqual([]);
  // The burst was really cut short: the killed server cannot have stored what was sent after it died.
  expect(stored.size).toBeLessThan(400);
  await running.kill('SIGTERM');
  running = null;
}, 120_000);
