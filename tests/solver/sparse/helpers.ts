// Test helpers: a seeded generator, random power-network-like admittance matrices, and mathjs as a dense reference.
import * as math from 'mathjs';
import { complex, lusolve, type Complex, type Matrix } from 'mathjs';
import { matInverse, type ComplexMatrix } from '../../../solver/complex';
import { ComplexTriplets, type BlockUpdate, type ComplexCsc } from '../../../solver/sparse';

/** mulberry32: a tiny seeded generator, so every random case is reproducible from its seed. */
export function mulberry32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export const uniform = (rng: () => number, lo: number, hi: number): number => lo + (hi - lo) * rng();

/** Admittance 1/(r + jx) of a series branch, as [re, im]. */
export function seriesAdmittance(rOhms: number, xOhms: number): [number, number] {
  const d = rOhms * rOhms + xOhms * xOhms;
  return [rOhms / d, -xOhms / d];
}

/** Stamps y between i and j: +y on both diagonals, −y off the diagonal. */
export function stampBranch(t: ComplexTriplets, i: number, j: number, y: [number, number]): void {
  t.add(i, i, y[0], y[1]);
  t.add(j, j, y[0], y[1]);
  t.add(i, j, -y[0], -y[1]);
  t.add(j, i, -y[0], -y[1]);
}

export interface NetworkOptions {
  nodes: number;
  topology: 'radial' | 'meshed';
  /** Share of nodes that get a one-way coupling to a random other node (pattern and values unsymmetric). */
  unsymmetricShare?: number;
}

/**
 * A random network built like a power system: a random tree of series branches (plus extra ties when meshed),
 * a load shunt at every node, a strong source admittance at one node, node numbers shuffled so that the
 * given numbering is no help to the ordering.
 */
export function randomNetwork(rng: () => number, options: NetworkOptions): ComplexCsc {
  const n = options.nodes;
  const label = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = n - 1; i > 0; i--) {
    const j = Math.floor(rng() * (i + 1));
    [label[i], label[j]] = [label[j], label[i]];
  }
  const t = new ComplexTriplets(n, 8 * n);
  for (let i = 1; i < n; i++) {
    const parent = Math.floor(rng() * i);
    stampBranch(t, label[i], label[parent], seriesAdmittance(uniform(rng, 0.02, 0.5), uniform(rng, 0.02, 0.5)));
  }
  if (options.topology === 'meshed') {
    const ties = Math.max(1, Math.round(0.2 * n));
    for (let k = 0; k < ties; k++) {
      const i = Math.floor(rng() * n);
      const j = Math.floor(rng() * n);
      if (i !== j) stampBranch(t, i, j, seriesAdmittance(uniform(rng, 0.05, 1), uniform(rng, 0.05, 1)));
    }
  }
  for (let i = 0; i < n; i++) t.add(i, i, uniform(rng, 0.001, 0.05), uniform(rng, -0.03, 0.01)); // loads
  t.add(label[0], label[0], 50, -200); // source
  const oneWay = Math.round((options.unsymmetricShare ?? 0.1) * n);
  for (let k = 0; k < oneWay; k++) {
    const i = Math.floor(rng() * n);
    const j = Math.floor(rng() * n);
    if (i !== j) t.add(i, j, uniform(rng, -0.5, 0.5), uniform(rng, -0.5, 0.5));
  }
  return t.toCsc();
}

export function randomVector(rng: () => number, n: number): { re: Float64Array; im: Float64Array } {
  const re = new Float64Array(n);
  const im = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    re[i] = uniform(rng, -1, 1);
    im[i] = uniform(rng, -1, 1);
  }
  return { re, im };
}

export function toDense(a: ComplexCsc): Complex[][] {
  const rows: Complex[][] = Array.from({ length: a.n }, () => Array.from({ length: a.n }, () => complex(0, 0)));
  for (let j = 0; j < a.n; j++) {
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) rows[a.rowIdx[p]][j] = complex(a.re[p], a.im[p]);
  }
  return rows;
}

/** mathjs's dense complex lusolve: the independent reference. */
export function mathjsSolve(a: ComplexCsc, bRe: Float64Array, bIm: Float64Array): { re: Float64Array; im: Float64Array } {
  const b = Array.from(bRe, (r, i) => [complex(r, bIm[i])]);
  const x = lusolve(toDense(a), b) as unknown as Complex[][];
  const re = new Float64Array(a.n);
  const im = new Float64Array(a.n);
  for (let i = 0; i < a.n; i++) {
    const v = x[i][0];
    re[i] = typeof v === 'number' ? v : v.re;
    im[i] = typeof v === 'number' ? 0 : v.im;
  }
  return { re, im };
}

/** max |x − ref| / max |ref|. */
export function relativeDifference(x: { re: Float64Array; im: Float64Array }, ref: { re: Float64Array; im: Float64Array }): number {
  let diff = 0;
  let size = 0;
  for (let i = 0; i < ref.re.length; i++) {
    diff = Math.max(diff, Math.hypot(x.re[i] - ref.re[i], x.im[i] - ref.im[i]));
    size = Math.max(size, Math.hypot(ref.re[i], ref.im[i]));
  }
  return diff / size;
}

export interface FourWireBranch {
  from: number;
  to: number;
  /** Primitive series impedance of the run, ohms, 4×4 over A, B, C, N. */
  zOhms: ComplexMatrix;
}

/** Bus b's conductor c (0..3 = A, B, C, N) is unknown 4b + c. */
export const conductorNode = (bus: number, conductor: number): number => 4 * bus + conductor;

/**
 * A four-wire network: each run stamps its 4×4 coupled series admittance as the two-port [Y −Y; −Y Y],
 * phase-to-neutral loads at every bus, a stiff grounded source at bus 0, a few neutral ground rods.
 */
export function fourWireNetwork(rng: () => number, buses: number, extraTies = 0): { a: ComplexCsc; branches: FourWireBranch[] } {
  const branches: FourWireBranch[] = [];
  for (let bus = 1; bus < buses; bus++) branches.push({ from: Math.floor(rng() * bus), to: bus, zOhms: runImpedance(rng) });
  for (let k = 0; k < extraTies; k++) {
    const from = Math.floor(rng() * buses);
    const to = Math.floor(rng() * buses);
    if (from !== to) branches.push({ from, to, zOhms: runImpedance(rng) });
  }
  const t = new ComplexTriplets(4 * buses);
  for (const br of branches) stampRun(t, br.from, br.to, matInverse(br.zOhms));
  for (let bus = 0; bus < buses; bus++) {
    for (let phase = 0; phase < 3; phase++) {
      const y = seriesAdmittance(uniform(rng, 5, 40), uniform(rng, 1, 10)); // a load of a few kW at 120 V
      stampBranch(t, conductorNode(bus, phase), conductorNode(bus, 3), y);
    }
    if (bus % 7 === 0) t.add(conductorNode(bus, 3), conductorNode(bus, 3), 1 / 25, 0); // 25-ohm ground rod
  }
  for (let c = 0; c < 4; c++) t.add(conductorNode(0, c), conductorNode(0, c), 200, -800); // stiff source
  return { a: t.toCsc(), branches };
}

function runImpedance(rng: () => number): ComplexMatrix {
  const lengthFt = uniform(rng, 30, 300);
  const self = { re: 0.2 * lengthFt / 1000, im: 0.05 * lengthFt / 1000 };
  const mutual = { re: 0.01 * lengthFt / 1000, im: 0.02 * lengthFt / 1000 };
  return Array.from({ length: 4 }, (_, i) => Array.from({ length: 4 }, (_, j) => (i === j ? { ...self } : { ...mutual })));
}

export function stampRun(t: ComplexTriplets, from: number, to: number, y: ComplexMatrix): void {
  for (let c = 0; c < 4; c++) {
    for (let d = 0; d < 4; d++) {
      const { re, im } = y[c][d];
      t.add(conductorNode(from, c), conductorNode(from, d), re, im);
      t.add(conductorNode(to, c), conductorNode(to, d), re, im);
      t.add(conductorNode(from, c), conductorNode(to, d), -re, -im);
      t.add(conductorNode(to, c), conductorNode(from, d), -re, -im);
    }
  }
}

/** The 8×8 change of Y when one conductor of a run opens: Y' = (Z without that conductor)⁻¹, padded with zeros. */
export function openConductorUpdate(branch: FourWireBranch, conductor: number): BlockUpdate {
  const keep = [0, 1, 2, 3].filter((c) => c !== conductor);
  const reduced = matInverse(keep.map((i) => keep.map((j) => branch.zOhms[i][j])));
  const before = matInverse(branch.zOhms);
  const delta4 = Array.from({ length: 4 }, (_, i) =>
    Array.from({ length: 4 }, (_, j) => {
      const ki = keep.indexOf(i);
      const kj = keep.indexOf(j);
      const after = ki >= 0 && kj >= 0 ? reduced[ki][kj] : { re: 0, im: 0 };
      return { re: after.re - before[i][j].re, im: after.im - before[i][j].im };
    }),
  );
  const nodes = new Int32Array(8);
  for (let c = 0; c < 4; c++) {
    nodes[c] = conductorNode(branch.from, c);
    nodes[4 + c] = conductorNode(branch.to, c);
  }
  const deltaRe = new Float64Array(64);
  const deltaIm = new Float64Array(64);
  for (let a = 0; a < 8; a++) {
    for (let b = 0; b < 8; b++) {
      const sign = (a < 4) === (b < 4) ? 1 : -1;
      const d = delta4[a % 4][b % 4];
      deltaRe[a * 8 + b] = sign * d.re;
      deltaIm[a * 8 + b] = sign * d.im;
    }
  }
  return { nodes, deltaRe, deltaIm };
}

// mathjs builds a SparseMatrix from CSC arrays at run time; its type declarations do not list the class.
const SparseMatrixClass = (math as unknown as {
  SparseMatrix: new (data: { values: unknown[]; index: number[]; ptr: number[]; size: number[] }) => Matrix;
}).SparseMatrix;

/** The pattern of a as a mathjs SparseMatrix holding the real parts (enough for mathjs's ordering). */
export function toMathjsSparseReal(a: ComplexCsc): Matrix {
  return new SparseMatrixClass({ values: Array.from(a.re), index: Array.from(a.rowIdx), ptr: Array.from(a.colPtr), size: [a.n, a.n] });
}
