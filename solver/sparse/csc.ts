// The compressed-sparse-column complex matrix shared by every sparse routine, and small pattern helpers.

/** Square n×n matrix; row indices sorted within each column; explicit zeros are real entries of the pattern. */
export interface ComplexCsc {
  n: number;
  colPtr: Int32Array; // length n+1
  rowIdx: Int32Array; // length nnz
  re: Float64Array; // length nnz
  im: Float64Array; // length nnz
}

export const nnzOf = (a: ComplexCsc): number => a.colPtr[a.n];

/** Position of entry (row, col) in a's arrays, or -1 when it is not in the pattern (binary search: rows are sorted). */
export function findEntry(a: ComplexCsc, row: number, col: number): number {
  let lo = a.colPtr[col];
  let hi = a.colPtr[col + 1] - 1;
  const rows = a.rowIdx;
  while (lo <= hi) {
    const mid = (lo + hi) >> 1;
    const r = rows[mid];
    if (r === row) return mid;
    if (r < row) lo = mid + 1;
    else hi = mid - 1;
  }
  return -1;
}

/** True when both matrices have the same n and pattern; shared pattern arrays make this O(1). */
export function samePattern(a: ComplexCsc, b: ComplexCsc): boolean {
  if (a.n !== b.n) return false;
  if (a.colPtr === b.colPtr && a.rowIdx === b.rowIdx) return true;
  const nnz = nnzOf(a);
  if (nnz !== nnzOf(b)) return false;
  for (let j = 0; j <= a.n; j++) if (a.colPtr[j] !== b.colPtr[j]) return false;
  for (let p = 0; p < nnz; p++) if (a.rowIdx[p] !== b.rowIdx[p]) return false;
  return true;
}

/** Checks the structural invariants; throws a RangeError that names the first bad column. */
export function assertCsc(a: ComplexCsc, what = 'matrix'): void {
  const { n, colPtr, rowIdx, re, im } = a;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`${what}: n must be a non-negative integer, got ${n}`);
  if (colPtr.length !== n + 1) throw new RangeError(`${what}: colPtr has length ${colPtr.length}, expected ${n + 1}`);
  const nnz = colPtr[n];
  if (colPtr[0] !== 0 || rowIdx.length < nnz || re.length < nnz || im.length < nnz) {
    throw new RangeError(`${what}: colPtr[0] must be 0 and rowIdx/re/im must hold colPtr[n] = ${nnz} entries`);
  }
  for (let j = 0; j < n; j++) {
    const end = colPtr[j + 1];
    if (end < colPtr[j]) throw new RangeError(`${what}: colPtr decreases at column ${j}`);
    let last = -1;
    for (let p = colPtr[j]; p < end; p++) {
      const i = rowIdx[p];
      if (i <= last || i >= n) throw new RangeError(`${what}: column ${j} has row ${i} out of range or out of order`);
      last = i;
    }
  }
}
