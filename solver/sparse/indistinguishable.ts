// Initial graph compression: nodes with identical closed neighbourhoods (the conductors of one bus) become one
// weighted supervariable before the ordering starts, which shrinks a four-wire network's graph about sixteen-fold.
import type { AdjacencyGraph } from './adjacency';

export interface Compression {
  /** principal[i] = the representative of i's group (i itself for representatives). */
  principal: Int32Array;
  /** Group size for representatives, 0 for absorbed members. */
  weight: Int32Array;
}

/** `skip[i]` nodes (dense rows) take no part: they are left out of every neighbourhood. */
export function compressIndistinguishable(g: AdjacencyGraph, skip: Uint8Array): Compression {
  const { n, ptr, adj } = g;
  const principal = new Int32Array(n);
  const weight = new Int32Array(n);
  const degree = new Int32Array(n);
  const hash = new Int32Array(n);
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) {
    principal[i] = i;
    weight[i] = skip[i] ? 0 : 1;
    if (skip[i]) continue;
    let h = i;
    let d = 0;
    for (let p = ptr[i]; p < ptr[i + 1]; p++) {
      const j = adj[p];
      if (skip[j]) continue;
      h += j;
      if (h >= n) h -= n;
      d++;
    }
    degree[i] = d;
    hash[i] = h;
    next[i] = head[h];
    head[h] = i;
  }

  const mark = new Int32Array(n).fill(-1);
  for (let h = 0; h < n; h++) {
    for (let a = head[h]; a !== -1; a = next[a]) {
      if (principal[a] !== a) continue;
      let marked = false;
      for (let b = next[a]; b !== -1; b = next[b]) {
        if (principal[b] !== b || degree[b] !== degree[a]) continue;
        if (!marked) {
          // Mark the closed neighbourhood of a once, only when a candidate shows up.
          mark[a] = a;
          for (let p = ptr[a]; p < ptr[a + 1]; p++) if (!skip[adj[p]]) mark[adj[p]] = a;
          marked = true;
        }
        if (mark[b] !== a) continue; // b must be a neighbour of a
        let same = true;
        for (let p = ptr[b]; p < ptr[b + 1]; p++) {
          const j = adj[p];
          if (!skip[j] && mark[j] !== a) {
            same = false;
            break;
          }
        }
        if (same) {
          principal[b] = a;
          weight[a] += weight[b];
          weight[b] = 0;
        }
      }
    }
  }
  return { principal, weight };
}
