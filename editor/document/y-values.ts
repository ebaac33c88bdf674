// Plain JSON values <-> Yjs values for the sheet document: every plain object becomes a Y.Map (so each leaf field
// merges on its own under concurrent edits); numbers, strings, booleans and null stay leaves. The sheet format has
// no arrays; one found is stored as a leaf (replaced whole), never as a Y.Array.
import * as Y from 'yjs';

export type Plain = null | boolean | number | string | Plain[] | { [key: string]: Plain };

const isPlainObject = (v: unknown): v is Record<string, Plain> =>
  typeof v === 'object' && v !== null && !Array.isArray(v) && !(v instanceof Y.AbstractType);

export function toY(value: Plain): unknown {
  if (!isPlainObject(value)) return value;
  const map = new Y.Map<unknown>();
  for (const [k, v] of Object.entries(value)) if (v !== undefined) map.set(k, toY(v));
  return map;
}

export function fromY(value: unknown): Plain {
  if (value instanceof Y.Map) {
    const out: Record<string, Plain> = {};
    for (const [k, v] of value.entries()) out[k] = fromY(v);
    return out;
  }
  return value as Plain;
}

const sameLeaf = (a: unknown, b: unknown) => a === b || (Array.isArray(a) && JSON.stringify(a) === JSON.stringify(b));

/**
 * Makes `map` equal to `value`, touching only what differs: unchanged leaves are not rewritten, so a merge with a
 * colleague's concurrent edit of another field keeps both.
 */
export function assignPlain(map: Y.Map<unknown>, value: Record<string, Plain>): void {
  for (const key of [...map.keys()]) if (!(key in value) || value[key] === undefined) map.delete(key);
  for (const [key, next] of Object.entries(value)) {
    if (next === undefined) continue;
    const current = map.get(key);
    if (isPlainObject(next)) {
      if (current instanceof Y.Map) assignPlain(current, next);
      else map.set(key, toY(next));
    } else if (current instanceof Y.Map || !sameLeaf(current, next)) {
      map.set(key, next);
    }
  }
}

/** Sets one field at a path of keys under `map`, creating maps on the way. */
export function setAtPath(map: Y.Map<unknown>, path: readonly string[], value: Plain | undefined): void {
  let at = map;
  for (const key of path.slice(0, -1)) {
    let next = at.get(key);
    if (!(next instanceof Y.Map)) {
      next = new Y.Map<unknown>();
      at.set(key, next);
    }
    at = next as Y.Map<unknown>;
  }
  const last = path[path.length - 1];
  if (value === undefined) at.delete(last);
  else if (isPlainObject(value)) {
    const current = at.get(last);
    if (current instanceof Y.Map) assignPlain(current, value);
    else at.set(last, toY(value));
  } else if (!sameLeaf(at.get(last), value)) at.set(last, value);
}
