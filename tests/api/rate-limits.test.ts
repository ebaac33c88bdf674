// Rate limits on invitations, links and pins (scaled down here so a few requests reach them) and on sign-in.
import { afterAll, beforeAll, expect, it } from 'vitest';
import { syncFixture, type SyncFixture } from '../support/sync-fixture';

let f: SyncFixture;
beforeAll(async () => {
  // 30 invitations a minute scaled by 0.1 is 3.
  f = await syncFixture('limits', { RATE_LIMIT_SCALE: '0.1' });
});
afterAll(() => f?.server.stop());

it('refuses the fourth invitation in a minute with 429 and a clear message', async () => {
  const statuses: number[] = [];
  let last: any;
  for (let i = 0; i < 4; i++) {
    last = await f.owner.post(`/api/projects/${f.projectId}/invitations`, { email: `p${i}@example.com`, role: 'viewer' });
    statuses.push(last.status);
  }
  expect(statuses).toEqual([201, 201, 201, 429]);
  expect(last.body.error.message).toMatch(/Too many invitations/);
  // Reads are not limited by the write limit.
  expect((await f.owner.get(`/api/projects/${f.projectId}/invitations`)).status).toBe(200);
});

it('limits repeated sign-in attempts (inside better-auth)', async () => {
  const statuses = new Set<number>();
  for (let i = 0; i < 35; i++) statuses.add((await f.outsider.signIn('outsider-limits@example.com', 'wrong-password')).status);
  expect(statuses.has(429)).toBe(true);
});
