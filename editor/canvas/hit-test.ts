// What is under a finger or a pointer, with every target at least 44 screen pixels across at any zoom: bodies are
// grown to that size, terminals and connections are reached within 22 px. A grid index keeps lookups fast on
// sheets of thousands of elements.
import { distanceToPolyline, distanceToTerminal, landingPoint, LANE_SPACING, toWorld, type Point, type Rect } from '../../shared/symbols';
import type { ConductorId } from '../../shared/sheet';
import type { PlacedElement, Scene } from './scene';

/** The smallest target, in screen pixels. */
export const TOUCH_TARGET_PX = 44;

export type Hit =
  | { kind: 'terminal'; elementId: string; terminal: string; point: Point }
  | { kind: 'element'; elementId: string }
  | { kind: 'connection'; connectionId: string }
  | { kind: 'canvas' };

const CELL = 200;

export class SceneIndex {
  private cells = new Map<string, string[]>();

  constructor(readonly scene: Scene) {
    for (const [id, e] of scene.elements) {
      const b = e.bounds;
      for (let cx = Math.floor(b.x / CELL); cx <= Math.floor((b.x + b.width) / CELL); cx++) {
        for (let cy = Math.floor(b.y / CELL); cy <= Math.floor((b.y + b.height) / CELL); cy++) {
          const key = `${cx},${cy}`;
          const list = this.cells.get(key);
          if (list) list.push(id);
          else this.cells.set(key, [id]);
        }
      }
    }
  }

  /** Elements whose bounds come within `reach` of the point. */
  near(p: Point, reach: number): PlacedElement[] {
    const seen = new Set<string>();
    const out: PlacedElement[] = [];
    for (let cx = Math.floor((p.x - reach) / CELL); cx <= Math.floor((p.x + reach) / CELL); cx++) {
      for (let cy = Math.floor((p.y - reach) / CELL); cy <= Math.floor((p.y + reach) / CELL); cy++) {
        for (const id of this.cells.get(`${cx},${cy}`) ?? []) {
          if (seen.has(id)) continue;
          seen.add(id);
          const e = this.scene.elements.get(id)!;
          const b = e.bounds;
          if (p.x >= b.x - reach && p.x <= b.x + b.width + reach && p.y >= b.y - reach && p.y <= b.y + b.height + reach) out.push(e);
        }
      }
    }
    return out;
  }

  /** Elements whose bounds meet the rectangle (box selection). */
  inRect(r: Rect): string[] {
    const x1 = r.x + r.width;
    const y1 = r.y + r.height;
    const out: string[] = [];
    for (const [id, e] of this.scene.elements) {
      const b = e.bounds;
      if (b.x <= x1 && b.x + b.width >= r.x && b.y <= y1 && b.y + b.height >= r.y) out.push(id);
    }
    return out;
  }
}

/** The body grown so that it is at least the touch target on screen. */
export function grownBody(body: Rect, zoom: number): Rect {
  const min = TOUCH_TARGET_PX / zoom;
  const gx = Math.max(0, (min - body.width) / 2);
  const gy = Math.max(0, (min - body.height) / 2);
  return { x: body.x - gx, y: body.y - gy, width: body.width + 2 * gx, height: body.height + 2 * gy };
}

const inside = (r: Rect, p: Point) => p.x >= r.x && p.x <= r.x + r.width && p.y >= r.y && p.y <= r.y + r.height;
const centreDistance = (r: Rect, p: Point) => Math.hypot(p.x - (r.x + r.width / 2), p.y - (r.y + r.height / 2));

export interface HitOptions {
  /** Offer terminals (to start a connection); viewers and the cut tool do not. */
  terminals: boolean;
}

export function hitTest(index: SceneIndex, p: Point, zoom: number, options: HitOptions): Hit {
  const reach = TOUCH_TARGET_PX / 2 / zoom;
  const near = index.near(p, reach * 2);
  // 1. Inside a body as drawn: that element (the nearest centre when bodies overlap).
  const direct = near.filter((e) => inside(e.body, p)).sort((a, b) => centreDistance(a.body, p) - centreDistance(b.body, p));
  if (direct.length) return { kind: 'element', elementId: direct[0].element.id };
  // 2. A terminal within reach (bars are bodies, not starting points).
  if (options.terminals) {
    let best: { d: number; hit: Hit } | null = null;
    for (const e of near) {
      for (const t of e.terminals) {
        if (t.bar) continue;
        const d = distanceToTerminal(t, p);
        if (d <= reach && (!best || d < best.d)) best = { d, hit: { kind: 'terminal', elementId: e.element.id, terminal: t.name, point: t.point } };
      }
    }
    if (best) return best.hit;
  }
  // 3. A body grown to the touch target.
  const grown = near.filter((e) => inside(grownBody(e.body, zoom), p)).sort((a, b) => centreDistance(a.body, p) - centreDistance(b.body, p));
  if (grown.length) return { kind: 'element', elementId: grown[0].element.id };
  // 4. A connection within reach.
  let bestConnection: { d: number; id: string } | null = null;
  for (const [id, c] of index.scene.connections) {
    const d = distanceToPolyline(c.points, p);
    if (d <= reach && (!bestConnection || d < bestConnection.d)) bestConnection = { d, id };
  }
  if (bestConnection) return { kind: 'connection', connectionId: bestConnection.id };
  return { kind: 'canvas' };
}

/** Where a connection being drawn would land: a terminal (bars included) within reach, or the only terminal of an element under the point. */
export function dropTarget(index: SceneIndex, p: Point, zoom: number, exceptElementId: string): { elementId: string; terminal: string; point: Point } | null {
  const reach = TOUCH_TARGET_PX / 2 / zoom;
  let best: { d: number; elementId: string; terminal: string; point: Point } | null = null;
  for (const e of index.near(p, reach * 2)) {
    if (e.element.id === exceptElementId) continue;
    for (const t of e.terminals) {
      const d = distanceToTerminal(t, p);
      if (d <= reach && (!best || d < best.d)) best = { d, elementId: e.element.id, terminal: t.name, point: landingPoint(t, p).point };
    }
    if (!best && e.terminals.length === 1 && inside(grownBody(e.body, zoom), p)) {
      const t = e.terminals[0];
      best = { d: reach, elementId: e.element.id, terminal: t.name, point: landingPoint(t, p).point };
    }
  }
  return best ? { elementId: best.elementId, terminal: best.terminal, point: best.point } : null;
}

/**
 * The conductor of a run under the point, when its lanes are far enough apart on screen to tell them apart by
 * finger; otherwise null (the editor then offers a chooser with full-size buttons).
 */
export function laneAt(e: PlacedElement, p: Point, zoom: number): ConductorId | null {
  if (e.symbol.lanes.length === 0) return null;
  if (e.symbol.lanes.length > 1 && LANE_SPACING * zoom < TOUCH_TARGET_PX / 2) return null;
  let best: { d: number; c: ConductorId } | null = null;
  for (const lane of e.symbol.lanes) {
    const d = distanceToPolyline([toWorld(e.element, lane.from), toWorld(e.element, lane.to)], p);
    if (!best || d < best.d) best = { d, c: lane.conductor };
  }
  return best && best.d <= Math.max(LANE_SPACING / 2, TOUCH_TARGET_PX / 2 / zoom) ? best.c : null;
}
