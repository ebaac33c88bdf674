// Symbolic analysis, done once per pattern: fill-reducing column order, elimination tree, sizes of L and U.
import { amdWithGroups } from './amd';
import { symmetricAdjacency } from './adjacency';
import { assertCsc, nnzOf, type ComplexCsc } from './csc';
import { eliminationStructure, groupedEliminationStructure } from './etree';

export interface SymbolicLu {
  n: number;
  /** colOrder[k] = original column (and preferred pivot row) eliminated k-th. */
  colOrder: Int32Array;
  colOrderInverse: Int32Array;
  /** Elimination tree of the permuted A+Aᵀ (parent of each permuted column, -1 at roots). */
  etreeParent: Int32Array;
  /** Cholesky column counts of the permuted A+Aᵀ, diagonal included. */
  colCounts: Int32Array;
  /** nnz(L) and nnz(U), unit and pivot diagonals included, if every diagonal pivot is accepted. */
  nnzLEstimate: number;
  nnzUEstimate: number;
  /** nnz(A) of the analysed pattern. */
  patternNnz: number;
  /** The analysed pattern (shared, not copied): a matrix with these arrays needs no pattern comparison. */
  colPtr: Int32Array;
  rowIdx: Int32Array;
  /** rowInOrder[p] = pivot-order position of row rowIdx[p]: factor works in that numbering for locality. */
  rowInOrder: Int32Array;
}

export type Ordering = 'amd' | 'natural' | Int32Array;

export interface AnalyseOptions {
  /** Default 'amd'; 'natural' keeps the given numbering; an Int32Array is a caller's order (order[k] = column). */
  ordering?: Ordering;
}

export function analyse(a: ComplexCsc, options: AnalyseOptions = {}): SymbolicLu {
  assertCsc(a);
  const n = a.n;
  const g = symmetricAdjacency(a);
  const ordering = options.ordering ?? 'amd';
  let colOrder: Int32Array;
  let principal: Int32Array | null = null;
  if (ordering === 'amd') {
    const amd = amdWithGroups(g);
    colOrder = amd.order;
    // Dense rows take no part in the grouping, so groups are exact only without them.
    if (amd.denseCount === 0) principal = amd.principal;
  } else if (ordering === 'natural') colOrder = Int32Array.from({ length: n }, (_, k) => k);
  else colOrder = ordering.slice();
  const colOrderInverse = new Int32Array(n).fill(-1);
  if (colOrder.length !== n) throw new RangeError(`ordering has ${colOrder.length} entries for a ${n}×${n} matrix`);
  for (let k = 0; k < n; k++) {
    const j = colOrder[k];
    if (j < 0 || j >= n || colOrderInverse[j] !== -1) throw new RangeError(`ordering is not a permutation at position ${k}`);
    colOrderInverse[j] = k;
  }
  const { parent, colCounts, nnzFactor } =
    (principal && groupedEliminationStructure(g, principal, colOrder)) ||
    eliminationStructure(g, colOrder, colOrderInverse);
  return {
    n,
    colOrder,
    colOrderInverse,
    etreeParent: parent,
    colCounts,
    nnzLEstimate: nnzFactor,
    nnzUEstimate: nnzFactor,
    patternNnz: nnzOf(a),
    colPtr: a.colPtr,
    rowIdx: a.rowIdx,
    rowInOrder: rowsInOrder(a, colOrderInverse),
  };
}

/** Row numbers of a's entries renamed to pivot-order positions. */
export function rowsInOrder(a: ComplexCsc, colOrderInverse: Int32Array): Int32Array {
  const nnz = nnzOf(a);
  const out = new Int32Array(nnz);
  for (let p = 0; p < nnz; p++) out[p] = colOrderInverse[a.rowIdx[p]];
  return out;
}
