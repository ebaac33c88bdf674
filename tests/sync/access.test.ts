// Who may sync a sheet and what the server lets through. (The rules are ARCHITECTURE.md's "Sync" section.)
import WebSocket from 'ws';
import * as Y from 'yjs';
import * as encoding from 'lib0/encoding';
import * as syncProtocol from 'y-protocols/sync';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { connectSheet, cookieWebSocket, eventually } from '../support/sync-client';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';

let f: SyncFixture;
beforeAll(async () => {
  f = await syncFixture('access');
});
afterAll(() => f?.server.stop());

/** Opens a raw socket and reports how the upgrade ended: the HTTP status, or 101 when it succeeded. */
function upgradeStatus(url: string, cookie?: string): Promise<number> {
  return new Promise((resolve) => {
    const Ws = cookie ? cookieWebSocket(cookie) : WebSocket;
    const ws = new Ws(url);
    ws.on('unexpected-response', (_req, res) => {
      resolve(res.statusCode ?? 0);
      ws.terminate();
    });
    ws.on('open', () => {
      resolve(101);
      ws.close();
    });
    ws.on('error', () => {});
  });
}

function craftedUpdate(step: 'step2' | 'update', key: string): Uint8Array {
  const scratch = new Y.Doc();
  scratch.getMap('elements').set(key, 'forged');
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, 0);
  if (step === 'step2') syncProtocol.writeSyncStep2(e, scratch);
  else syncProtocol.writeUpdate(e, Y.encodeStateAsUpdate(scratch));
  return encoding.toUint8Array(e);
}

const wsUrl = () => f.server.url.replace(/^http/, 'ws') + `/sync/${f.sheetId}`;

describe('the upgrade', () => {
  it('is refused with 401 without a session', async () => {
    expect(await upgradeStatus(wsUrl())).toBe(401);
  });
  it('is refused with 404 for a non-member and for a sheet that does not exist', async () => {
    expect(await upgradeStatus(wsUrl(), f.outsider.cookieHeader())).toBe(404);
    const missing = f.server.url.replace(/^http/, 'ws') + '/sync/00000000-0000-4000-8000-000000000000';
    expect(await upgradeStatus(missing, f.owner.cookieHeader())).toBe(404);
    expect(await upgradeStatus(f.server.url.replace(/^http/, 'ws') + '/sync/not-a-uuid', f.owner.cookieHeader())).toBe(404);
  });
  it('is accepted for every member', async () => {
    for (const c of [f.owner, f.editor, f.viewer]) expect(await upgradeStatus(wsUrl(), c.cookieHeader())).toBe(101);
  });
});

describe('a viewer', () => {
  it('receives the editors’ changes live but its own updates never reach anyone or the database', async () => {
    const owner = connectSheet(f.owner, f.sheetId);
    const viewer = connectSheet(f.viewer, f.sheetId);
    await Promise.all([owner.synced(), viewer.synced()]);

    owner.doc.getMap('elements').set('from-owner', 1);
    await eventually(() => viewer.doc.getMap('elements').get('from-owner') === 1, 'owner edit at the viewer');

    // The viewer's own provider sends its local edit as an update; a hand-made socket sends step 2 and update.
    viewer.doc.getMap('elements').set('viewer-local', 1);
    const raw = new (cookieWebSocket(f.viewer.cookieHeader()))(wsUrl());
    await new Promise((r) => raw.once('open', r));
    raw.send(craftedUpdate('step2', 'forged-step2'));
    raw.send(craftedUpdate('update', 'forged-update'));
    // A marker through awareness from the same socket: once the owner sees it, the server has read the messages before it.
    viewer.provider.awareness.setLocalStateField('cursor', { x: 1, y: 2 });
    await eventually(
      () => [...owner.provider.awareness.getStates().values()].some((s: any) => s.cursor?.x === 1),
      'viewer awareness at the owner',
    );
    await new Promise((r) => setTimeout(r, 200));
    const ownerKeys = [...owner.doc.getMap('elements').keys()];
    expect(ownerKeys).toContain('from-owner');
    expect(ownerKeys).not.toContain('viewer-local');
    expect(ownerKeys).not.toContain('forged-step2');
    expect(ownerKeys).not.toContain('forged-update');
    const stored = await f.owner.get(`/api/sheets/${f.sheetId}/document`);
    expect(Object.keys(stored.body.elements)).toEqual(['from-owner']);
    expect(f.server.logs.some((l) => /dropped an update from read-only/.test(l))).toBe(true);
    raw.close();
    owner.destroy();
    viewer.destroy();
  });

  it('is not logged for the sync reply every reader sends, on joining and on coming back, but a real write is', async () => {
    const readOnlyLines = (from: number) => f.server.logs.slice(from).filter((l) => /dropped an update from read-only/.test(l));
    /**
     * Once the owner sees this cursor from `c`, the server has read everything `c` sent before it. It is published
     * until seen: after a reconnect the room holds a higher awareness clock for `c` (its removal) than `c` sends.
     */
    const marker = async (c: ReturnType<typeof connectSheet>, x: number) => {
      const seen = () => (owner.provider.awareness.getStates().get(c.doc.clientID) as any)?.cursor?.x === x;
      for (let i = 0; i < 100 && !seen(); i++) {
        c.provider.awareness.setLocalStateField('cursor', { x, y: i });
        await new Promise((r) => setTimeout(r, 100));
      }
      expect(seen(), `marker ${x}`).toBe(true);
    };
    const from = f.server.logs.length;
    const owner = connectSheet(f.owner, f.sheetId);
    await owner.synced();
    const viewer = connectSheet(f.viewer, f.sheetId);
    await viewer.synced();
    await marker(viewer, 101);
    expect(readOnlyLines(from)).toEqual([]);

    // Something deleted that the viewer saw: coming back, its reply carries that delete set (the room's own).
    owner.doc.getMap('elements').set('short-lived', 1);
    owner.doc.getMap('elements').delete('short-lived');
    owner.doc.getMap('elements').set('after-delete', 1);
    await eventually(() => viewer.doc.getMap('elements').get('after-delete') === 1, 'the owner’s edits at the viewer');
    expect(Y.decodeUpdate(Y.encodeStateAsUpdate(viewer.doc, Y.encodeStateVector(viewer.doc))).ds.clients.size).toBeGreaterThan(0);
    viewer.provider.disconnect();
    await eventually(() => !viewer.provider.wsconnected, 'the viewer gone');
    viewer.provider.connect();
    await viewer.synced();
    await marker(viewer, 102);
    expect(readOnlyLines(from)).toEqual([]);

    // A reader's own edit is a write attempt: dropped and logged as before.
    viewer.doc.getMap('elements').set('viewer-write', 1);
    await marker(viewer, 103);
    expect(readOnlyLines(from)).toHaveLength(1);
    expect(owner.doc.getMap('elements').has('viewer-write')).toBe(false);
    owner.destroy();
    viewer.destroy();
  });

  it('cannot claim another name or move someone else’s cursor through awareness', async () => {
    const owner = connectSheet(f.owner, f.sheetId);
    const viewer = connectSheet(f.viewer, f.sheetId);
    await Promise.all([owner.synced(), viewer.synced()]);
    owner.provider.awareness.setLocalStateField('cursor', { x: 10, y: 10 });
    viewer.provider.awareness.setLocalState({ user: { id: f.ids.owner, name: 'Owner access' }, cursor: { x: 5, y: 5 } });
    await eventually(() => owner.provider.awareness.getStates().has(viewer.doc.clientID), 'viewer state at owner');
    const seen = owner.provider.awareness.getStates().get(viewer.doc.clientID) as any;
    expect(seen.user).toEqual({ id: f.ids.viewer, name: 'Viewer access', readOnly: true });

    // Forge an awareness entry for the owner's client id from the viewer's socket.
    const { encodeAwarenessUpdate, Awareness } = await import('y-protocols/awareness');
    const fake = new Awareness(new Y.Doc({ guid: 'x' }));
    const ownerId = owner.doc.clientID;
    fake.states.set(ownerId, { cursor: { x: 999, y: 999 } });
    fake.meta.set(ownerId, { clock: 1000, lastUpdated: Date.now() });
    const e = encoding.createEncoder();
    encoding.writeVarUint(e, 1);
    encoding.writeVarUint8Array(e, encodeAwarenessUpdate(fake, [ownerId]));
    (viewer.provider.ws as unknown as WebSocket).send(encoding.toUint8Array(e));
    viewer.provider.awareness.setLocalStateField('cursor', { x: 6, y: 6 });
    await eventually(() => (owner.provider.awareness.getStates().get(viewer.doc.clientID) as any)?.cursor?.x === 6, 'marker');
    expect((viewer.provider.awareness.getStates().get(ownerId) as any)?.cursor).toEqual({ x: 10, y: 10 });
    owner.destroy();
    viewer.destroy();
    fake.destroy();
  });
});

describe('membership changes reach open sockets', () => {
  it('a demoted editor’s writes are dropped from then on', async () => {
    const owner = connectSheet(f.owner, f.sheetId);
    const editor = connectSheet(f.editor, f.sheetId);
    await Promise.all([owner.synced(), editor.synced()]);
    editor.doc.getMap('elements').set('before-demotion', 1);
    await eventually(() => owner.doc.getMap('elements').has('before-demotion'), 'edit before demotion');
    expect((await f.owner.patch(`/api/projects/${f.projectId}/members/${f.ids.editor}`, { role: 'viewer' })).status).toBe(200);
    editor.doc.getMap('elements').set('after-demotion', 1);
    editor.provider.awareness.setLocalStateField('cursor', { x: 3, y: 3 });
    await eventually(() => (owner.provider.awareness.getStates().get(editor.doc.clientID) as any)?.cursor?.x === 3, 'marker');
    await new Promise((r) => setTimeout(r, 200));
    expect(owner.doc.getMap('elements').has('after-demotion')).toBe(false);
    expect((await f.owner.get(`/api/sheets/${f.sheetId}/document`)).body.elements['after-demotion']).toBeUndefined();
    await f.owner.patch(`/api/projects/${f.projectId}/members/${f.ids.editor}`, { role: 'editor' });
    owner.destroy();
    editor.destroy();
  });

  it('a removed member’s socket is closed at once and cannot reconnect', async () => {
    const editor = connectSheet(f.editor, f.sheetId);
    await editor.synced();
    const closed = new Promise<number>((resolve) => (editor.provider.ws as unknown as WebSocket).addEventListener('close', (e: any) => resolve(e.code)));
    expect((await f.owner.delete(`/api/projects/${f.projectId}/members/${f.ids.editor}`)).status).toBe(204);
    expect(await closed).toBe(4403);
    editor.destroy();
    expect(await upgradeStatus(wsUrl(), f.editor.cookieHeader())).toBe(404);
  });

  it('the last owner cannot be demoted or removed', async () => {
    const demote = await f.owner.patch(`/api/projects/${f.projectId}/members/${f.ids.owner}`, { role: 'editor' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.message).toMatch(/at least one owner/);
    expect((await f.owner.delete(`/api/projects/${f.projectId}/members/${f.ids.owner}`)).status).toBe(409);
    expect((await f.viewer.patch(`/api/projects/${f.projectId}/members/${f.ids.viewer}`, { role: 'owner' })).status).toBe(403);
  });
});
