// Where pins sit on the drawing: a pin on an element follows the element (its body's top-right corner, wherever it
// is moved), a pin on a point stays at that point; and what a tap in the pin tool lands on.
import type { Point } from '../../shared/symbols';
import { hitTest, type SceneIndex } from '../canvas/hit-test';
import type { Scene } from '../canvas/scene';

export interface PinPosition {
  elementId: string | null;
  x: number;
  y: number;
}

/** The drawing point the pin's flag stands on. */
export function pinAnchor(pin: PinPosition, scene: Scene): Point {
  const placed = pin.elementId ? scene.elements.get(pin.elementId) : undefined;
  // An element deleted since keeps its pin where the element was last pinned.
  if (!placed) return { x: pin.x, y: pin.y };
  return { x: placed.body.x + placed.body.width, y: placed.body.y };
}

/** A tap in the pin tool: on an element (with a touch target's reach) pins the element, anywhere else the point. */
export function pinTargetAt(index: SceneIndex, world: Point, zoom: number): PinPosition {
  const hit = hitTest(index, world, zoom, { terminals: false });
  const x = Math.round(world.x);
  const y = Math.round(world.y);
  return hit.kind === 'element' ? { elementId: hit.elementId, x, y } : { elementId: null, x, y };
}
