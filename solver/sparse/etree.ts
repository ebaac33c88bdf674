// Elimination tree and column counts of the Cholesky pattern of the permuted A+Aᵀ: the fill a diagonal-pivoting
// LU will have (upper bound for structurally unsymmetric A), used to size L and U before factorising.
import type { AdjacencyGraph } from './adjacency';

export interface EliminationStructure {
  /** parent[k] = parent of permuted column k in the elimination tree, -1 for a root. */
  parent: Int32Array;
  /** Nonzeros in column k of the Cholesky factor, diagonal included. */
  colCounts: Int32Array;
  /** Sum of colCounts. */
  nnzFactor: number;
}

/** order[k] = original node eliminated k-th; orderInverse is its inverse. */
export function eliminationStructure(
  g: AdjacencyGraph,
  order: Int32Array,
  orderInverse: Int32Array,
): EliminationStructure {
  const { n, ptr, adj } = g;
  const parent = new Int32Array(n).fill(-1);
  const ancestor = new Int32Array(n).fill(-1);
  // Liu's algorithm with path compression, row by row of the permuted upper triangle.
  for (let k = 0; k < n; k++) {
    const node = order[k];
    for (let p = ptr[node]; p < ptr[node + 1]; p++) {
      let j = orderInverse[adj[p]];
      while (j !== -1 && j < k) {
        const up = ancestor[j];
        ancestor[j] = k;
        if (up === -1) parent[j] = k;
        j = up;
      }
    }
  }
  // Row k of the factor is the union of tree paths from each neighbour j < k up to k: count each node once.
  const colCounts = new Int32Array(n);
  const mark = ancestor.fill(-1);
  let nnzFactor = 0;
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    colCounts[k]++;
    nnzFactor++;
    const node = order[k];
    for (let p = ptr[node]; p < ptr[node + 1]; p++) {
      let j = orderInverse[adj[p]];
      if (j > k) continue;
      while (mark[j] !== k) {
        mark[j] = k;
        colCounts[j]++;
        nnzFactor++;
        j = parent[j];
      }
    }
  }
  return { parent, colCounts, nnzFactor };
}

/**
 * The same structure computed on groups of indistinguishable nodes (equal closed neighbourhoods, contiguous in
 * the order): a four-wire network's graph is some sixteen times smaller that way. Returns null when a group is
 * not contiguous in the order, so that the caller uses eliminationStructure instead.
 */
export function groupedEliminationStructure(
  g: AdjacencyGraph,
  principal: Int32Array,
  order: Int32Array,
): EliminationStructure | null {
  const { n, ptr, adj } = g;
  // Groups numbered by first appearance in the order; each must occupy consecutive positions.
  const groupOf = new Int32Array(n).fill(-1);
  const groupStart: number[] = [];
  const groupRep: number[] = [];
  for (let k = 0; k < n; k++) {
    const r = principal[order[k]];
    if (groupOf[r] === -1) {
      groupOf[r] = groupStart.length;
      groupStart.push(k);
      groupRep.push(r);
    } else if (groupOf[r] !== groupStart.length - 1) {
      return null;
    }
  }
  const groups = groupStart.length;
  const size = new Int32Array(groups);
  for (let i = 0; i < n; i++) {
    groupOf[i] = groupOf[principal[i]];
    size[groupOf[i]]++;
  }

  // Group graph through representatives: a neighbouring group is listed once, by its own representative.
  const gParent = new Int32Array(groups).fill(-1);
  const ancestor = new Int32Array(groups).fill(-1);
  for (let K = 0; K < groups; K++) {
    const r = groupRep[K];
    for (let p = ptr[r]; p < ptr[r + 1]; p++) {
      const j = adj[p];
      if (principal[j] !== j) continue;
      let J = groupOf[j];
      while (J !== -1 && J < K) {
        const up = ancestor[J];
        ancestor[J] = K;
        if (up === -1) gParent[J] = K;
        J = up;
      }
    }
  }
  const external = new Float64Array(groups); // rows below each group's diagonal block
  const mark = ancestor.fill(-1);
  for (let K = 0; K < groups; K++) {
    mark[K] = K;
    const r = groupRep[K];
    for (let p = ptr[r]; p < ptr[r + 1]; p++) {
      const j = adj[p];
      if (principal[j] !== j) continue;
      let J = groupOf[j];
      if (J > K) continue;
      while (mark[J] !== K) {
        mark[J] = K;
        external[J] += size[K];
        J = gParent[J];
      }
    }
  }

  const parent = new Int32Array(n);
  const colCounts = new Int32Array(n);
  let nnzFactor = 0;
  for (let K = 0; K < groups; K++) {
    const s = size[K];
    const start = groupStart[K];
    for (let t = 0; t < s; t++) {
      colCounts[start + t] = s - t + external[K];
      parent[start + t] = t + 1 < s ? start + t + 1 : gParent[K] >= 0 ? groupStart[gParent[K]] : -1;
    }
    nnzFactor += (s * (s + 1)) / 2 + s * external[K];
  }
  return { parent, colCounts, nnzFactor };
}
