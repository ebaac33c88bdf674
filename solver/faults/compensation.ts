// A shunt fault solved by compensation at its terminals: the network seen from the faulted classes is its pre-fault
// voltage minus the Thevenin impedance matrix times the currents drawn (columns of the factored matrix), and the
// fault's own little network (fault-branches.ts) closes the equations. Exact at zero fault impedance: the branch
// currents are unknowns beside the voltages, never a large admittance. A part with no path to earth that the fault
// joins to earth (or to another part) floats: its voltages shift together and the fault draws no net current from it.
import type { Complex } from '../complex';
import type { BuiltNetwork } from '../network/build-network';
import type { ComplexVector, LinearSolver } from '../linear-system';
import type { AssembledSystem } from '../solve/assemble';
import type { PinClasses } from '../solve/classes';
import type { PinVoltages } from '../solve/load-iteration';
import type { Parts } from '../solve/parts';
import { denseComplexSolveInPlace } from '../sparse/dense-complex';
import type { FaultNetwork, FaultNode } from './fault-branches';
import type { NumericLu } from '../sparse/lu';
import { createSparseWorkspace, lowerSolveUnit, sparseDotDense, upperByRows, upperTransposeSolveUnit, type SparseVector, type SparseWorkspace } from '../sparse/sparse-rhs';

export interface FaultSystem {
  network: BuiltNetwork;
  classes: PinClasses;
  parts: Parts;
  system: AssembledSystem;
  solver: LinearSolver;
  /** Pin voltages before the fault (loads at constant impedance). */
  prefault: PinVoltages;
  /** class → the solution for a unit right-hand side at that class (scaled system), kept for further faults. */
  columns: Map<number, ComplexVector>;
  /**
   * The factors behind `solver`, when it is a plain factorization: transfer impedances then come from sparse unit
   * solves (the reach of one entry in L and in Uᵀ), without a full column per class.
   */
  factors?: NumericLu;
  sparse?: { ws: SparseWorkspace; forward: Map<number, SparseVector>; backward: Map<number, SparseVector>; transfers: Map<number, Complex> };
}

/** Forgets the columns and transfers found so far (the fault study does after each bus: they serve that bus only). */
export function clearFaultCaches(fs: FaultSystem): void {
  fs.columns.clear();
  if (fs.sparse) {
    fs.sparse.forward.clear();
    fs.sparse.backward.clear();
    fs.sparse.transfers.clear();
  }
}

/** (A⁻¹)(k, l) of the scaled system from the factors: (U⁻ᵀ e_k')·(L⁻¹ e_l') in pivot numbering. */
function inverseEntry(fs: FaultSystem, lu: NumericLu, k: number, l: number): Complex {
  const n = lu.n;
  const sp = (fs.sparse ??= { ws: createSparseWorkspace(n), forward: new Map(), backward: new Map(), transfers: new Map() });
  const cached = sp.transfers.get(k * n + l);
  if (cached) return cached;
  let y = sp.forward.get(l);
  if (!y) sp.forward.set(l, (y = lowerSolveUnit(lu, sp.ws, lu.rowPivot[l])));
  let v = sp.backward.get(k);
  if (!v) sp.backward.set(k, (v = upperTransposeSolveUnit(lu, upperByRows(lu), sp.ws, lu.colOrderInverse[k])));
  const { re, im } = sp.ws; // all zero between uses
  for (let t = 0; t < y.idx.length; t++) {
    re[y.idx[t]] = y.re[t];
    im[y.idx[t]] = y.im[t];
  }
  const g = sparseDotDense(v, re, im);
  for (let t = 0; t < y.idx.length; t++) {
    re[y.idx[t]] = 0;
    im[y.idx[t]] = 0;
  }
  sp.transfers.set(k * n + l, g);
  return g;
}

export interface FaultCurrents {
  /** Current in each fault branch, from → to, amperes. */
  branchAmps: Complex[];
  /** Current drawn out of each terminal pin by the fault (the return pins get it back: negative). */
  drawn: Map<number, Complex>;
  /** Galvanic groups shifted as a whole, with their shift in volts. */
  shifts: Map<number, Complex>;
}

export function unitColumn(fs: FaultSystem, cls: number): ComplexVector | string {
  const cached = fs.columns.get(cls);
  if (cached) return cached;
  const n = fs.classes.classCount;
  const bRe = new Float64Array(n);
  const bIm = new Float64Array(n);
  bRe[cls] = 1;
  const solved = fs.solver.solve(bRe, bIm);
  if (!solved.ok) return `the network equations are singular (${solved.message})`;
  fs.columns.set(cls, solved.value);
  return solved.value;
}

/** Thevenin transfer impedance between classes k and l (volts at k per ampere injected at l), ohms. */
function transfer(fs: FaultSystem, k: number, l: number): Complex | string {
  if (fs.factors) {
    const g = inverseEntry(fs, fs.factors, k, l);
    const f = fs.system.scale[k] * fs.system.scale[l];
    return { re: g.re * f, im: g.im * f };
  }
  const col = unitColumn(fs, l);
  if (typeof col === 'string') return col;
  const f = fs.system.scale[k] * fs.system.scale[l];
  return { re: col.re[k] * f, im: col.im[k] * f };
}

const isPin = (node: FaultNode) => node >= 0;

export function solveFaultCurrents(fs: FaultSystem, fault: FaultNetwork): FaultCurrents | string {
  const { classOf } = fs.classes;
  const { groupOf, ungrounded } = fs.parts;
  const branches = fault.branches;
  const nb = branches.length;
  const ni = fault.internalCount;
  const classOfNode = (node: FaultNode) => (isPin(node) ? classOf[node] : -1);
  const floatingGroup = (node: FaultNode): number | undefined => {
    const cls = classOfNode(node);
    return cls >= 0 && ungrounded[cls] ? groupOf[cls] : undefined;
  };

  // Which floating groups shift: per component of the fault graph, all of them when it reaches earth or a grounded
  // part, all but one otherwise (a common shift of everything would be undetermined).
  const label = (node: FaultNode) => (!isPin(node) ? `i${-1 - node}` : floatingGroup(node) !== undefined ? `g${floatingGroup(node)}` : 'E');
  const parent = new Map<string, string>();
  const find = (x: string): string => {
    if (!parent.has(x)) parent.set(x, x);
    while (parent.get(x) !== x) x = parent.get(x)!;
    return x;
  };
  for (const b of branches) {
    const a = find(label(b.from));
    const c = find(label(b.to));
    if (a !== c) parent.set(a, c);
  }
  const floating = [...new Set(branches.flatMap((b) => [b.from, b.to]).map(floatingGroup).filter((g): g is number => g !== undefined))];
  const shifted: number[] = [];
  const componentsSeen = new Set<string>();
  for (const g of floating) {
    const root = find(`g${g}`);
    const hasEarth = [...parent.keys()].some((k) => k === 'E' && find(k) === root);
    if (hasEarth || componentsSeen.has(root)) shifted.push(g);
    componentsSeen.add(root);
  }
  const ns = shifted.length;
  const N = nb + ni + ns;
  const sRe = new Float64Array(N * N);
  const sIm = new Float64Array(N * N);
  const rRe = new Float64Array(N);
  const rIm = new Float64Array(N);
  const addAt = (row: number, col: number, v: Complex, sign = 1) => {
    sRe[row * N + col] += sign * v.re;
    sIm[row * N + col] += sign * v.im;
  };

  // Row b: V(from) − V(to) − z_b i_b = 0, with V(pin) = V0 − Σ_l Z(cls, l) J_l + shift and J the currents drawn.
  for (let b = 0; b < nb; b++) {
    for (const [node, sign] of [
      [branches[b].from, 1],
      [branches[b].to, -1],
    ] as [FaultNode, number][]) {
      if (!isPin(node)) {
        addAt(b, nb + (-1 - node), { re: 1, im: 0 }, sign);
        continue;
      }
      rRe[b] -= sign * fs.prefault.re[node];
      rIm[b] -= sign * fs.prefault.im[node];
      const cls = classOf[node];
      if (cls < 0) continue; // held by remote earth or an ideal source: no impedance behind it
      for (let c = 0; c < nb; c++) {
        for (const [end, drawSign] of [
          [branches[c].from, 1],
          [branches[c].to, -1],
        ] as [FaultNode, number][]) {
          const l = classOfNode(end);
          if (l < 0) continue;
          const z = transfer(fs, cls, l);
          if (typeof z === 'string') return z;
          addAt(b, c, z, -sign * drawSign);
        }
      }
      const g = floatingGroup(node);
      const k = g === undefined ? -1 : shifted.indexOf(g);
      if (k >= 0) addAt(b, nb + ni + k, { re: 1, im: 0 }, sign);
    }
    addAt(b, b, branches[b].ohms, -1);
  }
  // Kirchhoff's current law at the fault's internal points, and no net current out of a floating group.
  for (let b = 0; b < nb; b++) {
    const { from, to } = branches[b];
    if (!isPin(from)) addAt(nb + (-1 - from), b, { re: 1, im: 0 });
    if (!isPin(to)) addAt(nb + (-1 - to), b, { re: -1, im: 0 });
    shifted.forEach((g, k) => {
      if (floatingGroup(from) === g) addAt(nb + ni + k, b, { re: 1, im: 0 });
      if (floatingGroup(to) === g) addAt(nb + ni + k, b, { re: -1, im: 0 });
    });
  }
  let largest = 0;
  for (let t = 0; t < N * N; t++) largest = Math.max(largest, Math.hypot(sRe[t], sIm[t]));
  if (!denseComplexSolveInPlace(N, sRe, sIm, rRe, rIm, 1e-12 * Math.max(largest, 1e-300))) {
    return 'the fault current is unbounded: a bolted fault where nothing limits it (a bus held by an ideal source with no impedance between)';
  }
  for (let t = 0; t < N; t++) {
    if (!Number.isFinite(rRe[t]) || !Number.isFinite(rIm[t])) return 'the fault equations gave no finite answer';
  }
  const branchAmps = branches.map((_, b) => ({ re: rRe[b], im: rIm[b] }));
  const drawn = new Map<number, Complex>();
  const draw = (node: FaultNode, amps: Complex, sign: number) => {
    if (!isPin(node)) return;
    const d = drawn.get(node) ?? { re: 0, im: 0 };
    drawn.set(node, { re: d.re + sign * amps.re, im: d.im + sign * amps.im });
  };
  branches.forEach((b, k) => {
    draw(b.from, branchAmps[k], 1);
    draw(b.to, branchAmps[k], -1);
  });
  const shifts = new Map<number, Complex>();
  shifted.forEach((g, k) => shifts.set(g, { re: rRe[nb + ni + k], im: rIm[nb + ni + k] }));
  return { branchAmps, drawn, shifts };
}

/** Every pin's voltage during the fault: the pre-fault voltages, minus the response to the currents drawn, plus shifts. */
export function faultedVolts(fs: FaultSystem, currents: FaultCurrents): PinVoltages | string {
  const n = fs.classes.classCount;
  const dRe = new Float64Array(n);
  const dIm = new Float64Array(n);
  const byClass = new Map<number, Complex>();
  for (const [pin, amps] of currents.drawn) {
    const cls = fs.classes.classOf[pin];
    if (cls < 0) continue;
    const d = byClass.get(cls) ?? { re: 0, im: 0 };
    byClass.set(cls, { re: d.re + amps.re, im: d.im + amps.im });
  }
  for (const [cls, amps] of byClass) {
    const col = unitColumn(fs, cls);
    if (typeof col === 'string') return col;
    const s = fs.system.scale[cls];
    const jRe = amps.re * s;
    const jIm = amps.im * s;
    for (let k = 0; k < n; k++) {
      dRe[k] -= col.re[k] * jRe - col.im[k] * jIm;
      dIm[k] -= col.re[k] * jIm + col.im[k] * jRe;
    }
  }
  const count = fs.network.pins.length;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  for (let pin = 0; pin < count; pin++) {
    const cls = fs.classes.classOf[pin];
    re[pin] = fs.prefault.re[pin];
    im[pin] = fs.prefault.im[pin];
    if (cls < 0) continue;
    re[pin] += fs.system.scale[cls] * dRe[cls];
    im[pin] += fs.system.scale[cls] * dIm[cls];
    const shift = currents.shifts.get(fs.parts.groupOf[cls]);
    if (shift && fs.parts.ungrounded[cls]) {
      re[pin] += shift.re;
      im[pin] += shift.im;
    }
  }
  return { re, im };
}
