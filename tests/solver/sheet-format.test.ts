// The sheet format, version 1: defaults, validation with paths, dangling references as warnings, migration.
import { describe, expect, it } from 'vitest';
import {
  migrateSheet,
  readSheet,
  SHEET_FORMAT_VERSION,
  terminalConductors,
  validateSheet,
  type Sheet,
} from '../../shared/sheet';
import { SheetBuilder, customRun } from './helpers/sheet-builder';

const minimal = () =>
  new SheetBuilder('minimal')
    .source('src', { nominalVolts: 208 })
    .bus('svc', { role: 'service', neutralGroundBond: true })
    .connect('src', 'out', 'svc', 'bars', ['A', 'B', 'C', 'N'], 'c-src');

describe('sheet format v1: defaults', () => {
  it('fills the settings the issue names with their defaults', () => {
    // source: the issue (60 Hz, ANSI C84.1, North American colours, switch at 0.7 of rating)
    const sheet = minimal().sheet();
    expect(sheet.formatVersion).toBe(SHEET_FORMAT_VERSION);
    expect(sheet.settings).toMatchObject({
      frequencyHz: 60,
      voltageStandard: 'ansi-c84.1',
      phaseColors: 'north-american',
      lowVoltageSwitchFraction: 0.7,
    });
  });

  it('gives elements sensible defaults for the fields later issues need', () => {
    // common practice, no source: 75 °C insulation, 30 °C ambient (NEC 310.16 basis), PVC raceway, one set
    const sheet = minimal()
      .run('r', { lengthFt: 50, conductors: { A: { size: '4/0' }, N: { size: '4/0' } } })
      .breaker('cb')
      .load('l', { ratedVolts: 120, kw: 1 })
      .sheet();
    const run = sheet.elements.r;
    if (run.kind !== 'run') throw new Error('expected a run');
    expect(run).toMatchObject({ insulationTempC: 75, ambientC: 30, raceway: 'pvc', parallelSets: 1, impedanceFrom: 'nec-table9' });
    expect(run.conductors.A).toMatchObject({ material: 'copper', open: false });
    expect(sheet.elements.cb).toMatchObject({ poleA: 'closed', poleB: 'closed', poleC: 'closed', interruptingKa: 10 });
    expect(sheet.elements.l).toMatchObject({ connection: 'line-to-neutral', powerFactor: 1, givenAs: 'kw', x: 0, y: 0, rotationDeg: 0 });
  });

  it('accepts 50 Hz and IEC 60038, and rejects other frequencies with the path', () => {
    const ok = validateSheet({ ...minimal().json(), settings: { frequencyHz: 50, voltageStandard: 'iec-60038', phaseColors: 'iec-60445' } });
    expect(ok.ok).toBe(true);
    const bad = validateSheet({ ...minimal().json(), settings: { frequencyHz: 55 } });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.issues[0].path).toBe('settings.frequencyHz');
  });
});

describe('sheet format v1: validation', () => {
  it('reports every bad field with its path', () => {
    const json = minimal()
      .run('r', { lengthFt: -3, conductors: { A: { size: '4/0' }, N: {} } })
      .load('l', { ratedVolts: 120, kw: 1, powerFactor: 1.2 })
      .json();
    const v = validateSheet(json);
    expect(v.ok).toBe(false);
    if (v.ok) return;
    const paths = v.issues.map((i) => i.path);
    expect(paths).toContain('elements.r.lengthFt');
    expect(paths).toContain('elements.r.conductors.N.size');
    expect(paths).toContain('elements.l.powerFactor');
    expect(v.issues.find((i) => i.path === 'elements.r.lengthFt')!.elementId).toBe('r');
  });

  it('rejects an id that differs from its key, an unknown kind and an unknown conductor', () => {
    const json = minimal().json() as { elements: Record<string, unknown>; connections: Record<string, unknown> };
    json.elements.other = { kind: 'bus', id: 'not-other' };
    json.elements.weird = { kind: 'generator', id: 'weird' };
    (json.connections['c-src'] as { conductorMap: Record<string, string> }).conductorMap = { A: 'A', X: 'B' };
    const v = validateSheet(json);
    expect(v.ok).toBe(false);
    if (v.ok) return;
    const paths = v.issues.map((i) => i.path);
    expect(paths).toContain('elements.other.id');
    expect(paths).toContain('elements.weird.kind');
    expect(paths.some((p) => p.startsWith('connections.c-src.conductorMap'))).toBe(true);
  });

  it('checks the cross-field rules: strength data, vector group, two conductors onto one', () => {
    const v = validateSheet(
      new SheetBuilder()
        .source('s', { nominalVolts: 480, strength: 'fault-current' })
        .transformer('t', { connection: 'delta-delta', vectorGroup: 'Dyn1', kva: 75, primaryVolts: 480, secondaryVolts: 240 })
        .bus('b')
        .connect('s', 'out', 'b', 'bars', { A: 'A', B: 'A' })
        .json(),
    );
    expect(v.ok).toBe(false);
    if (v.ok) return;
    expect(v.issues.map((i) => i.path)).toEqual(
      expect.arrayContaining(['elements.s.faultCurrentKa', 'elements.t.vectorGroup', 'connections.c1.conductorMap']),
    );
  });

  it('keeps the explicit conductor map of a connection (an apartment fed from A and C)', () => {
    // source: the issue's example (an apartment panel's two bus bars fed from phases A and C)
    const sheet = minimal()
      .bus('apt', { phaseC: false })
      .connect('svc', 'bars', 'apt', 'bars', { A: 'A', C: 'B', N: 'N' }, 'feed')
      .sheet();
    expect(sheet.connections.feed.conductorMap).toEqual({ A: 'A', C: 'B', N: 'N' });
    expect(terminalConductors(sheet.elements.apt, 'bars')).toEqual(['A', 'B', 'N', 'PE']);
  });
});

describe('sheet format v1: dangling references', () => {
  it('reads a sheet whose connection and what-if name deleted elements, with warnings naming them', () => {
    const json = minimal()
      .run('r', customRun(100, { A: [0.1, 0.05], N: [0.1, 0.05] }))
      .connect('svc', 'bars', 'gone', 'bars', ['A'], 'c-gone')
      .connect('svc', 'bars', 'r', 'middle', ['A'], 'c-terminal')
      .connect('svc', 'bars', 'r', 'from', { B: 'B' }, 'c-conductor')
      .whatIf('w', { x: { kind: 'open-conductor', runId: 'deleted-run', conductor: 'N' } })
      .json();
    const read = readSheet(json);
    expect(read.ok).toBe(true);
    if (!read.ok) return;
    const messages = read.warnings.map((w) => w.message).join('\n');
    expect(messages).toMatch(/connection c-gone: .*gone does not exist/);
    expect(messages).toMatch(/run r has no terminal 'middle'/);
    expect(messages).toMatch(/connection c-conductor: run r 'from' has no B conductor/);
    expect(messages).toMatch(/what-if w: run deleted-run does not exist/);
    expect(read.warnings.map((w) => w.elementId)).toEqual(expect.arrayContaining(['c-gone', 'c-terminal', 'c-conductor', 'w']));
  });
});

describe('migration', () => {
  // A hand-made document in the first draft format (version 0): arrays of items and wires, terse names.
  const version0 = {
    version: 0,
    title: 'Old farm sketch',
    hz: 60,
    standard: 'ansi',
    items: [
      { id: 'util', type: 'source', label: 'Utility', kv: 0.24, pos: [10, 20] },
      { id: 'main', type: 'panel', label: 'Main', phases: 'ABN', service: true, bonded: true, pos: [40, 20] },
      { id: 'drop', type: 'cable', label: 'Drop', lengthFeet: 120, conductorSize: '2/0', neutralSize: '1/0', material: 'al', phases: 'ABN' },
      { id: 'barn', type: 'panel', label: 'Barn', phases: 'ABN' },
      { id: 'heater', type: 'load', label: 'Heater', kw: 3, pf: 1, volts: 240, wiring: 'll' },
      { id: 'rod', type: 'ground-rod', ohms: 25 },
    ],
    wires: [
      { id: 'w1', a: 'util/out', b: 'main/bus', phases: 'ABN' },
      { id: 'w2', a: 'main/bus', b: 'drop/a', phases: 'ABN' },
      { id: 'w3', a: 'drop/b', b: 'barn/bus', phases: 'ABN' },
      { id: 'w4', a: 'barn/bus', b: 'heater/in', phases: 'AB' },
      { id: 'w5', a: 'rod/rod', b: 'main/bus', phases: 'PE' },
    ],
  };

  it('migrates a version 0 document to a valid version 1 sheet', () => {
    const migrated = migrateSheet(version0);
    expect(migrated.ok).toBe(true);
    if (!migrated.ok) return;
    expect(migrated.fromVersion).toBe(0);
    const v = validateSheet(migrated.document);
    if (!v.ok) throw new Error(v.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    const sheet: Sheet = v.sheet;
    expect(sheet.name).toBe('Old farm sketch');
    expect(sheet.elements.drop).toMatchObject({
      kind: 'run',
      lengthFt: 120,
      conductors: { A: { size: '2/0', material: 'aluminum' }, B: { size: '2/0' }, N: { size: '1/0' } },
    });
    expect(sheet.elements.main).toMatchObject({ kind: 'bus', role: 'service', neutralGroundBond: true, phaseC: false });
    expect(sheet.elements.heater).toMatchObject({ kind: 'load', connection: 'line-to-line', ratedVolts: 240, kw: 3 });
    expect(sheet.elements.util).toMatchObject({ kind: 'source', nominalVolts: 240, x: 10, y: 20 });
    expect(sheet.connections.w2).toMatchObject({ from: { elementId: 'main', terminal: 'bars' }, to: { elementId: 'drop', terminal: 'from' } });
    expect(sheet.connections.w5.conductorMap).toEqual({ PE: 'PE' });
  });

  it('readSheet migrates on read and says from which version', () => {
    const read = readSheet(version0);
    expect(read.ok).toBe(true);
    if (read.ok) expect(read.migratedFrom).toBe(0);
  });

  it('leaves a version 1 document alone and refuses unknown versions', () => {
    const json = minimal().json();
    const same = migrateSheet(json);
    expect(same.ok && same.steps).toBe(0);
    const future = migrateSheet({ ...json, formatVersion: 7 });
    expect(future.ok).toBe(false);
    if (!future.ok) expect(future.issues[0].message).toMatch(/format version 7 is not known/);
    const none = migrateSheet({ elements: {} });
    expect(none.ok).toBe(false);
  });

  it('reports a broken version 0 document instead of throwing', () => {
    const broken = migrateSheet({ ...version0, wires: [{ id: 'w', a: 'nothing', b: 'main/bus' }] });
    expect(broken.ok).toBe(false);
    if (!broken.ok) expect(broken.issues[0].message).toMatch(/item\/terminal/);
  });
});
