// Which element feeds which: a breadth-first walk from every source over the sheet's connections (a radial reading;
// in a meshed sheet each element hangs from the first path found) over connections that carry a phase. Voltage zones
// restart at each transformer.
import type { LoadKind, Sheet } from '../../shared/sheet';
import { connectionProblem } from '../../shared/sheet';

export interface FeedTree {
  /** The element each element is fed from (absent for sources and for elements no source reaches). */
  parent: Map<string, string>;
  children: Map<string, string[]>;
  /** Elements in the order the walk reached them (parents before children). */
  order: string[];
}

const carriesPhase = (map: Record<string, unknown>) => 'A' in map || 'B' in map || 'C' in map;

export function feedTree(sheet: Sheet): FeedTree {
  const neighbours = new Map<string, string[]>();
  // Connections in a stable order, so that the tree does not depend on map iteration of concurrent edits.
  const connections = Object.values(sheet.connections);
  connections.sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
  const link = (a: string, b: string) => {
    const list = neighbours.get(a);
    if (list) list.push(b);
    else neighbours.set(a, [b]);
  };
  for (const connection of connections) {
    // Power flows on the phases: a tie of neutrals or grounds alone (a neutral interconnection, an electrode) feeds nothing.
    if (!carriesPhase(connection.conductorMap) || connectionProblem(sheet, connection)) continue;
    link(connection.from.elementId, connection.to.elementId);
    link(connection.to.elementId, connection.from.elementId);
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
    const next = neighbours.get(id);
    if (!next) continue;
    let kids: string[] | undefined;
    for (const n of next) {
      if (seen.has(n)) continue;
      seen.add(n);
      parent.set(n, id);
      (kids ??= []).push(n);
      order.push(n);
    }
    if (kids) children.set(id, kids);
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

/** Load kinds taken as non-linear for NEC 310.15(E)(3) unless a study says otherwise (our default). */
export const DEFAULT_NON_LINEAR_KINDS: readonly LoadKind[] = ['electronics'];
/** "The major portion of the load": more than half of the kW downstream. */
export const DEFAULT_NON_LINEAR_MAJORITY = 0.5;

/** Share of the kW downstream of each element that is non-linear (a post-order walk; 0 where nothing is downstream). */
export function nonLinearShares(sheet: Sheet, tree: FeedTree, kwByLoad: Map<string, number>, kinds: readonly LoadKind[] = DEFAULT_NON_LINEAR_KINDS): Map<string, number> {
  const nonLinear = new Set(kinds);
  const totals = new Map<string, { all: number; nonLinear: number }>();
  for (let k = tree.order.length - 1; k >= 0; k--) {
    const id = tree.order[k];
    const e = sheet.elements[id];
    const own = e?.kind === 'load' ? Math.max(0, kwByLoad.get(id) ?? 0) : 0;
    const t = { all: own, nonLinear: e?.kind === 'load' && nonLinear.has(e.loadKind) ? own : 0 };
    for (const child of tree.children.get(id) ?? []) {
      const c = totals.get(child);
      if (c) {
        t.all += c.all;
        t.nonLinear += c.nonLinear;
      }
    }
    totals.set(id, t);
  }
  const out = new Map<string, number>();
  for (const [id, t] of totals) out.set(id, t.all > 0 ? t.nonLinear / t.all : 0);
  return out;
}
