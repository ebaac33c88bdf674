// PGlite on disk: a restart keeps users, sessions' accounts, projects and sheets; the demo seed runs only once;
// the auth secret generated on first start is kept. (Common practice, no source.)
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../db/seed';
import { freshDataDir, startTestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

describe('restart', () => {
  it('keeps every user, project and sheet, and seeds the demo only into an empty database', async () => {
    const dir = freshDataDir();
    rmSync(path.join(dir, 'auth-secret'), { force: true });
    try {
      const first = await startTestServer({ SEED_DEMO: 'true' }, dir);
      expect(first.seeded?.map((u) => u.email)).toEqual(['owner@example.com', 'editor@example.com', 'viewer@example.com']);
      const secret = readFileSync(path.join(dir, 'auth-secret'), 'utf8');
      expect(secret.trim().length).toBeGreaterThanOrEqual(32);
      const c = new TestClient(first.url);
      await c.signUp('keeper@example.com');
      const p = (await c.post('/api/projects', { name: 'Survives restarts' })).body.project.id;
      await c.post(`/api/projects/${p}/sheets`, { name: 'Panel LP-1' });
      await first.stop({ keepData: true });

      const second = await startTestServer({ SEED_DEMO: 'true' }, dir);
      expect(second.seeded).toBeNull();
      expect(readFileSync(path.join(dir, 'auth-secret'), 'utf8')).toBe(secret);
      const again = new TestClient(second.url);
      expect((await again.signIn('keeper@example.com')).status).toBe(200);
      const projects = (await again.get('/api/projects')).body.projects;
      expect(projects.map((x: any) => x.name)).toEqual(['Survives restarts']);
      const sheets = (await again.get(`/api/projects/${p}/sheets`)).body.sheets;
      expect(sheets.map((s: any) => s.name)).toEqual(['Panel LP-1']);

      const demo = new TestClient(second.url);
      expect((await demo.signIn('owner@example.com', DEMO_PASSWORD)).status).toBe(200);
      const demoProjects = (await demo.get('/api/projects')).body.projects;
      expect(demoProjects).toHaveLength(1);
      expect(demoProjects[0]).toMatchObject({ name: 'Larkspur Row', role: 'owner', sheetCount: 2 });
      // The demo sheets are seeded as documents: the building and the farm, each with its what-ifs.
      const demoSheets = (await demo.get(`/api/projects/${demoProjects[0].id}/sheets`)).body.sheets;
      const docs = await Promise.all(demoSheets.map((s: any) => demo.get(`/api/sheets/${s.id}/document`)));
      // Each document is named as the sheet list names it (not by its fixture's own name).
      const byName = Object.fromEntries(docs.map((d: any) => [d.body.name, d.body]));
      expect(Object.keys(byName).sort()).toEqual(demoSheets.map((s: any) => s.name).sort());
      expect(Object.keys(byName).sort()).toEqual(['Building distribution', 'Farm service, 120/240 V']);
      expect(Object.values(byName['Building distribution'].elements).filter((e: any) => e.kind === 'load').length).toBeGreaterThan(10);
      expect(byName['Building distribution'].whatIfs['open-service-neutral']).toBeDefined();
      expect(Object.values(byName['Farm service, 120/240 V'].elements).some((e: any) => e.kind === 'electrode')).toBe(true);
      const viewer = new TestClient(second.url);
      await viewer.signIn('viewer@example.com', DEMO_PASSWORD);
      expect((await viewer.get('/api/projects')).body.projects[0].role).toBe('viewer');
      await second.stop({ keepData: true });
    } finally {
      if (existsSync(dir)) rmSync(dir, { recursive: true, force: true });
    }
  });
});
