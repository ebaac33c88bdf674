// The undirected graph of A+Aᵀ without the diagonal: what the ordering and the elimination tree work on.
import type { ComplexCsc } from './csc';

/** Symmetric adjacency in compressed form: neighbours of i are adj[ptr[i] .. ptr[i+1]), sorted, no self loops. */
export interface AdjacencyGraph {
  n: number;
  ptr: Int32Array;
  adj: Int32Array;
}

/** Column j of A+Aᵀ is the sorted union of column j of A and column j of Aᵀ (row j of A): a merge, no marker. */
export function symmetricAdjacency(a: ComplexCsc): AdjacencyGraph {
  const { n, colPtr, rowIdx } = a;
  const nnz = colPtr[n];
  // Aᵀ by a counting sort; visiting columns in order leaves its rows sorted.
  const tPtr = new Int32Array(n + 1);
  for (let p = 0; p < nnz; p++) tPtr[rowIdx[p] + 1]++;
  for (let i = 0; i < n; i++) tPtr[i + 1] += tPtr[i];
  const tIdx = new Int32Array(nnz);
  const fill = tPtr.slice(0, n);
  for (let j = 0; j < n; j++) {
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) tIdx[fill[rowIdx[p]]++] = j;
  }
  const ptr = new Int32Array(n + 1);
  const adj = new Int32Array(2 * nnz);
  let out = 0;
  for (let j = 0; j < n; j++) {
    let p = colPtr[j];
    const pEnd = colPtr[j + 1];
    let t = tPtr[j];
    const tEnd = tPtr[j + 1];
    while (p < pEnd || t < tEnd) {
      const r = p < pEnd ? rowIdx[p] : n;
      const c = t < tEnd ? tIdx[t] : n;
      let v: number;
      if (r < c) {
        v = r;
        p++;
      } else if (c < r) {
        v = c;
        t++;
      } else {
        v = r;
        p++;
        t++;
      }
      if (v !== j) adj[out++] = v;
    }
    ptr[j + 1] = out;
  }
  return { n, ptr, adj: out < adj.length ? adj.slice(0, out) : adj };
}
