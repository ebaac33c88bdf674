// Weighted union-find over pins: merges zero-impedance ties and records known voltage offsets between pins
// (an ideal source's EMF), so that each merged class has one unknown voltage and every pin is root + offset.
import type { Complex } from '../complex';

export interface TieRecord {
  a: number;
  b: number;
  /** V(a) − V(b) imposed by the tie; zero for a plain conductor tie. */
  offset: Complex;
}

export class OffsetUnionFind {
  private readonly parent: Int32Array;
  private readonly offRe: Float64Array; // V(pin) − V(parent)
  private readonly offIm: Float64Array;
  /** Ties that joined two classes: they form a spanning forest of each class (used for tie currents). */
  readonly treeTies: number[] = [];

  constructor(size: number, private readonly earth = 0) {
    this.parent = new Int32Array(size);
    for (let i = 0; i < size; i++) this.parent[i] = i;
    this.offRe = new Float64Array(size);
    this.offIm = new Float64Array(size);
  }

  /** Root of the pin's class and V(pin) − V(root). */
  find(pin: number): { root: number; re: number; im: number } {
    let re = 0;
    let im = 0;
    let p = pin;
    while (this.parent[p] !== p) {
      re += this.offRe[p];
      im += this.offIm[p];
      p = this.parent[p];
    }
    const root = p;
    // Path compression, keeping each compressed pin's offset to the root.
    let q = pin;
    let accRe = re;
    let accIm = im;
    while (this.parent[q] !== root && this.parent[q] !== q) {
      const next = this.parent[q];
      const nextRe = accRe - this.offRe[q];
      const nextIm = accIm - this.offIm[q];
      this.parent[q] = root;
      this.offRe[q] = accRe;
      this.offIm[q] = accIm;
      q = next;
      accRe = nextRe;
      accIm = nextIm;
    }
    return { root, re, im };
  }

  /**
   * Imposes V(a) − V(b) = offset. Returns 'merged' when two classes joined, 'redundant' when the tie agrees with
   * ties already made, or 'conflict' when it contradicts them (ideal sources shorted or in parallel at different voltages).
   */
  union(a: number, b: number, offset: Complex, tieIndex: number, toleranceVolts = 1e-9): 'merged' | 'redundant' | 'conflict' {
    const fa = this.find(a);
    const fb = this.find(b);
    if (fa.root === fb.root) {
      const dRe = fa.re - fb.re - offset.re;
      const dIm = fa.im - fb.im - offset.im;
      const scale = Math.max(1, Math.hypot(offset.re, offset.im), Math.hypot(fa.re, fa.im), Math.hypot(fb.re, fb.im));
      return Math.hypot(dRe, dIm) <= toleranceVolts * scale ? 'redundant' : 'conflict';
    }
    // V(ra) − V(rb) = offset − (V(a) − V(ra)) + (V(b) − V(rb)).
    const re = offset.re - fa.re + fb.re;
    const im = offset.im - fa.im + fb.im;
    const earthRoot = this.find(this.earth).root;
    if (fa.root === earthRoot) {
      // Earth stays a root so that its class is the reference at zero volts.
      this.parent[fb.root] = fa.root;
      this.offRe[fb.root] = -re;
      this.offIm[fb.root] = -im;
    } else {
      this.parent[fa.root] = fb.root;
      this.offRe[fa.root] = re;
      this.offIm[fa.root] = im;
    }
    this.treeTies.push(tieIndex);
    return 'merged';
  }
}
