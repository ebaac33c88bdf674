// The fault study's rows on the demo building: each case against the ratings at its bus, failures first, the
// service marking, sorting and filtering, and the what-if a tapped row shows (the same fault the study solved).
import { describe, expect, it } from 'vitest';
import { faultStudy, solveSheet, testXOverR, peakFactor } from '../../../solver';
import { faultCaseChange, faultStudyView, queryFaultCases } from '../../../editor/studies/fault-study-rows';
import { emptyQuery } from '../../../editor/studies/table-query';
import { demoSheet } from '../support/fixtures';

const sheet = demoSheet('larkspur-row.json');
const study = (() => {
  const s = faultStudy(sheet);
  if (!s.ok) throw new Error(s.error.message);
  return s.study;
})();
const nameOf = (id: string) => sheet.elements[id]?.name || id;
const kindOf = (id: string) => sheet.elements[id]?.kind;
const view = faultStudyView(study, nameOf, kindOf, { dateText: '2026-12-02' });

describe('fault study rows', () => {
  it('has one row per bus and fault type', () => {
    const buses = Object.values(sheet.elements).filter((e) => e.kind === 'bus').length;
    expect(view.cases).toHaveLength(buses * 5);
    expect(new Set(view.cases.map((c) => c.key)).size).toBe(buses * 5);
  });

  it('judges each case against every rating at its bus by the UL 489 test X/R rule', () => {
    for (const row of view.cases) {
      const rated = study.duties.filter((d) => d.locationBusId === row.busId);
      if (row.symmetricalKa === undefined) {
        expect(row.status).toBe('no-figures');
        continue;
      }
      if (rated.length === 0) {
        expect(row.status).toBe('no-rating');
        continue;
      }
      // Recomputed here from the rule the solver states: duty × κ(X/R)/κ(test X/R) when X/R exceeds the test's.
      const exceeded = rated.filter((d) => {
        const test = testXOverR(d.interruptingKa);
        const duty = row.xOverR! > test ? (row.symmetricalKa! * peakFactor(row.xOverR!)) / peakFactor(test) : row.symmetricalKa!;
        return duty > d.interruptingKa;
      });
      expect(row.status === 'fails', row.key).toBe(exceeded.length > 0);
      expect(row.exceeds.sort()).toEqual(exceeded.map((d) => nameOf(d.elementId)).sort());
    }
  });

  it("agrees with the solver's duty checks: the worst case at a failing breaker's bus is a failing row", () => {
    const failing = study.duties.filter((d) => d.status === 'fails');
    expect(failing.length).toBeGreaterThan(0); // the demo building's 10 kA breakers sit on a 10.2 kA bus
    for (const d of failing) {
      const row = view.cases.find((c) => c.busId === d.locationBusId && c.faultType === d.faultType)!;
      expect(row.status).toBe('fails');
      expect(row.exceeds).toContain(nameOf(d.elementId));
    }
    expect(view.summary).toBe(`${failing.length} of ${study.duties.length} interrupting ratings exceeded`);
  });

  it('lists failures first, least margin first', () => {
    const ranks = view.cases.map((c) => c.statusRank);
    expect([...ranks].sort((a, b) => a - b)).toEqual(ranks);
    const fails = view.cases.filter((c) => c.status === 'fails').map((c) => c.marginPercent!);
    expect([...fails].sort((a, b) => a - b)).toEqual(fails);
    expect(view.duties[0].status).toBe('fails');
  });

  it('gives the service its NEC 110.24 marking with the largest fault there and the date', () => {
    expect(view.markings).toHaveLength(1);
    const m = view.markings[0];
    const atService = view.cases.filter((c) => c.busId === m.busId).map((c) => c.symmetricalKa ?? 0);
    expect(m.availableFaultKa).toBe(Math.max(...atService));
    expect(m.marking).toContain(`${m.availableFaultKa.toFixed(1)} kA`);
    expect(m.marking).toContain('2026-12-02');
  });

  it('sorts by current and filters by fault type and by words', () => {
    const byKa = queryFaultCases(view.cases, { ...emptyQuery(), sort: { key: 'symmetricalKa', direction: 'descending' } });
    const ka = byKa.map((r) => r.symmetricalKa ?? -1);
    expect([...ka].sort((a, b) => b - a)).toEqual(ka);
    const lg = queryFaultCases(view.cases, { ...emptyQuery(), only: { faultType: ['line-to-ground'] } });
    expect(lg.length).toBe(view.cases.length / 5);
    expect(lg.every((r) => r.faultType === 'line-to-ground')).toBe(true);
    const apt = queryFaultCases(view.cases, { ...emptyQuery(), text: 'apartment 3' });
    expect(apt.map((r) => r.busName)).toEqual(Array(5).fill('Apartment 3'));
    const fails = queryFaultCases(view.cases, { ...emptyQuery(), only: { status: ['fails'] } });
    expect(fails.every((r) => r.status === 'fails')).toBe(true);
  });

  it('shows a tapped row as a what-if with the same fault current the study found', () => {
    for (const row of [view.cases[0], view.cases.find((c) => c.faultType === 'line-to-ground' && c.busName === 'Apartment 3')!]) {
      const withCase = { ...sheet, whatIfs: { ...sheet.whatIfs, shown: { id: 'shown', name: 'shown', changes: { f: faultCaseChange(row) } } } };
      const out = solveSheet(withCase, { whatIfId: 'shown' });
      if (!out.ok) throw new Error(out.error.message);
      expect(out.result.fault?.busId).toBe(row.busId);
      expect(out.result.fault?.symmetricalKa).toBeCloseTo(row.symmetricalKa!, 9);
    }
  });
});
