// The pieces under the revision routes, without a server: the hook for further studies (loading checks, break
// sweep, voltage profile) reaching the report, the comparison's field paths, CSV quoting and the panel schedules.
// (CSV quoting: RFC 4180; the leading apostrophe against formula injection is common practice, no source.)
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { renderReportPdf } from '../../server/reports/report-pdf';
import { runExtraStudies, type ExtraStudy } from '../../server/reports/extra-studies';
import { panelSchedules } from '../../server/reports/panel-schedules';
import { differingPaths } from '../../server/revisions/compare';
import { inputHash } from '../../server/revisions/input-hash';
import { studySheet } from '../../server/revisions/study';
import { csvField } from '../../server/exports/results-csv';

const work = mkdtempSync(path.join(os.tmpdir(), 'pw-study-'));
afterAll(() => rmSync(work, { recursive: true, force: true }));
const farmJson = JSON.parse(readFileSync(path.resolve(__dirname, '../../solver/fixtures/farm.json'), 'utf8'));
const farm = (readSheet(farmJson) as { ok: true; sheet: Sheet }).sheet;

describe('further studies hook', () => {
  const profile: ExtraStudy = {
    id: 'voltage-profile',
    title: 'Voltage profile',
    run: (sheet) => [
      {
        title: 'Voltage along the service',
        columns: ['Bus', 'A–N V'],
        rows: Object.values(sheet.elements).filter((e) => e.kind === 'bus').map((b) => [b.name, 120]),
        notes: ['Drawn from the base case.'],
        figure: { svg: '<svg xmlns="http://www.w3.org/2000/svg" width="300" height="80"><path d="M 0 70 L 300 10" stroke="black"/><text x="4" y="14" font-family="Inter" font-size="10">profile plot</text></svg>', width: 300, height: 80 },
      },
    ],
  };
  const broken: ExtraStudy = { id: 'break-sweep', title: 'Break sweep', run: () => { throw new Error('sweep not ready'); } };

  it('runs each registered study, keeping a failure to itself', () => {
    const out = runExtraStudies(farm, [profile, broken]);
    expect(out.map((o) => [o.id, o.ok])).toEqual([['voltage-profile', true], ['break-sweep', false]]);
    expect(out[1].error).toBe('sweep not ready');
    expect(out[0].tables[0].rows.length).toBe(Object.values(farm.elements).filter((e) => e.kind === 'bus').length);
  });

  it('puts registered studies in the report and names the missing ones as not run', async () => {
    const results = { ...studySheet(farm), extra: runExtraStudies(farm, [profile, broken]) };
    const pdf = await renderReportPdf({
      projectName: 'Hook check',
      sheetName: 'Farm',
      document: farmJson,
      results,
      generatedAt: '2026-12-02T12:00:00.000Z',
      revision: { id: 'r', sheetId: 's', number: 4, note: '', inputHash: inputHash(farmJson), solverVersion: results.solverVersion, issuedAt: '2026-12-02T11:00:00.000Z', issuedBy: { id: null, name: 'Tester' }, status: 'issued', reviews: [], cases: [] },
    });
    const file = path.join(work, 'hook.pdf');
    writeFileSync(file, pdf);
    const text = execFileSync('/usr/bin/pdftotext', [file, '-'], { encoding: 'utf8' }).replace(/\s+/g, ' ');
    expect(text).toContain('Voltage along the service');
    expect(text).toContain('profile plot');
    expect(text).toContain('Drawn from the base case.');
    expect(text).toContain('Break sweep Could not be run: sweep not ready');
    expect(text).toContain('Loading checks Not run in this build of Phasewright.');
    expect(text).not.toContain('Voltage profile Not run');
  });
});

describe('comparison paths', () => {
  it('names the nested fields that differ, and nothing when equal', () => {
    expect(differingPaths({ a: 1, c: { N: { size: '1/0', open: false } } }, { a: 1, c: { N: { size: '2/0', open: false } }, d: 2 })).toEqual(['c.N.size', 'd']);
    expect(differingPaths({ x: [1, 2], y: { z: 1 } }, { y: { z: 1 }, x: [1, 2] })).toEqual([]);
  });
});

describe('CSV fields', () => {
  it('quotes what needs quoting and defuses formulas, leaving numbers alone', () => {
    expect(csvField('Service, 400 A')).toBe('"Service, 400 A"');
    expect(csvField('12" riser')).toBe('"12"" riser"');
    expect(csvField('=HYPERLINK("x")')).toBe(`"'=HYPERLINK(""x"")"`);
    expect(csvField('-1.25')).toBe('-1.25');
    expect(csvField('-sum')).toBe("'-sum");
    expect(csvField('118.8')).toBe('118.8');
  });
});

describe('panel schedules', () => {
  it('lists each panel\'s loads with their phases, amount and power factor', () => {
    const schedules = panelSchedules(farm);
    const names = schedules.map((s) => s.name);
    expect(names).toContain('House panel');
    expect(names).toContain('Barn panel');
    const house = schedules.find((s) => s.name === 'House panel')!;
    const pump = house.rows.find((r) => r.description === 'Well pump')!;
    const source = Object.values(farm.elements).find((e) => e.kind === 'load' && e.name === 'Well pump') as Extract<Sheet['elements'][string], { kind: 'load' }>;
    expect(pump.load).toBe(`${source.kw} kW`);
    expect(pump.phases).toBe('AB');
    // The barn's loads belong to the barn panel, not to the house panel that feeds it.
    expect(house.rows.some((r) => r.description.startsWith('Barn'))).toBe(false);
  });
});
