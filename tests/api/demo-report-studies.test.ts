// The further studies in the seeded demo revision: stored with its results, printed in its report (read back with
// pdftotext, pages rendered with pdftoppm) and written to its CSV. The break sweep's top case is checked against
// breakSweepSync run here on the revision's frozen document (an independent path: no worker, no stored results).
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../db/seed';
import { readSheet, type Sheet } from '../../shared/sheet';
import { breakSweepSync, loadingStudy, type BreakCase } from '../../solver';
import { startTestServer, type TestServer } from '../support/test-server';
import { TestClient } from '../support/http-client';

let server: TestServer;
let viewer: TestClient;
let building: { id: string };
let sheet: Sheet;
let flat = '';
const work = mkdtempSync(path.join(os.tmpdir(), 'pw-demo-studies-'));

async function download(url: string) {
  const res = await fetch(server.url + url, { headers: { cookie: viewer.cookieHeader(), origin: server.url } });
  return { status: res.status, bytes: Buffer.from(await res.arrayBuffer()) };
}

const conductorWords = (c: BreakCase) => `${c.conductor === 'N' ? 'neutral' : c.conductor === 'PE' ? 'protective conductor' : `phase ${c.conductor}`} of ${c.runName}`;

beforeAll(async () => {
  server = await startTestServer({ SEED_DEMO: 'true' });
  viewer = new TestClient(server.url);
  expect((await viewer.signIn('viewer@example.com', DEMO_PASSWORD)).status).toBe(200);
  const project = (await viewer.get('/api/projects')).body.projects[0];
  const sheets = (await viewer.get(`/api/projects/${project.id}/sheets`)).body.sheets;
  building = { id: sheets.find((s: any) => s.name === 'Building distribution').id };
  const read = readSheet((await viewer.get(`/api/sheets/${building.id}/revisions/1`)).body.revision.document);
  if (!read.ok) throw new Error('the demo revision is not a valid sheet');
  sheet = read.sheet;
  const pdf = await download(`/api/sheets/${building.id}/revisions/1/export/report.pdf`);
  expect(pdf.status).toBe(200);
  writeFileSync(path.join(work, 'building.pdf'), pdf.bytes);
  flat = execFileSync('/usr/bin/pdftotext', [path.join(work, 'building.pdf'), '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
}, 120_000);
afterAll(async () => {
  await server?.stop();
  rmSync(work, { recursive: true, force: true });
});

describe('the demo revision stores the further studies', () => {
  it('has loading checks, break sweep and voltage profile, each run', async () => {
    const extra = (await viewer.get(`/api/sheets/${building.id}/revisions/1/results`)).body.results.extra;
    expect(extra.map((e: any) => [e.id, e.ok])).toEqual([
      ['loading-checks', true],
      ['break-sweep', true],
      ['voltage-profile', true],
    ]);
  });
});

describe('the report of the demo revision', () => {
  it('no longer names any study as not run', () => {
    expect(flat).not.toContain('Not run in this build');
  });

  it('prints the loading checks: summary, conductors with the rule, breakers, drop, bonds and the notes', () => {
    for (const words of ['Loading checks: summary', 'Conductors (worst first)', 'Rule applied', 'Breakers, switches and fuses (worst first)', 'Voltage drop per run and from the start of its zone (3 % / 5 %)', 'Neutral-to-ground bonds', 'IEC 60364-5-52) in a later release'])
      expect(flat, words).toContain(words);
    // A breaker the solver's own loading study finds over its rating is named with its finding.
    const study = loadingStudy(sheet);
    if (!study.ok) throw new Error(study.error.message);
    const over = study.study.breakers.filter((b) => b.status === 'over');
    expect(over.length).toBeGreaterThan(0);
    for (const b of over) expect(flat).toContain(b.note);
    // The worst conductor's rule text (NEC 310.16 with its factors) is printed whole.
    expect(flat).toContain(study.study.conductors[0].rule!.text.replace(/\s+/g, ' '));
  });

  it('ranks the break sweep as breakSweepSync does on the same sheet', () => {
    const out = breakSweepSync(sheet, {});
    if (!out.ok) throw new Error(out.error.message);
    const top = out.value.cases[0];
    // Each run conductor is opened once: the sweep's size is the sheet's count of run conductors.
    const conductors = Object.values(sheet.elements).reduce((n, e) => n + (e.kind === 'run' ? Object.keys(e.conductors).length : 0), 0);
    expect(out.value.total).toBe(conductors);
    expect(flat).toContain(`${out.value.cases.length} cases swept of ${conductors}`);
    expect(flat).toContain('Top cases of the break sweep (worst first)');
    expect(flat).toContain(`1 ${conductorWords(top)}`);
    const under = top.worstUnder!;
    expect(flat).toContain(`${under.volts.toFixed(1)} V (${under.percentOfNominal.toFixed(1)} %) ${under.loadName}`);
    expect(flat).toContain(top.severityPercent.toFixed(1));
    expect(flat).toMatch(/… and \d+ more/);
  });

  it('draws the voltage profile with the base case beside the worst break and the what-ifs', () => {
    const out = breakSweepSync(sheet, {});
    if (!out.ok) throw new Error(out.error.message);
    expect(flat).toContain('Voltage profile Load voltages in percent of nominal');
    expect(flat).toContain(`Worst break: ${conductorWords(out.value.cases[0])}`);
    for (const w of Object.values(sheet.whatIfs).slice(0, 4)) expect(flat).toContain(`What-if: ${w.name}`);
    expect(flat).toContain('Load voltage, % of nominal');
  });

  it('renders every page', () => {
    const file = path.join(work, 'building.pdf');
    const pages = path.join(work, 'pages');
    mkdirSync(pages);
    execFileSync('/usr/bin/pdftoppm', ['-r', '60', '-png', file, path.join(pages, 'page')]);
    const count = Number(/Pages:\s+(\d+)/.exec(execFileSync('/usr/bin/pdfinfo', [file], { encoding: 'utf8' }))![1]);
    expect(readdirSync(pages)).toHaveLength(count);
    if (process.env.PW_KEEP_REPORT) execFileSync('cp', ['-r', pages, file, process.env.PW_KEEP_REPORT]);
  });
});

describe('the CSV of the demo revision', () => {
  it('carries each further study as a block of its own', async () => {
    const csv = (await download(`/api/sheets/${building.id}/revisions/1/export/results.csv`)).bytes.toString('utf8');
    const lines = csv.split('\r\n');
    for (const head of ['study: Loading checks,Loading checks: summary', 'study: Break sweep,Top cases of the break sweep (worst first)', 'study: Voltage profile,Load voltages in percent of nominal']) {
      const at = lines.indexOf(head);
      expect(at, head).toBeGreaterThan(0);
      expect(lines[at - 1]).toBe('');
    }
    const out = breakSweepSync(sheet, {});
    if (!out.ok) throw new Error(out.error.message);
    const sweepAt = lines.indexOf('study: Break sweep,Top cases of the break sweep (worst first)');
    expect(lines[sweepAt + 2].startsWith(`1,${conductorWords(out.value.cases[0])},`)).toBe(true);
  });
});
