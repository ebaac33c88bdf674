// Sets or deletes a field at a path of keys in a plain object, creating objects on the way (the plain twin of
// the document's setAtPath, used to check an edit before it is written).
import type { Plain } from '../document/y-values';

export function setAtPath(target: Record<string, Plain>, path: readonly string[], value: Plain | undefined): void {
  let at = target;
  for (const key of path.slice(0, -1)) {
    const next = at[key];
    if (typeof next !== 'object' || next === null || Array.isArray(next)) at[key] = {};
    at = at[key] as Record<string, Plain>;
  }
  const last = path[path.length - 1];
  if (value === undefined) delete at[last];
  else at[last] = value;
}
