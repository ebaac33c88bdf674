// Command-line benchmark of the sparse complex LU on four-wire networks, with mathjs's sparse and dense LU as
// yardsticks, then the studies (break sweep, fault study) on a 1,000-bus sheet. Run with `npm run bench:solver`
// (optionally followed by bus counts, e.g. `-- 100 1000`; `-- --studies [buses]` for the studies alone).
import { loadavg, cpus } from 'node:os';
import { performance } from 'node:perf_hooks';
import { setFlagsFromString } from 'node:v8';
import { runInNewContext } from 'node:vm';
import * as math from 'mathjs';
import {
  analyse,
  blockResidual,
  factor,
  nnzOf,
  relativeResidual,
  solve,
  solveWithBlockUpdate,
  type ComplexCsc,
  type NumericLu,
  type SymbolicLu,
} from '../sparse';
import { studyBench } from './study-bench';
import { assemble, deepRun, generateNetwork, mulberry32, openConductor, type Topology } from './four-wire-network';

const MATHJS_BUDGET_MS = 10_000;
const MATHJS_DENSE_MAX_UNKNOWNS = 2_000;
const TOPOLOGIES: Topology[] = ['radial', 'local-mesh', 'long-ties'];
// 251 buses = 1,000 unknowns: the size at which the mathjs targets are stated.
const DEFAULT_SIZES = [100, 251, 1_000, 10_000, 50_000];

setFlagsFromString('--expose-gc');
const gcOnce = runInNewContext('gc') as () => void;
// Array-buffer memory is released by a sweeper after the collection; a second pass settles the count.
const collectGarbage = (): void => {
  gcOnce();
  gcOnce();
};

interface Timing {
  medianMs: number;
  /** Median CPU time of this process (user + system): less sensitive to other work on a shared machine. */
  cpuMedianMs: number;
  runs: number;
}

const cpuMs = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

const median = (values: number[]): number => [...values].sort((a, b) => a - b)[values.length >> 1];

/** Warm-up, then repetitions within a time budget; returns the medians and the last result. */
function measure<R>(fn: () => R, budgetMs: number, maxRuns = 31): { timing: Timing; result: R } {
  let t0 = performance.now();
  let c0 = cpuMs();
  let result = fn(); // warm-up (also the only run when one takes longer than the budget)
  const first = performance.now() - t0;
  if (first > budgetMs) return { timing: { medianMs: first, cpuMedianMs: cpuMs() - c0, runs: 1 }, result };
  const runs = Math.max(3, Math.min(maxRuns, Math.floor(budgetMs / Math.max(first, 0.01))));
  const wall: number[] = [];
  const cpu: number[] = [];
  for (let r = 0; r < runs; r++) {
    t0 = performance.now();
    c0 = cpuMs();
    result = fn();
    cpu.push(cpuMs() - c0);
    wall.push(performance.now() - t0);
  }
  return { timing: { medianMs: median(wall), cpuMedianMs: median(cpu), runs }, result };
}

const SparseMatrix = (math as unknown as {
  SparseMatrix: new (data: { values: unknown[]; index: number[]; ptr: number[]; size: number[] }) => math.Matrix;
}).SparseMatrix;

function mathjsSparse(y: ComplexCsc): math.Matrix {
  const values = Array.from(y.re, (re, p) => math.complex(re, y.im[p]));
  return new SparseMatrix({ values, index: Array.from(y.rowIdx), ptr: Array.from(y.colPtr), size: [y.n, y.n] });
}

function mathjsDense(y: ComplexCsc): math.Complex[][] {
  const rows = Array.from({ length: y.n }, () => Array.from({ length: y.n }, () => math.complex(0, 0)));
  for (let j = 0; j < y.n; j++) {
    for (let p = y.colPtr[j]; p < y.colPtr[j + 1]; p++) rows[y.rowIdx[p]][j] = math.complex(y.re[p], y.im[p]);
  }
  return rows;
}

function columnOf(bRe: Float64Array, bIm: Float64Array): math.Complex[][] {
  return Array.from(bRe, (re, i) => [math.complex(re, bIm[i])]);
}

function maxRelativeDifference(x: { re: Float64Array; im: Float64Array }, m: unknown): number {
  const values = (math.isMatrix(m) ? (m as math.Matrix).toArray() : m) as Array<[math.Complex | number]>;
  let diff = 0;
  let size = 0;
  for (let i = 0; i < x.re.length; i++) {
    const v = values[i][0];
    const re = typeof v === 'number' ? v : v.re;
    const im = typeof v === 'number' ? 0 : v.im;
    diff = Math.max(diff, Math.hypot(x.re[i] - re, x.im[i] - im));
    size = Math.max(size, Math.hypot(re, im));
  }
  return diff / size;
}

interface CaseResult {
  topology: Topology;
  buses: number;
  unknowns: number;
  nnz: number;
  depth: number;
  runs: number;
  buildMs: number;
  analyseMs: number;
  factorMs: number;
  solveMs: number;
  /** analyse + factor + solve, CPU time medians. */
  afsCpuMs: number;
  fill: number;
  luBytes: number;
  heapDeltaBytes: number;
  offDiagonalPivots: number;
  residual: number;
  resolveFirstMs: number;
  resolveMs: number;
  /** Of resolveMs, the residual check on base+Δ (one product with the base matrix). */
  checkMs: number;
  resolveMethod: string;
  resolveResidual: number;
  mathjsSparse: string;
  mathjsSparseMs?: number;
  mathjsDense: string;
  mathjsDenseMs?: number;
  mathjsDenseEstimateMs?: number;
}

/** mathjs times of the previous size, per topology, to estimate the next one before running it. */
const previous = new Map<Topology, { oursMs: number; sparseMs?: number; denseMs?: number; unknowns: number }>();

function runCase(topology: Topology, buses: number): CaseResult {
  const rngNet = mulberry32(buses * 31 + TOPOLOGIES.indexOf(topology));
  const net = generateNetwork(rngNet, buses, topology);
  const seed = buses * 17 + 5;
  const budget = buses >= 10_000 ? 2_500 : 1_000;

  const built = measure(() => assemble(mulberry32(seed), net), budget, 5);
  const { y, bRe, bIm } = built.result;
  const analysed = measure(() => analyse(y), budget);
  const sym: SymbolicLu = analysed.result;
  // The first factorization doubles as the heap measurement (JS heap plus typed-array buffers it retains) and, when
  // one run exceeds the budget (long-range ties at 50,000 buses), as the only timed run.
  collectGarbage();
  const before = process.memoryUsage();
  let t0 = performance.now();
  const c0 = cpuMs();
  const firstLu = factor(sym, y);
  const firstFactorMs = performance.now() - t0;
  const firstFactorCpuMs = cpuMs() - c0;
  collectGarbage(); // what the factors retain, without the call's transient workspaces
  const after = process.memoryUsage();
  const heapDeltaBytes = after.heapUsed + after.arrayBuffers - (before.heapUsed + before.arrayBuffers);
  const factored =
    firstFactorMs > budget
      ? { timing: { medianMs: firstFactorMs, cpuMedianMs: firstFactorCpuMs, runs: 1 }, result: firstLu }
      : measure(() => factor(sym, y), budget);
  const lu: NumericLu = factored.result;
  const solved = measure(() => solve(lu, bRe, bIm), budget);
  const x = solved.result;

  // Open the neutral of one run deep in the network: an 8×8 change of Y. The first call on these factors also
  // builds U by rows (kept with the factors) and the row sums of the base (kept by identity).
  const update = openConductor(deepRun(net), 3);
  t0 = performance.now();
  solveWithBlockUpdate(lu, sym, y, update, bRe, bIm);
  const resolveFirstMs = performance.now() - t0;
  const resolved = measure(() => solveWithBlockUpdate(lu, sym, y, update, bRe, bIm), budget);
  const checked = measure(() => blockResidual(y, update, resolved.result, bRe, bIm), budget);

  const oursMs = analysed.timing.medianMs + factored.timing.medianMs + solved.timing.medianMs;
  const oursCpuMs = analysed.timing.cpuMedianMs + factored.timing.cpuMedianMs + solved.timing.cpuMedianMs;
  const prev = previous.get(topology);
  const unknowns = y.n;

  // mathjs sparse LU (slu: AMD on A+Aᵀ, threshold 0.1, on the same complex matrix) and lusolve.
  let mathjsSparseText: string;
  let mathjsSparseMs: number | undefined;
  const sparseEstimate = prev?.sparseMs !== undefined ? (prev.sparseMs * oursMs) / prev.oursMs : 0;
  if (sparseEstimate > MATHJS_BUDGET_MS || (prev && prev.sparseMs === undefined)) {
    mathjsSparseText = `skipped (over 10 s budget${sparseEstimate ? `, est. ${(sparseEstimate / 1000).toFixed(0)} s` : ''})`;
  } else {
    const a = mathjsSparse(y);
    const b = columnOf(bRe, bIm);
    t0 = performance.now();
    const f = math.slu(a, 1, 0.1);
    const xm = math.lusolve(f as unknown as math.Matrix, b);
    mathjsSparseMs = performance.now() - t0;
    const agree = maxRelativeDifference(x, xm);
    mathjsSparseText = `${(mathjsSparseMs / oursMs).toFixed(0)}× (${fmtMs(mathjsSparseMs)}; agree ${agree.toExponential(0)})`;
  }

  // mathjs dense lusolve on the same complex system; time grows as n³.
  let mathjsDenseText: string;
  let mathjsDenseMs: number | undefined;
  const denseEstimate = prev?.denseMs !== undefined ? prev.denseMs * (unknowns / prev.unknowns) ** 3 : 0;
  if (unknowns > MATHJS_DENSE_MAX_UNKNOWNS) {
    const hint = denseEstimate && denseEstimate < 86_400_000 ? `, est. ${fmtEstimate(denseEstimate)}` : '';
    mathjsDenseText = `skipped (never above ${MATHJS_DENSE_MAX_UNKNOWNS} unknowns${hint})`;
  } else if (denseEstimate > MATHJS_BUDGET_MS) {
    mathjsDenseText = `skipped (over 10 s budget, est. ${fmtEstimate(denseEstimate)}, ${(denseEstimate / oursMs).toFixed(0)}×)`;
  } else {
    const a = mathjsDense(y);
    const b = columnOf(bRe, bIm);
    t0 = performance.now();
    const xm = math.lusolve(a, b);
    mathjsDenseMs = performance.now() - t0;
    mathjsDenseText = `${(mathjsDenseMs / oursMs).toFixed(0)}× (${fmtMs(mathjsDenseMs)}; agree ${maxRelativeDifference(x, xm).toExponential(0)})`;
  }
  previous.set(topology, {
    oursMs,
    sparseMs: mathjsSparseMs,
    denseMs: mathjsDenseMs ?? (denseEstimate || undefined),
    unknowns,
  });

  const result: CaseResult = {
    topology,
    buses,
    unknowns,
    nnz: nnzOf(y),
    depth: net.depth,
    runs: factored.timing.runs,
    buildMs: built.timing.medianMs,
    analyseMs: analysed.timing.medianMs,
    factorMs: factored.timing.medianMs,
    solveMs: solved.timing.medianMs,
    afsCpuMs: oursCpuMs,
    fill: (lu.nnzL + lu.nnzU - y.n) / nnzOf(y),
    luBytes: lu.bytes,
    heapDeltaBytes,
    offDiagonalPivots: lu.offDiagonalPivots,
    residual: relativeResidual(y, x, bRe, bIm),
    resolveFirstMs,
    resolveMs: resolved.timing.medianMs,
    checkMs: checked.timing.medianMs,
    resolveMethod: resolved.result.method,
    resolveResidual: resolved.result.residual,
    mathjsSparse: mathjsSparseText,
    mathjsSparseMs,
    mathjsDense: mathjsDenseText,
    mathjsDenseMs,
    mathjsDenseEstimateMs: denseEstimate || undefined,
  };
  return result;
}

function fmtMs(ms: number): string {
  if (ms >= 1000) return `${(ms / 1000).toFixed(1)} s`;
  if (ms >= 10) return `${ms.toFixed(0)} ms`;
  return `${ms.toFixed(2)} ms`;
}

function fmtEstimate(ms: number): string {
  return ms >= 60_000 ? `${(ms / 60_000).toFixed(0)} min` : `${(ms / 1000).toFixed(0)} s`;
}

const mb = (bytes: number): string => (bytes / 1048576).toFixed(1);

function printTable(rows: string[][]): void {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  for (const [i, r] of rows.entries()) {
    console.log(r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  '));
    if (i === 0) console.log(widths.map((w) => '-'.repeat(w)).join('  '));
  }
}

async function main(): Promise<void> {
  // `-- --studies [buses]` runs only the studies part (break sweep, fault study) on a sheet of that many buses.
  const studiesAt = process.argv.indexOf('--studies');
  if (studiesAt >= 0) {
    await studyBench(Number(process.argv[studiesAt + 1]) || 1_000);
    return;
  }
  const argSizes = process.argv.slice(2).map(Number).filter((v) => Number.isInteger(v) && v >= 3);
  const sizes = argSizes.length ? argSizes : DEFAULT_SIZES;
  const started = performance.now();
  console.log(`Phasewright sparse LU benchmark — Node ${process.version}, ${cpus().length} cores, load average ${loadavg()[0].toFixed(1)}`);
  console.log('Four-wire networks (A, B, C, N per bus), coupled 4×4 runs stamped as [Y −Y; −Y Y], phase-to-neutral loads,');
  console.log('a 25-ohm ground rod every 10th bus, source bus voltages known (eliminated). Ties: 3 % of buses, between buses');
  console.log('a few spans apart (local-mesh) or between random buses (long-ties). Times are medians after a warm-up.');
  console.log('A+F+S = analyse + factor + solve. Re-solve = solveWithBlockUpdate opening the neutral of one run (8×8 block),');
  console.log('residual check on base+Δ included; "first" includes building U by rows and the row sums of the base.');
  console.log('mathjs sparse = slu(A, order 1 (AMD on A+Aᵀ), threshold 0.1) + lusolve on the same complex matrix (mathjs slu');
  console.log('accepts Complex entries, so no real-valued stand-in is needed); mathjs dense = lusolve on the Complex[][] matrix.');
  console.log('Ratios are mathjs time / our A+F+S time; "agree" is max |x_ours − x_mathjs| / max |x_mathjs|. L+U MB = bytes of');
  console.log('the factor arrays; kept MB = heap + array-buffer growth retained by one factorization (after GC). CPU time can');
  console.log('exceed wall time: it includes V8\'s concurrent GC threads.\n');

  // Let the JIT compile every path on a mid-sized case before anything is timed.
  for (let round = 0; round < 3; round++) {
    const net = generateNetwork(mulberry32(round), 2_000, 'local-mesh');
    const { y, bRe, bIm } = assemble(mulberry32(round + 1), net);
    const sym = analyse(y);
    const lu = factor(sym, y);
    solve(lu, bRe, bIm);
    solveWithBlockUpdate(lu, sym, y, openConductor(deepRun(net), 3), bRe, bIm);
  }

  const all: CaseResult[] = [];
  for (const topology of TOPOLOGIES) {
    const rows: string[][] = [[
      topology, 'unknowns', 'nnz(Y)', 'build', 'analyse', 'factor', 'solve', 'A+F+S', '(cpu)', 'fill', 'L+U MB', 'kept MB',
      're-solve', 'of it check', 'first', '÷(F+S)',
    ]];
    const mathRows: string[][] = [[`${topology} buses`, 'mathjs sparse slu+lusolve', 'mathjs dense lusolve']];
    const notes: string[] = [];
    for (const buses of sizes) {
      const r = runCase(topology, buses);
      all.push(r);
      rows.push([
        String(buses), String(r.unknowns), String(r.nnz), fmtMs(r.buildMs), fmtMs(r.analyseMs), fmtMs(r.factorMs),
        fmtMs(r.solveMs), fmtMs(r.analyseMs + r.factorMs + r.solveMs), fmtMs(r.afsCpuMs), r.fill.toFixed(2), mb(r.luBytes),
        mb(r.heapDeltaBytes), fmtMs(r.resolveMs), fmtMs(r.checkMs), fmtMs(r.resolveFirstMs), (r.resolveMs / (r.factorMs + r.solveMs)).toFixed(2),
      ]);
      mathRows.push([String(buses), r.mathjsSparse, r.mathjsDense]);
      notes.push(
        `${buses} buses: depth ${r.depth}, ${r.runs} timed factor runs, off-diagonal pivots ${r.offDiagonalPivots}, ` +
          `residual ${r.residual.toExponential(1)}, re-solve ${r.resolveMethod} residual ${r.resolveResidual.toExponential(1)}`,
      );
    }
    printTable(rows);
    console.log('');
    printTable(mathRows);
    for (const note of notes) console.log(`  ${note}`);
    console.log('');
  }

  console.log('Targets');
  const pick = (t: Topology, buses: number) => all.find((r) => r.topology === t && r.buses === buses);
  const afs = (r: CaseResult) => r.analyseMs + r.factorMs + r.solveMs;
  for (const t of ['radial', 'local-mesh'] as Topology[]) {
    const r10 = pick(t, 10_000);
    const r50 = pick(t, 50_000);
    for (const [r, limit] of [[r10, 100], [r50, 1000]] as const) {
      if (!r) continue;
      const verdict = afs(r) < limit ? 'met' : r.afsCpuMs < limit ? 'NOT met in wall time, met in CPU time' : 'NOT met';
      console.log(`  ${t} ${r.buses} buses A+F+S ${fmtMs(afs(r))} wall, ${fmtMs(r.afsCpuMs)} CPU (target < ${fmtMs(limit)}): ${verdict}`);
    }
  }
  for (const t of TOPOLOGIES) {
    const r = pick(t, 251);
    if (r?.mathjsSparseMs !== undefined) {
      const ratio = r.mathjsSparseMs / afs(r);
      console.log(`  ${t} 1,000 unknowns: ${ratio.toFixed(0)}× faster than mathjs sparse (target ≥ 10×): ${ratio >= 10 ? 'met' : 'NOT met'}`);
    }
  }
  for (const t of TOPOLOGIES) {
    const small = pick(t, 100);
    if (small?.mathjsDenseMs !== undefined) {
      console.log(`  ${t} 396 unknowns: ${(small.mathjsDenseMs / afs(small)).toFixed(0)}× faster than mathjs dense (measured)`);
    }
    const r = pick(t, 251);
    const denseMs = r?.mathjsDenseMs ?? r?.mathjsDenseEstimateMs;
    if (r && denseMs !== undefined) {
      const ratio = denseMs / afs(r);
      const how = r.mathjsDenseMs !== undefined ? 'measured' : 'mathjs time estimated by n³ from the smaller run';
      console.log(`  ${t} 1,000 unknowns: ${ratio.toFixed(0)}× faster than mathjs dense, ${how} (target ≥ 100×): ${ratio >= 100 ? 'met' : 'NOT met'}`);
    }
  }
  for (const r of all.filter((c) => c.buses >= 1_000)) {
    const ratio = r.resolveMs / (r.factorMs + r.solveMs);
    const withoutCheck = (r.resolveMs - r.checkMs) / (r.factorMs + r.solveMs);
    console.log(
      `  ${r.topology} ${r.buses} buses: single-opening re-solve ${ratio.toFixed(2)} of factor+solve ` +
        `(${withoutCheck.toFixed(2)} without its residual check) (target ≤ 0.10): ${ratio <= 0.1 ? 'met' : 'NOT met'}`,
    );
  }
  await studyBench(1_000);
  console.log(`\nTotal benchmark time ${((performance.now() - started) / 1000).toFixed(0)} s`);
}

void main();
