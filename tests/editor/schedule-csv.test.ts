// Panel schedule CSV imports: a good file becomes the right circuits, placed under the panel and connected in one
// transaction that solves; bad files (missing columns, bad numbers, unknown phases, an empty file, a 5 MB file)
// report every bad row with its line and reason, and nothing is half-imported.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { solveSheet } from '../../solver';
import { SheetCommands } from '../../editor/document/commands';
import { docFromSheet, docToJson, readDoc } from '../../editor/document/sheet-doc';
import { createUndoManager } from '../../editor/document/undo';
import { MAX_CSV_BYTES, readScheduleCsv, type PanelTarget } from '../../editor/schedule/schedule-csv';
import { placeCircuits } from '../../editor/schedule/place-circuits';
import { panelSchedule } from '../../editor/schedule/panel-schedule';

const PANEL_208: PanelTarget = { phases: ['A', 'B', 'C'], hasNeutral: true, lineToNeutralVolts: 120, lineToLineVolts: 208 };

const GOOD = [
  'Circuit,Description,Phases,Load,Power factor,Behaviour,Kind,Breaker',
  '1,Office lighting,A,1.2 kW,0.95,current,lighting,20',
  '3,Copier and printers,B,1500 W,0.9,,electronics,20 A',
  '5,Break room receptacles,C,12 A,0.95,by kind,receptacles,20',
  '"2,4",Rooftop unit,ABC,6 kVA,85 %,power,motor,30',
  '6,Water heater,BC,4.5,1,impedance,heating,',
].join('\n');

function fixture(name: string): Sheet {
  const read = readSheet(JSON.parse(readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error('bad fixture');
  return read.sheet;
}

describe('reading a panel schedule CSV', () => {
  it('reads a good file into circuits with their phases, amounts, units and behaviour', () => {
    const r = readScheduleCsv(GOOD, PANEL_208);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.circuits).toHaveLength(5);
    const [light, copier, recept, rtu, heater] = r.circuits;
    expect(light).toMatchObject({ line: 2, circuit: '1', phases: ['A'], connection: 'line-to-neutral', givenAs: 'kw', kw: 1.2, powerFactor: 0.95, behaviour: 'current', loadKind: 'lighting', breakerAmperes: 20, ratedVolts: 120 });
    expect(copier).toMatchObject({ kw: 1.5, powerFactor: 0.9, behaviour: 'by-kind', breakerAmperes: 20 }); // 1500 W
    expect(recept).toMatchObject({ givenAs: 'amperes', amperes: 12, kw: 0 });
    // 6 kVA at 0.85 is 5.1 kW; "2,4" quoted keeps its comma; ABC is a three-phase delta load at 208 V line-to-line
    expect(rtu).toMatchObject({ line: 5, circuit: '2,4', phases: ['A', 'B', 'C'], connection: 'three-phase-delta', powerFactor: 0.85, ratedVolts: 208 });
    expect(rtu.kw).toBeCloseTo(5.1, 12);
    expect(heater).toMatchObject({ phases: ['B', 'C'], connection: 'line-to-line', kw: 4.5, behaviour: 'impedance', ratedVolts: 208 });
    expect(heater.breakerAmperes).toBeUndefined();
  });

  it('matches headers without regard to case, spaces and aliases, reads semicolons, and reports columns it ignores', () => {
    const r = readScheduleCsv('CIRCUIT;description;PHASES;load;PF;Notes\n7;Sign;A-N;0.3;0,9;outside\n', PANEL_208);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.circuits[0]).toMatchObject({ circuit: '7', phases: ['A'], kw: 0.3, powerFactor: 0.9 });
    expect(r.ignoredColumns).toEqual(['Notes']);
  });

  it('reports missing columns on the header line and reads no rows', () => {
    const r = readScheduleCsv('circuit,description,load\n1,Lights,1.2\n', PANEL_208);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fileProblems).toEqual(['line 1: missing column phases (the header row needs circuit, description, phases, load)']);
    expect(r.rows).toEqual([]);
  });

  it('reports every bad number and unknown phase with its line number, not only the first', () => {
    const csv = [
      'circuit,description,phases,load,power factor,breaker',
      '1,Lights,A,1.2,0.95,20', // line 2: good
      '', // line 3: blank, skipped but counted
      '3,Receptacles,B,lots,0.95,20', // line 4: bad load
      '5,Fans,D,0.8,1.4,20', // line 5: unknown phase and a bad power factor
      '7,Sign,C,0.3,1,twenty', // line 6: bad breaker
      '"9","Heater with a long',
      'name",AB,2,1,', // lines 7–8: one record over two lines, good
      '11,Pump,Q,-1,1,', // line 9: unknown phases and a negative load
      '1,Duplicate,C,0.5,1,', // line 10: circuit 1 again
    ].join('\n');
    const r = readScheduleCsv(csv, PANEL_208);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    const where = r.problems.map((p) => `${p.line}:${p.column ?? ''}`);
    expect(where).toEqual(['4:load', '5:phases', '5:power factor', '6:breaker', '9:phases', '9:load', '10:circuit']);
    expect(r.problems.find((p) => p.line === 5 && p.column === 'phases')!.message).toBe('unknown phases "D" (use A, B, C, AB, BC, CA, ABC or ABCN)');
    expect(r.problems.find((p) => p.line === 4)!.message).toBe('"lots" is not a load (a number with kW, W, kVA, VA or A)');
    expect(r.problems.find((p) => p.line === 10)!.message).toBe('circuit 1 is also on line 2');
    // the good rows are in the preview, marked good, but nothing is offered for import
    expect(r.rows.filter((row) => row.circuit !== null).map((row) => row.line)).toEqual([2, 7]);
    expect('circuits' in r).toBe(false);
  });

  it('reports a row with too few cells', () => {
    const r = readScheduleCsv('circuit,description,phases,load\n1,Lights\n', PANEL_208);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems).toEqual([{ line: 2, message: 'the row has 2 of 4 columns: no phases, load' }]);
  });

  it('checks rows against the panel: phases it lacks, a neutral it lacks, circuits it has, a voltage it does not know yet', () => {
    const apartment: PanelTarget = { phases: ['A', 'B'], hasNeutral: true, lineToNeutralVolts: 120, lineToLineVolts: 208, existingCircuits: new Map([['1', 'Lighting']]) };
    const r = readScheduleCsv('circuit,description,phases,load\n1,Lamp,A,0.1\n2,Dryer,BC,5\n3,Oven,ABC,8\n', apartment);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => [p.line, p.message])).toEqual([
      [2, 'circuit 1 is already on the panel (Lighting)'],
      [3, 'the panel has no phase C'],
      [4, 'the panel has no phase C'],
    ]);
    const delta: PanelTarget = { phases: ['A', 'B', 'C'], hasNeutral: false };
    const d = readScheduleCsv('circuit,description,phases,load\n1,Lamp,A,0.1\n2,Motor,ABC,5\n3,Heater,ABC,5,\n', delta);
    expect(d.ok).toBe(false);
    if (d.ok) return;
    expect(d.problems.map((p) => [p.line, p.column, p.message])).toEqual([
      [2, 'phases', 'the panel has no neutral bar for a line-to-neutral load'],
      [2, 'volts', 'volts is needed: the panel’s voltage is not known until the sheet solves'],
      [3, 'volts', 'volts is needed: the panel’s voltage is not known until the sheet solves'],
      [4, undefined, 'the row has 5 columns, the header 4'],
    ]);
  });

  it('an empty file, a file of blank lines and a header alone are reported as such', () => {
    for (const empty of ['', '\n\n  \n', '\uFEFF']) {
      const r = readScheduleCsv(empty, PANEL_208);
      expect(r).toMatchObject({ ok: false, fileProblems: ['the file is empty: it needs a header row and at least one circuit'] });
    }
    expect(readScheduleCsv('circuit,description,phases,load\n', PANEL_208)).toMatchObject({ ok: false, fileProblems: ['the file has a header row but no circuits'] });
  });

  it('refuses a 5 MB file before reading it', () => {
    const row = '1,Lights,A,1.2,0.95\n';
    const big = 'circuit,description,phases,load,power factor\n' + row.repeat(Math.ceil(5_000_000 / row.length));
    expect(big.length).toBeGreaterThan(5_000_000);
    const r = readScheduleCsv(big, PANEL_208);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fileProblems).toHaveLength(1);
    expect(r.fileProblems[0]).toMatch(/^the file is too large: 5\.0 MB, at most 1 MB/);
    expect(r.rows).toEqual([]);
    expect(MAX_CSV_BYTES).toBe(1_000_000);
  });

  it('refuses more circuits than a panel can hold even under the size limit', () => {
    const rows = Array.from({ length: 501 }, (_, i) => `${i + 1},Load ${i + 1},A,0.1`).join('\n');
    const r = readScheduleCsv(`circuit,description,phases,load\n${rows}`, PANEL_208);
    expect(r).toMatchObject({ ok: false, fileProblems: ['the file has 501 circuits, at most 500'] });
  });
});

describe('placing imported circuits under a panel', () => {
  it('adds every load (and breaker) connected on its phases, in one transaction, and the sheet solves', () => {
    const sheet = fixture('larkspur-row.json');
    const doc = docFromSheet(sheet);
    const cmd = new SheetCommands(doc);
    const undo = createUndoManager(doc, cmd.origin);
    // the house panel's own circuits are numbered 1 to 10: these go in as 11 and up
    const r = readScheduleCsv(GOOD.replace(/^1,/m, '11,').replace(/^3,/m, '13,').replace(/^5,/m, '15,').replace('"2,4"', '"12,14"').replace(/^6,/m, '16,'), PANEL_208);
    if (!r.ok) throw new Error('good file refused');
    const before = JSON.stringify(docToJson(doc));
    const placement = placeCircuits(sheet, 'house-panel', r.circuits);
    // five loads, four breakers (the water heater has no rating), nine plus four connections
    expect(placement.elements.filter((e) => e.kind === 'load')).toHaveLength(5);
    expect(placement.elements.filter((e) => e.kind === 'breaker')).toHaveLength(4);
    expect(placement.connections).toHaveLength(9);
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    cmd.insertEntries(placement);
    expect(transactions).toBe(1);
    const read = readDoc(doc);
    if (!read.ok) throw new Error(read.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
    expect(read.warnings).toEqual([]);
    // under the panel, below its existing loads
    const panel = read.sheet.elements['house-panel'];
    const houseLoads = ['corridor-lights', 'exterior-lights', 'laundry-receptacles', 'elevator', 'boiler-pumps'];
    const lowestBefore = Math.max(...houseLoads.map((id) => sheet.elements[id].y));
    for (const e of placement.elements) expect(e.y as number).toBeGreaterThan(Math.max(panel.y, lowestBefore));
    // the schedule now lists them with their written circuits and phases
    const schedule = panelSchedule(read.sheet, 'house-panel', null)!;
    const placedLoads = new Set(placement.elements.filter((e) => e.kind === 'load').map((e) => e.id));
    const imported = schedule.rows.filter((row) => placedLoads.has(row.loadId));
    expect(imported.map((row) => [row.circuit, row.phases.join('')])).toEqual([
      ['11', 'A'],
      ['12,14', 'ABC'],
      ['13', 'B'],
      ['15', 'C'],
      ['16', 'BC'],
    ]);
    expect(imported.find((row) => row.circuit === '11')!.breaker).toMatchObject({ ratingAmperes: 20 });
    const solved = solveSheet(read.sheet);
    expect(solved.ok).toBe(true);
    if (solved.ok) {
      const withResults = panelSchedule(read.sheet, 'house-panel', solved.result)!;
      expect(withResults.rows.find((row) => row.circuit === '11')!.breaker!.amperes!).toBeGreaterThan(9); // 1.2 kW at ~120 V
    }
    undo.undo();
    expect(JSON.stringify(docToJson(doc))).toBe(before);
  });

  it('a two-phase apartment panel takes a line-to-line load on A and B', () => {
    const sheet = fixture('larkspur-row.json');
    const r = readScheduleCsv('circuit,description,phases,load,volts\n9,Dryer,AB,5,208\n', { phases: ['A', 'B'], hasNeutral: true });
    if (!r.ok) throw new Error(JSON.stringify(r));
    const placed = placeCircuits(sheet, 'apt-1', r.circuits);
    expect(placed.connections).toEqual([expect.objectContaining({ from: { elementId: 'apt-1', terminal: 'bars' }, conductorMap: { A: 'A', B: 'B' } })]);
  });
});
