// The inspector's checks (numbers with units, schema rules placed under their fields) and the conductor matching
// when two terminals are connected.
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { elementView } from '../../editor/document/sheet-mirror';
import { fieldsFor, readValues } from '../../editor/inspector/fields';
import { checkForm } from '../../editor/inspector/form-check';
import { loadPhases, proposeConductorMap, withLoadPhases } from '../../editor/document/conductor-map';
import { smallSystem } from './support/small-system';

const sheetOf = (input = smallSystem()): Sheet => {
  const r = readSheet(input);
  if (!r.ok) throw new Error('bad');
  return r.sheet;
};

function edit(id: string, changes: Record<string, string | boolean>) {
  const sheet = sheetOf();
  const element = elementView(id, sheet.elements[id] as never);
  const defs = fieldsFor(element.kind);
  const initial = readValues(defs, element);
  return { result: checkForm(defs, { ...initial, ...changes }, initial, element), initial };
}

describe('inspector checks', () => {
  it('reads defaults through the schema and writes only changed fields, units converted', () => {
    const { result, initial } = edit('feeder', { lengthFt: '45 m', 'size-N': '2/0' });
    expect(initial).toMatchObject({ lengthFt: '50', 'has-N': true, 'size-phase': '4/0', material: 'copper', raceway: 'pvc' });
    expect(result).toEqual({
      ok: true,
      writes: [
        { path: ['lengthFt'], value: 45 / 0.3048 },
        { path: ['conductors', 'N', 'size'], value: '2/0' },
      ],
    });
  });

  it('says what is wrong with a number, under its field, and writes nothing', () => {
    const { result } = edit('la', { kw: '3 ft', powerFactor: '1.2' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.kw).toMatch(/not a power/);
    // the quantity reads, the schema refuses it: its message names the field's label
    expect(Object.keys(result.errors)).toEqual(['kw']);
    const second = edit('la', { powerFactor: '1.2' }).result;
    expect(second.ok).toBe(false);
    if (!second.ok) expect(second.errors.powerFactor).toBe('Power factor must be at most 1');
  });

  it('places a rule across fields under the field it needs', () => {
    const { result } = edit('src', { strength: 'fault-current' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors.faultCurrentKa).toBe('strength fault-current needs faultCurrentKa');
    const fixed = edit('src', { strength: 'fault-current', faultCurrentKa: '22000 A' }).result;
    expect(fixed).toEqual({ ok: true, writes: [{ path: ['strength'], value: 'fault-current' }, { path: ['faultCurrentKa'], value: 22 }] });
  });

  it('accepts an expression for a voltage', () => {
    expect(edit('la', { ratedVolts: '208/sqrt(3)' }).result).toMatchObject({ ok: true, writes: [{ path: ['ratedVolts'] }] });
  });
});

describe('conductor matching', () => {
  it('feeds line-to-neutral loads from the least-used phase of the bus, then lets the inspector move them', () => {
    const sheet = sheetOf();
    const load = { ...sheet.elements.la, id: 'lc', name: 'Load C' } as Sheet['elements'][string];
    const withLoad = { ...sheet, elements: { ...sheet.elements, lc: load } };
    // A and B each have one load already: the third goes on C
    const p = proposeConductorMap(withLoad, { element: load, terminal: 'supply' }, { element: sheet.elements.panel, terminal: 'bars' });
    expect(p).toEqual({ ok: true, conductorMap: { A: 'C', N: 'N' } });
    const c4 = sheet.connections.c4;
    expect(loadPhases(c4, 'lb')).toEqual(['B']);
    expect(withLoadPhases(c4, 'lb', ['C'])).toEqual({ N: 'N', C: 'A' });
  });

  it('matches conductors by name elsewhere and refuses ends that share none', () => {
    const sheet = sheetOf();
    const p = proposeConductorMap(sheet, { element: sheet.elements.src, terminal: 'out' }, { element: sheet.elements.feeder, terminal: 'from' });
    expect(p).toEqual({ ok: true, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N' } });
    const delta = { ...sheet.elements.src, id: 'd', system: 'three-phase-delta', grounding: 'ungrounded' } as Sheet['elements'][string];
    const rod = { kind: 'electrode', id: 'rod', name: 'Rod', ohms: 25, x: 0, y: 0, rotationDeg: 0 } as Sheet['elements'][string];
    const refused = proposeConductorMap(sheet, { element: delta, terminal: 'out' }, { element: rod, terminal: 'lead' });
    expect(refused.ok).toBe(false);
    if (!refused.ok) expect(refused.message).toMatch(/share no conductor/);
    expect(proposeConductorMap(sheet, { element: sheet.elements.la, terminal: 'supply' }, { element: sheet.elements.la, terminal: 'supply' }).ok).toBe(false);
  });
});
