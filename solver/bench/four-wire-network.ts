// Synthetic four-wire (A, B, C, N) low-voltage networks for the solver benchmark: coupled 4×4 runs stamped as
// two-ports, phase-to-neutral loads, neutral ground rods, and a source bus whose voltages are known.
import { matInverse, type ComplexMatrix } from '../complex';
import { ComplexTriplets, type BlockUpdate, type ComplexCsc } from '../sparse';

export type Topology = 'radial' | 'local-mesh' | 'long-ties';

export interface Run {
  from: number;
  to: number;
  lineType: number;
  lengthFt: number;
}

export interface BenchNetwork {
  buses: number;
  runs: Run[];
  /** Tree depth of the radial skeleton (spans from the source to the farthest bus). */
  depth: number;
}

export interface AssembledNetwork {
  y: ComplexCsc;
  /** Currents injected by the known source voltages: the right-hand side. */
  bRe: Float64Array;
  bIm: Float64Array;
}

/** Unknown of bus b ≥ 1, conductor c (0..3 = A, B, C, N); bus 0 is the source and has none. */
export const unknownOf = (bus: number, conductor: number): number => 4 * (bus - 1) + conductor;

const SOURCE_VOLTS = 120;

/** Series impedance per 1000 ft of four cable types, ohms: [self R, self X, mutual R, mutual X, neutral self R]. */
const LINE_TYPES: Array<[number, number, number, number, number]> = [
  [0.1, 0.045, 0.01, 0.03, 0.16], // ~2/0 aluminium, smaller neutral
  [0.052, 0.042, 0.01, 0.028, 0.08],
  [0.2, 0.05, 0.012, 0.034, 0.32],
  [0.32, 0.052, 0.012, 0.036, 0.32],
];

/** Primitive impedance of a run, ohms (4×4). */
export function runImpedance(run: Run): ComplexMatrix {
  const [r, x, rm, xm, rn] = LINE_TYPES[run.lineType];
  const k = run.lengthFt / 1000;
  return Array.from({ length: 4 }, (_, i) =>
    Array.from({ length: 4 }, (_, j) => {
      if (i !== j) return { re: rm * k, im: xm * k };
      return { re: (i === 3 ? rn : r) * k, im: x * k };
    }),
  );
}

// Admittance per 1000 ft, inverted once per cable type: Y of a run is this times 1000/lengthFt.
const Y_PER_KFT = LINE_TYPES.map((_, lineType) => matInverse(runImpedance({ from: 0, to: 0, lineType, lengthFt: 1000 })));

export function generateNetwork(rng: () => number, buses: number, topology: Topology, tieShare = 0.03): BenchNetwork {
  const parent = new Int32Array(buses).fill(-1);
  const depthOf = new Int32Array(buses);
  const runs: Run[] = [];
  const addRun = (from: number, to: number) =>
    runs.push({ from, to, lineType: Math.floor(rng() * LINE_TYPES.length), lengthFt: 50 + 250 * rng() });
  let depth = 0;
  for (let b = 1; b < buses; b++) {
    // Parents are biased towards recent buses (u^(1/3)), giving feeders some 3·ln(buses) spans deep.
    const p = Math.min(b - 1, Math.floor(b * Math.cbrt(rng())));
    parent[b] = p;
    depthOf[b] = depthOf[p] + 1;
    depth = Math.max(depth, depthOf[b]);
    addRun(p, b);
  }
  const ties = topology === 'radial' ? 0 : Math.round(tieShare * buses);
  if (ties > 0) {
    const children = childLists(parent);
    for (let k = 0; k < ties; k++) {
      const a = 1 + Math.floor(rng() * (buses - 1));
      const c = topology === 'local-mesh' ? nearbyBus(rng, a, parent, children) : Math.floor(rng() * buses);
      if (c !== a && parent[a] !== c && parent[c] !== a) addRun(a, c);
    }
  }
  return { buses, runs, depth };
}

function childLists(parent: Int32Array): { ptr: Int32Array; idx: Int32Array } {
  const n = parent.length;
  const ptr = new Int32Array(n + 1);
  for (let b = 1; b < n; b++) ptr[parent[b] + 1]++;
  for (let b = 0; b < n; b++) ptr[b + 1] += ptr[b];
  const fill = ptr.slice(0, n);
  const idx = new Int32Array(Math.max(0, n - 1));
  for (let b = 1; b < n; b++) idx[fill[parent[b]]++] = b;
  return { ptr, idx };
}

/** Up one to three spans, then down as far: a bus a few spans away along the feeder. */
function nearbyBus(rng: () => number, a: number, parent: Int32Array, children: { ptr: Int32Array; idx: Int32Array }): number {
  let b = a;
  const up = 1 + Math.floor(rng() * 3);
  for (let s = 0; s < up && parent[b] >= 0; s++) b = parent[b];
  const down = 1 + Math.floor(rng() * 3);
  for (let s = 0; s < down; s++) {
    const count = children.ptr[b + 1] - children.ptr[b];
    if (count === 0) break;
    b = children.idx[children.ptr[b] + Math.floor(rng() * count)];
  }
  return b;
}

const SOURCE_PHASORS: Array<[number, number]> = [0, -120, 120].map((deg) => [
  SOURCE_VOLTS * Math.cos((deg * Math.PI) / 180),
  SOURCE_VOLTS * Math.sin((deg * Math.PI) / 180),
]);

/** Stamps every run, load and ground rod; source voltages move to the right-hand side. */
export function assemble(rng: () => number, net: BenchNetwork): AssembledNetwork {
  const n = 4 * (net.buses - 1);
  const t = new ComplexTriplets(n, 64 * net.runs.length + 16 * net.buses);
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  for (const run of net.runs) {
    const y = Y_PER_KFT[run.lineType];
    const k = 1000 / run.lengthFt;
    for (let c = 0; c < 4; c++) {
      for (let d = 0; d < 4; d++) {
        const re = y[c][d].re * k;
        const im = y[c][d].im * k;
        if (run.from > 0) t.add(unknownOf(run.from, c), unknownOf(run.from, d), re, im);
        if (run.to > 0) t.add(unknownOf(run.to, c), unknownOf(run.to, d), re, im);
        if (run.from > 0 && run.to > 0) {
          t.add(unknownOf(run.from, c), unknownOf(run.to, d), -re, -im);
          t.add(unknownOf(run.to, c), unknownOf(run.from, d), -re, -im);
        } else {
          // −Y·V_source moves across: the run injects Y·V_source into the other end.
          const bus = run.from > 0 ? run.from : run.to;
          if (d < 3) {
            const [vr, vi] = SOURCE_PHASORS[d];
            bRe[unknownOf(bus, c)] += re * vr - im * vi;
            bIm[unknownOf(bus, c)] += re * vi + im * vr;
          }
        }
      }
    }
  }
  for (let bus = 1; bus < net.buses; bus++) {
    for (let phase = 0; phase < 3; phase++) {
      // A load of 0.5 to 6 kVA at 0.9 power factor and 120 V, phase to neutral: y = (P − jQ)/V².
      const kva = 0.5 + 5.5 * rng();
      const g = (kva * 900) / (SOURCE_VOLTS * SOURCE_VOLTS);
      const b = -(kva * 436) / (SOURCE_VOLTS * SOURCE_VOLTS);
      const i = unknownOf(bus, phase);
      const nn = unknownOf(bus, 3);
      t.add(i, i, g, b);
      t.add(nn, nn, g, b);
      t.add(i, nn, -g, -b);
      t.add(nn, i, -g, -b);
    }
    if (bus % 10 === 0) t.add(unknownOf(bus, 3), unknownOf(bus, 3), 1 / 25, 0); // 25-ohm ground rod
  }
  return { y: t.toCsc(), bRe, bIm };
}

/** Opening one conductor of a run: Y' = (Z without it)⁻¹ padded with zeros; the change is the 8×8 two-port of Y' − Y. */
export function openConductor(run: Run, conductor: number): BlockUpdate {
  if (run.from === 0 || run.to === 0) throw new RangeError('pick a run that does not touch the source bus');
  // Per 1000 ft, then scaled exactly as assemble() scales, so that the opened entries cancel to exact zeros.
  const z = runImpedance({ ...run, lengthFt: 1000 });
  const k = 1000 / run.lengthFt;
  const keep = [0, 1, 2, 3].filter((c) => c !== conductor);
  const reduced = matInverse(keep.map((i) => keep.map((j) => z[i][j])));
  const before = Y_PER_KFT[run.lineType];
  const nodes = new Int32Array(8);
  for (let c = 0; c < 4; c++) {
    nodes[c] = unknownOf(run.from, c);
    nodes[4 + c] = unknownOf(run.to, c);
  }
  const deltaRe = new Float64Array(64);
  const deltaIm = new Float64Array(64);
  for (let a = 0; a < 8; a++) {
    for (let b = 0; b < 8; b++) {
      const i = a % 4;
      const j = b % 4;
      const ki = keep.indexOf(i);
      const kj = keep.indexOf(j);
      const after = ki >= 0 && kj >= 0 ? reduced[ki][kj] : { re: 0, im: 0 };
      const sign = a < 4 === b < 4 ? 1 : -1;
      deltaRe[a * 8 + b] = sign * (after.re * k - before[i][j].re * k);
      deltaIm[a * 8 + b] = sign * (after.im * k - before[i][j].im * k);
    }
  }
  return { nodes, deltaRe, deltaIm };
}

/** mulberry32: a small seeded generator, so that every benchmark network is reproducible from its seed. */
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

/** A run deep in the network (both ends are unknown buses): the one the benchmark opens. */
export function deepRun(net: BenchNetwork): Run {
  for (let i = Math.floor((net.runs.length * 2) / 3); i < net.runs.length; i++) {
    const run = net.runs[i];
    if (run.from > 0 && run.to > 0) return run;
  }
  const run = net.runs.find((r) => r.from > 0 && r.to > 0);
  if (!run) throw new RangeError('the network has no run between two unknown buses');
  return run;
}
