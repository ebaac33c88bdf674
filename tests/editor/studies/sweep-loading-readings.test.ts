// The break sweep's rows, the loading of the case on show and the readings entered, on the demo building:
// the worst opening first and its row's figures from the sweep, sorting and filtering, the loading study of a
// what-if (and of the base case when a fault is on show), and pasted CSV readings with each bad line named.
import { describe, expect, it } from 'vitest';
import { breakSweepSync, loadingStudyOf, solveSheet, type SolveResult } from '../../../solver';
import { querySweep, sweepView } from '../../../editor/studies/break-sweep-rows';
import { loadingViewOf, queryConductors } from '../../../editor/studies/loading-rows';
import { parseReadingsCsv, toReadings } from '../../../editor/studies/readings-entry';
import { faultCaseChange } from '../../../editor/studies/fault-study-rows';
import { emptyQuery } from '../../../editor/studies/table-query';
import { demoSheet } from '../support/fixtures';

const sheet = demoSheet('larkspur-row.json');
const solved = (s = sheet, whatIfId?: string): SolveResult => {
  const out = solveSheet(s, { whatIfId });
  if (!out.ok) throw new Error(out.error.message);
  return out.result;
};

describe('break sweep rows', () => {
  const sweep = breakSweepSync(sheet, { conductors: 'neutrals' });
  if (!sweep.ok) throw new Error(sweep.error.message);
  const view = sweepView(sweep.value);

  it('has a row per opened neutral, worst first, each showing its case as an open-conductor change', () => {
    expect(view.rows).toHaveLength(sweep.value.cases.length);
    expect(view.rows.every((r) => r.conductor === 'N' && r.change.kind === 'open-conductor' && r.change.runId === r.runId)).toBe(true);
    const sev = view.rows.map((r) => r.severityPercent);
    expect([...sev].sort((a, b) => b - a)).toEqual(sev);
    const c = sweep.value.cases[0];
    expect(view.rows[0].runId).toBe(c.runId);
    // A lost neutral puts loads outside the standard (the demo's open-neutral what-ifs reach 150 to 186 V).
    expect(view.rows[0].standing).toBe('outside');
    expect(view.rows[0].loadsOutside).toBe(c.loadsOutside);
    expect(view.rows[0].over!.percent).toBe(c.worstOver!.percentOfNominal);
  });

  it('sorts by the lowest voltage and filters by words', () => {
    const byUnder = querySweep(view.rows, { ...emptyQuery(), sort: { key: 'under', direction: 'ascending' } });
    const u = byUnder.filter((r) => r.under).map((r) => r.under!.percent);
    expect([...u].sort((a, b) => a - b)).toEqual(u);
    const apt4 = querySweep(view.rows, { ...emptyQuery(), text: 'apartment 4' });
    expect(apt4.length).toBeGreaterThan(0);
    expect(apt4.every((r) => `${r.runName} ${r.over?.load} ${r.under?.load}`.toLowerCase().includes('apartment 4'))).toBe(true);
  });
});

describe('loading of the case on show', () => {
  const base = solved();

  it('is the loading study of the what-if on show, and of the base case while a fault is on show', () => {
    const whatIf = solved(sheet, 'open-service-neutral');
    const v = loadingViewOf(sheet, base, whatIf);
    const study = loadingStudyOf(sheet, whatIf);
    expect(v.caseNote).toContain('Open service neutral');
    expect(v.conductors.map((c) => c.amperes)).toEqual(study.conductors.map((c) => c.amperes));
    const withFault = { ...sheet, whatIfs: { f: { id: 'f', name: 'f', changes: { x: faultCaseChange({ busId: 'service', faultType: 'three-phase' }) } } } };
    const fault = solved(withFault, 'f');
    const during = loadingViewOf(sheet, base, fault);
    expect(during.caseNote).toContain('fault');
    expect(during.conductors.map((c) => c.amperes)).toEqual(loadingStudyOf(sheet, base).conductors.map((c) => c.amperes));
  });

  it('sorts conductors by their share of ampacity and filters the neutrals', () => {
    const v = loadingViewOf(sheet, base, null);
    const byPct = queryConductors(v.conductors, { ...emptyQuery(), sort: { key: 'percent', direction: 'descending' } });
    const p = byPct.filter((r) => r.percent !== undefined).map((r) => r.percent!);
    expect([...p].sort((a, b) => b - a)).toEqual(p);
    const n = queryConductors(v.conductors, { ...emptyQuery(), only: { conductor: ['N'] } });
    expect(n.length).toBeGreaterThan(0);
    expect(n.every((r) => r.conductor === 'N')).toBe(true);
  });
});

describe('readings entered as CSV', () => {
  const elements = Object.values(sheet.elements).map((e) => ({ id: e.id, name: e.name ?? '', kind: e.kind }));
  let n = 0;
  const id = () => `r${++n}`;

  it('reads names or ids, a header, volts with a unit, and a bus’s two bars', () => {
    const out = parseReadingsCsv('where,volts\nApartment 4 lighting, 186.2 V\napt-4-kitchen;19\n"Service, 400 A", 118.4, B-N\n\n', elements, id);
    if (!out.ok) throw new Error(JSON.stringify(out.problems));
    expect(out.entries.map((e) => e.point)).toEqual([
      { kind: 'load', loadId: 'apt-4-lights' },
      { kind: 'load', loadId: 'apt-4-kitchen' },
      { kind: 'bus', busId: 'service', from: 'B', to: 'N' },
    ]);
    expect(out.entries[2].where).toBe('Service, 400 A B–N');
    const readings = toReadings(out.entries);
    expect(readings.ok && readings.readings.map((r) => r.volts)).toEqual([186.2, 19, 118.4]);
  });

  it('takes nothing when a line is bad, naming each bad line and why', () => {
    const out = parseReadingsCsv('Apartment 4 lighting, 186\nNo such panel, 120\nservice, high\nservice, 120, A-Q', elements, id);
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.problems.map((p) => p.line)).toEqual([2, 3, 4]);
    expect(out.problems[0].message).toContain('no load or bus is called "No such panel"');
    expect(out.problems[1].message).toContain('"high" is not a voltage');
    expect(out.problems[2].message).toContain('not two bars');
  });

  it('refuses an entry whose voltage is not a number, naming it', () => {
    const r = toReadings([{ id: 'x', point: { kind: 'load', loadId: 'apt-4-lights' }, where: 'Apartment 4 lights', voltsText: 'abc' }]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toBe('Apartment 4 lights: "abc" is not a voltage above 0');
    expect(toReadings([]).ok).toBe(false);
  });
});
