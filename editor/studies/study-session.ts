// The studies of one open sheet: runs the fault study on the sheet as it now reads (in the study worker, with
// progress and cancel), remembers the answer and whether the sheet changed since, and shows a chosen case on the
// drawing as a trial (never saved unless an editor keeps it as a what-if).
import type { FaultStudyResult, SolveFailure } from '../../solver';
import type { WhatIfChange } from '../../shared/sheet';
import type { SheetSession } from '../session/sheet-session';
import { Store } from '../session/store';
import { StudyRunner, type StudyWorkerLike } from '../solve/study-runner';
import { faultCaseChange, type FaultCaseColumn, type FaultCaseRow } from './fault-study-rows';
import { emptyQuery, nextSort, type TableQuery } from './table-query';
import type { ProfileOrder } from './voltage-profile';
import { FAULT_TYPE_LABEL } from './fault-labels';

export type StudyStatus = 'idle' | 'running' | 'done' | 'failed' | 'cancelled';

export interface FaultStudyState {
  status: StudyStatus;
  progress: { done: number; total: number } | null;
  result: FaultStudyResult | null;
  error: SolveFailure | null;
  ms: number | null;
  where: 'worker' | 'main' | null;
  /** The sheet changed after the study ran: its figures may no longer hold. */
  stale: boolean;
  /** Transformer impedances at nameplate − 7.5 % (maximum duty). */
  transformerTolerance: boolean;
  /** The tolerance the shown result was run with. */
  ranWithTolerance: boolean;
  /** When the shown result was found (epoch ms): the date of the calculation that a field marking states. */
  finishedAt: number | null;
}

/** The studies panel's sections. */
export type StudyTab = 'faults' | 'profile';

export interface StudiesState {
  tab: StudyTab;
  fault: FaultStudyState;
  faultQuery: TableQuery<FaultCaseColumn>;
  profileOrder: ProfileOrder;
}

export function initialStudies(): StudiesState {
  return {
    tab: 'faults',
    faultQuery: emptyQuery<FaultCaseColumn>(),
    profileOrder: 'name',
    fault: { status: 'idle', progress: null, result: null, error: null, ms: null, where: null, stale: false, transformerTolerance: false, ranWithTolerance: false, finishedAt: null },
  };
}

/** The fault case on the drawing: the trial is exactly one shunt fault. */
export function shownFaultKey(trialChanges: readonly WhatIfChange[]): string | null {
  if (trialChanges.length !== 1) return null;
  const c = trialChanges[0];
  return c.kind === 'shunt-fault' ? `${c.busId}|${c.faultType}` : null;
}

export class StudySession {
  readonly store = new Store<StudiesState>(initialStudies());
  private readonly runner: StudyRunner;
  private readonly off: () => void;

  constructor(
    private readonly session: SheetSession,
    private readonly say: (text: string) => void,
    createWorker?: (url: string) => StudyWorkerLike,
  ) {
    const fault = (patch: Partial<FaultStudyState>) => this.store.set((s) => ({ fault: { ...s.fault, ...patch } }));
    this.runner = new StudyRunner({
      workerUrl: session.options.workerUrl,
      createWorker,
      onProgress: (_, done, total) => fault({ progress: { done, total } }),
      onDone: (_, m, where) => fault({ status: 'done', result: m.result, error: null, ms: m.ms, where, progress: null, finishedAt: Date.now() }),
      onFailed: (_, error) => fault({ status: 'failed', error, progress: null }),
      onCancelled: () => fault({ status: 'cancelled', progress: null }),
    });
    this.off = session.mirror.subscribe(() => {
      const f = this.store.get().fault;
      if ((f.result || f.status === 'running') && !f.stale) fault({ stale: true });
    });
  }

  runFaultStudy(): void {
    const read = this.session.reader.read(this.session.mirror.current);
    const tolerance = this.store.get().fault.transformerTolerance;
    this.store.set((s) => ({ fault: { ...s.fault, status: 'running', progress: { done: 0, total: 0 }, error: null, stale: false, ranWithTolerance: tolerance } }));
    this.runner.start({ type: 'study', study: 'fault', sheet: read.sheet, transformerTolerance: tolerance });
  }

  setTab(tab: StudyTab): void {
    this.store.set({ tab });
  }

  setFaultQuery(patch: Partial<TableQuery<FaultCaseColumn>>): void {
    this.store.set((s) => ({ faultQuery: { ...s.faultQuery, ...patch } }));
  }

  /** A tap on a column's head: figures first high to low, words and the standing (worst first) low to high. */
  sortFaultsBy(column: FaultCaseColumn): void {
    const first = column === 'bus' || column === 'faultType' || column === 'status' || column === 'marginPercent' ? 'ascending' : 'descending';
    this.store.set((s) => ({ faultQuery: { ...s.faultQuery, sort: nextSort(s.faultQuery.sort, column, first) } }));
  }

  /** Adds the value to the column's filter, or takes it out. */
  toggleFaultFilter(column: 'faultType' | 'status', value: string): void {
    this.store.set((s) => {
      const now = s.faultQuery.only[column] ?? [];
      const next = now.includes(value) ? now.filter((v) => v !== value) : [...now, value];
      return { faultQuery: { ...s.faultQuery, only: { ...s.faultQuery.only, [column]: next } } };
    });
  }

  setProfileOrder(profileOrder: ProfileOrder): void {
    this.store.set({ profileOrder });
  }

  cancel(): void {
    this.runner.cancel();
  }

  setTransformerTolerance(on: boolean): void {
    this.store.set((s) => ({ fault: { ...s.fault, transformerTolerance: on } }));
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

  /** Back to the base case. */
  clearCase(): void {
    this.session.ui.set({ trialChanges: [] });
  }

  destroy(): void {
    this.off();
    this.runner.destroy();
  }
}
