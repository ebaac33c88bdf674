// Bad input: each gets 400 with the field path and a message, and nothing already saved is lost.
// Server faults: 500 with no stack trace in the body, and a log line. (Common practice, no source.)
import express from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorHandler } from '../../server/http/errors';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

let server: TestServer;
let owner: TestClient;
let projectId: string;

beforeAll(async () => {
  server = await startTestServer();
  owner = new TestClient(server.url);
  await owner.signUp('bad-input@example.com');
  projectId = (await owner.post('/api/projects', { name: 'Kept safe', description: 'original' })).body.project.id;
});
afterAll(() => server?.stop());

const issuesOf = (r: { body: any }) => r.body.error.issues as { path: string; message: string }[];

describe('validation errors name the field', () => {
  it.each([
    ['missing name', {}, 'body.name', /required/i],
    ['empty name', { name: '   ' }, 'body.name', /empty/i],
    ['name too long', { name: 'x'.repeat(121) }, 'body.name', /120/],
    ['name of the wrong type', { name: 42 }, 'body.name', /.+/],
    ['unknown field', { name: 'ok', colour: 'red' }, 'body', /colour/],
  ])('POST /api/projects with %s', async (_label, body, path, message) => {
    const r = await owner.post('/api/projects', body);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad_request');
    const issue = issuesOf(r).find((i) => i.path === path);
    expect(issue, JSON.stringify(r.body)).toBeDefined();
    expect(issue!.message).toMatch(message);
  });

  it('a malformed id is a 400 on the id parameter, not a 500', async () => {
    const r = await owner.get('/api/projects/not-a-uuid');
    expect(r.status).toBe(400);
    expect(issuesOf(r)[0].path).toBe('params.projectId');
    const s = await owner.patch('/api/sheets/123', { name: 'x' });
    expect(s.status).toBe(400);
    expect(issuesOf(s).map((i) => i.path)).toEqual(['params.sheetId']);
  });

  it('an empty PATCH says what is missing', async () => {
    const r = await owner.patch(`/api/projects/${projectId}`, {});
    expect(r.status).toBe(400);
    expect(r.body.error.issues[0].message).toMatch(/at least one field/i);
  });

  it('a body that is not JSON is a clear 400', async () => {
    const r = await owner.request('POST', '/api/projects', undefined, '{"name": "unterminated');
    expect(r.status).toBe(400);
    expect(r.body.error.message).toMatch(/not valid JSON/);
  });

  it('an unknown API route is a JSON 404, not the web app', async () => {
    const r = await owner.get('/api/no-such-thing');
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found');
  });

  it('none of the refused requests changed the saved project', async () => {
    const r = await owner.get(`/api/projects/${projectId}`);
    expect(r.body.project).toMatchObject({ name: 'Kept safe', description: 'original' });
    const list = await owner.get('/api/projects');
    expect(list.body.projects).toHaveLength(1);
  });
});

describe('server faults', () => {
  it('answer 500 without a stack trace and log the cause', async () => {
    const logs: string[] = [];
    const app = express();
    app.get('/boom', () => {
      throw new Error('database exploded at /secret/path.ts:12');
    });
    app.use(errorHandler((l) => logs.push(l)));
    const http = app.listen(0);
    await new Promise((r) => http.once('listening', r));
    const port = (http.address() as { port: number }).port;
    const res = await fetch(`http://127.0.0.1:${port}/boom`);
    const text = await res.text();
    http.close();
    expect(res.status).toBe(500);
    expect(JSON.parse(text)).toEqual({ error: { code: 'internal', message: 'Something went wrong on the server' } });
    expect(text).not.toMatch(/exploded|secret|\.ts/);
    expect(logs.join('\n')).toMatch(/database exploded/);
  });
});
