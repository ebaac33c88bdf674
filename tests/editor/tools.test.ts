// The tools as a person uses them, through the canvas controller (the same path as the browser's gestures):
// tap, drag, long press, box, connect from a terminal, place, cut; whole gestures as one undo step; a viewer's
// cuts in the trial layer; and finger-sized targets at any zoom.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SheetSession } from '../../editor/session/sheet-session';
import { CanvasController } from '../../editor/canvas/canvas-controller';
import { worldToScreen } from '../../editor/canvas/viewport';
import { hitTest } from '../../editor/canvas/hit-test';
import { writeSheet, docToJson } from '../../editor/document/sheet-doc';
import { readSheet } from '../../shared/sheet';
import { toWorld, type Point } from '../../shared/symbols';
import { smallSystem } from './support/small-system';

const open: (CanvasController | SheetSession)[] = [];
afterEach(() => {
  for (const x of open.splice(0)) x.destroy();
  vi.useRealTimers();
});

function editorOn(sheet = smallSystem(), editable = true) {
  const session = new SheetSession({ sheetId: 's', wsBase: '', editable, user: { id: 'u1', name: 'Rosa' }, solveMode: 'main' });
  const read = readSheet(sheet);
  if (!read.ok) throw new Error('bad sheet');
  session.doc.transact(() => writeSheet(session.doc, read.sheet), 'seed');
  const canvas = new CanvasController(session);
  canvas.setViewport({ x: 400, y: 100, zoom: 1 });
  open.push(canvas, session);
  return { session, canvas };
}

/** A touch gesture through the controller: down at `from`, moves in steps, up at `to` (world points). */
function drag(canvas: CanvasController, from: Point, to: Point, pointerType: 'touch' | 'mouse' = 'touch') {
  const s = (p: Point) => canvas.sample(worldToScreen(canvas.viewport, p), pointerType);
  canvas.pointerDown(s(from));
  for (let i = 1; i <= 5; i++) canvas.pointerMove(s({ x: from.x + ((to.x - from.x) * i) / 5, y: from.y + ((to.y - from.y) * i) / 5 }));
  canvas.pointerUp(s(to));
}

function tap(canvas: CanvasController, at: Point) {
  const s = canvas.sample(worldToScreen(canvas.viewport, at), 'touch');
  canvas.pointerDown(s);
  canvas.pointerUp(s);
}

const json = (session: SheetSession) => docToJson(session.doc) as any;

describe('select and move', () => {
  it('a tap selects an element and a tap on empty canvas clears the selection', () => {
    const { session, canvas } = editorOn();
    tap(canvas, { x: 0, y: 280 }); // the panel's bar
    expect([...session.ui.get().selection]).toEqual(['panel']);
    tap(canvas, { x: 600, y: 600 });
    expect(session.ui.get().selection.size).toBe(0);
  });

  it('a drag moves the element by whole grid steps in one transaction, previewed meanwhile, undone whole', () => {
    const { session, canvas } = editorOn();
    let transactions = 0;
    session.doc.on('afterTransaction', () => transactions++);
    const s = (p: Point) => canvas.sample(worldToScreen(canvas.viewport, p), 'touch');
    canvas.pointerDown(s({ x: 0, y: 0 }));
    canvas.pointerMove(s({ x: 30, y: 10 }));
    canvas.pointerMove(s({ x: 67, y: 43 }));
    expect(session.ui.get().drag).toMatchObject({ dx: 60, dy: 40 });
    expect(canvas.scene.elements.get('src')!.element.x).toBe(60); // drawn at the preview
    expect(json(session).elements.src.x).toBe(0); // the document waits for the end
    expect(transactions).toBe(0);
    canvas.pointerUp(s({ x: 67, y: 43 }));
    expect(transactions).toBe(1);
    expect(json(session).elements.src).toMatchObject({ x: 60, y: 40 });
    expect(session.ui.get().drag).toBeNull();
    session.undo();
    expect(json(session).elements.src).toMatchObject({ x: 0, y: 0 });
  });

  it('a long press adds to the selection, so a drag then moves both', () => {
    vi.useFakeTimers();
    const { session, canvas } = editorOn();
    tap(canvas, { x: -60, y: 400 });
    const s = canvas.sample(worldToScreen(canvas.viewport, { x: 60, y: 400 }), 'touch');
    canvas.pointerDown(s);
    vi.advanceTimersByTime(600);
    canvas.pointerUp(s);
    expect([...session.ui.get().selection].sort()).toEqual(['la', 'lb']);
    drag(canvas, { x: 60, y: 400 }, { x: 60, y: 460 });
    expect(json(session).elements.la.y).toBe(460);
    expect(json(session).elements.lb.y).toBe(460);
  });

  it('a mouse drag on empty canvas draws a box that selects what it touches', () => {
    const { session, canvas } = editorOn();
    drag(canvas, { x: -200, y: 360 }, { x: 200, y: 440 }, 'mouse');
    expect([...session.ui.get().selection].sort()).toEqual(['la', 'lb']);
    expect(session.ui.get().box).toBeNull();
  });

  it('a touch drag on empty canvas pans the view instead', () => {
    const { canvas } = editorOn();
    const before = { ...canvas.viewport };
    drag(canvas, { x: 600, y: 600 }, { x: 650, y: 620 });
    // the view moved with the finger (the world point stayed under it), by about the drag's screen distance
    expect(canvas.viewport.x - before.x).toBeGreaterThan(30);
  });
});

describe('connect and place', () => {
  it('a drag from a load terminal to the panel connects it, to the least-used phase', () => {
    const sheet = smallSystem();
    delete (sheet.connections as any).c3;
    delete (sheet.connections as any).c4;
    const { session, canvas } = editorOn(sheet);
    const terminal = (id: string) => toWorld({ x: id === 'la' ? -60 : 60, y: 400, rotationDeg: 0 }, { x: 0, y: -30 });
    drag(canvas, terminal('la'), { x: -60, y: 284 });
    drag(canvas, terminal('lb'), { x: 60, y: 284 });
    const maps = Object.values(json(session).connections as Record<string, any>)
      .filter((c) => c.to.elementId === 'la' || c.from.elementId === 'la' || c.to.elementId === 'lb' || c.from.elementId === 'lb')
      .map((c) => c.conductorMap);
    expect(maps).toHaveLength(2);
    // first load on A, second on B (the phases with fewest loads), each with the neutral
    expect(maps.map((m) => Object.entries(m).sort().map(([k, v]) => `${k}${v}`).join(' ')).sort()).toEqual(['AA NN', 'AB NN'].sort());
    expect(session.ui.get().message?.text).toMatch(/^Connected/);
  });

  it('letting go away from a terminal draws nothing and says why', () => {
    const { session, canvas } = editorOn();
    const before = Object.keys(json(session).connections).length;
    drag(canvas, { x: 0, y: 44 }, { x: 500, y: 44 });
    expect(Object.keys(json(session).connections).length).toBe(before);
    expect(session.ui.get().message?.text).toMatch(/terminal/);
  });

  it('the place tool puts the chosen element on the grid and selects it', () => {
    const { session, canvas } = editorOn();
    session.ui.set({ tool: 'place', placeKind: 'electrode' });
    tap(canvas, { x: 207, y: 93 });
    const [id] = [...session.ui.get().selection];
    expect(json(session).elements[id]).toMatchObject({ kind: 'electrode', x: 200, y: 100, ohms: 25, name: 'Ground rod' });
    expect(session.ui.get().tool).toBe('select');
  });
});

describe('cut', () => {
  it('on the base case, opens the tapped conductor of a feeder (zoomed in), and undo closes it', () => {
    const { session, canvas } = editorOn();
    canvas.setViewport({ x: 400, y: 100, zoom: 4 });
    session.ui.set({ tool: 'cut' });
    // the run's lanes, left to right A B C N PE, 7 units apart about its centre: N is at +7
    tap(canvas, { x: 7, y: 140 });
    expect(json(session).elements.feeder.conductors.N.open).toBe(true);
    expect(session.ui.get().message?.text).toBe('Opened N of Feeder');
    session.undo();
    expect(json(session).elements.feeder.conductors.N.open).toBe(false);
  });

  it('zoomed out, a tap on a feeder offers its conductors as full-size choices', () => {
    const { session, canvas } = editorOn();
    session.ui.set({ tool: 'cut' });
    tap(canvas, { x: 0, y: 140 });
    const chooser = session.ui.get().chooser;
    expect(chooser).toEqual({ kind: 'run', elementId: 'feeder', conductors: ['A', 'B', 'C', 'N', 'PE'] });
    canvas.actions.chooseCut(chooser!, 'N');
    expect(json(session).elements.feeder.conductors.N.open).toBe(true);
  });

  it('in a what-if, the cut is a change of that what-if and the sheet stays as built', () => {
    const { session, canvas } = editorOn();
    const w = session.commands.addWhatIf('Lost neutral');
    session.ui.set({ tool: 'cut', whatIfId: w });
    canvas.actions.chooseCut({ kind: 'run', elementId: 'feeder', conductors: ['N'] }, 'N');
    const doc = json(session);
    expect(Object.values(doc.whatIfs[w].changes)).toEqual([{ kind: 'open-conductor', runId: 'feeder', conductor: 'N' }]);
    expect(doc.elements.feeder.conductors.N.open).toBe(false);
    canvas.actions.chooseCut({ kind: 'run', elementId: 'feeder', conductors: ['N'] }, 'N');
    expect(Object.values(json(session).whatIfs[w].changes)).toEqual([]);
  });

  it("a viewer's cut goes to the trial layer, never to the document", () => {
    const { session, canvas } = editorOn(smallSystem(), false);
    const before = JSON.stringify(json(session));
    session.ui.set({ tool: 'cut' });
    canvas.actions.chooseCut({ kind: 'run', elementId: 'feeder', conductors: ['N'] }, 'N');
    expect(session.ui.get().trialChanges).toEqual([{ kind: 'open-conductor', runId: 'feeder', conductor: 'N' }]);
    expect(JSON.stringify(json(session))).toBe(before);
    expect(session.ui.get().message?.text).toMatch(/trial, not saved/);
  });

  it('a viewer cannot move or connect: a drag pans', () => {
    const { session, canvas } = editorOn(smallSystem(), false);
    const before = canvas.viewport.x;
    drag(canvas, { x: 0, y: 0 }, { x: 80, y: 0 });
    expect(json(session).elements.src.x).toBe(0);
    expect(canvas.viewport.x).toBeGreaterThan(before + 40);
  });
});

describe('finger-sized targets', () => {
  it('at a quarter zoom, a tap 20 screen px from a load still selects it; 10 px off the end of a bar selects the bar', () => {
    const { canvas } = editorOn();
    const zoom = 0.25;
    const worldPerPx = 1 / zoom;
    const index = canvas.sceneIndex();
    expect(hitTest(index, { x: -60 + 20 * worldPerPx * 0.7, y: 400 + 20 * worldPerPx * 0.7 }, zoom, { terminals: false })).toEqual({ kind: 'element', elementId: 'la' });
    expect(hitTest(index, { x: 80, y: 280 - 10 * worldPerPx }, zoom, { terminals: false })).toEqual({ kind: 'element', elementId: 'panel' });
    // and far from everything it is the canvas
    expect(hitTest(index, { x: 600, y: 600 }, zoom, { terminals: false })).toEqual({ kind: 'canvas' });
  });

  it('solves after each change, on the main thread for a tiny sheet', async () => {
    const { session } = editorOn();
    await vi.waitFor(() => expect(session.results.get().drawn?.tags.get('la:v')).toBeDefined());
    expect(session.results.get().where).toBe('main');
    const before = session.results.get().serial;
    session.commands.setField('elements', 'feeder', ['conductors', 'N', 'open'], true);
    await vi.waitFor(() => expect(session.results.get().serial).toBeGreaterThan(before));
    expect(session.results.get().drawn!.tags.get('la:v')!.value).toBeGreaterThan(130);
  });
});
