// Placing a symbol on the drawing: rotation in quarter turns about the element's centre, terminal positions in
// drawing coordinates (a bar terminal lands at the point of the bar nearest the other end), bounds, and where
// text goes once rotated (text itself always stays upright).
import type { Point, Rect, Side, SymbolGeometry, TerminalGeometry, TextAlign, TextAnchor } from './types';

export interface Placement {
  x: number;
  y: number;
  rotationDeg: number;
}

/** Quarter turns, 0..3, from any angle (snapped to the nearest quarter). */
export function quarterTurns(rotationDeg: number): number {
  const q = Math.round((Number.isFinite(rotationDeg) ? rotationDeg : 0) / 90) % 4;
  return q < 0 ? q + 4 : q;
}

/** Rotates a local point clockwise on the screen (y down) by quarter turns. */
export function rotateLocal(p: Point, turns: number): Point {
  switch (turns) {
    case 1:
      return { x: -p.y, y: p.x };
    case 2:
      return { x: -p.x, y: -p.y };
    case 3:
      return { x: p.y, y: -p.x };
    default:
      return { x: p.x, y: p.y };
  }
}

export function toWorld(at: Placement, p: Point): Point {
  const r = rotateLocal(p, quarterTurns(at.rotationDeg));
  return { x: at.x + r.x, y: at.y + r.y };
}

const SIDES: Side[] = ['up', 'right', 'down', 'left'];
export function rotateSide(side: Side, turns: number): Side {
  return SIDES[(SIDES.indexOf(side) + turns) % 4];
}

export function rotateRect(r: Rect, turns: number): Rect {
  const a = rotateLocal({ x: r.x, y: r.y }, turns);
  const b = rotateLocal({ x: r.x + r.width, y: r.y + r.height }, turns);
  return { x: Math.min(a.x, b.x), y: Math.min(a.y, b.y), width: Math.abs(a.x - b.x), height: Math.abs(a.y - b.y) };
}

export function worldRect(at: Placement, r: Rect): Rect {
  const rr = rotateRect(r, quarterTurns(at.rotationDeg));
  return { x: rr.x + at.x, y: rr.y + at.y, width: rr.width, height: rr.height };
}

export interface PlacedTerminal {
  name: string;
  point: Point;
  side: Side;
  /** For bars: the two ends of the bar in drawing coordinates. */
  bar?: [Point, Point];
}

export function placeTerminal(at: Placement, t: TerminalGeometry): PlacedTerminal {
  const turns = quarterTurns(at.rotationDeg);
  const point = toWorld(at, t);
  const side = rotateSide(t.side, turns);
  if (!t.span) return { name: t.name, point, side };
  const bar: [Point, Point] = [toWorld(at, { x: t.x - t.span, y: t.y }), toWorld(at, { x: t.x + t.span, y: t.y })];
  return { name: t.name, point, side, bar };
}

export function placedTerminals(at: Placement, symbol: SymbolGeometry): PlacedTerminal[] {
  return symbol.terminals.map((t) => placeTerminal(at, t));
}

function clamp(v: number, lo: number, hi: number) {
  return Math.max(Math.min(lo, hi), Math.min(Math.max(lo, hi), v));
}

/** Where a connection meets this terminal when its other end is at `toward`: a bar's nearest point, else the terminal. */
export function landingPoint(t: PlacedTerminal, toward: Point): { point: Point; side: Side } {
  if (!t.bar) return { point: t.point, side: t.side };
  const [a, b] = t.bar;
  if (a.y === b.y) {
    const point = { x: clamp(toward.x, a.x, b.x), y: a.y };
    return { point, side: toward.y < a.y ? 'up' : 'down' };
  }
  const point = { x: a.x, y: clamp(toward.y, a.y, b.y) };
  return { point, side: toward.x < a.x ? 'left' : 'right' };
}

/** Distance from a point to a terminal (to the nearest point of a bar). */
export function distanceToTerminal(t: PlacedTerminal, p: Point): number {
  const q = landingPoint(t, p).point;
  return Math.hypot(p.x - q.x, p.y - q.y);
}

/** A text anchor after rotation: its position and an alignment that still reads outward from the symbol. */
export function placeText(at: Placement, anchor: TextAnchor): TextAnchor {
  const turns = quarterTurns(at.rotationDeg);
  const p = toWorld(at, anchor);
  if (turns === 0) return { x: p.x, y: p.y, align: anchor.align };
  const dx = p.x - at.x;
  const dy = p.y - at.y;
  let align: TextAlign = 'middle';
  if (Math.abs(dx) > Math.abs(dy) * 0.6) align = dx > 0 ? 'start' : 'end';
  return { x: p.x, y: p.y, align };
}

/** The whole symbol's extent in drawing coordinates (body and terminals), for culling and box selection. */
export function symbolBounds(at: Placement, symbol: SymbolGeometry): Rect {
  const body = worldRect(at, symbol.body);
  let x0 = body.x;
  let y0 = body.y;
  let x1 = body.x + body.width;
  let y1 = body.y + body.height;
  for (const t of placedTerminals(at, symbol)) {
    for (const p of t.bar ?? [t.point]) {
      x0 = Math.min(x0, p.x);
      y0 = Math.min(y0, p.y);
      x1 = Math.max(x1, p.x);
      y1 = Math.max(y1, p.y);
    }
  }
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/** A connection's route: leave each terminal the way it faces, then meet with right angles. */
export function routeConnection(a: { point: Point; side: Side }, b: { point: Point; side: Side }, stub = 12): Point[] {
  const out = (p: Point, side: Side): Point =>
    side === 'up' ? { x: p.x, y: p.y - stub } : side === 'down' ? { x: p.x, y: p.y + stub } : side === 'left' ? { x: p.x - stub, y: p.y } : { x: p.x + stub, y: p.y };
  const p0 = a.point;
  const p3 = b.point;
  const p1 = out(p0, a.side);
  const p2 = out(p3, b.side);
  const vertical = a.side === 'up' || a.side === 'down';
  const mid = vertical ? [{ x: p1.x, y: (p1.y + p2.y) / 2 }, { x: p2.x, y: (p1.y + p2.y) / 2 }] : [{ x: (p1.x + p2.x) / 2, y: p1.y }, { x: (p1.x + p2.x) / 2, y: p2.y }];
  // Drop points that add nothing, so a straight connection stays one segment.
  const pts = [p0, p1, ...mid, p2, p3];
  const out2: Point[] = [];
  for (const p of pts) {
    const last = out2[out2.length - 1];
    if (last && Math.abs(last.x - p.x) < 1e-9 && Math.abs(last.y - p.y) < 1e-9) continue;
    out2.push(p);
  }
  const simplified: Point[] = [];
  for (const p of out2) {
    const n = simplified.length;
    if (n >= 2) {
      const a1 = simplified[n - 2];
      const b1 = simplified[n - 1];
      const collinear = Math.abs((b1.x - a1.x) * (p.y - b1.y) - (b1.y - a1.y) * (p.x - b1.x)) < 1e-9;
      if (collinear) simplified[n - 1] = p;
      else simplified.push(p);
    } else simplified.push(p);
  }
  return simplified;
}

export function distanceToPolyline(points: readonly Point[], p: Point): number {
  let best = Infinity;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    const dx = b.x - a.x;
    const dy = b.y - a.y;
    const len2 = dx * dx + dy * dy;
    const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
    best = Math.min(best, Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy)));
  }
  return best;
}

export function polylinePath(points: readonly Point[]): string {
  return points.map((p, i) => `${i === 0 ? 'M' : 'L'} ${round(p.x)} ${round(p.y)}`).join(' ');
}

const round = (v: number) => Math.round(v * 100) / 100;
