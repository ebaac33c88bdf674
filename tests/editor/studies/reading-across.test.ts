// What a reading tapped on the drawing can be across: only the bars the bus has (a 208Y/120 service with its ground
// bar, a 120/240 apartment panel, a panel without a neutral), the default pair, a three-element load's elements,
// and changing an entry's bars after adding it (its point and its words follow; a choice its element does not
// offer changes nothing). The pairs offered are the ones the solver takes: each one is matched on a small system.
import { describe, expect, it } from 'vitest';
import { busSchema, readSheet, type SheetElement } from '../../../shared/sheet';
import { readingsMatchSync, type ReadingPoint } from '../../../solver';
import { acrossAt, busAcross, defaultPointAt } from '../../../editor/studies/reading-across';
import { chooseAcross, pointWords, readingRows, toReadings, withPoint, type ReadingEntry } from '../../../editor/studies/readings-entry';
import { demoSheet } from '../support/fixtures';
import { smallSystem } from '../support/small-system';

const sheet = demoSheet('larkspur-row.json');
const nameOf = (id: string) => sheet.elements[id]?.name || id;
const labels = (element: SheetElement) => Object.fromEntries(acrossAt(element).map((g) => [g.kind, g.choices.map((c) => c.label)]));

describe('the bars a bus offers', () => {
  it('a 208Y/120 four-wire service with a ground bar: every phase to N, the three phase pairs, to PE and to earth', () => {
    expect(labels(sheet.elements.service)).toEqual({
      neutral: ['A–N', 'B–N', 'C–N'],
      phases: ['A–B', 'B–C', 'C–A'],
      ground: ['A–PE', 'B–PE', 'C–PE', 'N–PE'],
      earth: ['A–earth', 'B–earth', 'C–earth', 'N–earth', 'PE–earth'],
    });
    expect(defaultPointAt(sheet.elements.service)).toEqual({ kind: 'bus', busId: 'service', from: 'A', to: 'N' });
  });

  it('a 120/240 split-phase apartment panel: no C anywhere, one phase pair', () => {
    const apt = sheet.elements['apt-4'];
    expect(labels(apt)).toEqual({
      neutral: ['A–N', 'B–N'],
      phases: ['A–B'],
      ground: ['A–PE', 'B–PE', 'N–PE'],
      earth: ['A–earth', 'B–earth', 'N–earth', 'PE–earth'],
    });
    expect(defaultPointAt(apt)).toEqual({ kind: 'bus', busId: 'apt-4', from: 'A', to: 'N' });
  });

  it('a three-wire panel without neutral or ground bar: phase pairs and earth only, A–earth by default', () => {
    const mcc = busSchema.parse({ kind: 'bus', id: 'mcc', name: 'Motor panel', neutralBar: false, groundBar: false }) as SheetElement;
    expect(labels(mcc)).toEqual({ phases: ['A–B', 'B–C', 'C–A'], earth: ['A–earth', 'B–earth', 'C–earth'] });
    expect(defaultPointAt(mcc)).toEqual({ kind: 'bus', busId: 'mcc', from: 'A', to: 'earth' });
  });

  it('a bus without phase A starts at its first phase', () => {
    expect(busAcross('x', ['B', 'C', 'N'])[0].choices.map((c) => c.key)).toEqual(['B-N', 'C-N']);
    const bc = busSchema.parse({ kind: 'bus', id: 'bc', phaseA: false, groundBar: false }) as SheetElement;
    expect(defaultPointAt(bc)).toEqual({ kind: 'bus', busId: 'bc', from: 'B', to: 'N' });
  });
});

describe('a load of more than one element', () => {
  it('a delta elevator machine offers its three elements and names the first by default; a one-element load offers none', () => {
    expect(labels(sheet.elements.elevator)).toEqual({ element: ['A–B', 'B–C', 'C–A'] });
    expect(defaultPointAt(sheet.elements.elevator)).toEqual({ kind: 'load', loadId: 'elevator', element: 'A–B' });
    expect(acrossAt(sheet.elements['apt-4-lights'])).toEqual([]);
    expect(defaultPointAt(sheet.elements['apt-4-lights'])).toEqual({ kind: 'load', loadId: 'apt-4-lights' });
  });
});

describe('changing an entry’s bars', () => {
  const entry = (id: string, point: ReadingPoint): ReadingEntry => ({ id, point, where: pointWords(point, nameOf), voltsText: '121' });
  const entries = [entry('r1', defaultPointAt(sheet.elements['apt-4'])!), entry('r2', defaultPointAt(sheet.elements.elevator)!)];

  it('moves the point and the words, and leaves the other entries alone', () => {
    expect(entries[0].where).toBe('Apartment 4 A–N');
    const next = chooseAcross(entries, 'r1', 'B-N', sheet.elements, nameOf);
    expect(next[0]).toEqual({ id: 'r1', point: { kind: 'bus', busId: 'apt-4', from: 'B', to: 'N' }, where: 'Apartment 4 B–N', voltsText: '121' });
    expect(next[1]).toBe(entries[1]);
    const earth = chooseAcross(next, 'r1', 'N-earth', sheet.elements, nameOf);
    expect(earth[0].where).toBe('Apartment 4 N–earth');
    const element = chooseAcross(entries, 'r2', 'C–A', sheet.elements, nameOf);
    expect(element[1].point).toEqual({ kind: 'load', loadId: 'elevator', element: 'C–A' });
    expect(element[1].where).toBe('Elevator machine C–A');
    expect(toReadings(element).ok && toReadings(element)).toMatchObject({ readings: [{ at: entries[0].point }, { at: { element: 'C–A' } }] });
  });

  it('refuses a pair the bus does not have (no C bar on a 120/240 panel) and a key of another element', () => {
    expect(chooseAcross(entries, 'r1', 'C-N', sheet.elements, nameOf)).toEqual(entries);
    expect(chooseAcross(entries, 'r1', 'B–C', sheet.elements, nameOf)).toEqual(entries);
  });

  it('shows each row’s choices with the chosen one, and says so when the bus loses the chosen bar', () => {
    const rows = readingRows([withPoint(entries[0], { kind: 'bus', busId: 'apt-4', from: 'B', to: 'N' }, nameOf)], sheet.elements);
    expect(rows[0]).toMatchObject({ at: 'Apartment 4', chosen: 'B-N', problem: null });
    expect(rows[0].across.map((g) => g.kind)).toEqual(['neutral', 'phases', 'ground', 'earth']);
    const noNeutral = { ...sheet.elements, 'apt-4': { ...sheet.elements['apt-4'], neutralBar: false } as SheetElement };
    const stale = readingRows(rows.map((r) => r.entry), noNeutral);
    expect(stale[0].problem).toBe('Apartment 4 has no B–N now: choose the bars again');
    expect(stale[0].across.map((g) => g.kind)).toEqual(['phases', 'ground', 'earth']);
    const gone = readingRows(rows.map((r) => r.entry), {});
    expect(gone[0].problem).toBe('no bus "apt-4" on the sheet now');
  });

  it('a pasted load reading without an element is shown across the load’s first element', () => {
    const rows = readingRows([entry('r3', { kind: 'load', loadId: 'elevator' })], sheet.elements);
    expect(rows[0]).toMatchObject({ chosen: 'A–B', problem: null });
  });
});

describe('the pairs offered are the ones the solver takes', () => {
  const read = readSheet(smallSystem());
  if (!read.ok) throw new Error(JSON.stringify(read.issues));
  const small = read.sheet;

  it('every pair offered on the small 208Y/120 panel is matched without a complaint', () => {
    const points = acrossAt(small.elements.panel).flatMap((g) => g.choices.map((c) => c.point));
    expect(points).toHaveLength(15);
    for (const at of points) {
      const out = readingsMatchSync(small, [{ at, volts: 120 }], { causes: { openings: false, degradations: false } });
      expect(out.ok, `${JSON.stringify(at)}: ${out.ok ? '' : out.error.message}`).toBe(true);
    }
  });

  it('a bar the panel does not have is refused by the solver, so offering only real bars matters', () => {
    const noC = { ...small, elements: { ...small.elements, panel: { ...small.elements.panel, phaseC: false } as SheetElement } };
    expect(acrossAt(noC.elements.panel).flatMap((g) => g.choices.map((c) => c.key))).not.toContain('C-N');
    const out = readingsMatchSync(noC, [{ at: { kind: 'bus', busId: 'panel', from: 'C', to: 'N' }, volts: 120 }], { causes: { openings: false, degradations: false } });
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.error.message).toContain('has no C bar');
  });
});
