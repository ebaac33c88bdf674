// The editor's crew over a real room: a member with the sheet open in two tabs is one person in the crew with two
// cursors, and two unsigned visitors through a viewer link are two people.
import WebSocket from 'ws';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SheetSession } from '../../editor/session/sheet-session';
import { connectSheet, eventually } from '../support/sync-client';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';

let f: SyncFixture;
const open: { destroy(): void }[] = [];
beforeAll(async () => {
  // The session uses the browser's WebSocket; Node 20 has none of its own.
  (globalThis as { WebSocket?: unknown }).WebSocket ??= WebSocket;
  f = await syncFixture('crewtabs');
});
afterAll(async () => {
  for (const x of open.splice(0)) x.destroy();
  await f?.server.stop();
});

function visitor(token: string) {
  const session = new SheetSession({ sheetId: f.sheetId, wsBase: f.server.url.replace(/^http/, 'ws'), editable: false, user: { id: 'visitor', name: 'Visitor' }, viewLink: token, solveMode: 'main' });
  open.push(session);
  session.connect();
  return session;
}

describe('the crew of a session', () => {
  it('lists a member with two tabs once (both cursors drawn) and each unsigned visitor on their own', async () => {
    const link = await f.owner.post(`/api/sheets/${f.sheetId}/links`, { label: 'crew tabs' });
    expect(link.status).toBe(201);
    const first = visitor(link.body.token);
    const second = visitor(link.body.token);
    const tabs = [connectSheet(f.owner, f.sheetId), connectSheet(f.owner, f.sheetId)];
    open.push(...tabs);
    tabs.forEach((t, i) => t.provider.awareness.setLocalStateField('cursor', { x: 100 * (i + 1), y: 0 }));

    await eventually(() => first.crew.get().members.length === 4, 'four tabs in the first visitor’s crew');
    const { members, people } = first.crew.get();
    const owner = people.filter((p) => p.userId === f.ids.owner);
    expect(owner).toHaveLength(1);
    expect(owner[0].tabs).toBe(2);
    expect(members.filter((m) => m.userId === f.ids.owner && m.cursor).map((m) => m.cursor!.x).sort()).toEqual([100, 200]);
    // This visitor first, then the owner and the other visitor: three people.
    expect(people).toHaveLength(3);
    expect(people[0].self).toBe(true);
    const otherVisitor = people.filter((p) => !p.self && p.userId !== f.ids.owner);
    expect(otherVisitor).toHaveLength(1);
    expect(otherVisitor[0].userId).toMatch(/^visitor-/);
    await eventually(() => second.crew.get().people.length === 3, 'three people in the second visitor’s crew');
  });
});
