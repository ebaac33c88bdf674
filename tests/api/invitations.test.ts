// Invitations by e-mail (through the local SMTP sink), membership activity and preferences, for every kind of caller.
// (Rules: PRODUCT.md "Collaboration and sharing"; the 7-day single-use link is the issue's; status codes common practice.)
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';
import { TestClient } from '../support/http-client';

let f: SyncFixture;
beforeAll(async () => {
  f = await syncFixture('inv');
});
afterAll(() => f?.server.stop());

const outbox = async () => (await new TestClient(f.server.url).get('/api/outbox')).body.messages as { to: string[]; subject: string; text: string }[];
const tokenFor = async (email: string) => {
  const m = (await outbox()).find((x) => x.to.includes(email) && /invited you/.test(x.subject));
  const url = /\/invite\/([A-Za-z0-9_-]+)/.exec(m?.text ?? '');
  if (!url) throw new Error(`no invitation mail for ${email}`);
  return url[1];
};

describe('invitations', () => {
  it('only owners invite; others are refused as usual', async () => {
    const base = `/api/projects/${f.projectId}/invitations`;
    for (const [who, c, status] of [['editor', f.editor, 403], ['viewer', f.viewer, 403], ['outsider', f.outsider, 404], ['anonymous', new TestClient(f.server.url), 401]] as const) {
      expect({ who, status: (await c.post(base, { email: 'x@example.com', role: 'viewer' })).status }).toEqual({ who, status });
      expect({ who, status: (await c.get(base)).status }).toEqual({ who, status });
    }
    const bad = await f.owner.post(base, { email: 'not-an-address', role: 'boss' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.issues.map((i: any) => i.path).sort()).toEqual(['body.email', 'body.role']);
    expect((await f.owner.post(base, { email: 'editor-inv@example.com', role: 'viewer' })).status).toBe(409);
  });

  it('a real e-mail carries a link that works once; accepting adds the member with the role', async () => {
    const made = await f.owner.post(`/api/projects/${f.projectId}/invitations`, { email: 'Newcomer@Example.com', role: 'editor' });
    expect(made.status).toBe(201);
    expect(made.body.invitation).toMatchObject({ email: 'newcomer@example.com', role: 'editor', state: 'pending' });
    const token = await tokenFor('newcomer@example.com');
    const info = await new TestClient(f.server.url).get(`/api/invitations/${token}`);
    expect(info.body.invitation).toMatchObject({ projectName: 'Sync inv', role: 'editor', inviter: 'Owner inv' });

    const wrong = new TestClient(f.server.url);
    await wrong.signUp('someone-else@example.com');
    const refused = await wrong.post(`/api/invitations/${token}/accept`, {});
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toMatch(/newcomer@example.com/);

    const newcomer = new TestClient(f.server.url);
    await newcomer.signUp('newcomer@example.com');
    expect((await newcomer.post(`/api/invitations/${token}/accept`, {})).body).toEqual({ projectId: f.projectId, role: 'editor' });
    expect((await newcomer.get(`/api/projects/${f.projectId}`)).body.project.role).toBe('editor');
    expect((await newcomer.post(`/api/invitations/${token}/accept`, {})).status).toBe(410);
    expect((await new TestClient(f.server.url).get(`/api/invitations/${token}`)).status).toBe(410);
  });

  it('resending replaces the link; withdrawing stops it', async () => {
    const base = `/api/projects/${f.projectId}/invitations`;
    const made = (await f.owner.post(base, { email: 'later@example.com', role: 'viewer' })).body.invitation;
    const first = await tokenFor('later@example.com');
    expect((await f.owner.post(`${base}/${made.id}/resend`, {})).status).toBe(200);
    const mails = (await outbox()).filter((m) => m.to.includes('later@example.com'));
    expect(mails).toHaveLength(2);
    expect((await new TestClient(f.server.url).get(`/api/invitations/${first}`)).status).toBe(404);
    const second = await tokenFor('later@example.com');
    expect((await new TestClient(f.server.url).get(`/api/invitations/${second}`)).status).toBe(200);
    expect((await f.owner.delete(`${base}/${made.id}`)).body.invitation.state).toBe('withdrawn');
    expect((await new TestClient(f.server.url).get(`/api/invitations/${second}`)).status).toBe(410);
    const list = (await f.owner.get(base)).body.invitations;
    expect(list.find((i: any) => i.id === made.id).state).toBe('withdrawn');
  });

  it('every membership change is recorded for owners, with who and what', async () => {
    const newcomer = (await f.owner.get(`/api/projects/${f.projectId}/members`)).body.members.find((m: any) => m.email === 'newcomer@example.com');
    expect(newcomer.lastActiveAt).not.toBeNull();
    await f.owner.patch(`/api/projects/${f.projectId}/members/${newcomer.userId}`, { role: 'viewer' });
    await f.owner.delete(`/api/projects/${f.projectId}/members/${newcomer.userId}`);
    const activity = (await f.owner.get(`/api/projects/${f.projectId}/activity`)).body.activity;
    const actions = activity.map((a: any) => `${a.action} ${a.subject}`);
    for (const expected of ['invited newcomer@example.com', 'joined newcomer@example.com', 'role-changed newcomer@example.com', 'removed newcomer@example.com', 'invitation-withdrawn later@example.com']) {
      expect(actions).toContain(expected);
    }
    expect(activity.find((a: any) => a.action === 'removed').actor).toBe('Owner inv');
    expect((await f.editor.get(`/api/projects/${f.projectId}/activity`)).status).toBe(403);
  });
});

describe('preferences', () => {
  it('pin e-mails can be turned off, and then none are sent', async () => {
    expect((await f.owner.get('/api/me/preferences')).body.preferences).toEqual({ pinEmails: true });
    expect((await f.owner.patch('/api/me/preferences', { pinEmails: 'no' })).status).toBe(400);
    expect((await f.owner.patch('/api/me/preferences', { pinEmails: false })).body.preferences).toEqual({ pinEmails: false });
    const before = (await outbox()).length;
    expect((await f.editor.post(`/api/sheets/${f.sheetId}/pins`, { body: 'Check the bond here' })).status).toBe(201);
    expect((await outbox()).length).toBe(before);
  });
});
