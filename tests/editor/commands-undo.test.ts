// The sheet's commands and undo: new commands (duplicate, rotate, several fields at once), undo of whole gestures,
// and a colleague's edit that survives my undo (two documents synced in memory, as two browsers through the room).
import { describe, expect, it } from 'vitest';
import * as Y from 'yjs';
import { SheetCommands } from '../../editor/document/commands';
import { createUndoManager } from '../../editor/document/undo';
import { collection, docToJson, readDoc } from '../../editor/document/sheet-doc';
import { SheetMirror } from '../../editor/document/sheet-mirror';
import { SheetReader } from '../../editor/document/sheet-reader';
import { ELEMENT_KINDS, newElement, nextName } from '../../editor/document/element-defaults';

/** Two replicas that pass every update to each other at once (the room relays in the same way). */
function syncedPair() {
  const a = new Y.Doc();
  const b = new Y.Doc();
  a.on('update', (u: Uint8Array, origin: unknown) => origin !== 'remote' && Y.applyUpdate(b, u, 'remote'));
  b.on('update', (u: Uint8Array, origin: unknown) => origin !== 'remote' && Y.applyUpdate(a, u, 'remote'));
  return { a, b };
}

const el = (doc: Y.Doc, id: string) => docToJson(doc).elements as Record<string, Record<string, unknown>>;

describe('commands', () => {
  it('duplicates elements and the connections between them, offset, in one transaction', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    cmd.addElement({ kind: 'bus', id: 'p', name: 'Panel', x: 100, y: 100 });
    cmd.addElement({ kind: 'load', id: 'l', name: 'Load', x: 100, y: 200, ratedVolts: 120, kw: 1 });
    cmd.addElement({ kind: 'source', id: 's', name: 'Utility', x: 0, y: 0, nominalVolts: 208 });
    cmd.connect({ id: 'c1', from: { elementId: 'p', terminal: 'bars' }, to: { elementId: 'l', terminal: 'supply' }, conductorMap: { B: 'A', N: 'N' } });
    cmd.connect({ id: 'c2', from: { elementId: 's', terminal: 'out' }, to: { elementId: 'p', terminal: 'bars' }, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N' } });
    let transactions = 0;
    doc.on('afterTransaction', () => transactions++);
    const copies = cmd.duplicateElements(['p', 'l'], { dx: 40, dy: 20 });
    expect(transactions).toBe(1);
    expect(copies).toHaveLength(2);
    const json = docToJson(doc) as { elements: Record<string, any>; connections: Record<string, any> };
    expect(json.elements[copies[0]]).toMatchObject({ kind: 'bus', x: 140, y: 120, id: copies[0] });
    expect(json.elements[copies[1]]).toMatchObject({ kind: 'load', x: 140, y: 220, kw: 1 });
    const copied = Object.values(json.connections).filter((c) => c.from.elementId === copies[0]);
    expect(copied).toHaveLength(1);
    expect(copied[0]).toMatchObject({ to: { elementId: copies[1], terminal: 'supply' }, conductorMap: { B: 'A', N: 'N' } });
    // the source's connection reaches only the original panel: one end was not copied
    expect(Object.values(json.connections).filter((c) => c.from.elementId === 's')).toHaveLength(1);
    expect(readDoc(doc).ok).toBe(true);
  });

  it('rotates by quarter turns and wraps at 360', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    cmd.addElement({ kind: 'run', id: 'r', lengthFt: 50, conductors: { A: { size: '2' } }, rotationDeg: 270 });
    cmd.rotateElements(['r', 'missing']);
    expect(el(doc, 'r').r.rotationDeg).toBe(0);
    cmd.rotateElements(['r'], -90);
    expect(el(doc, 'r').r.rotationDeg).toBe(270);
  });

  it('sets several fields at once, nested paths included', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    cmd.addElement(newElement('run', { x: 0, y: 0 }, []));
    const id = [...collection(doc, 'elements').keys()][0];
    expect(cmd.updateFields('elements', id, [{ path: ['lengthFt'], value: 150 }, { path: ['conductors', 'N', 'open'], value: true }])).toBe(true);
    const run = el(doc, id)[id] as any;
    expect(run.lengthFt).toBe(150);
    expect(run.conductors.N).toEqual({ size: '4/0', open: true });
    expect(cmd.updateFields('elements', 'nope', [{ path: ['x'], value: 1 }])).toBe(false);
  });

  it('places every kind from the palette as a valid element with its own name', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    for (const kind of ELEMENT_KINDS) cmd.addElement(newElement(kind, { x: 0, y: 0 }, []));
    const read = readDoc(doc);
    expect(read.ok ? [] : read.issues).toEqual([]);
    expect(nextName('bus', ['Panel', 'Panel 2'])).toBe('Panel 3');
  });
});

describe('undo', () => {
  it('undoes a whole drag of several elements as one step, and redoes it', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    const undo = createUndoManager(doc, cmd.origin);
    cmd.addElement({ kind: 'bus', id: 'p1', x: 0, y: 0 });
    cmd.addElement({ kind: 'bus', id: 'p2', x: 0, y: 100 });
    cmd.moveElements([
      { id: 'p1', x: 40, y: 20 },
      { id: 'p2', x: 40, y: 120 },
    ]);
    undo.undo();
    const e = el(doc, '');
    expect([e.p1.x, e.p1.y, e.p2.x, e.p2.y]).toEqual([0, 0, 0, 100]);
    undo.redo();
    const r = el(doc, '');
    expect([r.p1.x, r.p2.y]).toEqual([40, 120]);
  });

  it('keeps quick successive commands as separate steps (no time-based merging)', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    const undo = createUndoManager(doc, cmd.origin);
    cmd.addElement({ kind: 'load', id: 'l', ratedVolts: 120, kw: 1 });
    cmd.setField('elements', 'l', ['kw'], 2);
    cmd.setField('elements', 'l', ['kw'], 3);
    undo.undo();
    expect(el(doc, 'l').l.kw).toBe(2);
    undo.undo();
    expect(el(doc, 'l').l.kw).toBe(1);
    undo.undo();
    expect(el(doc, 'l').l).toBeUndefined();
  });

  it("never undoes a colleague's edit: mine goes back, theirs stays", () => {
    const { a, b } = syncedPair();
    const mine = new SheetCommands(a);
    const theirs = new SheetCommands(b);
    const myUndo = createUndoManager(a, mine.origin);
    theirs.addElement({ kind: 'load', id: 'l', name: 'Café', ratedVolts: 120, kw: 1, x: 0, y: 0 });
    expect(myUndo.undoStack).toHaveLength(0); // a remote edit is not mine to undo
    mine.moveElements([{ id: 'l', x: 200, y: 80 }]);
    theirs.setField('elements', 'l', ['kw'], 4.5);
    theirs.setField('elements', 'l', ['name'], 'Café lights');
    myUndo.undo();
    for (const doc of [a, b]) {
      const l = el(doc, 'l').l;
      expect([l.x, l.y]).toEqual([0, 0]);
      expect(l.kw).toBe(4.5);
      expect(l.name).toBe('Café lights');
    }
    expect(myUndo.undoStack).toHaveLength(0);
  });

  it('undoes my delete of an element and its connections while a colleague edits another one', () => {
    const { a, b } = syncedPair();
    const mine = new SheetCommands(a);
    const theirs = new SheetCommands(b);
    const myUndo = createUndoManager(a, mine.origin);
    theirs.addElement({ kind: 'bus', id: 'p', x: 0, y: 0 });
    theirs.addElement({ kind: 'load', id: 'l', ratedVolts: 120, kw: 1 });
    theirs.connect({ id: 'c', from: { elementId: 'p', terminal: 'bars' }, to: { elementId: 'l', terminal: 'supply' }, conductorMap: { A: 'A', N: 'N' } });
    mine.deleteElements(['l']);
    theirs.setField('elements', 'p', ['name'], 'House panel');
    expect(Object.keys(docToJson(b).connections as object)).toEqual([]);
    myUndo.undo();
    const json = docToJson(b) as any;
    expect(json.elements.l).toMatchObject({ kind: 'load', kw: 1 });
    expect(json.connections.c).toMatchObject({ conductorMap: { A: 'A', N: 'N' } });
    expect(json.elements.p.name).toBe('House panel');
  });
});

describe('mirror and reader', () => {
  it('keeps unchanged entries identical and reports whether a change was local', () => {
    const { a, b } = syncedPair();
    const mine = new SheetCommands(a);
    const theirs = new SheetCommands(b);
    const mirror = new SheetMirror(a, (o) => o === mine.origin);
    mine.addElement({ kind: 'bus', id: 'p', x: 0, y: 0 });
    mine.addElement({ kind: 'load', id: 'l', ratedVolts: 120, kw: 1 });
    const before = mirror.current;
    const heard: boolean[] = [];
    mirror.subscribe((_s, change) => heard.push(change.local));
    theirs.setField('elements', 'l', ['kw'], 2);
    mine.moveElements([{ id: 'p', x: 20, y: 0 }]);
    const after = mirror.current;
    expect(heard).toEqual([false, true]);
    expect(after.elements.get('l')!.kw).toBe(2);
    expect(after.elements.get('p')!.x).toBe(20);
    expect(before.elements.get('l')).not.toBe(after.elements.get('l'));
    const s1 = mirror.current;
    theirs.setField('elements', 'l', ['kw'], 3);
    expect(mirror.current.elements.get('p')).toBe(s1.elements.get('p'));
  });

  it('leaves an invalid element out of the solve, names the field, and re-reads only what changed', () => {
    const doc = new Y.Doc();
    const cmd = new SheetCommands(doc);
    const mirror = new SheetMirror(doc);
    const reader = new SheetReader();
    cmd.addElement({ kind: 'load', id: 'good', ratedVolts: 120, kw: 1 });
    cmd.addElement({ kind: 'load', id: 'bad', ratedVolts: -5, kw: 1 });
    const first = reader.read(mirror.current);
    expect(Object.keys(first.sheet.elements)).toEqual(['good']);
    expect(first.invalid).toEqual([{ path: 'elements.bad.ratedVolts', message: 'ratedVolts must be greater than zero', elementId: 'bad' }]);
    const good = first.sheet.elements.good;
    cmd.setField('elements', 'bad', ['ratedVolts'], 120);
    const second = reader.read(mirror.current);
    expect(second.invalid).toEqual([]);
    expect(second.sheet.elements.good).toBe(good); // not parsed again
    expect(second.sheet.elements.bad).toMatchObject({ kind: 'load', powerFactor: 1, connection: 'line-to-neutral' });
  });
});
