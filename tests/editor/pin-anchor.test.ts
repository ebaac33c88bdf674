// Pins on the drawing: a pin on an element follows it when it moves, a pin on a point stays put, a pin whose
// element was deleted stays where it was pinned, and a tap in the pin tool pins what is under it.
import { describe, expect, it } from 'vitest';
import { buildScene } from '../../editor/canvas/scene';
import { SceneIndex } from '../../editor/canvas/hit-test';
import { pinAnchor, pinTargetAt } from '../../editor/pins/pin-anchor';
import { SheetMirror } from '../../editor/document/sheet-mirror';
import { writeSheet } from '../../editor/document/sheet-doc';
import { readSheet } from '../../shared/sheet';
import * as Y from 'yjs';
import { smallSystem } from './support/small-system';

function sceneOf(move?: { id: string; x: number; y: number }) {
  const sheet = smallSystem();
  if (move) Object.assign(sheet.elements![move.id], { x: move.x, y: move.y });
  const read = readSheet(sheet);
  if (!read.ok) throw new Error('bad sheet');
  const doc = new Y.Doc();
  doc.transact(() => writeSheet(doc, read.sheet));
  const mirror = new SheetMirror(doc, () => false);
  const scene = buildScene(mirror.current);
  mirror.destroy();
  return scene;
}

describe('pin anchors', () => {
  it('a pin on an element stands on its body and moves with it', () => {
    const before = sceneOf();
    const after = sceneOf({ id: 'la', x: -60 + 200, y: 400 + 40 });
    const pin = { elementId: 'la', x: 0, y: 0 };
    const a = pinAnchor(pin, before);
    const b = pinAnchor(pin, after);
    const body = before.elements.get('la')!.body;
    expect(a).toEqual({ x: body.x + body.width, y: body.y });
    expect({ dx: b.x - a.x, dy: b.y - a.y }).toEqual({ dx: 200, dy: 40 });
  });

  it('a pin on a point, or on an element deleted since, stays at its own point', () => {
    const scene = sceneOf();
    expect(pinAnchor({ elementId: null, x: 321, y: -45 }, scene)).toEqual({ x: 321, y: -45 });
    expect(pinAnchor({ elementId: 'gone', x: 10, y: 20 }, scene)).toEqual({ x: 10, y: 20 });
  });

  it('a tap on a load pins the load; a tap on empty drawing pins the point', () => {
    const scene = sceneOf();
    const index = new SceneIndex(scene);
    const body = scene.elements.get('lb')!.body;
    const centre = { x: body.x + body.width / 2, y: body.y + body.height / 2 };
    expect(pinTargetAt(index, centre, 1)).toMatchObject({ elementId: 'lb' });
    expect(pinTargetAt(index, { x: 900.4, y: -700.6 }, 1)).toEqual({ elementId: null, x: 900, y: -701 });
  });
});
