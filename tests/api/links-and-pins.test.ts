// Viewer links and pins for owner, editor, viewer, a guest with a link, a guest with a revoked link, an outsider
// and no session. (The rules are PRODUCT.md's "Collaboration and sharing"; status codes are common practice.)
import WebSocket from 'ws';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';
import { TestClient } from '../support/http-client';
import { connectSheet, cookieWebSocket, eventually } from '../support/sync-client';

let f: SyncFixture;
let token: string;
let linkId: string;
const guest = () => new TestClient(f.server.url);

beforeAll(async () => {
  f = await syncFixture('links');
});
afterAll(() => f?.server.stop());

async function signInGuest(name: string) {
  const g = guest();
  const r = await g.post('/api/auth/sign-in/anonymous', {});
  expect(r.status, JSON.stringify(r.body)).toBe(200);
  expect((await g.post('/api/auth/update-user', { name })).status).toBe(200);
  return g;
}

describe('viewer links', () => {
  it('only an owner may make, list or revoke them', async () => {
    for (const [who, c, status] of [['editor', f.editor, 403], ['viewer', f.viewer, 403], ['outsider', f.outsider, 404], ['anonymous', guest(), 401]] as const) {
      const r = await c.post(`/api/sheets/${f.sheetId}/links`, { label: who });
      expect({ who, status: r.status }).toEqual({ who, status });
      expect({ who, status: (await c.get(`/api/sheets/${f.sheetId}/links`)).status }).toEqual({ who, status });
    }
    const made = await f.owner.post(`/api/sheets/${f.sheetId}/links`, { label: 'For the inspector', expiresInDays: 7 });
    expect(made.status).toBe(201);
    token = made.body.token;
    linkId = made.body.link.id;
    expect(token.length).toBeGreaterThanOrEqual(40);
    expect(made.body.url).toBe(`${f.server.url}/view/${token}`);
    const list = await f.owner.get(`/api/sheets/${f.sheetId}/links`);
    expect(list.body.links).toHaveLength(1);
    expect(JSON.stringify(list.body)).not.toContain(token);
    expect(list.body.links[0]).toMatchObject({ label: 'For the inspector', state: 'active' });
  });

  it('bad input names the field', async () => {
    const r = await f.owner.post(`/api/sheets/${f.sheetId}/links`, { expiresInDays: 0 });
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].path).toBe('body.expiresInDays');
  });

  it('opens the sheet without an account, read-only, and nothing else', async () => {
    const anon = guest();
    const view = await anon.get(`/api/view/${token}`);
    expect(view.status).toBe(200);
    expect(view.body.sheet).toEqual({ id: f.sheetId, name: 'Service' });
    expect(view.body.you).toBeNull();
    expect((await anon.get(`/api/view/${token}/document`)).body.formatVersion).toBe(1);
    expect((await anon.get(`/api/view/not-a-real-token-${'x'.repeat(30)}`)).status).toBe(404);
    // The link opens a socket that receives edits but cannot write.
    const editor = connectSheet(f.editor, f.sheetId);
    await editor.synced();
    const ws = new WebSocket(f.server.url.replace(/^http/, 'ws') + `/sync/${f.sheetId}?link=${token}`);
    await new Promise((r, j) => (ws.once('open', r), ws.once('error', j)));
    ws.close();
    editor.destroy();
  });

  it('a guest gives a name and may comment, but may not reach any project route', async () => {
    const g = await signInGuest('Pat from the county');
    expect((await g.get(`/api/view/${token}`)).body.you).toMatchObject({ name: 'Pat from the county', guest: true });
    const pin = await g.post(`/api/view/${token}/pins`, { body: 'Is the neutral here 1/0?', elementId: 'lamp', x: 10, y: 20 });
    expect(pin.status, JSON.stringify(pin.body)).toBe(201);
    expect(pin.body.pin).toMatchObject({ number: 1, author: { name: 'Pat from the county' }, elementId: 'lamp' });
    expect((await g.get('/api/projects')).status).toBe(403);
    expect((await g.get(`/api/sheets/${f.sheetId}`)).status).toBe(403);
    expect((await g.post('/api/projects', { name: 'Guest project' })).status).toBe(403);
    expect((await g.get(`/api/sheets/${f.sheetId}/pins`)).status).toBe(403);
    // Without a link, a guest's socket is refused like an outsider's.
    const status = await new Promise<number>((resolve) => {
      const ws = new (cookieWebSocket(g.cookieHeader()))(f.server.url.replace(/^http/, 'ws') + `/sync/${f.sheetId}`);
      ws.on('unexpected-response', (_q, res) => resolve(res.statusCode ?? 0));
      ws.on('open', () => resolve(101));
      ws.on('error', () => {});
    });
    expect(status).toBe(404);
  });

  it('someone without a session can read pins through the link but not write them', async () => {
    const anon = guest();
    expect((await anon.get(`/api/view/${token}/pins`)).body.pins).toHaveLength(1);
    expect((await anon.post(`/api/view/${token}/pins`, { body: 'anonymous' })).status).toBe(401);
  });

  it('revoking stops the link at once: requests get 410 and open sockets close', async () => {
    const ws = new WebSocket(f.server.url.replace(/^http/, 'ws') + `/sync/${f.sheetId}?link=${token}`);
    await new Promise((r) => ws.once('open', r));
    const closed = new Promise<number>((resolve) => ws.once('close', (code) => resolve(code)));
    const g = await signInGuest('Late guest');
    expect((await f.editor.delete(`/api/sheets/${f.sheetId}/links/${linkId}`)).status).toBe(403);
    const revoked = await f.owner.delete(`/api/sheets/${f.sheetId}/links/${linkId}`);
    expect(revoked.status).toBe(200);
    expect(revoked.body.link.state).toBe('revoked');
    expect(await closed).toBe(4410);
    expect((await guest().get(`/api/view/${token}`)).status).toBe(410);
    expect((await g.post(`/api/view/${token}/pins`, { body: 'too late' })).status).toBe(410);
    const again = await new Promise<number>((resolve) => {
      const w = new WebSocket(f.server.url.replace(/^http/, 'ws') + `/sync/${f.sheetId}?link=${token}`);
      w.on('unexpected-response', (_q, res) => resolve(res.statusCode ?? 0));
      w.on('open', () => resolve(101));
      w.on('error', () => {});
    });
    expect(again).toBe(410);
  });
});

describe('pins by members', () => {
  it('members read and write; outsiders and no session cannot', async () => {
    for (const c of [f.owner, f.editor, f.viewer]) expect((await c.get(`/api/sheets/${f.sheetId}/pins`)).status).toBe(200);
    expect((await f.outsider.get(`/api/sheets/${f.sheetId}/pins`)).status).toBe(404);
    expect((await guest().get(`/api/sheets/${f.sheetId}/pins`)).status).toBe(401);
    const byViewer = await f.viewer.post(`/api/sheets/${f.sheetId}/pins`, { body: 'Viewer question', x: 5, y: 5 });
    expect(byViewer.status).toBe(201);
    expect(byViewer.body.pin.number).toBe(2);
    expect((await f.viewer.post(`/api/sheets/${f.sheetId}/pins`, { body: '' })).body.error.issues[0].path).toBe('body.body');
  });

  it('replies, resolving by author/editor/owner only, live events and e-mails to owners and participants', async () => {
    const events: string[] = [];
    const ctrl = new AbortController();
    const stream = fetch(`${f.server.url}/api/sheets/${f.sheetId}/pins/events`, { headers: { cookie: f.owner.cookieHeader() }, signal: ctrl.signal }).then(async (res) => {
      const reader = res.body!.getReader();
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        events.push(new TextDecoder().decode(value));
      }
    }).catch(() => {});
    await eventually(() => events.join('').includes('connected'), 'event stream');
    const pins = (await f.editor.get(`/api/sheets/${f.sheetId}/pins`)).body.pins;
    const viewerPin = pins.find((p: any) => p.number === 2);
    const reply = await f.editor.post(`/api/sheets/${f.sheetId}/pins/${viewerPin.id}/replies`, { body: 'It is 1/0 Cu.' });
    expect(reply.status).toBe(201);
    expect(reply.body.pin.replies.map((r: any) => r.body)).toEqual(['It is 1/0 Cu.']);
    await eventually(() => events.join('').includes('reply-added'), 'live reply event');
    const guestPin = pins.find((p: any) => p.number === 1);
    expect((await f.viewer.patch(`/api/sheets/${f.sheetId}/pins/${guestPin.id}`, { resolved: true })).status).toBe(403);
    expect((await f.viewer.patch(`/api/sheets/${f.sheetId}/pins/${viewerPin.id}`, { resolved: true })).body.pin.resolvedAt).not.toBeNull();
    expect((await f.editor.patch(`/api/sheets/${f.sheetId}/pins/${guestPin.id}`, { resolved: true })).status).toBe(200);
    expect((await f.owner.patch(`/api/sheets/${f.sheetId}/pins/${guestPin.id}`, { resolved: false })).body.pin.resolvedAt).toBeNull();
    ctrl.abort();
    await stream;
    const mail = (await new TestClient(f.server.url).get('/api/outbox')).body.messages;
    const toOwner = mail.filter((m: any) => m.to.includes('owner-links@example.com'));
    expect(toOwner.some((m: any) => /added pin 1/.test(m.subject))).toBe(true);
    expect(toOwner.some((m: any) => /replied on pin 2/.test(m.subject))).toBe(true);
    // The viewer started pin 2, so hears of the reply; the editor wrote it, so does not.
    expect(mail.some((m: any) => m.to.includes('viewer-links@example.com') && /replied on pin 2/.test(m.subject))).toBe(true);
    expect(mail.some((m: any) => m.to.includes('editor-links@example.com') && /replied on pin 2/.test(m.subject))).toBe(false);
    expect(toOwner.find((m: any) => /replied on pin 2/.test(m.subject)).text).toContain(`/sheets/${f.sheetId}?pin=2`);
  });
});

describe('pin attachments', () => {
  // A 1×1 PNG (signature, IHDR, IDAT, IEND), written out so the test does not depend on an image library.
  const png = Buffer.from('89504e470d0a1a0a0000000d49484452000000010000000108060000001f15c4890000000d49444154789c6360000002000154a24f5d0000000049454e44ae426082', 'hex');
  const upload = async (name: string, content: Buffer, type: string) => {
    const pinId = (await f.owner.get(`/api/sheets/${f.sheetId}/pins`)).body.pins[0].id;
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(content)], { type }), name);
    const res = await fetch(`${f.server.url}/api/sheets/${f.sheetId}/pins/${pinId}/attachments`, {
      method: 'POST',
      headers: { cookie: f.editor.cookieHeader(), origin: f.server.url },
      body: form,
    });
    return { status: res.status, body: await res.json(), pinId };
  };

  it('takes photos, PDFs and CSVs judged by their content, and serves them back', async () => {
    const photo = await upload('panel-photo.png', png, 'image/png');
    expect(photo.status, JSON.stringify(photo.body)).toBe(201);
    expect(photo.body.attachment).toMatchObject({ fileName: 'panel-photo.png', mediaType: 'image/png', sizeBytes: png.length });
    const csv = await upload('readings.csv', Buffer.from('point,volts\nA-N,121.4\nB-N,96.2\n'), 'text/csv');
    expect(csv.body.attachment.mediaType).toBe('text/csv');
    const pdf = await upload('meter.pdf', Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\ntrailer\n<<>>\n%%EOF\n'), 'application/pdf');
    expect(pdf.body.attachment.mediaType).toBe('application/pdf');
    const pins = (await f.viewer.get(`/api/sheets/${f.sheetId}/pins`)).body.pins;
    expect(pins[0].attachments.map((a: any) => a.fileName)).toEqual(['panel-photo.png', 'readings.csv', 'meter.pdf']);
    const back = await fetch(`${f.server.url}/api/sheets/${f.sheetId}/pins/${photo.pinId}/attachments/${photo.body.attachment.id}`, { headers: { cookie: f.viewer.cookieHeader() } });
    expect(back.headers.get('content-type')).toBe('image/png');
    expect(Buffer.from(await back.arrayBuffer()).equals(png)).toBe(true);
    const outsider = await fetch(`${f.server.url}/api/sheets/${f.sheetId}/pins/${photo.pinId}/attachments/${photo.body.attachment.id}`, { headers: { cookie: f.outsider.cookieHeader() } });
    expect(outsider.status).toBe(404);
  });

  it('refuses a file whose content is not what its name says, and one that is too large', async () => {
    const fake = await upload('photo.png', Buffer.from('just text pretending'), 'image/png');
    expect(fake.status).toBe(400);
    expect(fake.body.error.message).toMatch(/not a photo, a PDF or a CSV/);
    const exe = await upload('readings.csv', Buffer.from([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00, 0x04, 0x00, 0x00, 0x00, 0xff, 0xff, 0x00, 0x00]), 'text/csv');
    expect(exe.status).toBe(400);
    const big = await upload('huge.csv', Buffer.alloc(10 * 1024 * 1024 + 10, 0x41), 'text/csv');
    expect(big.status).toBe(400);
    expect(big.body.error.message).toMatch(/larger than 10 MB/);
    const pins = (await f.viewer.get(`/api/sheets/${f.sheetId}/pins`)).body.pins;
    expect(pins[0].attachments).toHaveLength(3);
  });
});
