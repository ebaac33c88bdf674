// The break sweep: open each run conductor (or each neutral) in turn through the base factors and rank the cases
// by the worst over- and under-voltage any load sees against the sheet's standard. The work is a list of cases
// stepped through in time slices, so the async form can yield to a UI between slices and stop when aborted.
import type { ConductorId, Sheet } from '../../shared/sheet';
import { buildNetwork, type BuiltNetwork } from '../network/build-network';
import { NO_MODIFICATIONS, runConductorKey, type Modifications } from '../network/modifications';
import type { ComplexVector, LinearSolver } from '../linear-system';
import { standardLabel } from '../results/standing';
import { iterateLoads } from '../solve/load-iteration';
import { solveBuiltNetwork, type Solution } from '../solve/solve-network';
import type { Factorization } from '../linear-system';
import { LoadWatch, type CaseFigures } from './load-watch';
import { BLOCK_COLUMNS, OpeningSolver, type OpeningUpdate } from './opening-solver';
import { runAsync, runSync, type SlicedStudy } from './run-study';
import type { BreakCase, BreakRanking, BreakSweepOptions, BreakSweepResult, StudyLoadModel, StudyOutcome, StudyProgress } from './study-types';

const DEFAULT_REFINE_WORST = 10;
/** Constant-impedance cases per step: a block of columns (see OpeningSolver.solveManyFromBase), a few ms of work. */
const CASES_PER_STEP = 16;

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());

type CaseHead = Omit<BreakCase, keyof CaseFigures | 'method' | 'residual'>;

interface Work {
  run: number;
  conductor: number;
}

const rankKey = (c: BreakCase, by: BreakRanking): number =>
  by === 'over' ? c.worstOver?.beyondPercent ?? -Infinity : by === 'under' ? c.worstUnder?.beyondPercent ?? -Infinity : c.severityPercent;

/** Worst first by the ranking, then loads outside, then loads without voltage; then by name for a stable order. */
export function compareBreakCases(a: BreakCase, b: BreakCase, by: BreakRanking = 'severity'): number {
  if (!!a.problem !== !!b.problem) return a.problem ? 1 : -1;
  const ka = rankKey(a, by);
  const kb = rankKey(b, by);
  return (
    (kb > ka ? 1 : kb < ka ? -1 : 0) ||
    b.loadsOutside - a.loadsOutside ||
    b.loadsWithoutVoltage - a.loadsWithoutVoltage ||
    b.loadsTolerable - a.loadsTolerable ||
    (a.runId < b.runId ? -1 : a.runId > b.runId ? 1 : 0) ||
    (a.conductor < b.conductor ? -1 : a.conductor > b.conductor ? 1 : 0)
  );
}

/** A prepared sweep: the base case factored once, the cases listed, stepped through by slices. */
export class BreakSweeper implements SlicedStudy<BreakSweepResult> {
  readonly total: number;
  readonly cases: BreakCase[] = [];
  private next = 0;
  private refineQueue?: number[];
  /** Cases of the other shares, added by absorb(), counted in the total. */
  private absorbed = 0;
  /** Set while the other shares' cases are awaited: the refinement must rank them too. */
  private holding = false;
  private readonly x0: ComplexVector;
  private readonly out: ComplexVector;
  private readonly openedRe: Float64Array;
  private readonly openedIm: Float64Array;

  private constructor(
    private readonly sheet: Sheet,
    private readonly network: BuiltNetwork,
    private readonly solution: Solution,
    private readonly factorization: Factorization,
    private readonly solver: OpeningSolver,
    readonly watch: LoadWatch,
    private readonly work: Work[],
    private readonly model: StudyLoadModel,
    private readonly refineWorst: number,
    private readonly rankBy: BreakRanking,
    readonly base: CaseFigures,
  ) {
    this.total = work.length;
    const n = factorization.matrix.n;
    const { rhsRe, rhsIm } = solution.system;
    // The constant-impedance base answer: the known voltages alone on the right-hand side.
    this.x0 = solver.solveBase(rhsRe, rhsIm);
    this.out = { re: new Float64Array(n), im: new Float64Array(n) };
    this.openedRe = new Float64Array(n);
    this.openedIm = new Float64Array(n);
  }

  static prepare(sheet: Sheet, options: BreakSweepOptions = {}): StudyOutcome<BreakSweeper> {
    const share = options.share;
    if (share && !(Number.isInteger(share.count) && share.count >= 1 && Number.isInteger(share.index) && share.index >= 0 && share.index < share.count)) {
      return { ok: false, error: { code: 'internal', message: `a sweep share must be index 0 to count − 1 of a whole count, not ${share.index} of ${share.count}`, elementIds: [] } };
    }
    const network = buildNetwork(sheet, NO_MODIFICATIONS);
    const outcome = solveBuiltNetwork(network, sheet.settings);
    if (!outcome.ok) return { ok: false, error: { ...outcome.error, message: `the base case does not solve: ${outcome.error.message}` } };
    const { solution, factorization } = outcome;
    if (!factorization) return { ok: false, error: { code: 'not-supported', message: 'the sheet has no unknowns to sweep', elementIds: [] } };
    const watch = new LoadWatch(sheet, network, solution.classes, solution.system);
    const work: Work[] = [];
    network.runs.forEach((layout, run) =>
      layout.conductors.forEach((k, conductor) => {
        if (k.open) return;
        if (options.conductors === 'neutrals' && k.conductor !== 'N') return;
        work.push({ run, conductor });
      }),
    );
    const mine = share ? work.filter((_, i) => i % share.count === share.index) : work;
    const solver = new OpeningSolver(network, solution.classes, solution.system);
    const model = options.loadModel ?? 'constant-impedance';
    const refine = model === 'constant-impedance' ? Math.max(0, Math.floor(options.refineWorst ?? DEFAULT_REFINE_WORST)) : 0;
    return { ok: true, value: new BreakSweeper(sheet, network, solution, factorization, solver, watch, mine, model, refine, options.rankBy ?? 'severity', watch.fromPins(solution.volts)) };
  }

  get finished(): boolean {
    return this.next >= this.work.length && this.refineQueue !== undefined && this.refineQueue.length === 0;
  }

  /** This sweeper's own cases are done and the refinement has not begun. */
  get swept(): boolean {
    return this.next >= this.work.length && this.refineQueue === undefined;
  }

  /** Stops before the refinement until release(): the cases of other shares are to be added first. */
  hold(): void {
    this.holding = true;
  }

  /** Adds the cases another share swept (before the refinement, which then ranks every case). */
  absorb(cases: readonly BreakCase[], total: number): void {
    if (this.refineQueue) throw new RangeError('cases can only be added before the refinement begins');
    this.cases.push(...cases);
    this.absorbed += total;
  }

  release(): void {
    this.holding = false;
  }

  /** Cases done, counting the refinements. */
  get done(): number {
    return this.next + (this.refineQueue ? this.refineTarget - this.refineQueue.length : 0);
  }

  /** Total steps, counting the refinements. */
  get steps(): number {
    return this.work.length + this.refineTarget;
  }

  private get refineTarget(): number {
    return Math.min(this.refineWorst, this.work.length + this.absorbed);
  }

  progress(): StudyProgress {
    return { done: this.done, total: this.steps };
  }

  /** Steps until about `ms` have passed (at least one), unless aborted. */
  runSlice(ms: number, signal?: AbortSignal): void {
    const end = now() + ms;
    do {
      if (signal?.aborted || this.finished || (this.holding && this.swept)) return;
      this.step();
    } while (now() < end);
  }

  step(): void {
    if (this.next < this.work.length) {
      if (this.model === 'constant-impedance') {
        const batch = this.work.slice(this.next, this.next + CASES_PER_STEP);
        this.next += batch.length;
        this.cases.push(...this.solveConstantImpedance(batch));
      } else {
        this.cases.push(this.solveCase(this.work[this.next++], this.model));
      }
      return;
    }
    if (!this.refineQueue) {
      // The worst cases again with the sheet's load laws.
      this.cases.sort((a, b) => compareBreakCases(a, b, this.rankBy));
      this.refineQueue = this.cases
        .slice(0, this.refineTarget)
        .map((_, i) => i)
        .reverse();
      return;
    }
    const i = this.refineQueue.pop();
    if (i === undefined) return;
    const c = this.cases[i];
    const run = this.network.runs.findIndex((r) => r.runId === c.runId);
    const conductor = this.network.runs[run].conductors.findIndex((k) => k.conductor === c.conductor);
    const refined = this.solveCase({ run, conductor }, 'sheet');
    this.cases[i] = refined.problem ? { ...c, refineProblem: refined.problem } : refined;
  }

  private head(w: Work, model: StudyLoadModel): CaseHead {
    const layout = this.network.runs[w.run];
    const conductor = layout.conductors[w.conductor].conductor;
    return {
      runId: layout.runId,
      runName: this.sheet.elements[layout.runId]?.name ?? layout.runId,
      conductor,
      change: { kind: 'open-conductor' as const, runId: layout.runId, conductor },
      loadModel: model,
    };
  }

  /** The conductor carries nothing the matrix sees (both ends one node): the base case stands. */
  private baseStands(head: CaseHead, model: StudyLoadModel): BreakCase {
    const figures = model === 'sheet' ? this.watch.fromPins(this.solution.volts) : this.watch.fromUnknowns(this.x0);
    return { ...head, ...figures, method: 'low-rank', residual: 0 };
  }

  /**
   * Constant-impedance cases through the base factors, their columns solved in blocks. A case whose opening cuts
   * a part off goes again in a block with the tie that holds it; one that still fails (or whose residual is too
   * large) goes through the single-case path, and from there to a fresh solve.
   */
  private solveConstantImpedance(batch: readonly Work[]): BreakCase[] {
    const model = 'constant-impedance';
    const heads = batch.map((w) => this.head(w, model));
    const updates = batch.map((w) => this.solver.update(this.network.runs[w.run], w.conductor));
    const cases: (BreakCase | undefined)[] = new Array(batch.length);
    const { rhsRe, rhsIm } = this.solution.system;
    let pending: { index: number; update: OpeningUpdate }[] = [];
    const failed: number[] = [];
    updates.forEach((u, i) => {
      if (!u) cases[i] = this.baseStands(heads[i], model);
      else if (u.m > BLOCK_COLUMNS) failed.push(i);
      else pending.push({ index: i, update: this.solver.likelyUpdate(u) });
    });
    for (const tied of [false, true]) {
      const retry: { index: number; update: OpeningUpdate }[] = [];
      for (const group of blocks(pending)) {
        const block = this.solver.solveBlock(
          group.map((g) => g.update),
          rhsRe,
          rhsIm,
          this.x0,
        );
        const answered = group.map((_, j) => j).filter((j) => block.cases[j].tRe);
        const figures = this.watch.fromBlock(block, answered);
        answered.forEach((j, a) => {
          const outcome = this.solver.verify(block, j, figures[a].xMax);
          if (outcome.ok) cases[group[j].index] = { ...heads[group[j].index], ...figures[a].figures, method: 'low-rank', residual: outcome.residual };
        });
        group.forEach((g, j) => {
          if (cases[g.index]) return;
          const withTie = !tied && !block.cases[j].tRe && g.update.tieClass === undefined ? this.solver.tiedUpdate(g.update) : undefined;
          if (withTie) retry.push({ index: g.index, update: withTie });
          else failed.push(g.index);
        });
      }
      pending = retry;
    }
    for (const i of failed) {
      const single = this.solver.solveFromBase(updates[i]!, rhsRe, rhsIm, this.x0, this.out);
      cases[i] = single.ok ? { ...heads[i], ...this.watch.fromUnknowns(this.out), method: 'low-rank', residual: single.residual } : this.fullSolve(heads[i], batch[i], model);
    }
    return cases as BreakCase[];
  }

  /** The figures of one case (exposed for checks: `watch.lastVolts()` then holds its load voltages). */
  solveCase(w: Work, model: StudyLoadModel): BreakCase {
    if (model === 'constant-impedance') return this.solveConstantImpedance([w])[0];
    const layout = this.network.runs[w.run];
    const head = this.head(w, model);
    const u = this.solver.update(layout, w.conductor);
    if (!u) return this.baseStands(head, model);
    const { system, classes } = this.solution;
    const prepared = this.solver.linearSolver(u);
    if (!prepared) return this.fullSolve(head, w, model);
    const linear = prepared.solver;
    let residual = 0;
    const checked: LinearSolver = {
      matrix: linear.matrix,
      method: linear.method,
      solve: (bRe, bIm) => {
        const x = linear.solve(bRe, bIm);
        if (x.ok) residual = Math.max(residual, this.solver.residual(prepared.update, x.value, bRe, bIm));
        return x;
      },
    };
    this.solver.openedRhs(u, system.rhsRe, system.rhsIm, this.openedRe, this.openedIm);
    const iteration = iterateLoads(this.network, classes, { ...system, rhsRe: this.openedRe, rhsIm: this.openedIm }, checked, this.iterationOptions());
    if (iteration.ok) return { ...head, ...this.watch.fromPins(iteration.volts), method: 'low-rank', residual };
    if (iteration.message.includes('singular')) return this.fullSolve(head, w, model);
    return { ...head, ...this.empty(), method: 'low-rank', problem: iteration.message };
  }

  private iterationOptions() {
    const s = this.sheet.settings;
    return { lowVoltageSwitchFraction: s.lowVoltageSwitchFraction, tolerance: s.loadMismatchTolerance, maxIterations: s.maxLoadIterations };
  }

  private empty(): CaseFigures {
    return { loadsOutside: 0, loadsTolerable: 0, loadsWithoutVoltage: 0, severityPercent: 0 };
  }

  /** The case built and solved afresh (the opening changed which parts are live or referenced). */
  private fullSolve(head: CaseHead, w: Work, model: StudyLoadModel): BreakCase {
    const mods = openingMods(this.network.runs[w.run].runId, head.conductor);
    const network = buildNetwork(this.sheet, mods);
    if (network.pins.length !== this.network.pins.length) {
      return { ...head, ...this.empty(), method: 'full-solve', problem: 'the opened network does not line up with the base case' };
    }
    const outcome = solveBuiltNetwork(network, this.sheet.settings, this.factorization, { constantImpedanceOnly: model === 'constant-impedance' });
    if (!outcome.ok) return { ...head, ...this.empty(), method: 'full-solve', problem: outcome.error.message };
    return { ...head, ...this.watch.fromPins(outcome.solution.volts), method: 'full-solve' };
  }

  result(cancelled: boolean): BreakSweepResult {
    const cases = [...this.cases].sort((a, b) => compareBreakCases(a, b, this.rankBy));
    const model = this.model;
    return {
      cases,
      base: this.base,
      total: this.work.length + this.absorbed,
      cancelled,
      standard: standardLabel(this.sheet.settings),
      assumptions: [
        'Break sweep: each run conductor is opened alone, the rest of the sheet as drawn; connections and breaker poles are not opened here.',
        model === 'constant-impedance'
          ? `Break sweep: loads at their rated-voltage impedance in every case (the series-divider answer); the worst ${this.refineTarget} cases are solved again with the sheet's load laws (marked).`
          : "Break sweep: every case with the sheet's load laws.",
        'Break sweep: load voltages judged against the utilization ranges of the standard; below 5 % of nominal a load counts as without voltage, not as an under-voltage.',
      ],
    };
  }
}

export function openingMods(runId: string, conductor: ConductorId): Modifications {
  return { ...NO_MODIFICATIONS, openRunConductors: new Set([runConductorKey(runId, conductor)]) };
}

/** The whole sweep in one go (Node, a worker thread, a Web Worker). Progress is reported once per slice. */
export function breakSweepSync(sheet: Sheet, options: BreakSweepOptions = {}): StudyOutcome<BreakSweepResult> {
  return runSync('break sweep', () => BreakSweeper.prepare(sheet, options), options);
}

/** The sweep in slices, yielding to the event loop between them (for a UI thread); same result as breakSweepSync. */
export function breakSweep(sheet: Sheet, options: BreakSweepOptions = {}): Promise<StudyOutcome<BreakSweepResult>> {
  return runAsync('break sweep', () => BreakSweeper.prepare(sheet, options), options);
}

/** Consecutive groups whose columns fit one block (each item fits one alone). */
function blocks<T extends { update: OpeningUpdate }>(items: readonly T[]): T[][] {
  const groups: T[][] = [];
  let group: T[] = [];
  let width = 0;
  for (const item of items) {
    if (group.length > 0 && width + item.update.m > BLOCK_COLUMNS) {
      groups.push(group);
      group = [];
      width = 0;
    }
    group.push(item);
    width += item.update.m;
  }
  if (group.length > 0) groups.push(group);
  return groups;
}
