// The readings match: which single cause (a run conductor opened, or a run conductor with a resistance in series:
// a failing lug or splice; or no break at all), each with a fitted load level for the loads it affects, best
// explains a few measured voltage magnitudes. Every candidate is evaluated through one factorization of the base
// case (reading-model.ts), fitted by a coarse grid and golden-section refinement, ranked by its residual, and grouped
// with the candidates whose predicted readings agree within the meter's tolerance.
import type { ConductorId, Sheet, WhatIfChange } from '../../shared/sheet';
import { buildNetwork, type BuiltNetwork } from '../network/build-network';
import { runAdmittance } from '../network/run';
import { EARTH_PIN, pinKey, type LoadPart, type RunLayout } from '../network/types';
import { analyse } from '../sparse/symbolic';
import { factor, type NumericLu } from '../sparse/lu';
import { solve } from '../sparse/solve';
import { downstreamElements } from '../solve/downstream';
import { solveBuiltNetwork, type Solution } from '../solve/solve-network';
import type { ComplexCsc, ComplexVector, Factorization } from '../linear-system';
import { NO_MODIFICATIONS, connectionConductorKey, runConductorKey, type Modifications } from '../network/modifications';
import { withoutExplicitZeros } from './opening-solver';
import { LoadLawTrials, scaledPart, type TrialOutcome } from './load-law-trial';
import { mergeTies } from '../solve/classes';
import { findParts } from '../solve/parts';
import { assemble } from '../solve/assemble';
import type { PinVoltages } from '../solve/load-iteration';
import { runAsync, runSync, type SlicedStudy } from './run-study';
import { minimiseLogBrent, minimiseLogGolden, type LogMinimum } from './minimise-log';
import { branchBetween, prepareColumns, type Branch, type PreparedColumns, type ReadingRow } from './reading-model';
import type { CandidateCause, CandidateGroup, MatchCandidate, Reading, ReadingsMatchOptions, ReadingsMatchResult, StudyLoadModel, StudyOutcome, StudyProgress } from './study-types';

const DEFAULT_TOLERANCE_PERCENT = 1;
const DEFAULT_LEVEL_RANGE: [number, number] = [0.1, 3];
const DEFAULT_OHMS_RANGE: [number, number] = [0.01, 100];
/** Above this many affected load elements the level is not fitted (the update would be too wide). */
const MAX_LEVEL_ELEMENTS = 240;
const GRID = 13;
const GOLDEN_STEPS = 28;
/** How many of the best constant-impedance fits are fitted again with the sheet's load laws (as the break sweep's worst 10). */
const DEFAULT_REFINE_BEST = 10;
/** A coarser search for the refinement: each trial there is a full solve. */
const REFINE_GRID = 7;
const REFINE_STEPS = 14;
/** Rounds of resistance-then-level for a degradation in the refinement. */
const REFINE_ROUNDS = 2;
/** Brent's stopping bracket in the constant-impedance fit (log units), about that of GOLDEN_STEPS golden steps. */
const CI_TOLERANCE = 2e-7;
/** Brent's stopping bracket in the refit (log units: 0.05 %), and its most trials after the grid. */
const REFIT_TOLERANCE = 5e-4;
const REFIT_MAX_TRIALS = 12;
const at = (v: Float64Array, i: number): number => (i >= 0 ? v[i] : 0);

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());
const conductorWord = (c: ConductorId): string => (c === 'N' ? 'neutral' : c === 'PE' ? 'protective conductor' : `phase ${c}`);

type Failure = { ok: false; error: { code: 'not-supported'; message: string; elementIds: string[] } };
const fail = (message: string, elementIds: string[] = []): Failure => ({ ok: false, error: { code: 'not-supported', message, elementIds } });

/** A one-parameter minimiser of a fit: over [lo, hi], or (when it can) near `around` once a first round found it. */
type Minimiser = (f: (v: number) => number, lo: number, hi: number, around?: number) => LogMinimum;
/** The constant-impedance fit: a fine grid, then Brent's method to the bracket the golden steps used to reach. */
const CI_MINIMISER: Minimiser = (f, lo, hi) => minimiseLogBrent(f, lo, hi, GRID, CI_TOLERANCE, GOLDEN_STEPS);
/** The refit as it was with a fresh solve per trial: a coarser grid and golden section, from the whole range each round. */
const FRESH_MINIMISER: Minimiser = (f, lo, hi) => minimiseLogGolden(f, lo, hi, REFINE_GRID, REFINE_STEPS);
/**
 * The refit: the same coarse grid, then Brent's method to about the bracket those golden steps reach (each trial is
 * a load iteration); a later round of a degradation searches only a grid step either side of the last answer.
 */
const REFIT_MINIMISER: Minimiser = (f, lo, hi, around) => minimiseLogBrent(f, lo, hi, REFINE_GRID, REFIT_TOLERANCE, REFIT_MAX_TRIALS, around);

interface Candidate {
  cause: CandidateCause;
  /** Index into network.runs, and the conductor's index in the run (undefined for 'none'). */
  run?: number;
  conductor?: number;
  /** Load part indices whose level is fitted. */
  parts: number[];
  levelElementIds: string[];
  /** For a load's own connection: the load part the series resistance (or opening) is in. */
  loadPart?: number;
  /**
   * For a connection conductor that lands on one of its load element's two pins: the kind and connection. Such
   * candidates are one circuit (a resistance in either lead of a two-wire load is in series with the same loop),
   * so the refit of one stands for the others.
   */
  loopKey?: string;
}

interface Fitted {
  candidate: Candidate;
  level: number;
  ohms?: number;
  predicted: Float64Array;
  objective: number;
  /** The loads' model of the fit: constant impedance through the base factors, or the sheet's load laws (refined). */
  loadModel: StudyLoadModel;
  /** Why solving again with the sheet's load laws failed (the constant-impedance fit stands). */
  refineProblem?: string;
}

class ReadingsMatcher implements SlicedStudy<ReadingsMatchResult> {
  private readonly rows: ReadingRow[];
  private readonly measured: Float64Array;
  private readonly readingPart: number[];
  readonly candidates: Candidate[] = [];
  readonly fitted: Fitted[] = [];
  next = 0;
  private cached?: { key: string; prepared: PreparedColumns };
  private readonly tolerance: number;
  private readonly levelRange: [number, number];
  private readonly ohmsRange: [number, number];
  skipped = 0;
  unfittedLevels = 0;
  private refineQueue?: number[];
  /** The base network's factors for the refit's trials, made on the first refit. */
  private baseTrials?: LoadLawTrials;
  /** Refits by loop (Candidate.loopKey). */
  private readonly refitLoops = new Map<string, Fitted>();
  private readonly refineBest: number;

  constructor(
    private readonly sheet: Sheet,
    private readonly network: BuiltNetwork,
    private readonly solution: Solution,
    private readonly lu: NumericLu,
    /** The base matrix without its explicit zeros (what `lu` factors). */
    private readonly matrix: ComplexCsc,
    private readonly x0: ComplexVector,
    private readonly factorization: Factorization | undefined,
    rows: ReadingRow[],
    private readonly readings: Reading[],
    private readonly options: ReadingsMatchOptions,
  ) {
    this.refineBest = Math.max(0, Math.floor(options.refineBest ?? DEFAULT_REFINE_BEST));
    this.rows = rows;
    this.measured = Float64Array.from(readings, (r) => r.volts);
    // Which load part each load reading is across (a series fault in that load's own connection divides it).
    this.readingPart = readings.map((r) => {
      if (r.at.kind !== 'load') return -1;
      const at = r.at;
      return network.loads.findIndex((p) => p.loadId === at.loadId && (at.element === undefined || p.label === at.element));
    });
    this.tolerance = options.tolerancePercent ?? DEFAULT_TOLERANCE_PERCENT;
    this.levelRange = options.loadLevelRange ?? DEFAULT_LEVEL_RANGE;
    this.ohmsRange = options.ohmsRange ?? DEFAULT_OHMS_RANGE;
    this.listCandidates();
  }

  static prepare(sheet: Sheet, readings: Reading[], options: ReadingsMatchOptions): StudyOutcome<ReadingsMatcher> {
    if (!Array.isArray(readings) || readings.length === 0) return fail('the readings match needs at least one reading');
    for (const [name, range] of [['loadLevelRange', options.loadLevelRange], ['ohmsRange', options.ohmsRange]] as const) {
      if (range && !(range[0] > 0 && range[1] > range[0] && Number.isFinite(range[1]))) return fail(`${name} must be two increasing positive numbers, got ${JSON.stringify(range)}`);
    }
    if (options.tolerancePercent !== undefined && !(options.tolerancePercent > 0)) return fail(`tolerancePercent must be positive, got ${options.tolerancePercent}`);
    const network = buildNetwork(sheet);
    const outcome = solveBuiltNetwork(network, sheet.settings, undefined, { constantImpedanceOnly: true });
    if (!outcome.ok) return { ok: false, error: { ...outcome.error, message: `the base case does not solve: ${outcome.error.message}` } };
    const { system } = outcome.solution;
    if (system.matrix.n === 0) return fail('the sheet has no unknowns to match readings against');
    const rows: ReadingRow[] = [];
    for (const [i, reading] of readings.entries()) {
      const row = readingRow(sheet, network, outcome.solution, reading, i);
      if (typeof row === 'string') return fail(row, [reading?.at && 'loadId' in reading.at ? reading.at.loadId : (reading?.at as { busId?: string })?.busId ?? ''].filter(Boolean));
      rows.push(row);
    }
    const matrix = withoutExplicitZeros(system.matrix);
    const lu = factor(analyse(matrix), matrix);
    const x0 = solve(lu, system.rhsRe, system.rhsIm);
    return { ok: true, value: new ReadingsMatcher(sheet, network, outcome.solution, lu, matrix, x0, outcome.factorization, rows, readings, options) };
  }

  private listCandidates(): void {
    const allParts = this.network.loads.map((_, k) => k);
    const sources = Object.values(this.sheet.elements).filter((e) => e.kind === 'source').map((e) => e.id);
    this.candidates.push({ cause: { kind: 'none' }, parts: allParts, levelElementIds: sources });
    const causes = this.options.causes ?? {};
    const partsOf = new Map<string, number[]>();
    this.network.loads.forEach((p, k) => partsOf.set(p.loadId, [...(partsOf.get(p.loadId) ?? []), k]));
    this.network.runs.forEach((layout, run) => {
      const down = [...downstreamElements(this.sheet, layout.runId, 'downstream')].filter((id) => this.sheet.elements[id]?.kind === 'load');
      const parts = down.flatMap((id) => partsOf.get(id) ?? []);
      layout.conductors.forEach((k, conductor) => {
        if (k.open) return;
        if (this.options.conductors === 'neutrals' && k.conductor !== 'N') return;
        if (causes.openings !== false) this.candidates.push({ cause: { kind: 'open-conductor', runId: layout.runId, conductor: k.conductor }, run, conductor, parts, levelElementIds: [layout.runId] });
        if (causes.degradations !== false) {
          this.candidates.push({ cause: { kind: 'degrade-conductor', runId: layout.runId, conductor: k.conductor, ohms: 0 }, run, conductor, parts, levelElementIds: [layout.runId] });
        }
      });
    });
    this.listConnectionCandidates(partsOf, causes);
  }

  /** A load's supply connection opened or degraded: single-element loads only (the series path is that element). */
  private listConnectionCandidates(partsOf: Map<string, number[]>, causes: NonNullable<ReadingsMatchOptions['causes']>): void {
    for (const connection of Object.values(this.sheet.connections)) {
      const ends = [connection.to, connection.from];
      const loadEnd = ends.find((e) => this.sheet.elements[e.elementId]?.kind === 'load' && e.terminal === 'supply');
      if (!loadEnd) continue;
      const parts = partsOf.get(loadEnd.elementId) ?? [];
      if (parts.length !== 1) continue;
      const loadIsTo = loadEnd === connection.to;
      for (const [fromConductor, toConductor] of Object.entries(connection.conductorMap) as [ConductorId, ConductorId][]) {
        const loadConductor = loadIsTo ? toConductor : fromConductor;
        if (this.options.conductors === 'neutrals' && loadConductor !== 'N') continue;
        const base = { connectionId: connection.id, conductor: fromConductor, loadId: loadEnd.elementId };
        const common = { parts, levelElementIds: [loadEnd.elementId], loadPart: parts[0] };
        const pin = this.network.pinIndex.get(pinKey(loadEnd.elementId, loadEnd.terminal, loadConductor));
        const part = this.network.loads[parts[0]];
        const inLoop = pin !== undefined && (pin === part.p || pin === part.q);
        const loop = (kind: string) => (inLoop ? { loopKey: `${kind}|${connection.id}` } : {});
        if (causes.openings !== false) this.candidates.push({ cause: { kind: 'open-connection', ...base }, ...common, ...loop('open') });
        if (causes.degradations !== false) this.candidates.push({ cause: { kind: 'degrade-connection', ...base, ohms: 0 }, ...common, ...loop('degrade') });
      }
    }
  }

  get finished(): boolean {
    return this.next >= this.candidates.length && this.refineQueue !== undefined && this.refineQueue.length === 0;
  }

  /** How many of the best constant-impedance fits are fitted again with the sheet's load laws. */
  private get refineTarget(): number {
    return Math.min(this.refineBest, this.candidates.length);
  }

  progress(): StudyProgress {
    const refined = this.refineQueue ? this.refineTarget - this.refineQueue.length : 0;
    return { done: this.next + refined, total: this.candidates.length + this.refineTarget };
  }

  runSlice(ms: number, signal?: AbortSignal): void {
    const end = now() + ms;
    do {
      if (signal?.aborted || this.finished) return;
      if (this.next < this.candidates.length) {
        const fitted = this.fit(this.candidates[this.next++]);
        if (fitted) this.fitted.push(fitted);
        else this.skipped++;
        continue;
      }
      if (!this.refineQueue) {
        // The best fits by the constant-impedance model, fitted again with the sheet's load laws: far from rated
        // voltage (an open neutral) constant-power and constant-current loads divide the voltage differently.
        const order = this.fitted.map((_, i) => i).sort((a, b) => this.fitted[a].objective - this.fitted[b].objective);
        this.refineQueue = order.slice(0, this.refineTarget).reverse();
      }
      const i = this.refineQueue.pop();
      if (i !== undefined) this.fitted[i] = this.refineOnce(this.fitted[i]);
    } while (now() < end);
  }

  /** The what-if modifications of a candidate at a trial resistance and level (the affected loads scaled). */
  private modsOf(c: Candidate, ohms: number | 'open', level: number): Modifications {
    const mods: Modifications = {
      ...NO_MODIFICATIONS,
      openRunConductors: new Set(),
      addedRunOhms: new Map(),
      openConnections: new Set(),
      degradedConnections: new Map(),
      loadScale: new Map(),
      whatIfId: 'readings-match',
    };
    const cause = c.cause;
    if (cause.kind === 'open-conductor') mods.openRunConductors.add(runConductorKey(cause.runId, cause.conductor));
    else if (cause.kind === 'degrade-conductor' && ohms !== 'open') mods.addedRunOhms.set(runConductorKey(cause.runId, cause.conductor), ohms);
    else if (cause.kind === 'open-connection') mods.openConnections.add(connectionConductorKey(cause.connectionId, cause.conductor));
    else if (cause.kind === 'degrade-connection' && ohms !== 'open') mods.degradedConnections.set(connectionConductorKey(cause.connectionId, cause.conductor), ohms);
    if (Math.abs(level - 1) > 1e-12) for (const k of c.parts) mods.loadScale.set(this.network.loads[k].loadId, level);
    return mods;
  }

  /** The refit, or the refit of a candidate in the same loop (see Candidate.loopKey) under this one's cause. */
  private refineOnce(f: Fitted): Fitted {
    const key = f.candidate.loopKey;
    const shared = key !== undefined ? this.refitLoops.get(key) : undefined;
    if (shared && shared.loadModel === 'sheet' && this.options.refit !== 'fresh-solves') {
      const found = { level: shared.level, ohms: shared.ohms, value: shared.objective };
      return this.fittedOf(f.candidate, found, shared.predicted.slice(), 'sheet');
    }
    const refitted = this.refine(f);
    if (key !== undefined) this.refitLoops.set(key, refitted);
    return refitted;
  }

  /** A fit again with the sheet's load laws, from the constant-impedance answer. */
  private refine(f: Fitted): Fitted {
    const c = f.candidate;
    const out = new Float64Array(this.rows.length);
    let problem: string | undefined;
    const fresh = (ohms: number | 'open', level: number): number => {
      const network = buildNetwork(this.sheet, this.modsOf(c, ohms, level));
      const outcome = solveBuiltNetwork(network, this.sheet.settings, this.factorization);
      if (!outcome.ok) {
        problem = outcome.error.message;
        return Infinity;
      }
      return this.readOut(network, outcome.solution.volts, out);
    };
    const fast = this.options.refit === 'fresh-solves' ? undefined : this.lowRankTrial(c, f);
    const trial = !fast
      ? fresh
      : (ohms: number | 'open', level: number): number => {
          const r = fast(ohms, level);
          if (r.outcome.ok) return this.readOut(r.network, r.outcome.volts, out);
          if (r.outcome.fresh) return fresh(ohms, level);
          problem = r.outcome.message;
          return Infinity;
        };
    const minimiser = fast ? REFIT_MINIMISER : FRESH_MINIMISER;
    const found = this.search(c, c.parts.length > 0, trial, minimiser, { level: f.level, ohms: f.ohms }, REFINE_ROUNDS);
    if (!found) return { ...f, refineProblem: problem ?? 'no trial solved with the sheet\'s load laws' };
    const opening = c.cause.kind === 'open-conductor' || c.cause.kind === 'open-connection';
    trial(found.ohms ?? (opening ? 'open' : 0), found.level);
    return this.fittedOf(c, found, out.slice(), 'sheet');
  }

  /** The readings of a solved network into `out`, and their objective (Infinity when a reading has no pins). */
  private readOut(network: BuiltNetwork, v: PinVoltages, out: Float64Array): number {
    for (let r = 0; r < this.readings.length; r++) {
      const pins = readingPins(this.sheet, network, this.readings[r]);
      if (!pins) return Infinity;
      const [p, q] = pins;
      out[r] = Math.hypot(at(v.re, p) - at(v.re, q), at(v.im, p) - at(v.im, q));
    }
    return this.objective(out);
  }

  /**
   * The refit's trials through one factorization (load-law-trial.ts): the base network's for a run conductor or no
   * break; for a load's degraded connection, the network built once with the fitted resistance (the lug is a branch
   * of its own there). Undefined for an opened connection: its load is cut off, one fresh solve settles it.
   */
  private lowRankTrial(c: Candidate, f: Fitted): ((ohms: number | 'open', level: number) => { network: BuiltNetwork; outcome: TrialOutcome }) | undefined {
    const cause = c.cause;
    const parts = new Set(c.parts);
    const loadsAt = (loads: LoadPart[], level: number) => (level === 1 || parts.size === 0 ? loads : loads.map((p, k) => (parts.has(k) ? scaledPart(p, level) : p)));
    if (cause.kind === 'open-connection') return undefined;
    if (cause.kind === 'degrade-connection') {
      const r0 = f.ohms;
      if (!(r0 && r0 > 0)) return undefined;
      const network = buildNetwork(this.sheet, this.modsOf(c, r0, 1));
      const merged = mergeTies(network);
      if (!merged.ok) return undefined;
      const classes = merged.classes;
      const system = assemble(network, classes, findParts(network, classes));
      const lug = network.stamps.find((st) => st.kind === 'degraded-connection' && st.elementId === cause.connectionId);
      const part = network.loads.findIndex((p) => p.loadId === cause.loadId);
      if (!lug || part < 0 || c.parts.length !== 1) return undefined;
      const trials = new LoadLawTrials(network, classes, system, this.sheet.settings);
      const load = network.loads[part];
      const columns = trials.columns([branchBetween(classes, system.scale, lug.pins[0], lug.pins[1]), branchBetween(classes, system.scale, load.p, load.q)]);
      return (ohms, level) => {
        const dRe = new Float64Array(4);
        const dIm = new Float64Array(4);
        if (ohms !== 'open') dRe[0] = 1 / ohms - 1 / r0;
        dRe[3] = (level - 1) * load.y.re;
        dIm[3] = (level - 1) * load.y.im;
        const loads = level === 1 ? network.loads : network.loads.map((p, k) => (k === part ? scaledPart(p, level) : p));
        return { network, outcome: ohms === 'open' ? { ok: false, message: 'opened', fresh: true } : trials.solve(columns, dRe, dIm, loads) };
      };
    }
    this.baseTrials ??= new LoadLawTrials(this.network, this.solution.classes, this.solution.system, this.sheet.settings, { matrix: this.matrix, lu: this.lu });
    const trials = this.baseTrials;
    const { branches, runRows } = this.branches(c, c.parts);
    const columns = trials.columns(branches);
    const layout = c.run !== undefined ? this.network.runs[c.run] : undefined;
    return (ohms, level) => {
      const { dRe, dIm } = this.delta(layout, runRows, c.conductor, ohms, level, c.parts);
      return { network: this.network, outcome: trials.solve(columns, dRe, dIm, loadsAt(this.network.loads, level)) };
    };
  }

  /** The branches of a candidate: its run's conductors (all of them when coupled), then the affected load elements. */
  private branches(c: Candidate, parts: number[]): { branches: Branch[]; runRows: number[] } {
    const make = (p: number, q: number): Branch => branchBetween(this.solution.classes, this.solution.system.scale, p, q);
    const branches: Branch[] = [];
    let runRows: number[] = [];
    if (c.run !== undefined) {
      const layout = this.network.runs[c.run];
      runRows = layout.mutualCoupling ? layout.conductors.map((_, i) => i) : [c.conductor!];
      for (const i of runRows) branches.push(make(layout.conductors[i].fromPin, layout.conductors[i].toPin));
    }
    for (const k of parts) branches.push(make(this.network.loads[k].p, this.network.loads[k].q));
    return { branches, runRows };
  }

  /** D for a trial: the run block's change (opened, or R in series) and (level − 1) × each load element's admittance. */
  private delta(layout: RunLayout | undefined, runRows: number[], index: number | undefined, ohms: number | 'open', level: number, parts: number[], loadPart?: number) {
    const m = runRows.length + parts.length;
    const dRe = new Float64Array(m * m);
    const dIm = new Float64Array(m * m);
    if (layout && index !== undefined) {
      const y = this.network.stamps[layout.stampIndex].y;
      const open = layout.conductors.map((k, i) => k.open || (ohms === 'open' && i === index));
      const added = layout.conductors.map((k, i) => k.addedOhms + (ohms !== 'open' && i === index ? ohms : 0));
      if (!layout.mutualCoupling) {
        const z = layout.impedanceOhms[index][index];
        let re = -y[index][index].re;
        let im = -y[index][index].im;
        if (ohms !== 'open') {
          const zr = z.re + added[index];
          const d = zr * zr + z.im * z.im;
          re += zr / d;
          im += -z.im / d;
        }
        dRe[0] = re;
        dIm[0] = im;
      } else {
        const yNew = runAdmittance(layout.impedanceOhms, open, added);
        runRows.forEach((i, a) =>
          runRows.forEach((j, b) => {
            dRe[a * m + b] = yNew[i][j].re - y[i][j].re;
            dIm[a * m + b] = yNew[i][j].im - y[i][j].im;
          }),
        );
      }
    }
    const offset = runRows.length;
    parts.forEach((k, t) => {
      const y = this.network.loads[k].y;
      const at = (offset + t) * m + offset + t;
      if (k === loadPart) {
        // In series with the load's own connection: s·y / (1 + s·y·R), nothing when open.
        let re = 0;
        let im = 0;
        if (ohms !== 'open') {
          const sr = level * y.re;
          const si = level * y.im;
          const dr = 1 + sr * ohms;
          const di = si * ohms;
          const d = dr * dr + di * di;
          re = (sr * dr + si * di) / d;
          im = (si * dr - sr * di) / d;
        }
        dRe[at] = re - y.re;
        dIm[at] = im - y.im;
        return;
      }
      dRe[at] = (level - 1) * y.re;
      dIm[at] = (level - 1) * y.im;
    });
    return { dRe, dIm };
  }

  private objective(predicted: Float64Array): number {
    let sum = 0;
    for (let r = 0; r < predicted.length; r++) {
      const e = (this.measured[r] - predicted[r]) / Math.max(this.measured[r], 1);
      sum += e * e;
    }
    return sum;
  }

  private fit(c: Candidate): Fitted | undefined {
    let parts = c.parts;
    if (parts.length > MAX_LEVEL_ELEMENTS) {
      parts = [];
      this.unfittedLevels++;
    }
    const key = `${c.run ?? 'none'}|${c.conductor ?? ''}|${c.loadPart ?? ''}|${parts.length}`;
    const { branches, runRows } = this.branches(c, parts);
    let prepared = this.cached?.key === key ? this.cached.prepared : undefined;
    if (!prepared) {
      prepared = prepareColumns(this.lu, this.x0, this.rows, branches);
      this.cached = { key, prepared };
    }
    const layout = c.run !== undefined ? this.network.runs[c.run] : undefined;
    const out = new Float64Array(this.rows.length);
    const trial = (ohms: number | 'open', level: number): number => {
      const { dRe, dIm } = this.delta(layout, runRows, c.conductor, ohms, level, parts, c.loadPart);
      if (!prepared!.predict(dRe, dIm, out)) return Infinity;
      if (c.loadPart !== undefined) {
        // The model's branch holds the resistance; the load's own terminals see V / (1 + s·y·R), nothing when open.
        const y = this.network.loads[c.loadPart].y;
        const divide = ohms === 'open' ? 0 : 1 / Math.hypot(1 + level * y.re * ohms, level * y.im * ohms);
        this.readingPart.forEach((k, r) => {
          if (k === c.loadPart) out[r] *= divide;
        });
      }
      return this.objective(out);
    };
    const found = this.search(c, parts.length > 0, trial, CI_MINIMISER);
    if (!found) return undefined;
    const opening = c.cause.kind === 'open-conductor' || c.cause.kind === 'open-connection';
    trial(found.ohms ?? (opening ? 'open' : 0), found.level);
    return this.fittedOf({ ...c, parts }, found, out.slice(), 'constant-impedance');
  }

  private fittedOf(c: Candidate, found: { level: number; ohms?: number; value: number }, predicted: Float64Array, loadModel: StudyLoadModel): Fitted {
    const cause: CandidateCause = c.cause.kind === 'degrade-conductor' || c.cause.kind === 'degrade-connection' ? { ...c.cause, ohms: found.ohms! } : c.cause;
    return { candidate: { ...c, cause }, level: found.level, ohms: found.ohms, predicted, objective: found.value, loadModel };
  }

  /** The level (and a degradation's resistance) that minimise `trial`, starting from `start` when given. */
  private search(
    c: Candidate,
    fitsLevel: boolean,
    trial: (ohms: number | 'open', level: number) => number,
    minimise: Minimiser,
    start?: { level: number; ohms?: number },
    rounds = 4,
  ): { level: number; ohms?: number; value: number } | undefined {
    const [lo, hi] = fitsLevel ? this.levelRange : [1, 1];
    const fitLevel = (ohms: number | 'open', around?: number) => (fitsLevel ? minimise((s) => trial(ohms, s), lo, hi, around) : { at: 1, value: trial(ohms, 1) });
    let ohms: number | undefined;
    let level: number;
    let value: number;
    const opening = c.cause.kind === 'open-conductor' || c.cause.kind === 'open-connection';
    if (c.cause.kind === 'open-connection') {
      // The load is cut off: its level changes nothing.
      level = 1;
      value = trial('open', 1);
    } else if (c.cause.kind === 'degrade-conductor' || c.cause.kind === 'degrade-connection') {
      // Alternate: the resistance for the current level, then the level for that resistance.
      level = start?.level ?? 1;
      ohms = start?.ohms ?? 1;
      value = Infinity;
      // From a start, a decade either side of its resistance (within the range).
      const [ohmsLo, ohmsHi] = start?.ohms ? [Math.max(this.ohmsRange[0], start.ohms / 10), Math.min(this.ohmsRange[1], start.ohms * 10)] : this.ohmsRange;
      for (let round = 0; round < rounds; round++) {
        // After the first round, near the last answer (a minimiser that cannot ignores `around`).
        const r = minimise((o) => trial(o, level), ohmsLo, ohmsHi, round > 0 ? ohms : undefined);
        ohms = r.at;
        const s = fitLevel(ohms, round > 0 ? level : undefined);
        level = s.at;
        if (!(s.value < value * (1 - 1e-9))) {
          value = Math.min(value, s.value);
          break;
        }
        value = s.value;
      }
    } else {
      const s = fitLevel(opening ? 'open' : 0);
      level = s.at;
      value = s.value;
    }
    return Number.isFinite(value) ? { level, ohms, value } : undefined;
  }

  result(cancelled: boolean): ReadingsMatchResult {
    const candidates = this.fitted.map((f) => this.describe(f)).sort((a, b) => a.rmsPercent - b.rmsPercent || a.description.localeCompare(b.description));
    // Greedy grouping: a candidate joins the first group whose leader predicts every reading within the tolerance.
    const groups: CandidateGroup[] = [];
    for (const c of candidates) {
      const g = groups.find((group) =>
        group.candidates[0].predictedVolts.every((v, r) => Math.abs(v - c.predictedVolts[r]) <= (this.tolerance / 100) * Math.max(this.measured[r], 1)),
      );
      if (g) g.candidates.push(c);
      else groups.push({ candidates: [c], rmsVolts: c.rmsVolts, rmsPercent: c.rmsPercent });
    }
    const best = groups[0]?.candidates[0];
    const next = groups[1];
    const bestPercent = best?.rmsPercent ?? Infinity;
    const ratio = next ? (bestPercent > 0 ? next.rmsPercent / bestPercent : Infinity) : Infinity;
    const tol = this.tolerance;
    const place = (c: MatchCandidate) =>
      c.cause.kind === 'none' ? 'none' : c.cause.kind === 'open-conductor' || c.cause.kind === 'degrade-conductor' ? `run ${c.cause.runId}` : `connection ${c.cause.connectionId}`;
    const locationsInBestGroup = new Set(groups[0]?.candidates.map(place) ?? []).size;
    const verdict: ReadingsMatchResult['certainty']['verdict'] = !best || bestPercent > 1.5 * tol
      ? 'poor-fit'
      : (next && next.rmsPercent <= 1.5 * tol) || locationsInBestGroup > 1
        ? 'ambiguous'
        : !next || (next.rmsPercent > 2 * tol && ratio > 2)
          ? 'clear'
          : 'likely';
    const assumptions = [
      'Readings match: loads are constant impedances at a fitted level (the level stands for how much was switched on when the readings were taken), the same factor for every load the cause affects.',
      ...(this.refineTarget ? [`Readings match: the best ${this.refineTarget} candidates by that fit are fitted again with the sheet's load laws (full solves; marked), which decide the readings far from rated voltage, as under an open neutral.`] : []),
      'Readings match: candidates are the sound network, each run conductor opened or with a resistance in series (a failing lug at either end of the run or a splice along it), and the supply connection of each single-element load opened or degraded; breaker poles, the ties between buses and breakers and the connections of three-phase loads are not candidates yet.',
      `Readings match: candidates whose predicted readings agree within ${tol} % of every reading are one group: the readings cannot tell them apart.`,
    ];
    if (this.skipped) assumptions.push(`Readings match: ${this.skipped} candidates leave part of the network without a reference (a protective conductor cut off, say) and change no reading of a load; they were left out.`);
    if (this.unfittedLevels) assumptions.push(`Readings match: ${this.unfittedLevels} candidates affect more than ${MAX_LEVEL_ELEMENTS} load elements; their load level is kept at the drawn value.`);
    return {
      groups,
      best,
      fit: { rmsVolts: best?.rmsVolts ?? Infinity, rmsPercent: bestPercent, withinTolerance: bestPercent <= tol },
      certainty: { gapVolts: next && best ? next.rmsVolts - best.rmsVolts : Infinity, ratio, locationsInBestGroup, verdict },
      candidatesTried: this.next,
      candidatesRefined: this.refineQueue ? this.refineTarget - this.refineQueue.length : 0,
      cancelled,
      assumptions,
    };
  }

  private describe(f: Fitted): MatchCandidate {
    const predictedVolts = [...f.predicted];
    const n = predictedVolts.length;
    let sv = 0;
    let sp = 0;
    predictedVolts.forEach((v, r) => {
      const e = this.measured[r] - v;
      sv += e * e;
      sp += ((100 * e) / Math.max(this.measured[r], 1)) ** 2;
    });
    const c = f.candidate;
    const changes: Record<string, WhatIfChange> = {};
    let description: string;
    switch (c.cause.kind) {
      case 'none':
        description = 'no break: the network as drawn';
        break;
      case 'open-conductor':
        description = `${conductorWord(c.cause.conductor)} of run ${this.nameOf(c.cause.runId)} open`;
        changes.cause = { kind: 'open-conductor', runId: c.cause.runId, conductor: c.cause.conductor };
        break;
      case 'degrade-conductor':
        description = `${conductorWord(c.cause.conductor)} of run ${this.nameOf(c.cause.runId)} with ${c.cause.ohms.toPrecision(3)} Ω in series (a failing lug or splice)`;
        changes.cause = { kind: 'degrade-conductor', runId: c.cause.runId, conductor: c.cause.conductor, addedOhms: c.cause.ohms };
        break;
      case 'open-connection':
        description = `${conductorWord(c.cause.conductor)} of connection ${c.cause.connectionId} to load ${this.nameOf(c.cause.loadId)} open`;
        changes.cause = { kind: 'open-connection', connectionId: c.cause.connectionId, conductor: c.cause.conductor };
        break;
      case 'degrade-connection':
        description = `${conductorWord(c.cause.conductor)} of connection ${c.cause.connectionId} to load ${this.nameOf(c.cause.loadId)} at ${c.cause.ohms.toPrecision(3)} Ω (a loose terminal)`;
        changes.cause = { kind: 'degrade-connection', connectionId: c.cause.connectionId, conductor: c.cause.conductor, ohms: c.cause.ohms };
        break;
    }
    if (c.parts.length && Math.abs(f.level - 1) > 1e-9) {
      c.levelElementIds.forEach((id, i) => (changes[`level-${i + 1}`] = { kind: 'scale-loads', elementId: id, factor: f.level, scope: 'downstream' }));
    }
    return {
      cause: c.cause,
      description,
      loadLevel: { elementId: c.cause.kind === 'none' ? undefined : c.levelElementIds[0], factor: f.level, loadCount: new Set(c.parts.map((k) => this.network.loads[k].loadId)).size },
      predictedVolts,
      rmsVolts: Math.sqrt(sv / n),
      rmsPercent: Math.sqrt(sp / n),
      changes,
      loadModel: f.loadModel,
      ...(f.refineProblem ? { refineProblem: f.refineProblem } : {}),
    };
  }

  private nameOf(id: string): string {
    const name = this.sheet.elements[id]?.name;
    return name && name !== id ? `${name} (${id})` : id;
  }
}

/** The two pins a (checked) reading is across in a network built with modifications, or undefined. */
function readingPins(sheet: Sheet, network: BuiltNetwork, reading: Reading): [number, number] | undefined {
  const point = reading.at;
  if (point.kind === 'load') {
    const parts = network.loads.filter((x) => x.loadId === point.loadId);
    const part = point.element === undefined ? parts[0] : parts.find((x) => x.label === point.element);
    return part ? [part.p, part.q] : undefined;
  }
  if (sheet.elements[point.busId]?.kind !== 'bus') return undefined;
  const p = network.pinIndex.get(pinKey(point.busId, 'bars', point.from));
  const q = point.to === 'earth' ? EARTH_PIN : network.pinIndex.get(pinKey(point.busId, 'bars', point.to));
  return p === undefined || q === undefined ? undefined : [p, q];
}

/** A reading as a row over the unknowns, or what is wrong with it. */
function readingRow(sheet: Sheet, network: BuiltNetwork, solution: Solution, reading: Reading, i: number): ReadingRow | string {
  const where = `reading ${i + 1}`;
  if (!reading || typeof reading !== 'object' || !reading.at) return `${where}: needs a point ("at") and a value in volts`;
  if (!(typeof reading.volts === 'number' && Number.isFinite(reading.volts) && reading.volts >= 0)) return `${where}: volts must be a number of at least 0 (got ${String(reading.volts)})`;
  const at = reading.at;
  if (at.kind === 'load') {
    const parts = network.loads.filter((part) => part.loadId === at.loadId);
    if (sheet.elements[at.loadId]?.kind !== 'load' || parts.length === 0) return `${where}: "${at.loadId}" is not a connected load of the sheet`;
    if (at.element !== undefined && !parts.some((x) => x.label === at.element)) return `${where}: load ${at.loadId} has no element "${at.element}" (it has ${parts.map((x) => x.label).join(', ')})`;
  } else if (at.kind === 'bus') {
    if (sheet.elements[at.busId]?.kind !== 'bus') return `${where}: "${at.busId}" is not a bus of the sheet`;
    const bar = [at.from, at.to].find((k) => k !== 'earth' && !network.pinIndex.has(pinKey(at.busId, 'bars', k)));
    if (bar) return `${where}: bus ${at.busId} has no ${bar} bar`;
  } else {
    return `${where}: the point must be a load or a bus (got ${(at as { kind?: unknown }).kind as string})`;
  }
  const [p, q] = readingPins(sheet, network, reading)!;
  const { classOf, offsetRe, offsetIm } = solution.classes;
  const scale = solution.system.scale;
  const cp = classOf[p];
  const cq = classOf[q];
  return { p: cp, q: cq, sp: cp >= 0 ? scale[cp] : 0, sq: cq >= 0 ? scale[cq] : 0, offRe: offsetRe[p] - offsetRe[q], offIm: offsetIm[p] - offsetIm[q] };
}

export function readingsMatchSync(sheet: Sheet, readings: Reading[], options: ReadingsMatchOptions = {}): StudyOutcome<ReadingsMatchResult> {
  return runSync('readings match', () => ReadingsMatcher.prepare(sheet, readings, options), options);
}

/** The match in slices, yielding to the event loop between candidates; same result as readingsMatchSync. */
export function readingsMatch(sheet: Sheet, readings: Reading[], options: ReadingsMatchOptions = {}): Promise<StudyOutcome<ReadingsMatchResult>> {
  return runAsync('readings match', () => ReadingsMatcher.prepare(sheet, readings, options), options);
}
