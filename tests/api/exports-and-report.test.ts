// Exports of the demo sheets and their seeded revisions: JSON out and back in gives the same document; the SVG
// holds every element; the PNG is a valid PNG of the drawing's size; the CSV lines up every case; the report PDF
// carries its tables, assumptions and cautions (read back with pdftotext, pages rendered with pdftoppm).
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../db/seed';
import { CAUTION } from '../../solver/results/derive';
import { DEMO_REVISION_NOTE } from '../../server/demo-documents';
import { pngScale } from '../../server/exports/drawing-png';
import { canonicalJson } from '../../server/revisions/input-hash';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

let server: TestServer;
let owner: TestClient;
let viewer: TestClient;
let building: { id: string; projectId: string };
let farm: { id: string };
const work = mkdtempSync(path.join(os.tmpdir(), 'pw-report-'));

/** The fields of one CSV line (RFC 4180 quoting). */
function fields(line: string): string[] {
  const out: string[] = [];
  for (const m of line.matchAll(/(?:^|,)(?:"((?:[^"]|"")*)"|([^,]*))/g)) out.push(m[1] !== undefined ? m[1].replace(/""/g, '"') : m[2]);
  return out;
}

async function download(c: TestClient, url: string) {
  const res = await fetch(server.url + url, { headers: { cookie: c.cookieHeader(), origin: server.url } });
  return { status: res.status, type: res.headers.get('content-type') ?? '', disposition: res.headers.get('content-disposition') ?? '', bytes: Buffer.from(await res.arrayBuffer()) };
}

beforeAll(async () => {
  server = await startTestServer({ SEED_DEMO: 'true' });
  owner = new TestClient(server.url);
  viewer = new TestClient(server.url);
  expect((await owner.signIn('owner@example.com', DEMO_PASSWORD)).status).toBe(200);
  expect((await viewer.signIn('viewer@example.com', DEMO_PASSWORD)).status).toBe(200);
  const project = (await owner.get('/api/projects')).body.projects[0];
  const sheets = (await owner.get(`/api/projects/${project.id}/sheets`)).body.sheets;
  building = { id: sheets.find((s: any) => s.name === 'Building distribution').id, projectId: project.id };
  farm = { id: sheets.find((s: any) => s.name.startsWith('Farm')).id };
});
afterAll(async () => {
  await server?.stop();
  rmSync(work, { recursive: true, force: true });
});

describe('the demo seed', () => {
  it('has an issued revision on each demo sheet', async () => {
    for (const s of [building, farm]) {
      const list = (await viewer.get(`/api/sheets/${s.id}/revisions`)).body.revisions;
      expect(list).toHaveLength(1);
      expect(list[0]).toMatchObject({ number: 1, note: DEMO_REVISION_NOTE, status: 'issued', issuedBy: { name: 'Rosa Almeida' } });
      expect(list[0].cases.every((c: any) => c.ok)).toBe(true);
    }
  });
});

describe('exports', () => {
  it('JSON export then import gives the same document', async () => {
    const exported = await download(viewer, `/api/sheets/${building.id}/export/document.json`);
    expect(exported.status).toBe(200);
    expect(exported.disposition).toMatch(/^attachment; filename="Building-distribution.json"/);
    const json = JSON.parse(exported.bytes.toString('utf8'));
    const copy = (await owner.post(`/api/projects/${building.projectId}/sheets`, { name: 'Imported copy' })).body.sheet.id;
    const imported = await owner.request('PUT', `/api/sheets/${copy}/document`, json);
    expect(imported.status, JSON.stringify(imported.body)).toBe(200);
    const back = (await owner.get(`/api/sheets/${copy}/document`)).body;
    // Everything comes back but the name: the copy is named as its own sheet list entry is.
    expect(json.name).toBe('Building distribution');
    expect(canonicalJson(back)).toBe(canonicalJson({ ...json, name: 'Imported copy' }));
    // The revision's own JSON export is its frozen document.
    const rev = await download(viewer, `/api/sheets/${building.id}/revisions/1/export/document.json`);
    expect(canonicalJson(JSON.parse(rev.bytes.toString('utf8')))).toBe(canonicalJson((await viewer.get(`/api/sheets/${building.id}/revisions/1`)).body.revision.document));
  });

  it('the SVG holds every element and connection, with the base case tags', async () => {
    const doc = (await viewer.get(`/api/sheets/${building.id}/document`)).body;
    const svg = await download(viewer, `/api/sheets/${building.id}/export/drawing.svg`);
    expect(svg.status).toBe(200);
    expect(svg.type).toMatch(/^image\/svg\+xml/);
    const text = svg.bytes.toString('utf8');
    expect(text.startsWith('<svg xmlns="http://www.w3.org/2000/svg"')).toBe(true);
    const drawn = [...text.matchAll(/data-element="([^"]+)"/g)].map((m) => m[1]).sort();
    expect(drawn).toEqual(Object.keys(doc.elements).sort());
    expect([...text.matchAll(/data-connection="/g)]).toHaveLength(Object.keys(doc.connections).length);
    for (const e of Object.values(doc.elements) as any[]) if (e.name) expect(text).toContain(e.name.replace(/&/g, '&amp;').slice(0, 31));
    expect([...text.matchAll(/data-tag="/g)].length).toBeGreaterThan(20);
  });

  it('the PNG is a valid PNG at the drawing\'s size', async () => {
    const svg = (await download(viewer, `/api/sheets/${farm.id}/revisions/1/export/drawing.svg`)).bytes.toString('utf8');
    const [, w, h] = /<svg[^>]* width="(\d+)" height="(\d+)"/.exec(svg)!.map(Number);
    const png = await download(viewer, `/api/sheets/${farm.id}/revisions/1/export/drawing.png`);
    expect(png.status).toBe(200);
    expect(png.type).toBe('image/png');
    // PNG signature and IHDR (ISO/IEC 15948: the first chunk, width and height as big-endian 32-bit integers).
    expect([...png.bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.bytes.subarray(12, 16).toString('latin1')).toBe('IHDR');
    const scale = pngScale(w, h);
    expect(png.bytes.readUInt32BE(16)).toBe(Math.round(w * scale));
    expect(Math.abs(png.bytes.readUInt32BE(20) - h * scale)).toBeLessThanOrEqual(1);
    writeFileSync(path.join(work, 'farm.png'), png.bytes);
  });

  it('the CSV has a column per case and the values of the stored results', async () => {
    const csv = await download(viewer, `/api/sheets/${building.id}/revisions/1/export/results.csv`);
    expect(csv.type).toMatch(/^text\/csv/);
    const lines = csv.bytes.toString('utf8').trim().split('\r\n');
    const results = (await viewer.get(`/api/sheets/${building.id}/revisions/1/results`)).body.results;
    const header = fields(lines[0]);
    expect(header.slice(0, 4)).toEqual(['element', 'kind', 'quantity', 'unit']);
    expect(header.slice(4)).toEqual(['Base case', ...results.whatIfs.map((w: any) => w.name)]);
    const service = results.base.result.buses.find((b: any) => b.role === 'service');
    const row = lines.map(fields).find((f) => f[0] === service.name && f[1] === 'bus' && f[2] === 'A-N')!;
    expect(row).toBeDefined();
    expect(Number(row[4])).toBeCloseTo(service.lineToNeutralVolts.A, 2);
    // The open service neutral moves the service's A–N voltage away from the base case.
    const open = results.whatIfs.findIndex((w: any) => w.whatIfId === 'open-service-neutral');
    expect(open).toBeGreaterThanOrEqual(0);
    expect(Math.abs(Number(row[5 + open]) - service.lineToNeutralVolts.A)).toBeGreaterThan(1);
    // A live sheet has no report; a live CSV works for a viewer.
    expect((await download(viewer, `/api/sheets/${building.id}/export/report.pdf`)).status).toBe(400);
    expect((await download(viewer, `/api/sheets/${building.id}/export/results.csv`)).status).toBe(200);
  });
});

describe('the report of the demo revision', () => {
  it('carries the title block, tables, assumptions and cautions, on pages that render', async () => {
    const pdf = await download(viewer, `/api/sheets/${building.id}/revisions/1/report.pdf`.replace('/report.pdf', '/export/report.pdf'));
    expect(pdf.status).toBe(200);
    expect(pdf.type).toBe('application/pdf');
    expect(pdf.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const file = path.join(work, 'building.pdf');
    writeFileSync(file, pdf.bytes);
    const text = execFileSync('/usr/bin/pdftotext', ['-layout', file, '-'], { encoding: 'utf8' });
    const flat = text.replace(/\s+/g, ' ');
    for (const words of [
      'Study report', 'Larkspur Row', 'Building distribution', `1 (issued) — ${DEMO_REVISION_NOTE}`, 'Rosa Almeida', 'SHA-256',
      'Drawing (base case)', 'Bus voltages', 'Load voltages', 'Conductor currents',
      'What-if: Open service neutral (service lateral)', 'What-if: Failing neutral lug at apartment 2 (3 Ω)',
      'Fault study', 'Fault currents at each bus', 'Interrupting ratings', 'NEC 110.24',
      'Loading checks', 'Break sweep', 'Voltage profile',
      'Panel schedules', 'Café panel', 'Apartment 6', 'Espresso machine',
      'Data and assumptions', 'ANSI C84.1', 'Low-voltage switch', 'NEC Chapter 9 Table 9', 'NEC 310.16', 'Load behaviour used', 'IEC 60909',
    ]) expect(flat, words).toContain(words);
    expect(flat).toContain(CAUTION.replace(/\s+/g, ' '));
    const revision = (await viewer.get(`/api/sheets/${building.id}/revisions/1`)).body.revision;
    expect(flat).toContain(revision.inputHash);
    expect(flat).toContain(`Solver version ${revision.solverVersion}`.replace('Solver version', 'SOLVER VERSION'));
    // The service bus's A–N voltage of the stored base case, as printed in the bus table.
    const base = (await viewer.get(`/api/sheets/${building.id}/revisions/1/results`)).body.results.base.result;
    const service = base.buses.find((b: any) => b.role === 'service');
    expect(flat).toMatch(new RegExp(`${service.name.replace(/[().]/g, '\\$&')} energised ${service.lineToNeutralVolts.A.toFixed(1)}`));

    const pages = path.join(work, 'pages');
    mkdirSync(pages);
    execFileSync('/usr/bin/pdftoppm', ['-r', '60', '-png', file, path.join(pages, 'page')]);
    const count = Number(/Pages:\s+(\d+)/.exec(execFileSync('/usr/bin/pdfinfo', [file], { encoding: 'utf8' }))![1]);
    expect(readdirSync(pages)).toHaveLength(count);
    expect(count).toBeGreaterThan(5);
    if (process.env.PW_KEEP_REPORT) execFileSync('cp', ['-r', pages, file, process.env.PW_KEEP_REPORT]);
  });
});
