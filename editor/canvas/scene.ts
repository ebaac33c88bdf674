// The drawing's geometry, computed from the mirror: each element's symbol placed on the sheet (terminals, body,
// bounds) and each connection's route. Entries are reused while their element objects are unchanged, so a change
// to one element re-computes only it and the connections that land on it.
import type { ConductorId } from '../../shared/sheet';
import {
  landingPoint,
  placedTerminals,
  routeConnection,
  symbolBounds,
  symbolOf,
  worldRect,
  type PlacedTerminal,
  type Point,
  type Rect,
  type SymbolGeometry,
} from '../../shared/symbols';
import type { ConnectionView, ElementView, MirrorSnapshot } from '../document/sheet-mirror';

export interface PlacedElement {
  element: ElementView;
  symbol: SymbolGeometry;
  body: Rect;
  bounds: Rect;
  terminals: PlacedTerminal[];
}

export interface PlacedConnection {
  connection: ConnectionView;
  points: Point[];
  /** Conductors it carries, as its 'from' end names them. */
  conductors: ConductorId[];
}

export interface Scene {
  elements: Map<string, PlacedElement>;
  connections: Map<string, PlacedConnection>;
  /** Extent of everything drawn. */
  bounds: Rect;
}

export function placeElement(element: ElementView): PlacedElement {
  const symbol = symbolOf(element as Parameters<typeof symbolOf>[0]);
  return {
    element,
    symbol,
    body: worldRect(element, symbol.body),
    bounds: symbolBounds(element, symbol),
    terminals: placedTerminals(element, symbol),
  };
}

export function placeConnection(connection: ConnectionView, elements: ReadonlyMap<string, PlacedElement>): PlacedConnection | undefined {
  const a = elements.get(connection.from.elementId);
  const b = elements.get(connection.to.elementId);
  if (!a || !b) return undefined; // dangling (deleted meanwhile): not drawn
  const ta = a.terminals.find((t) => t.name === connection.from.terminal);
  const tb = b.terminals.find((t) => t.name === connection.to.terminal);
  if (!ta || !tb) return undefined;
  const ea = landingPoint(ta, tb.point);
  const eb = landingPoint(tb, ea.point);
  return { connection, points: routeConnection(ea, eb), conductors: Object.keys(connection.conductorMap) as ConductorId[] };
}

function union(rects: Iterable<Rect>): Rect {
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  for (const r of rects) {
    x0 = Math.min(x0, r.x);
    y0 = Math.min(y0, r.y);
    x1 = Math.max(x1, r.x + r.width);
    y1 = Math.max(y1, r.y + r.height);
  }
  if (!Number.isFinite(x0)) return { x: 0, y: 0, width: 0, height: 0 };
  return { x: x0, y: y0, width: x1 - x0, height: y1 - y0 };
}

/**
 * The scene for a snapshot, reusing `previous` entries whose inputs are the same objects. `moved` shifts some
 * elements (a drag's preview) without touching the document.
 */
export function buildScene(snapshot: Pick<MirrorSnapshot, 'elements' | 'connections'>, previous?: Scene, moved?: { ids: ReadonlySet<string>; dx: number; dy: number }): Scene {
  const elements = new Map<string, PlacedElement>();
  const changed = new Set<string>();
  for (const [id, raw] of snapshot.elements) {
    const element = moved?.ids.has(id) ? { ...raw, x: raw.x + moved.dx, y: raw.y + moved.dy } : raw;
    const old = previous?.elements.get(id);
    if (old && old.element === raw && !moved?.ids.has(id)) elements.set(id, old);
    else {
      elements.set(id, placeElement(element));
      changed.add(id);
    }
  }
  if (previous) for (const id of previous.elements.keys()) if (!snapshot.elements.has(id)) changed.add(id);
  const connections = new Map<string, PlacedConnection>();
  for (const [id, c] of snapshot.connections) {
    const old = previous?.connections.get(id);
    if (old && old.connection === c && !changed.has(c.from.elementId) && !changed.has(c.to.elementId)) connections.set(id, old);
    else {
      const placed = placeConnection(c, elements);
      if (placed) connections.set(id, placed);
    }
  }
  const sameBounds = previous && changed.size === 0 && previous.elements.size === elements.size;
  return { elements, connections, bounds: sameBounds ? previous.bounds : union([...elements.values()].map((e) => e.bounds)) };
}

/** Replaces the placed elements of a drag preview only, keeping every other entry of `scene`. */
export function withMoved(scene: Scene, snapshot: Pick<MirrorSnapshot, 'elements' | 'connections'>, ids: ReadonlySet<string>, dx: number, dy: number): Scene {
  if (ids.size === 0 || (dx === 0 && dy === 0)) return scene;
  const elements = new Map(scene.elements);
  for (const id of ids) {
    const raw = snapshot.elements.get(id);
    if (raw) elements.set(id, placeElement({ ...raw, x: raw.x + dx, y: raw.y + dy }));
  }
  const connections = new Map(scene.connections);
  for (const [id, c] of snapshot.connections) {
    if (!ids.has(c.from.elementId) && !ids.has(c.to.elementId)) continue;
    const placed = placeConnection(c, elements);
    if (placed) connections.set(id, placed);
    else connections.delete(id);
  }
  return { elements, connections, bounds: scene.bounds };
}
