// Which element feeds which: a breadth-first walk from every source over the sheet's connections (a radial reading;
// in a meshed sheet each element hangs from the first path found) over connections that carry a phase. Voltage zones
// restart at each transformer.
import type { Sheet } from '../../shared/sheet';
import { connectionProblem } from '../../shared/sheet';

export interface FeedTree {
  /** The element each element is fed from (absent for sources and for elements no source reaches). */
  parent: Map<string, string>;
  children: Map<string, string[]>;
  /** Elements in the order the walk reached them (parents before children). */
  order: string[];
}

export function feedTree(sheet: Sheet): FeedTree {
  const neighbours = new Map<string, string[]>();
  for (const id of Object.keys(sheet.elements)) neighbours.set(id, []);
  // Connections in a stable order, so that the tree does not depend on map iteration of concurrent edits.
  for (const connection of Object.values(sheet.connections).sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0))) {
    if (connectionProblem(sheet, connection)) continue;
    // Power flows on the phases: a tie of neutrals or grounds alone (a neutral interconnection, an electrode) feeds nothing.
    if (!Object.keys(connection.conductorMap).some((k) => k === 'A' || k === 'B' || k === 'C')) continue;
    neighbours.get(connection.from.elementId)!.push(connection.to.elementId);
    neighbours.get(connection.to.elementId)!.push(connection.from.elementId);
  }
  const parent = new Map<string, string>();
  const children = new Map<string, string[]>();
  const seen = new Set<string>();
  const order: string[] = [];
  for (const e of Object.values(sheet.elements)) {
    if (e.kind !== 'source') continue;
    seen.add(e.id);
    order.push(e.id);
  }
  for (let head = 0; head < order.length; head++) {
    const id = order[head];
    for (const next of neighbours.get(id) ?? []) {
      if (seen.has(next)) continue;
      seen.add(next);
      parent.set(next, id);
      const list = children.get(id);
      if (list) list.push(next);
      else children.set(id, [next]);
      order.push(next);
    }
  }
  return { parent, children, order };
}

/** The runs from the start of an element's voltage zone (a source or a transformer) down to it, and that start. */
export function runsFromOrigin(sheet: Sheet, tree: FeedTree, elementId: string): { originId?: string; path: string[] } {
  const path: string[] = [];
  let at: string | undefined = elementId;
  while (at !== undefined) {
    const e = sheet.elements[at];
    if (!e) break;
    if (e.kind === 'run') path.push(at);
    if ((e.kind === 'source' || e.kind === 'transformer') && at !== elementId) return { originId: at, path: path.reverse() };
    at = tree.parent.get(at);
  }
  return { path: path.reverse() };
}

/** The nearest element of a kind upstream of an element, not crossing a transformer. */
export function nearestUpstream(sheet: Sheet, tree: FeedTree, elementId: string, kind: string): string | undefined {
  let at = tree.parent.get(elementId);
  while (at !== undefined) {
    const e = sheet.elements[at];
    if (!e || e.kind === 'transformer' || e.kind === 'source') return undefined;
    if (e.kind === kind) return at;
    at = tree.parent.get(at);
  }
  return undefined;
}
