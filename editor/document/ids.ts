// New ids for elements, connections, what-ifs and changes: short, random, prefixed by kind for readable JSON.
import * as random from 'lib0/random';

export function newId(prefix: string): string {
  return `${prefix}-${random.uuidv4().replace(/-/g, '').slice(0, 12)}`;
}
