// The studies of one open sheet: runs the fault study, the break sweep and the readings match on the sheet as it
// now reads (each in a study worker of its own, with progress and cancel), remembers each answer and whether the
// sheet changed since, and shows a chosen case on the drawing as a trial (never saved unless an editor keeps it
// as a what-if). The loading study needs no run: it is read from the solve on show.
import type { Reading, SolveFailure } from '../../solver';
import type { WhatIfChange } from '../../shared/sheet';
import type { SheetSession } from '../session/sheet-session';
import { Store } from '../session/store';
import { StudyRunner, type StudyWorkerLike } from '../solve/study-runner';
import type { StudyKind, StudyRequest, StudyResults } from '../solve/study-request';
import { faultCaseChange, type FaultCaseColumn, type FaultCaseRow } from './fault-study-rows';
import { FAULT_TYPE_LABEL } from './fault-labels';
import { emptyQuery, nextSort, type TableQuery } from './table-query';
import type { ProfileOrder } from './voltage-profile';
import type { SweepColumn } from './break-sweep-rows';
import type { LoadingColumn } from './loading-rows';
import type { ReadingEntry } from './readings-entry';

export type StudyStatus = 'idle' | 'running' | 'done' | 'failed' | 'cancelled';

export interface RunState<R> {
  status: StudyStatus;
  progress: { done: number; total: number } | null;
  result: R | null;
  error: SolveFailure | null;
  ms: number | null;
  where: 'worker' | 'main' | null;
  /** The sheet changed after the study ran: its figures may no longer hold. */
  stale: boolean;
  /** When the shown result was found (epoch ms): the date of the calculation that a field marking states. */
  finishedAt: number | null;
}

export interface FaultStudyState extends RunState<StudyResults['fault']> {
  /** Transformer impedances at nameplate − 7.5 % (maximum duty). */
  transformerTolerance: boolean;
  /** The tolerance the shown result was run with. */
  ranWithTolerance: boolean;
}

/** The studies panel's sections. */
export type StudyTab = 'faults' | 'profile' | 'loading' | 'sweep' | 'readings';

export interface StudiesState {
  tab: StudyTab;
  fault: FaultStudyState;
  sweep: RunState<StudyResults['break-sweep']>;
  match: RunState<StudyResults['readings-match']>;
  faultQuery: TableQuery<FaultCaseColumn>;
  sweepQuery: TableQuery<SweepColumn>;
  loadingQuery: TableQuery<LoadingColumn>;
  /** Open every conductor in the sweep, or only the neutrals. */
  sweepConductors: 'all' | 'neutrals';
  profileOrder: ProfileOrder;
  /** The readings being entered for the readings match. */
  readings: ReadingEntry[];
}

function idle<R>(): RunState<R> {
  return { status: 'idle', progress: null, result: null, error: null, ms: null, where: null, stale: false, finishedAt: null };
}

export function initialStudies(): StudiesState {
  return {
    tab: 'faults',
    fault: { ...idle(), transformerTolerance: false, ranWithTolerance: false },
    sweep: idle(),
    match: idle(),
    faultQuery: emptyQuery<FaultCaseColumn>(),
    sweepQuery: emptyQuery<SweepColumn>(),
    loadingQuery: emptyQuery<LoadingColumn>(),
    sweepConductors: 'all',
    profileOrder: 'name',
    readings: [],
  };
}

/** The fault case on the drawing: the trial is exactly one shunt fault. */
export function shownFaultKey(trialChanges: readonly WhatIfChange[]): string | null {
  if (trialChanges.length !== 1) return null;
  const c = trialChanges[0];
  return c.kind === 'shunt-fault' ? `${c.busId}|${c.faultType}` : null;
}

/** The opening on the drawing: the trial is exactly one open conductor. */
export function shownOpeningKey(trialChanges: readonly WhatIfChange[]): string | null {
  if (trialChanges.length !== 1) return null;
  const c = trialChanges[0];
  return c.kind === 'open-conductor' ? `${c.runId}|${c.conductor}` : null;
}

type Slot = 'fault' | 'sweep' | 'match';
const SLOT_OF: Record<StudyKind, Slot> = { fault: 'fault', 'break-sweep': 'sweep', 'readings-match': 'match' };

type RequestBody<R extends StudyRequest = StudyRequest> = R extends StudyRequest ? Omit<R, 'id' | 'type' | 'sheet'> : never;

export class StudySession {
  readonly store = new Store<StudiesState>(initialStudies());
  private readonly runners: Record<Slot, StudyRunner>;
  private readonly off: () => void;

  constructor(
    private readonly session: SheetSession,
    private readonly say: (text: string) => void,
    createWorker?: (url: string) => StudyWorkerLike,
  ) {
    const runner = (slot: Slot) => {
      const patch = (p: Partial<RunState<unknown>>) => this.store.set((s) => ({ [slot]: { ...s[slot], ...p } }) as Partial<StudiesState>);
      return new StudyRunner({
        workerUrl: session.options.workerUrl,
        createWorker,
        onProgress: (_, done, total) => patch({ progress: { done, total } }),
        onDone: (_, m, where) => {
          patch({ status: 'done', result: m.result, error: null, ms: m.ms, where, progress: null, finishedAt: Date.now() });
          if (slot === 'match') this.showBestCandidate();
        },
        onFailed: (_, error) => patch({ status: 'failed', error, progress: null }),
        onCancelled: () => patch({ status: 'cancelled', progress: null }),
      });
    };
    this.runners = { fault: runner('fault'), sweep: runner('sweep'), match: runner('match') };
    this.off = session.mirror.subscribe(() => {
      const s = this.store.get();
      const patch: Partial<StudiesState> = {};
      for (const slot of ['fault', 'sweep', 'match'] as const) {
        const r = s[slot];
        if ((r.result || r.status === 'running') && !r.stale) (patch as Record<Slot, unknown>)[slot] = { ...r, stale: true };
      }
      if (Object.keys(patch).length) this.store.set(patch);
    });
  }

  private start(body: RequestBody, extra: Partial<FaultStudyState> = {}): void {
    const slot = SLOT_OF[body.study];
    const read = this.session.reader.read(this.session.mirror.current);
    this.store.set((s) => ({ [slot]: { ...s[slot], status: 'running', progress: { done: 0, total: 0 }, error: null, stale: false, ...extra } }) as Partial<StudiesState>);
    this.runners[slot].start({ ...body, type: 'study', sheet: read.sheet } as Parameters<StudyRunner['start']>[0]);
  }

  runFaultStudy(): void {
    const tolerance = this.store.get().fault.transformerTolerance;
    this.start({ study: 'fault', transformerTolerance: tolerance }, { ranWithTolerance: tolerance });
  }

  runBreakSweep(): void {
    this.start({ study: 'break-sweep', conductors: this.store.get().sweepConductors });
  }

  /** Runs the match on these readings (the panel checks the entries first). */
  runReadingsMatch(readings: Reading[]): void {
    this.start({ study: 'readings-match', readings, conductors: 'all' });
  }

  cancel(which: Slot = 'fault'): void {
    this.runners[which].cancel();
  }

  setTab(tab: StudyTab): void {
    this.store.set({ tab });
  }

  setFaultQuery(patch: Partial<TableQuery<FaultCaseColumn>>): void {
    this.store.set((s) => ({ faultQuery: { ...s.faultQuery, ...patch } }));
  }

  setSweepQuery(patch: Partial<TableQuery<SweepColumn>>): void {
    this.store.set((s) => ({ sweepQuery: { ...s.sweepQuery, ...patch } }));
  }

  setLoadingQuery(patch: Partial<TableQuery<LoadingColumn>>): void {
    this.store.set((s) => ({ loadingQuery: { ...s.loadingQuery, ...patch } }));
  }

  sortLoadingBy(column: LoadingColumn): void {
    const first = column === 'run' || column === 'conductor' || column === 'status' ? 'ascending' : 'descending';
    this.store.set((s) => ({ loadingQuery: { ...s.loadingQuery, sort: nextSort(s.loadingQuery.sort, column, first) } }));
  }

  toggleLoadingFilter(column: 'status' | 'conductor', value: string): void {
    this.store.set((s) => ({ loadingQuery: toggled(s.loadingQuery, column, value) }));
  }

  setSweepConductors(sweepConductors: 'all' | 'neutrals'): void {
    this.store.set({ sweepConductors });
  }

  /** A tap on a column's head: figures first high to low, words and the standing (worst first) low to high. */
  sortFaultsBy(column: FaultCaseColumn): void {
    const first = column === 'bus' || column === 'faultType' || column === 'status' || column === 'marginPercent' ? 'ascending' : 'descending';
    this.store.set((s) => ({ faultQuery: { ...s.faultQuery, sort: nextSort(s.faultQuery.sort, column, first) } }));
  }

  sortSweepBy(column: SweepColumn): void {
    const first = column === 'run' || column === 'conductor' || column === 'under' ? 'ascending' : 'descending';
    this.store.set((s) => ({ sweepQuery: { ...s.sweepQuery, sort: nextSort(s.sweepQuery.sort, column, first) } }));
  }

  /** Adds the value to the column's filter, or takes it out. */
  toggleFaultFilter(column: 'faultType' | 'status', value: string): void {
    this.store.set((s) => ({ faultQuery: toggled(s.faultQuery, column, value) }));
  }

  toggleSweepFilter(column: 'conductor', value: string): void {
    this.store.set((s) => ({ sweepQuery: toggled(s.sweepQuery, column, value) }));
  }

  setProfileOrder(profileOrder: ProfileOrder): void {
    this.store.set({ profileOrder });
  }

  setTransformerTolerance(on: boolean): void {
    this.store.set((s) => ({ fault: { ...s.fault, transformerTolerance: on } }));
  }

  setReadings(readings: ReadingEntry[]): void {
    this.store.set({ readings });
  }

  /** Shows a case of the fault study on the drawing: the base case with that fault, as a trial. */
  showFaultCase(row: Pick<FaultCaseRow, 'busId' | 'busName' | 'faultType'> & { problem?: string }): void {
    if (row.problem) {
      this.say(`No figures for this case: ${row.problem}`);
      return;
    }
    this.session.ui.set({ whatIfId: null, trialChanges: [faultCaseChange(row)] });
    this.say(`${FAULT_TYPE_LABEL[row.faultType]} fault at ${row.busName}, on the drawing (a trial, not saved)`);
  }

  /** Shows changes from a study (an opening, a candidate cause) on the drawing over the base case, as a trial. */
  showChanges(changes: WhatIfChange[], words: string): void {
    this.session.ui.set({ whatIfId: null, trialChanges: changes });
    this.say(`${words}, on the drawing (a trial, not saved)`);
  }

  private showBestCandidate() {
    const best = this.store.get().match.result?.best;
    if (best) this.showChanges(Object.values(best.changes), `Best match: ${best.description}`);
  }

  /** Back to the base case. */
  clearCase(): void {
    this.session.ui.set({ trialChanges: [] });
  }

  destroy(): void {
    this.off();
    for (const r of Object.values(this.runners)) r.destroy();
  }
}

function toggled<K extends string>(q: TableQuery<K>, column: K, value: string): TableQuery<K> {
  const now = q.only[column] ?? [];
  const next = now.includes(value) ? now.filter((v) => v !== value) : [...now, value];
  return { ...q, only: { ...q.only, [column]: next } };
}
