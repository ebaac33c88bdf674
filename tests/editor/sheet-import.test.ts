// Importing a sheet from our JSON format into an open sheet: export then import gives the same document, an old
// version is migrated, problems come back with their paths, and the replacement is one undoable transaction.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { SheetCommands } from '../../editor/document/commands';
import { docFromSheet, docToJson, readDoc } from '../../editor/document/sheet-doc';
import { createUndoManager } from '../../editor/document/undo';
import { readSheetImport } from '../../editor/import/sheet-import';

const farmText = readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', 'farm.json'), 'utf8');
const larkspurText = readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', 'larkspur-row.json'), 'utf8');

describe('reading a sheet to import', () => {
  it('export then import gives the same document', () => {
    const first = readSheetImport(larkspurText);
    if (!first.ok) throw new Error('fixture refused');
    const doc = new Y.Doc();
    new SheetCommands(doc).replaceSheet(first.sheet);
    // Exported as the server does, under the sheet list's name (the document holds none of its own).
    const exported = JSON.stringify(docToJson(doc, first.sheet.name), null, 2);
    const again = readSheetImport(exported);
    if (!again.ok) throw new Error('export refused');
    expect(again.sheet).toEqual(first.sheet);
    const doc2 = new Y.Doc();
    new SheetCommands(doc2).replaceSheet(again.sheet);
    expect(docToJson(doc2)).toEqual(docToJson(doc));
    expect(first.summary).toMatchObject({ name: 'Larkspur Row', whatIfs: Object.keys(JSON.parse(larkspurText).whatIfs).length });
  });

  it('migrates a version 0 document and says so', () => {
    const v0 = {
      version: 0,
      title: 'Old shed sketch',
      items: [
        { id: 'util', type: 'source', label: 'Utility', kv: 0.24, pos: [0, 0] },
        { id: 'shed', type: 'panel', label: 'Shed', phases: 'ABN', service: true, bonded: true, pos: [0, 100] },
        { id: 'heater', type: 'load', label: 'Heater', kw: 3, pf: 1, volts: 240, wiring: 'll', pos: [0, 200] },
      ],
      wires: [
        { id: 'w1', a: 'util/out', b: 'shed/bus', phases: 'ABN' },
        { id: 'w2', a: 'shed/bus', b: 'heater/in', phases: 'AB' },
      ],
    };
    const r = readSheetImport(JSON.stringify(v0));
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.migratedFrom).toBe(0);
    expect(r.sheet.formatVersion).toBe(1);
    expect(r.sheet.elements.shed).toMatchObject({ kind: 'bus', role: 'service', neutralGroundBond: true });
  });

  it('gives every schema problem with its path', () => {
    const bad = JSON.parse(farmText);
    bad.elements['service-drop'].lengthFt = -5;
    bad.elements['well-pump'].powerFactor = 'high';
    const r = readSheetImport(JSON.stringify(bad));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.issues.map((i) => i.path).sort()).toEqual(['elements.service-drop.lengthFt', 'elements.well-pump.powerFactor']);
  });

  it('refuses text that is not JSON, an empty file, a newer version and a document with no version', () => {
    expect(readSheetImport('{"formatVersion": 1,')).toMatchObject({ ok: false, issues: [{ path: '', message: expect.stringMatching(/^not JSON/) }] });
    expect(readSheetImport('  ')).toEqual({ ok: false, issues: [{ path: '', message: 'the file is empty' }] });
    expect(readSheetImport('{"formatVersion": 7}')).toMatchObject({ ok: false, issues: [{ path: 'formatVersion', message: expect.stringContaining('newer') }] });
    expect(readSheetImport('{"name": "x"}')).toMatchObject({ ok: false, issues: [{ path: 'formatVersion' }] });
    expect(readSheetImport('[1, 2]')).toMatchObject({ ok: false, issues: [{ message: 'a sheet must be a JSON object' }] });
  });
});

describe('replacing the open sheet', () => {
  it('is one transaction, and one undo brings the old sheet back', () => {
    const farm = readSheetImport(farmText);
    const larkspur = readSheetImport(larkspurText);
    if (!farm.ok || !larkspur.ok) throw new Error('fixtures refused');
    const doc = docFromSheet(farm.sheet);
    const cmd = new SheetCommands(doc);
    const undo = createUndoManager(doc, cmd.origin);
    const before = docToJson(doc);
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    cmd.replaceSheet(larkspur.sheet);
    expect(transactions).toBe(1);
    const now = readDoc(doc);
    // Everything but the file's name, which is not kept: the sheet keeps the name its project's list gives it.
    expect(now.ok && now.sheet).toEqual({ ...larkspur.sheet, name: '' });
    expect(doc.getMap('sheet').has('name')).toBe(false);
    undo.undo();
    expect(docToJson(doc)).toEqual(before);
  });
});
