// A sheet has one name, the one in its project's sheet list: the seeded demo documents, the JSON view, the live
// exports, a viewer link's view, revisions and their reports all carry it, a rename reaches every one of them,
// and neither an imported file's name nor a name left inside an older document takes its place.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../db/seed';
import { connectSheet } from '../support/sync-client';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

let server: TestServer;
let owner: TestClient;
let sheets: { id: string; name: string }[];
const work = mkdtempSync(path.join(os.tmpdir(), 'pw-sheet-name-'));
const fixture = (file: string) => JSON.parse(readFileSync(path.join(__dirname, '..', '..', 'solver', 'fixtures', file), 'utf8'));

async function download(url: string) {
  const res = await fetch(server.url + url, { headers: { cookie: owner.cookieHeader(), origin: server.url } });
  expect(res.status, url).toBe(200);
  return Buffer.from(await res.arrayBuffer());
}

/** Every name the sheet goes by outside the list: its JSON view, its live JSON export and its live drawing's title. */
async function namesShown(sheetId: string) {
  const svg = (await download(`/api/sheets/${sheetId}/export/drawing.svg`)).toString('utf8');
  return {
    document: (await owner.get(`/api/sheets/${sheetId}/document`)).body.name,
    exported: JSON.parse((await download(`/api/sheets/${sheetId}/export/document.json`)).toString('utf8')).name,
    drawingTitle: /<title>([^<]*)<\/title>/.exec(svg)?.[1],
  };
}

beforeAll(async () => {
  server = await startTestServer({ SEED_DEMO: 'true' });
  owner = new TestClient(server.url);
  expect((await owner.signIn('owner@example.com', DEMO_PASSWORD)).status).toBe(200);
  const project = (await owner.get('/api/projects')).body.projects[0];
  sheets = (await owner.get(`/api/projects/${project.id}/sheets`)).body.sheets;
});
afterAll(async () => {
  await server?.stop();
  rmSync(work, { recursive: true, force: true });
});

describe('the demo seed', () => {
  it('names each document, its exports and its first revision as the sheet list does, not by its fixture', async () => {
    expect(sheets.map((s) => s.name)).toEqual(['Building distribution', 'Farm service, 120/240 V']);
    for (const s of sheets) {
      expect(await namesShown(s.id)).toEqual({ document: s.name, exported: s.name, drawingTitle: s.name });
      expect((await owner.get(`/api/sheets/${s.id}/revisions/1`)).body.revision.document.name).toBe(s.name);
    }
  });
});

describe('a rename in the sheet list', () => {
  it('reaches the JSON view, the exports, a viewer link, the comparison with an older revision and a new revision’s report', async () => {
    const building = sheets.find((s) => s.name === 'Building distribution')!;
    const renamed = await owner.patch(`/api/sheets/${building.id}`, { name: 'Main building, 208Y/120 V' });
    expect(renamed.status).toBe(200);
    expect(await namesShown(building.id)).toEqual({ document: 'Main building, 208Y/120 V', exported: 'Main building, 208Y/120 V', drawingTitle: 'Main building, 208Y/120 V' });

    const link = await owner.post(`/api/sheets/${building.id}/links`, { label: 'rename check' });
    expect(link.status).toBe(201);
    const guest = new TestClient(server.url);
    expect((await guest.get(`/api/view/${link.body.token}/document`)).body.name).toBe('Main building, 208Y/120 V');

    // Revision 1 was filed under the old name: the comparison says so rather than showing a change it cannot name.
    const cmp = (await owner.get(`/api/sheets/${building.id}/revisions/1/compare`)).body.comparison;
    expect(cmp).toMatchObject({ identical: false, renamed: { from: 'Building distribution', to: 'Main building, 208Y/120 V' }, elements: { added: [], removed: [], changed: [] } });

    const issued = await owner.post(`/api/sheets/${building.id}/revisions`, { note: 'After the rename' });
    expect(issued.status, JSON.stringify(issued.body)).toBe(201);
    const number = issued.body.revision.number;
    expect((await owner.get(`/api/sheets/${building.id}/revisions/${number}`)).body.revision.document.name).toBe('Main building, 208Y/120 V');
    expect((await owner.get(`/api/sheets/${building.id}/revisions/${number}/compare`)).body.comparison).toMatchObject({ identical: true, renamed: null });
    const file = path.join(work, 'renamed.pdf');
    writeFileSync(file, await download(`/api/sheets/${building.id}/revisions/${number}/export/report.pdf`));
    const flat = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(flat).toContain('Main building, 208Y/120 V');
    expect(flat).not.toContain('Building distribution');
  });
});

describe('the name inside a document', () => {
  it('is not taken from an imported file, and one left in an older document is not read', async () => {
    const farm = sheets.find((s) => s.name.startsWith('Farm'))!;
    const file = fixture('farm.json');
    expect(file.name).toBe('Hollis farm');
    const put = await owner.request('PUT', `/api/sheets/${farm.id}/document`, { ...file, name: 'A name from elsewhere' });
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect((await namesShown(farm.id)).document).toBe(farm.name);
    expect((await owner.get(`/api/sheets/${farm.id}`)).body.sheet.name).toBe(farm.name);

    // The room's document holds no name of its own; one written there (as older documents have) changes nothing.
    const client = connectSheet(owner, farm.id);
    await client.synced();
    expect(client.doc.getMap('sheet').has('name')).toBe(false);
    client.doc.getMap('sheet').set('name', 'Stale document name');
    client.doc.getMap('elements').set('marker-after-name', { id: 'marker-after-name' });
    const stored = async () => (await owner.get(`/api/sheets/${farm.id}/document`)).body.elements['marker-after-name'] !== undefined;
    for (let i = 0; i < 100 && !(await stored()); i++) await new Promise((r) => setTimeout(r, 50));
    expect(await stored()).toBe(true);
    expect(await namesShown(farm.id)).toEqual({ document: farm.name, exported: farm.name, drawingTitle: farm.name });
    client.destroy();
  });
});
