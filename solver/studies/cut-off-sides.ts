// Which side of a coupling is left without a reference when that coupling opens: the bridges of the matrix's own
// graph (classes joined by off-diagonal entries, and a class with an admittance to the reference, a shunt or a
// known voltage, joined to one reference node), by Tarjan's bridge-finding from the reference. A bridge from p
// to its child v in the search cuts v's side off. The sweep gives such an opening its tie from the start, instead
// of learning from a singular K and solving the case again.
import type { ComplexCsc } from '../linear-system';

/** A row is joined to the reference when its unscaled sum is above this share of its diagonal. */
const SHUNT_SHARE = 1e-9;

export class CutOffSides {
  private readonly cutOff = new Map<number, number>();
  /** Classes whose only tie to the reference is their own shunt (a bridge from the reference node). */
  private readonly heldByShunt = new Set<number>();
  private readonly n: number;
  /** Unscaled row sums (the shunt admittance to the reference) and diagonals, siemens. */
  private readonly sumRe: Float64Array;
  private readonly sumIm: Float64Array;
  private readonly diagonal: Float64Array;

  constructor(private readonly matrix: ComplexCsc, scale: Float64Array) {
    const n = (this.n = matrix.n);
    const root = n;
    const { colPtr, rowIdx, re, im } = matrix;
    const neighbours: number[][] = Array.from({ length: n + 1 }, () => []);
    const seen = new Set<number>();
    const join = (a: number, b: number) => {
      const key = this.key(a, b);
      if (seen.has(key)) return;
      seen.add(key);
      neighbours[a].push(b);
      neighbours[b].push(a);
    };
    const sumRe = (this.sumRe = new Float64Array(n));
    const sumIm = (this.sumIm = new Float64Array(n));
    const diagonal = (this.diagonal = new Float64Array(n));
    for (let j = 0; j < n; j++) {
      for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
        const i = rowIdx[p];
        if (re[p] === 0 && im[p] === 0) continue;
        // Unscaled: Y_ij = A_ij / (s_i s_j).
        const f = scale[i] * scale[j];
        sumRe[i] += re[p] / f;
        sumIm[i] += im[p] / f;
        if (i === j) diagonal[i] = Math.hypot(re[p], im[p]) / f;
        else join(i, j);
      }
    }
    for (let i = 0; i < n; i++) if (Math.hypot(sumRe[i], sumIm[i]) > SHUNT_SHARE * diagonal[i]) join(i, root);
    this.findBridges(neighbours, root);
  }

  private key(a: number, b: number): number {
    return a < b ? a * (this.n + 1) + b : b * (this.n + 1) + a;
  }

  /** Iterative (a radial sheet is a deep tree): discovery order, low links, and each bridge's child side. */
  private findBridges(neighbours: number[][], root: number): void {
    const count = neighbours.length;
    const order = new Int32Array(count).fill(-1);
    const low = new Int32Array(count);
    const parent = new Int32Array(count).fill(-1);
    const next = new Int32Array(count);
    let time = 0;
    const stack = [root];
    order[root] = low[root] = time++;
    while (stack.length > 0) {
      const v = stack[stack.length - 1];
      if (next[v] < neighbours[v].length) {
        const w = neighbours[v][next[v]++];
        if (order[w] < 0) {
          parent[w] = v;
          order[w] = low[w] = time++;
          stack.push(w);
        } else if (w !== parent[v]) {
          low[v] = Math.min(low[v], order[w]);
        }
        continue;
      }
      stack.pop();
      const p = parent[v];
      if (p < 0) continue;
      low[p] = Math.min(low[p], low[v]);
      if (low[v] > order[p]) {
        if (p === root) this.heldByShunt.add(v);
        else this.cutOff.set(this.key(p, v), v);
      }
    }
  }

  /** The class cut off when the whole coupling between classes a and b opens, or −1 when every part stays referenced. */
  sideCutOff(a: number, b: number): number {
    if (a < 0 || b < 0) return -1;
    return this.cutOff.get(this.key(a, b)) ?? -1;
  }

  /**
   * The class cut off when a coupling of admittance y (siemens) from class c to the reference opens, or −1: c is
   * cut off when that shunt is its only way to the reference and all of its shunt.
   */
  sideCutOffFromReference(c: number, yRe: number, yIm: number): number {
    if (c < 0 || !this.heldByShunt.has(c)) return -1;
    return Math.hypot(this.sumRe[c] - yRe, this.sumIm[c] - yIm) <= SHUNT_SHARE * this.diagonal[c] ? c : -1;
  }

  /** A_ab, the scaled entry between two classes (zero when absent). */
  entry(a: number, b: number): { re: number; im: number } {
    const { colPtr, rowIdx, re, im } = this.matrix;
    for (let p = colPtr[b]; p < colPtr[b + 1]; p++) if (rowIdx[p] === a) return { re: re[p], im: im[p] };
    return { re: 0, im: 0 };
  }
}
