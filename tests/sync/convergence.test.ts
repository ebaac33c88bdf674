// Seeded randomised co-editing: two and three Node clients (y-websocket over ws) apply random commands of the sheet
// model while dropping and regaining their connection; all replicas and the server's JSON view end up identical and
// pass the sheet schema. (Method: Yjs's own randomised tests, STYLE.md; convergence is the CRDT's promise.)
import * as prng from 'lib0/prng';
import * as Y from 'yjs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SheetCommands } from '../../editor/document/commands';
import { docToJson, readDoc } from '../../editor/document/sheet-doc';
import { connectSheet, eventually, type SyncClient } from '../support/sync-client';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';
import { randomCommand } from '../support/random-commands';
import type { TestClient } from '../support/http-client';

let f: SyncFixture;
beforeAll(async () => {
  f = await syncFixture('random');
});
afterAll(() => f?.server.stop());

const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function runSession(seed: number, people: TestClient[], steps: number) {
  const sheetId = (await f.owner.post(`/api/projects/${f.projectId}/sheets`, { name: `Random ${seed}` })).body.sheet.id;
  const gen = prng.create(seed);
  const clients: SyncClient[] = people.map((p) => connectSheet(p, sheetId));
  await Promise.all(clients.map((c) => c.synced()));
  const commands = clients.map((c) => new SheetCommands(c.doc, { client: c.doc.clientID }));
  const log: string[] = [];
  for (let step = 0; step < steps; step++) {
    const i = prng.int32(gen, 0, clients.length - 1);
    const c = clients[i];
    const r = prng.int32(gen, 0, 99);
    if (r < 6 && c.provider.wsconnected) {
      c.provider.disconnect();
      log.push(`${i} offline`);
    } else if (r < 14 && !c.provider.shouldConnect) {
      c.provider.connect();
      log.push(`${i} online`);
    } else {
      log.push(`${i} ${randomCommand(gen, commands[i], `s${seed}c${i}`, step)}`);
    }
    if (prng.int32(gen, 0, 9) === 0) await pause(prng.int32(gen, 0, 15));
  }
  for (const c of clients) if (!c.provider.shouldConnect) c.provider.connect();
  const sameState = () => {
    const first = Y.encodeStateVector(clients[0].doc).toString();
    return clients.every((c) => c.provider.synced && Y.encodeStateVector(c.doc).toString() === first);
  };
  await eventually(sameState, `replicas of seed ${seed} to converge`, 15_000);
  await pause(100);
  const views = clients.map((c) => docToJson(c.doc));
  for (const v of views.slice(1)) expect(v).toEqual(views[0]);
  const server = (await f.owner.get(`/api/sheets/${sheetId}/document`)).body;
  expect({ ...server, name: views[0].name || server.name }).toEqual({ ...views[0], name: views[0].name || server.name });
  const read = readDoc(clients[0].doc);
  expect(read.ok, JSON.stringify(read)).toBe(true);
  for (const c of clients) c.destroy();
  return { log, elements: Object.keys(views[0].elements as object).length };
}

describe('random co-editing converges', () => {
  for (const seed of [1, 2, 3]) {
    it(`two editors, seed ${seed}`, async () => {
      const { elements } = await runSession(seed, [f.owner, f.editor], 120);
      expect(elements).toBeGreaterThan(0);
    });
  }
  for (const seed of [11, 12]) {
    it(`three clients (two editors, one on two devices), seed ${seed}`, async () => {
      const { log } = await runSession(seed, [f.owner, f.editor, f.editor], 150);
      expect(log.some((l) => l.endsWith('offline'))).toBe(true);
    });
  }
});
