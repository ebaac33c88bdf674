// Sign-up, sign-in, sign-out and password reset through the e-mail the local SMTP sink catches;
// with SMTP_URL set, mail goes to that server instead and the outbox does not exist.
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loopbackOnly } from '../../server/api/outbox/router';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

describe('with the local mail sink', () => {
  let server: TestServer;
  beforeAll(async () => {
    server = await startTestServer();
  });
  afterAll(() => server?.stop());

  it('signs up, keeps the session in a cookie, and signs out', async () => {
    const c = new TestClient(server.url);
    await c.signUp('ada@example.com', 'first-password-1', 'Ada Lind');
    const me = await c.get('/api/auth/get-session');
    expect(me.body.user.email).toBe('ada@example.com');
    expect((await c.get('/api/projects')).status).toBe(200);
    await c.signOut();
    expect((await c.get('/api/projects')).status).toBe(401);
  });

  it('refuses a wrong password and a duplicate sign-up', async () => {
    const c = new TestClient(server.url);
    const wrong = await c.signIn('ada@example.com', 'not-the-password');
    expect(wrong.status).toBe(401);
    const dup = await c.post('/api/auth/sign-up/email', { email: 'ada@example.com', password: 'whatever-123', name: 'Ada' });
    expect(dup.status).toBeGreaterThanOrEqual(400);
    expect((await c.get('/api/projects')).status).toBe(401);
  });

  it('resets a password through the link in the e-mail, and the old password stops working', async () => {
    const c = new TestClient(server.url);
    const asked = await c.post('/api/auth/request-password-reset', { email: 'ada@example.com', redirectTo: '/reset-password' });
    expect(asked.status).toBe(200);
    const outbox = await c.get('/api/outbox');
    expect(outbox.status).toBe(200);
    const mail = outbox.body.messages.find((m: any) => m.to.includes('ada@example.com'));
    expect(mail.subject).toMatch(/reset/i);
    const link = /https?:\/\/\S+reset-password\/[^\s?]+\S*/.exec(mail.text)?.[0];
    expect(link, mail.text).toBeDefined();
    expect(link!.startsWith(server.url)).toBe(true);
    // The link redirects to the app's reset page with the token.
    const follow = await c.request('GET', link!.slice(server.url.length));
    expect(follow.status).toBe(302);
    const location = new URL(follow.headers.get('location')!, server.url);
    expect(location.pathname).toBe('/reset-password');
    const token = location.searchParams.get('token')!;
    const reset = await c.post('/api/auth/reset-password', { newPassword: 'second-password-2', token });
    expect(reset.status).toBe(200);
    expect((await c.signIn('ada@example.com', 'first-password-1')).status).toBe(401);
    expect((await c.signIn('ada@example.com', 'second-password-2')).status).toBe(200);
    // A token works once.
    const again = await c.post('/api/auth/reset-password', { newPassword: 'third-password-3', token });
    expect(again.status).toBeGreaterThanOrEqual(400);
  });

  it('reports the local sink in /api/health', async () => {
    const r = await new TestClient(server.url).get('/api/health');
    expect(r.body).toMatchObject({ ok: true, mail: 'local-sink' });
  });
});

describe('the outbox answers only this machine', () => {
  const run = (remoteAddress: string) =>
    new Promise<unknown>((resolve) => loopbackOnly({ socket: { remoteAddress } } as any, {} as any, (err?: unknown) => resolve(err)));
  it.each(['127.0.0.1', '::1', '::ffff:127.0.0.1'])('lets %s in', async (a) => {
    expect(await run(a)).toBeUndefined();
  });
  it.each(['192.0.2.10', '::ffff:198.51.100.7', '2001:db8::1'])('answers %s with not found', async (a) => {
    expect(await run(a)).toMatchObject({ status: 404 });
  });
});

describe('with SMTP_URL set', () => {
  let smtp: SMTPServer;
  const received: { to: string[]; raw: string }[] = [];
  let server: TestServer;

  beforeAll(async () => {
    smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, session, cb) {
        let raw = '';
        stream.on('data', (d) => (raw += d));
        stream.on('end', () => {
          received.push({ to: session.envelope.rcptTo.map((r) => r.address), raw });
          cb();
        });
      },
    });
    await new Promise<void>((r) => smtp.listen(0, '127.0.0.1', () => r()));
    const port = (smtp.server.address() as { port: number }).port;
    server = await startTestServer({ SMTP_URL: `smtp://127.0.0.1:${port}` });
  });
  afterAll(async () => {
    await server?.stop();
    await new Promise<void>((r) => smtp.close(() => r()));
  });

  it('delivers the reset e-mail to that server and has no outbox', async () => {
    const c = new TestClient(server.url);
    await c.signUp('grace@example.com');
    await c.signOut();
    await c.post('/api/auth/request-password-reset', { email: 'grace@example.com', redirectTo: '/reset-password' });
    expect(received.some((m) => m.to.includes('grace@example.com') && /reset-password\//.test(m.raw))).toBe(true);
    expect((await c.get('/api/outbox')).status).toBe(404);
    expect((await c.get('/api/health')).body.mail).toBe('smtp');
  });
});
