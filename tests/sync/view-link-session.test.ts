// The editor's session opened through a viewer link, as the view page opens it: it receives the sheet and follows
// an editor's changes, cannot change the room's document, and ends for good (close code 4410, no reconnecting)
// when the owner revokes the link.
import WebSocket from 'ws';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SheetSession } from '../../editor/session/sheet-session';
import { writeSheet } from '../../editor/document/sheet-doc';
import { readSheet } from '../../shared/sheet';
import { connectSheet, eventually } from '../support/sync-client';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';
import { smallSystem } from '../editor/support/small-system';

let f: SyncFixture;
const open: { destroy(): void }[] = [];
beforeAll(async () => {
  // The session uses the browser's WebSocket; Node 20 has none of its own.
  (globalThis as { WebSocket?: unknown }).WebSocket ??= WebSocket;
  f = await syncFixture('viewlink');
});
afterAll(async () => {
  for (const x of open.splice(0)) x.destroy();
  await f?.server.stop();
});

async function newLink(): Promise<{ id: string; token: string }> {
  const r = await f.owner.post(`/api/sheets/${f.sheetId}/links`, { label: 'session test' });
  expect(r.status).toBe(201);
  return { id: r.body.link.id, token: r.body.token };
}

function linkSession(token: string) {
  const session = new SheetSession({
    sheetId: f.sheetId,
    wsBase: f.server.url.replace(/^http/, 'ws'),
    editable: false,
    user: { id: 'visitor', name: 'Visitor' },
    viewLink: token,
    solveMode: 'main',
  });
  open.push(session);
  session.connect();
  return session;
}

describe('a session through a viewer link', () => {
  it('follows an editor’s changes, keeps its own out of the room, and ends with 4410 when the link is revoked', async () => {
    const link = await newLink();
    const session = linkSession(link.token);
    await eventually(() => session.link.get().synced, 'the first copy of the sheet through the link');

    // An editor draws the small system: it arrives through the link.
    const editor = connectSheet(f.editor, f.sheetId);
    open.push(editor);
    await editor.synced();
    const read = readSheet(smallSystem());
    if (!read.ok) throw new Error('bad sheet');
    editor.doc.transact(() => writeSheet(editor.doc, read.sheet));
    await eventually(() => session.mirror.current.elements.size === 5, 'the editor’s five elements through the link');

    // A change made in the link's own document never reaches the room.
    session.doc.getMap('elements').set('forged', 'forged');
    await new Promise((r) => setTimeout(r, 300));
    expect(editor.doc.getMap('elements').has('forged')).toBe(false);

    expect((await f.owner.delete(`/api/sheets/${f.sheetId}/links/${link.id}`)).status).toBe(200);
    await eventually(() => session.link.get().ended !== null, 'the socket to be closed by the revocation');
    expect(session.link.get()).toMatchObject({ status: 'offline', ended: { code: 4410 } });
    // Final: no new connection is tried.
    await new Promise((r) => setTimeout(r, 600));
    expect(session.link.get().status).toBe('offline');
  });

  it('a member’s own session is not ended by a link being revoked', async () => {
    const link = await newLink();
    const member = connectSheet(f.viewer, f.sheetId);
    open.push(member);
    await member.synced();
    expect((await f.owner.delete(`/api/sheets/${f.sheetId}/links/${link.id}`)).status).toBe(200);
    await new Promise((r) => setTimeout(r, 300));
    expect(member.provider.wsconnected).toBe(true);
  });
});
