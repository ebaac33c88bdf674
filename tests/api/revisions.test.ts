// Revisions and reviews for owner, editor, viewer, a guest through a viewer link, an outsider and no session; a
// revision stays as issued while the sheet changes; hash and solver version; compare; restore; review e-mails.
// (Role rules: PRODUCT.md "Collaboration and sharing" and issue 8; status codes: common practice.)
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SOLVER_VERSION } from '../../solver';
import { canonicalJson } from '../../server/revisions/input-hash';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';
import { TestClient } from '../support/http-client';
import { connectSheet, eventually } from '../support/sync-client';

let f: SyncFixture;
let token: string;
let guest: TestClient;
const farm = JSON.parse(readFileSync(path.resolve(__dirname, '../../solver/fixtures/farm.json'), 'utf8'));
const put = (c: TestClient, sheetId: string, doc: unknown) => c.request('PUT', `/api/sheets/${sheetId}/document`, doc);
const base = () => `/api/sheets/${f.sheetId}/revisions`;
const viaLink = () => `/api/view/${token}/revisions`;
const sha256 = (s: string) => createHash('sha256').update(s, 'utf8').digest('hex');

beforeAll(async () => {
  f = await syncFixture('rev');
  expect((await put(f.owner, f.sheetId, farm)).status).toBe(200);
  token = (await f.owner.post(`/api/sheets/${f.sheetId}/links`, { label: 'Inspector' })).body.token;
  guest = new TestClient(f.server.url);
  expect((await guest.post('/api/auth/sign-in/anonymous', {})).status).toBe(200);
  expect((await guest.post('/api/auth/update-user', { name: 'Sam from the county' })).status).toBe(200);
});
afterAll(() => f?.server.stop());

describe('who may do what', () => {
  it('editors and owners issue; viewers, guests, outsiders and no session cannot', async () => {
    const nobody = new TestClient(f.server.url);
    const refused: [string, TestClient, string, number][] = [
      ['viewer', f.viewer, base(), 403],
      ['outsider', f.outsider, base(), 404],
      ['no session', nobody, base(), 401],
      ['guest on the member route', guest, base(), 403],
      ['guest through the link', guest, viaLink(), 403],
      ['no session through the link', nobody, viaLink(), 403],
    ];
    for (const [who, c, url, status] of refused) {
      const r = await c.post(url, { note: who });
      expect({ who, status: r.status }).toEqual({ who, status });
    }
    expect((await f.owner.get(base())).body.revisions).toHaveLength(0);
    const byOwner = await f.owner.post(base(), { note: 'Issued for the inspection' });
    expect(byOwner.status, JSON.stringify(byOwner.body)).toBe(201);
    expect(byOwner.body.revision).toMatchObject({ number: 1, note: 'Issued for the inspection', status: 'issued', issuedBy: { name: 'Owner rev' } });
    const byEditor = await f.editor.post(base(), {});
    expect(byEditor.status).toBe(201);
    expect(byEditor.body.revision.number).toBe(2);
  });

  it('members and link holders read; outsiders get 404 and no session 401', async () => {
    for (const [who, c, url] of [['owner', f.owner, base()], ['editor', f.editor, base()], ['viewer', f.viewer, base()], ['guest', guest, viaLink()], ['no session', new TestClient(f.server.url), viaLink()]] as const) {
      const list = await c.get(url);
      expect({ who, status: list.status }).toEqual({ who, status: 200 });
      expect(list.body.revisions.map((r: any) => r.number)).toEqual([2, 1]);
      const one = await c.get(`${url}/1`);
      expect({ who, status: one.status }).toEqual({ who, status: 200 });
      expect(one.body.revision.document.name).toBe('Service'); // the sheet list's name, not the imported file's
    }
    expect((await f.outsider.get(base())).status).toBe(404);
    expect((await f.outsider.get(`${base()}/1`)).status).toBe(404);
    expect((await new TestClient(f.server.url).get(base())).status).toBe(401);
    expect((await guest.get(base())).status).toBe(403);
  });

  it('exports: members and link holders download, outsiders get 404 and no session 401', async () => {
    const nobody = new TestClient(f.server.url);
    for (const [who, c, url, status] of [
      ['viewer, live drawing', f.viewer, `/api/sheets/${f.sheetId}/export/drawing.svg`, 200],
      ['viewer, revision CSV', f.viewer, `${base()}/1/export/results.csv`, 200],
      ['no session through the link, revision CSV', nobody, `${viaLink()}/1/export/results.csv`, 200],
      ['guest through the link, revision drawing', guest, `${viaLink()}/1/export/drawing.svg`, 200],
      ['outsider, live drawing', f.outsider, `/api/sheets/${f.sheetId}/export/drawing.svg`, 404],
      ['outsider, revision CSV', f.outsider, `${base()}/1/export/results.csv`, 404],
      ['no session, live drawing', nobody, `/api/sheets/${f.sheetId}/export/drawing.svg`, 401],
      ['guest on the member route', guest, `${base()}/1/export/results.csv`, 403],
    ] as const) {
      const r = await c.get(url);
      expect({ who, status: r.status }).toEqual({ who, status });
    }
  });

  it('only an owner restores, and never through a link', async () => {
    for (const [who, c, url, status] of [
      ['editor', f.editor, base(), 403],
      ['viewer', f.viewer, base(), 403],
      ['outsider', f.outsider, base(), 404],
      ['no session', new TestClient(f.server.url), base(), 401],
      ['guest through the link', guest, viaLink(), 403],
    ] as const) {
      const r = await c.post(`${url}/1/restore`, {});
      expect({ who, status: r.status }).toEqual({ who, status });
    }
  });

  it('bad input names the field; a missing revision is 404', async () => {
    const long = await f.owner.post(base(), { note: 'x'.repeat(2001) });
    expect(long.status).toBe(400);
    expect(long.body.error.issues[0].path).toBe('body.note');
    const extra = await f.owner.post(base(), { note: 'ok', number: 7 });
    expect(extra.status).toBe(400);
    const verdict = await f.viewer.post(`${base()}/1/reviews`, { verdict: 'rubber-stamped' });
    expect(verdict.status).toBe(400);
    expect(verdict.body.error.issues[0]).toMatchObject({ path: 'body.verdict', message: 'verdict must be reviewed or approved' });
    const notNumber = await f.owner.get(`${base()}/first`);
    expect(notNumber.status).toBe(400);
    expect(notNumber.body.error.issues[0].path).toBe('params.number');
    const missing = await f.owner.get(`${base()}/99`);
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe('This sheet has no revision 99');
    expect((await f.owner.get(`${base()}/1/export/drawing.gif`)).status).toBe(400);
    expect((await f.owner.get(`${base()}`)).body.revisions).toHaveLength(2);
  });
});

describe('a revision is frozen', () => {
  it('records the hash of its canonical input and the solver version', async () => {
    const r1 = (await f.owner.get(`${base()}/1`)).body.revision;
    expect(r1.solverVersion).toBe(SOLVER_VERSION);
    expect(r1.inputHash).toMatch(/^[0-9a-f]{64}$/);
    expect(r1.inputHash).toBe(sha256(canonicalJson(r1.document)));
    // Canonical: key order does not change the hash.
    expect(canonicalJson({ b: 1, a: { d: [1, { z: 0, y: 1 }], c: 'x' } })).toBe('{"a":{"c":"x","d":[1,{"y":1,"z":0}]},"b":1}');
    const results = (await f.owner.get(`${base()}/1/results`)).body.results;
    expect(results.solverVersion).toBe(SOLVER_VERSION);
    expect(results.base.ok).toBe(true);
    expect(results.whatIfs.map((w: any) => w.name)).toEqual(Object.values(farm.whatIfs).map((w: any) => w.name));
    expect(r1.cases).toHaveLength(1 + Object.keys(farm.whatIfs).length);
  });

  it('does not change when the sheet is edited, and compare names what changed', async () => {
    const before = (await f.owner.get(`${base()}/1`)).body.revision;
    const beforeResults = (await f.owner.get(`${base()}/1/results`)).body.results;
    const live = (await f.owner.get(`/api/sheets/${f.sheetId}/document`)).body;
    const loadId = Object.keys(live.elements).find((id) => live.elements[id].kind === 'load' && live.elements[id].givenAs !== 'amperes')!;
    live.elements[loadId].kw = live.elements[loadId].kw * 3 + 2;
    live.elements.spare = { kind: 'electrode', id: 'spare', name: 'Spare rod', ohms: 40, x: 0, y: 0 };
    expect((await put(f.editor, f.sheetId, live)).status).toBe(200);

    const after = (await f.owner.get(`${base()}/1`)).body.revision;
    expect(after.document).toEqual(before.document);
    expect(after.inputHash).toBe(before.inputHash);
    expect((await f.owner.get(`${base()}/1/results`)).body.results).toEqual(beforeResults);

    const cmp = await f.viewer.get(`${base()}/1/compare`);
    expect(cmp.status).toBe(200);
    const c = cmp.body.comparison;
    expect(c.identical).toBe(false);
    expect(c.elements.added).toEqual([{ id: 'spare', name: 'Spare rod', kind: 'electrode' }]);
    expect(c.elements.removed).toEqual([]);
    expect(c.elements.changed).toEqual([expect.objectContaining({ id: loadId, fields: ['kw'] })]);
    // More load means more drop: the load's own voltage falls (common practice, no source).
    const own = c.voltages.find((v: any) => v.elementId === loadId);
    expect(own).toBeDefined();
    expect(own.changeVolts).toBeLessThan(-0.05);
    expect(Math.abs(c.voltages[0].changeVolts ?? Infinity)).toBeGreaterThanOrEqual(Math.abs(c.voltages[c.voltages.length - 1].changeVolts ?? 0));

    const r3 = await f.editor.post(base(), { note: 'After the load change' });
    expect(r3.body.revision.number).toBe(3);
    expect(r3.body.revision.inputHash).not.toBe(before.inputHash);
    // Two issued at once get the next two numbers, and the same sheet gives the same hash.
    const both = await Promise.all([f.editor.post(base(), { note: 'twin a' }), f.owner.post(base(), { note: 'twin b' })]);
    expect(both.map((b) => b.status)).toEqual([201, 201]);
    expect(both.map((b) => b.body.revision.number).sort()).toEqual([4, 5]);
    expect(both[0].body.revision.inputHash).toBe(r3.body.revision.inputHash);
    expect(both[1].body.revision.inputHash).toBe(r3.body.revision.inputHash);
  });

  it('an owner restores it as a new edit in the room', async () => {
    // Someone on the sheet sees the restore arrive as an edit.
    const peer = connectSheet(f.editor, f.sheetId);
    await peer.synced();
    const elements = peer.doc.getMap('elements');
    expect(elements.has('spare')).toBe(true);
    const r = await f.owner.post(`${base()}/1/restore`, {});
    expect(r.status, JSON.stringify(r.body)).toBe(200);
    expect(r.body.restoredFrom).toBe(1);
    const live = (await f.owner.get(`/api/sheets/${f.sheetId}/document`)).body;
    const r1 = (await f.owner.get(`${base()}/1`)).body.revision;
    expect(canonicalJson(live)).toBe(canonicalJson(r1.document));
    expect(live.elements.spare).toBeUndefined();
    await eventually(() => !elements.has('spare'), 'the restore to reach the connected editor');
    peer.destroy();
    const cmp = (await f.owner.get(`${base()}/1/compare`)).body.comparison;
    expect(cmp).toMatchObject({ identical: true, elements: { added: [], removed: [], changed: [] }, voltages: [] });
    // The restore is an edit, not a rewrite of history: revision 3 still holds the changed sheet.
    expect((await f.owner.get(`${base()}/3`)).body.revision.document.elements.spare).toMatchObject({ name: 'Spare rod' });
    expect((await f.owner.get(base())).body.revisions.map((r: any) => r.number)).toEqual([5, 4, 3, 2, 1]);
  });
});

describe('reviews', () => {
  it('any member or a guest through the link reviews; owners get an e-mail', async () => {
    const byViewer = await f.viewer.post(`${base()}/1/reviews`, { verdict: 'approved', comment: 'Neutral sizing checked against the schedule.' });
    expect(byViewer.status, JSON.stringify(byViewer.body)).toBe(201);
    expect(byViewer.body.revision.status).toBe('approved');
    const byEditor = await f.editor.post(`${base()}/2/reviews`, { verdict: 'reviewed' });
    expect(byEditor.status).toBe(201);
    expect(byEditor.body.revision.status).toBe('reviewed');
    const byGuest = await guest.post(`${viaLink()}/2/reviews`, { verdict: 'reviewed', comment: 'Seen on site.' });
    expect(byGuest.status).toBe(201);
    expect(byGuest.body.review.reviewer).toMatchObject({ name: 'Sam from the county', viaLink: true });
    expect((await new TestClient(f.server.url).post(`${viaLink()}/2/reviews`, { verdict: 'approved' })).status).toBe(401);
    expect((await f.outsider.post(`${base()}/2/reviews`, { verdict: 'approved' })).status).toBe(404);
    expect((await new TestClient(f.server.url).post(`${base()}/2/reviews`, { verdict: 'approved' })).status).toBe(401);

    const listed = (await f.owner.get(base())).body.revisions;
    expect(listed.find((r: any) => r.number === 2).reviews.map((r: any) => r.reviewer.name)).toEqual(['Editor rev', 'Sam from the county']);

    let mail: any[] = [];
    for (let i = 0; i < 50; i++) {
      mail = (await new TestClient(f.server.url).get('/api/outbox')).body.messages.filter((m: any) => /revision/.test(m.subject));
      if (mail.length >= 3) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    expect(mail).toHaveLength(3);
    for (const m of mail) expect(m.to).toEqual(['owner-rev@example.com']);
    const approved = mail.find((m) => m.subject === 'Viewer rev approved revision 1 of Service');
    expect(approved?.text).toContain('Neutral sizing checked against the schedule.');
    expect(mail.find((m) => /Sam from the county marked as reviewed revision 2/.test(m.subject))?.text).toContain('through a viewer link');
    // An owner reviewing is not told about their own review.
    await f.owner.post(`${base()}/1/reviews`, { verdict: 'reviewed' });
    await new Promise((r) => setTimeout(r, 300));
    expect((await new TestClient(f.server.url).get('/api/outbox')).body.messages.filter((m: any) => /revision/.test(m.subject))).toHaveLength(3);
  });
});
