// Assembly of a complex sparse matrix from (row, col, value) stamps, compressed to CSC.
import type { ComplexCsc } from './csc';

/** Collects stamps; duplicates are summed by toCsc and explicit zeros stay in the pattern (openings rely on that). */
export class ComplexTriplets {
  readonly n: number;
  private rows: Int32Array;
  private cols: Int32Array;
  private vRe: Float64Array;
  private vIm: Float64Array;
  private count = 0;

  constructor(n: number, capacityHint = 16) {
    if (!Number.isInteger(n) || n < 0) throw new RangeError(`matrix size must be a non-negative integer, got ${n}`);
    this.n = n;
    const cap = Math.max(16, Math.floor(capacityHint));
    this.rows = new Int32Array(cap);
    this.cols = new Int32Array(cap);
    this.vRe = new Float64Array(cap);
    this.vIm = new Float64Array(cap);
  }

  /** Number of stamps so far (before duplicates are summed). */
  get size(): number {
    return this.count;
  }

  add(row: number, col: number, re: number, im: number): void {
    const n = this.n;
    if ((row | 0) !== row || (col | 0) !== col || row < 0 || col < 0 || row >= n || col >= n) {
      throw new RangeError(`entry (${row}, ${col}) is outside the ${n}×${n} matrix`);
    }
    if (!Number.isFinite(re) || !Number.isFinite(im)) {
      throw new RangeError(`entry (${row}, ${col}) has a non-finite value ${re} + ${im}i`);
    }
    if (this.count === this.rows.length) this.grow();
    const k = this.count++;
    this.rows[k] = row;
    this.cols[k] = col;
    this.vRe[k] = re;
    this.vIm[k] = im;
  }

  private grow(): void {
    const cap = this.rows.length * 2;
    const rows = new Int32Array(cap);
    rows.set(this.rows);
    const cols = new Int32Array(cap);
    cols.set(this.cols);
    const vRe = new Float64Array(cap);
    vRe.set(this.vRe);
    const vIm = new Float64Array(cap);
    vIm.set(this.vIm);
    this.rows = rows;
    this.cols = cols;
    this.vRe = vRe;
    this.vIm = vIm;
  }

  /** Two counting sorts (by row, then stably by column) leave rows sorted in each column, duplicates adjacent. */
  toCsc(): ComplexCsc {
    const { n, count, rows, cols, vRe, vIm } = this;
    const rowPtr = new Int32Array(n + 1);
    for (let k = 0; k < count; k++) rowPtr[rows[k] + 1]++;
    for (let i = 0; i < n; i++) rowPtr[i + 1] += rowPtr[i];
    const byRow = new Int32Array(count); // stamp indices grouped by row
    const next = rowPtr.slice(0, n);
    for (let k = 0; k < count; k++) byRow[next[rows[k]]++] = k;

    const colPtr = new Int32Array(n + 1);
    for (let k = 0; k < count; k++) colPtr[cols[k] + 1]++;
    for (let j = 0; j < n; j++) colPtr[j + 1] += colPtr[j];
    const fill = colPtr.slice(0, n);
    const rowIdx = new Int32Array(count);
    const re = new Float64Array(count);
    const im = new Float64Array(count);
    for (let t = 0; t < count; t++) {
      const k = byRow[t];
      const dst = fill[cols[k]]++;
      rowIdx[dst] = rows[k];
      re[dst] = vRe[k];
      im[dst] = vIm[k];
    }

    // Sum adjacent duplicates in place, compacting towards the front.
    let out = 0;
    let start = 0;
    for (let j = 0; j < n; j++) {
      const end = colPtr[j + 1];
      const colStart = out;
      for (let p = start; p < end; p++) {
        if (out > colStart && rowIdx[out - 1] === rowIdx[p]) {
          re[out - 1] += re[p];
          im[out - 1] += im[p];
        } else {
          rowIdx[out] = rowIdx[p];
          re[out] = re[p];
          im[out] = im[p];
          out++;
        }
      }
      start = end;
      colPtr[j + 1] = out;
    }
    if (out === count) return { n, colPtr, rowIdx, re, im };
    return { n, colPtr, rowIdx: rowIdx.slice(0, out), re: re.slice(0, out), im: im.slice(0, out) };
  }
}
