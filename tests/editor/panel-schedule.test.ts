// The panel schedule derived from a sheet and its solve: circuits and their phases, the phase totals and imbalance,
// the neutral current (checked against the feeder's neutral that the solver finds by Kirchhoff's current law), each
// breaker's loading, and a row edit that is one undoable transaction.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet, type SheetInput } from '../../shared/sheet';
import { solveSheet, type SolveResult } from '../../solver';
import { SheetCommands } from '../../editor/document/commands';
import { docFromSheet, readDoc } from '../../editor/document/sheet-doc';
import { createUndoManager } from '../../editor/document/undo';
import { imbalancePercent, panelSchedule } from '../../editor/schedule/panel-schedule';
import { circuitEditWrites } from '../../editor/schedule/circuit-edit';
import { smallSystem } from './support/small-system';

function fixture(name: string): Sheet {
  const read = readSheet(JSON.parse(readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error(read.issues.map((i) => i.message).join('; '));
  return read.sheet;
}
function solve(sheet: Sheet, whatIfId?: string): SolveResult {
  const out = solveSheet(sheet, { whatIfId });
  if (!out.ok) throw new Error(out.error.message);
  return out.result;
}
function sheetOf(input: SheetInput): Sheet {
  const read = readSheet(input);
  if (!read.ok) throw new Error(read.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  return read.sheet;
}

/** A 208Y/120 panel with three 120 V loads, one per phase, each through a one-pole 20 A breaker. */
function breakerPanel(kw: { A: number; B: number; C: number }): SheetInput {
  const elements: Record<string, unknown> = {
    src: { kind: 'source', id: 'src', nominalVolts: 208, x: 0, y: 0 },
    panel: { kind: 'bus', id: 'panel', name: 'Panel L1', x: 0, y: 100 },
  };
  const connections: Record<string, unknown> = {
    c0: { id: 'c0', from: { elementId: 'src', terminal: 'out' }, to: { elementId: 'panel', terminal: 'bars' }, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N' } },
  };
  (['A', 'B', 'C'] as const).forEach((p, i) => {
    elements[`cb-${p}`] = { kind: 'breaker', id: `cb-${p}`, name: `CB ${p}`, poleB: 'none', poleC: 'none', ratingAmperes: 20, x: i * 80, y: 200 };
    elements[`l-${p}`] = { kind: 'load', id: `l-${p}`, name: `Heater ${p}`, loadKind: 'heating', kw: kw[p], ratedVolts: 120, circuit: String(2 * i + 1), x: i * 80, y: 300 };
    connections[`b-${p}`] = { id: `b-${p}`, from: { elementId: 'panel', terminal: 'bars' }, to: { elementId: `cb-${p}`, terminal: 'line' }, conductorMap: { [p]: 'A', N: 'N' } };
    connections[`l-${p}`] = { id: `l-${p}`, from: { elementId: `cb-${p}`, terminal: 'load' }, to: { elementId: `l-${p}`, terminal: 'supply' }, conductorMap: { A: 'A', N: 'N' } };
  });
  return { formatVersion: 1, name: 'Breaker panel', elements, connections, whatIfs: {} } as SheetInput;
}

describe('panel schedule of the Larkspur Row café panel', () => {
  const sheet = fixture('larkspur-row.json');
  const base = solve(sheet);
  const schedule = panelSchedule(sheet, 'cafe-panel', base)!;

  it('lists the six circuits with the phases their connections take', () => {
    expect(schedule.phases).toEqual(['A', 'B', 'C']);
    const byId = Object.fromEntries(schedule.rows.map((r) => [r.loadId, r]));
    expect(Object.keys(byId).sort()).toEqual(['cafe-lights', 'cafe-range', 'cafe-receptacles', 'espresso', 'point-of-sale', 'walk-in-cooler']);
    expect(byId['cafe-lights'].phases).toEqual(['A']);
    expect(byId['cafe-receptacles'].phases).toEqual(['B']);
    expect(byId['point-of-sale'].phases).toEqual(['C']);
    expect(byId['espresso'].phases).toEqual(['A', 'B']);
    expect(byId['cafe-range'].phases).toEqual(['A', 'B', 'C']);
    // the circuits as written on the loads, in natural order ("2,4" after "1", "10" after "9")
    expect(schedule.rows.map((r) => r.circuit)).toEqual(['1', '2,4', '3', '5', '6,8,10', '7,9,11']);
    expect(schedule.rows.every((r) => r.circuitGiven)).toBe(true);
    expect(byId['walk-in-cooler'].behaviourLabel).toBe('by kind (P 100 %)'); // motor: constant power (solver/README.md)
    expect(byId['espresso'].phaseOptions).toEqual(['AB', 'BC', 'CA']);
    expect(byId['cafe-lights'].phaseOptions).toEqual(['A', 'B', 'C']);
  });

  it('reads each branch breaker’s loading: its largest pole current against its rating', () => {
    for (const r of schedule.rows) {
      const b = base.breakers.find((x) => x.breakerId === r.breaker!.id)!;
      expect(r.breaker!.ratingAmperes).toBe(b.ratingAmperes);
      // one breaker per load: the breaker carries exactly the load's current (Kirchhoff)
      expect(r.breaker!.amperes!).toBeCloseTo(r.solved!.amperes, 6);
      expect(r.breaker!.percentOfRating!).toBeCloseTo((100 * r.solved!.amperes) / b.ratingAmperes!, 6);
    }
  });

  it('numbers circuits with no written number by their place on the drawing, left to right', () => {
    const small = sheetOf(smallSystem());
    const s = panelSchedule(small, 'panel', null)!;
    expect(s.rows.map((r) => [r.circuit, r.loadId, r.circuitGiven])).toEqual([
      ['1', 'la', false],
      ['2', 'lb', false],
    ]);
  });

  it('totals each phase from the data entered: kW / pf, line-to-line split half and half, three-phase in thirds', () => {
    // Hand sums from the fixture (common practice for a panel schedule, no source):
    // range 10/1 ÷ 3 = 3.3333 each; cooler 3.5/0.82 ÷ 3 = 1.4228 each; espresso 4.5 on A–B = 2.25 each;
    // lights 1.8/0.95 = 1.8947 on A; receptacles 2.4/0.95 = 2.5263 on B; registers 0.8/0.95 = 0.8421 on C.
    expect(schedule.totals.A!.kva).toBeCloseTo(3.3333 + 1.4228 + 2.25 + 1.8947, 3);
    expect(schedule.totals.B!.kva).toBeCloseTo(3.3333 + 1.4228 + 2.25 + 2.5263, 3);
    expect(schedule.totals.C!.kva).toBeCloseTo(3.3333 + 1.4228 + 0.8421, 3);
    const mean = (8.9008 + 9.5324 + 5.5982) / 3;
    expect(schedule.imbalancePercent).toBeCloseTo((100 * (mean - 5.5982)) / mean, 1);
  });

  it('finds the neutral and phase currents the café feeder carries (Kirchhoff at the panel)', () => {
    // The feeder feeds only this panel and the panel has no bond, so by KCL its conductors carry exactly the sum of
    // the circuits' currents. The schedule sums them from each load's solved voltage and power; the solver finds the
    // feeder's currents from the network: two independent routes to one number.
    const feeder = base.runs.find((r) => r.runId === 'cafe-panel-feeder')!;
    expect(schedule.neutralAmperes).toBeGreaterThan(5);
    expect(schedule.neutralAmperes!).toBeCloseTo(feeder.conductors.N!.current.magnitude, 6);
    for (const p of ['A', 'B', 'C'] as const) expect(schedule.totals[p]!.amperes!).toBeCloseTo(feeder.conductors[p]!.current.magnitude, 6);
    expect(schedule.feederNeutral).toEqual({ runName: 'Café panel feeder', amperes: feeder.conductors.N!.current.magnitude });
  });

  it('reads the circuits of a what-if too: an open service neutral changes the café neutral current', () => {
    const open = panelSchedule(sheet, 'cafe-panel', solve(sheet, 'open-service-neutral'))!;
    expect(Math.abs(open.neutralAmperes! - schedule.neutralAmperes!)).toBeGreaterThan(0.1);
  });

  it('has no solved figures before a solve', () => {
    const unsolved = panelSchedule(sheet, 'cafe-panel', null)!;
    expect(unsolved.neutralAmperes).toBeNull();
    expect(unsolved.totals.A!.amperes).toBeNull();
    expect(unsolved.rows.every((r) => r.solved === null)).toBe(true);
    expect(unsolved.totals.A!.kva).toBeCloseTo(schedule.totals.A!.kva, 12);
  });

  it('is null for an element that is not a bus', () => {
    expect(panelSchedule(sheet, 'cafe-range', base)).toBeNull();
  });
});

describe('a panel of breaker-fed circuits', () => {
  it('balanced resistive loads on three phases return no neutral current, and each breaker reads I = P / V', () => {
    // Fortescue/Kirchhoff: three equal currents 120° apart sum to zero in the neutral.
    const sheet = sheetOf(breakerPanel({ A: 1.2, B: 1.2, C: 1.2 }));
    const s = panelSchedule(sheet, 'panel', solve(sheet))!;
    expect(s.rows.map((r) => r.circuit)).toEqual(['1', '3', '5']);
    expect(s.neutralAmperes!).toBeLessThan(1e-6);
    expect(s.imbalancePercent).toBeCloseTo(0, 9);
    for (const r of s.rows) {
      // Ohm: an ideal 208 V source puts 208/√3 = 120.09 V on each heater, a constant impedance of
      // 120² / 1200 = 12 Ω, so I = 120.09 / 12 = 10.007 A on a 20 A breaker.
      expect(r.breaker!.amperes!).toBeCloseTo(208 / Math.sqrt(3) / 12, 6);
      expect(r.breaker!.percentOfRating!).toBeCloseTo((100 * (208 / Math.sqrt(3) / 12)) / 20, 4);
    }
  });

  it('one phase loaded: the neutral carries that phase’s whole current', () => {
    // Kirchhoff: with B and C unloaded, the neutral returns phase A's current.
    const sheet = sheetOf(breakerPanel({ A: 2.4, B: 0, C: 0 }));
    const s = panelSchedule(sheet, 'panel', solve(sheet))!;
    // Ohm: 120² / 2400 = 6 Ω at 208/√3 V.
    expect(s.neutralAmperes!).toBeCloseTo(208 / Math.sqrt(3) / 6, 6);
    expect(s.totals.A!.amperes!).toBeCloseTo(208 / Math.sqrt(3) / 6, 6);
    // (max − mean) / mean with 2.4, 0, 0: mean 0.8, largest departure 1.6, 200 %
    expect(s.imbalancePercent).toBeCloseTo(200, 9);
  });

  it('imbalance needs two phases and some load', () => {
    expect(imbalancePercent([5])).toBeNull();
    expect(imbalancePercent([0, 0, 0])).toBeNull();
    expect(imbalancePercent([10, 10, 7])).toBeCloseTo((100 * (9 - 7)) / 9, 9);
  });
});

describe('editing a row', () => {
  it('writes the load, its breaker and its phases in one transaction that one undo takes back', () => {
    const input = breakerPanel({ A: 1.2, B: 1.2, C: 1.2 });
    const doc = docFromSheet(input);
    const cmd = new SheetCommands(doc);
    const undo = createUndoManager(doc, cmd.origin);
    const before = readDoc(doc);
    if (!before.ok) throw new Error('bad doc');
    const s = panelSchedule(before.sheet, 'panel', null)!;
    const row = s.rows.find((r) => r.loadId === 'l-A')!;
    const made = circuitEditWrites(before.sheet, s.phases, row, {
      description: 'Break room heater',
      circuit: '7',
      amount: 1.5,
      powerFactor: 0.9,
      behaviour: 'impedance',
      phases: ['C'],
      breakerAmperes: 15,
    });
    expect(made.ok).toBe(true);
    if (!made.ok) return;
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    cmd.updateEntries(made.edits);
    expect(transactions).toBe(1);
    const after = readDoc(doc);
    if (!after.ok) throw new Error('edit left an invalid sheet');
    expect(after.sheet.elements['l-A']).toMatchObject({ name: 'Break room heater', circuit: '7', kw: 1.5, powerFactor: 0.9, constantImpedanceFraction: 1 });
    expect(after.sheet.elements['cb-A']).toMatchObject({ ratingAmperes: 15 });
    expect(after.sheet.connections['b-A'].conductorMap).toEqual({ C: 'A', N: 'N' });
    const again = panelSchedule(after.sheet, 'panel', null)!.rows.find((r) => r.loadId === 'l-A')!;
    expect(again.phases).toEqual(['C']);
    expect(again.behaviour).toBe('impedance');
    undo.undo();
    const undone = readDoc(doc);
    if (!undone.ok) throw new Error('undo left an invalid sheet');
    expect(undone.sheet).toEqual(before.sheet);
  });

  it('refuses a bad edit with a reason and writes nothing', () => {
    const sheet = sheetOf(breakerPanel({ A: 1, B: 1, C: 1 }));
    const s = panelSchedule(sheet, 'panel', null)!;
    const row = s.rows[0];
    expect(circuitEditWrites(sheet, s.phases, row, { powerFactor: 1.2 })).toEqual({ ok: false, message: 'The power factor must be above 0 and at most 1' });
    expect(circuitEditWrites(sheet, s.phases, row, { phases: ['A', 'B'] })).toMatchObject({ ok: false, message: 'A line-to-neutral circuit takes 1 phase' });
    expect(circuitEditWrites(sheet, s.phases, row, { amount: -1 })).toMatchObject({ ok: false });
    expect(circuitEditWrites(sheet, s.phases, row, { description: '  ' })).toMatchObject({ ok: false });
  });

  it('changes the phases on the connection from the bars, straight or through a breaker', () => {
    const sheet = fixture('larkspur-row.json');
    const s = panelSchedule(sheet, 'cafe-panel', null)!;
    const small = sheetOf(smallSystem());
    const sc = panelSchedule(small, 'panel', null)!;
    const made = circuitEditWrites(small, sc.phases, sc.rows.find((r) => r.loadId === 'la')!, { phases: ['C'] });
    expect(made).toEqual({ ok: true, edits: [{ where: 'connections', id: 'c3', changes: [{ path: ['conductorMap'], value: { N: 'N', C: 'A' } }] }] });
    // through a branch breaker, the phases are chosen where the breaker takes them from the bars
    const row = s.rows.find((r) => r.loadId === 'espresso')!;
    const through = circuitEditWrites(sheet, s.phases, row, { phases: ['B', 'C'] });
    expect(through).toEqual({ ok: true, edits: [{ where: 'connections', id: 'c-espresso', changes: [{ path: ['conductorMap'], value: { B: 'A', C: 'B' } }] }] });
  });
});
