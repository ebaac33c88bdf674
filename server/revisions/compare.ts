// A revision against the live sheet: which elements, connections and what-ifs were added, removed or changed (and
// which of their fields), and which base-case voltages moved, by how much, largest first.
import type { ElementChange, RevisionComparison, VoltageMove } from '../../shared/revisions';
import type { SolveResult } from '../../solver';
import { canonicalJson } from './input-hash';
import { keyedVolts } from './summaries';

/** Smaller moves than this are rounding, not a change anyone acts on. */
export const VOLTAGE_MOVE_THRESHOLD = 0.05;

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === 'object' && v !== null && !Array.isArray(v);
const group = (doc: Json, name: string): Json => (isObject(doc[name]) ? (doc[name] as Json) : {});

/** Dotted paths at which two plain values differ (objects are walked, anything else compared whole). */
export function differingPaths(a: unknown, b: unknown, prefix = ''): string[] {
  if (isObject(a) && isObject(b)) {
    const keys = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
    return keys.flatMap((k) => differingPaths(a[k], b[k], prefix ? `${prefix}.${k}` : k));
  }
  return canonicalJson(a) === canonicalJson(b) ? [] : [prefix || '(value)'];
}

function describe(id: string, v: unknown): ElementChange {
  const o = isObject(v) ? v : {};
  return { id, name: typeof o.name === 'string' && o.name ? o.name : id, kind: typeof o.kind === 'string' ? o.kind : '' };
}

function compareGroup(before: Json, after: Json) {
  const added: ElementChange[] = [];
  const removed: ElementChange[] = [];
  const changed: ElementChange[] = [];
  for (const [id, v] of Object.entries(after)) if (!(id in before)) added.push(describe(id, v));
  for (const [id, v] of Object.entries(before)) {
    if (!(id in after)) removed.push(describe(id, v));
    else {
      const fields = differingPaths(v, after[id]);
      if (fields.length > 0) changed.push({ ...describe(id, after[id]), fields });
    }
  }
  return { added, removed, changed };
}

export function compareDocuments(
  revision: { number: number; document: Json; hash: string; base: SolveResult | null },
  live: { document: Json; hash: string; base: SolveResult | null },
): RevisionComparison {
  const elements = compareGroup(group(revision.document, 'elements'), group(live.document, 'elements'));
  const c = compareGroup(group(revision.document, 'connections'), group(live.document, 'connections'));
  const whatIfs = compareGroup(group(revision.document, 'whatIfs'), group(live.document, 'whatIfs'));
  const settings = differingPaths(group(revision.document, 'settings'), group(live.document, 'settings')).filter((p) => p !== '(value)');
  const nameOf = (d: Json) => (typeof d.name === 'string' ? d.name : '');
  const renamed = nameOf(revision.document) !== nameOf(live.document) ? { from: nameOf(revision.document), to: nameOf(live.document) } : null;
  const voltages: VoltageMove[] = [];
  const before = revision.base ? keyedVolts(revision.base) : new Map();
  const after = live.base ? keyedVolts(live.base) : new Map();
  for (const key of new Set([...before.keys(), ...after.keys()])) {
    const b = before.get(key);
    const a = after.get(key);
    const any = (a ?? b)!;
    const change = a && b ? a.volts - b.volts : null;
    if (change !== null && Math.abs(change) < VOLTAGE_MOVE_THRESHOLD) continue;
    voltages.push({ key, elementId: any.elementId, name: any.name, label: any.label, revisionVolts: b?.volts ?? null, liveVolts: a?.volts ?? null, changeVolts: change });
  }
  const size = (v: VoltageMove) => (v.changeVolts === null ? Infinity : Math.abs(v.changeVolts));
  voltages.sort((x, y) => size(y) - size(x) || x.key.localeCompare(y.key));
  return {
    revision: revision.number,
    identical: revision.hash === live.hash,
    liveHash: live.hash,
    revisionHash: revision.hash,
    elements,
    connections: { added: c.added.map((x) => x.id), removed: c.removed.map((x) => x.id), changed: c.changed.map((x) => x.id) },
    whatIfs,
    settings,
    renamed,
    voltages,
    voltageThresholdVolts: VOLTAGE_MOVE_THRESHOLD,
  };
}
