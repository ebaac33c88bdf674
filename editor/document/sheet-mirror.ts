// A plain, immutable mirror of the sheet document for drawing: every element, connection and what-if as a plain
// object that keeps its identity until that entry changes, so the canvas re-draws only what changed. Updated from
// Yjs events (only the touched entries are re-read); listeners hear of each change with whether it was local.
import * as Y from 'yjs';
import type { Plain } from './y-values';
import { fromY } from './y-values';
import { collection, COLLECTIONS, settingsMap, sheetMeta, type Collection } from './sheet-doc';

/** An element as stored: unvalidated, but with the placement fields read defensively. */
export interface ElementView {
  id: string;
  kind: string;
  name: string;
  x: number;
  y: number;
  rotationDeg: number;
  [field: string]: Plain | undefined;
}

export interface ConnectionView {
  id: string;
  from: { elementId: string; terminal: string };
  to: { elementId: string; terminal: string };
  conductorMap: Record<string, string>;
  [field: string]: Plain | undefined;
}

export interface WhatIfView {
  id: string;
  name: string;
  changes: Record<string, Record<string, Plain>>;
}

export interface MirrorSnapshot {
  /** Grows by one with every change. */
  version: number;
  settings: Record<string, Plain>;
  elements: ReadonlyMap<string, ElementView>;
  connections: ReadonlyMap<string, ConnectionView>;
  whatIfs: ReadonlyMap<string, WhatIfView>;
}

export type MirrorListener = (snapshot: MirrorSnapshot, change: { local: boolean; collections: ReadonlySet<Collection | 'settings' | 'sheet'> }) => void;

const num = (v: unknown, fallback = 0) => (typeof v === 'number' && Number.isFinite(v) ? v : fallback);
const str = (v: unknown, fallback = '') => (typeof v === 'string' ? v : fallback);

export function elementView(id: string, raw: Plain): ElementView {
  const o = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, Plain>;
  return { ...o, id, kind: str(o.kind, 'unknown'), name: str(o.name), x: num(o.x), y: num(o.y), rotationDeg: num(o.rotationDeg) };
}

function end(v: Plain | undefined): { elementId: string; terminal: string } {
  const o = (v && typeof v === 'object' && !Array.isArray(v) ? v : {}) as Record<string, Plain>;
  return { elementId: str(o.elementId), terminal: str(o.terminal) };
}

export function connectionView(id: string, raw: Plain): ConnectionView {
  const o = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, Plain>;
  const map = (o.conductorMap && typeof o.conductorMap === 'object' && !Array.isArray(o.conductorMap) ? o.conductorMap : {}) as Record<string, Plain>;
  const conductorMap: Record<string, string> = {};
  for (const [k, v] of Object.entries(map)) if (typeof v === 'string') conductorMap[k] = v;
  return { ...o, id, from: end(o.from), to: end(o.to), conductorMap };
}

export function whatIfView(id: string, raw: Plain): WhatIfView {
  const o = (raw && typeof raw === 'object' && !Array.isArray(raw) ? raw : {}) as Record<string, Plain>;
  const changes: WhatIfView['changes'] = {};
  const rawChanges = (o.changes && typeof o.changes === 'object' && !Array.isArray(o.changes) ? o.changes : {}) as Record<string, Plain>;
  for (const [k, v] of Object.entries(rawChanges)) if (v && typeof v === 'object' && !Array.isArray(v)) changes[k] = v as Record<string, Plain>;
  return { id, name: str(o.name), changes };
}

const VIEW = { elements: elementView, connections: connectionView, whatIfs: whatIfView } as const;

export class SheetMirror {
  private snapshot: MirrorSnapshot;
  private readonly listeners = new Set<MirrorListener>();
  private readonly unobserve: (() => void)[] = [];

  constructor(
    readonly doc: Y.Doc,
    /** Origins whose transactions count as this user's own (the commands' origin, the undo manager). */
    private readonly isLocal: (origin: unknown) => boolean = (origin) => origin === null,
  ) {
    this.snapshot = this.readAll(0);
    for (const name of COLLECTIONS) {
      const map = collection(doc, name);
      const handler = (events: Y.YEvent<Y.AbstractType<unknown>>[], tr: Y.Transaction) => this.apply(name, map, events, tr);
      map.observeDeep(handler);
      this.unobserve.push(() => map.unobserveDeep(handler));
    }
    for (const [name, map] of [['settings', settingsMap(doc)], ['sheet', sheetMeta(doc)]] as const) {
      const handler = (_events: unknown, tr: Y.Transaction) => {
        const s = this.snapshot;
        this.snapshot = {
          ...s,
          version: s.version + 1,
          // The "sheet" map holds only the format version (the sheet's name lives in the sheet list).
          ...(name === 'settings' ? { settings: fromY(map) as Record<string, Plain> } : {}),
        };
        this.emit(tr, new Set([name]));
      };
      map.observeDeep(handler);
      this.unobserve.push(() => map.unobserveDeep(handler));
    }
  }

  get current(): MirrorSnapshot {
    return this.snapshot;
  }

  subscribe(listener: MirrorListener): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  destroy(): void {
    for (const off of this.unobserve) off();
    this.listeners.clear();
  }

  private readAll(version: number): MirrorSnapshot {
    const read = <T>(name: Collection, view: (id: string, raw: Plain) => T) =>
      new Map([...collection(this.doc, name).entries()].map(([id, m]) => [id, view(id, fromY(m))] as const));
    return {
      version,
      settings: fromY(settingsMap(this.doc)) as Record<string, Plain>,
      elements: read('elements', elementView),
      connections: read('connections', connectionView),
      whatIfs: read('whatIfs', whatIfView),
    };
  }

  private apply(name: Collection, map: Y.Map<Y.Map<unknown>>, events: Y.YEvent<Y.AbstractType<unknown>>[], tr: Y.Transaction) {
    const touched = new Set<string>();
    for (const e of events) {
      if (e.target === map) for (const key of e.keys.keys()) touched.add(key);
      else if (e.path.length > 0) touched.add(String(e.path[0]));
    }
    if (touched.size === 0) return;
    const next = new Map(this.snapshot[name] as ReadonlyMap<string, unknown>);
    const view = VIEW[name] as (id: string, raw: Plain) => unknown;
    for (const id of touched) {
      const entry = map.get(id);
      if (entry instanceof Y.Map) next.set(id, view(id, fromY(entry)));
      else next.delete(id);
    }
    this.snapshot = { ...this.snapshot, version: this.snapshot.version + 1, [name]: next };
    this.emit(tr, new Set([name]));
  }

  private emit(tr: Y.Transaction, collections: Set<Collection | 'settings' | 'sheet'>) {
    const local = this.isLocal(tr.origin);
    for (const l of this.listeners) l(this.snapshot, { local, collections });
  }
}
