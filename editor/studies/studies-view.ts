// What the studies panel shows, from the studies' state and the latest solve: each study's rows as its query
// asks, its progress and standing (stale, cancelled), the loading of the case on show, the readings entered, and
// the voltage profile of the base case beside the case on show. Plain data for the components.
import type { BreakSweepResult, ReadingsMatchResult, SolveResult } from '../../solver';
import type { Sheet, WhatIfChange } from '../../shared/sheet';
import { querySweep, sweepView, type SweepRow, type SweepView } from './break-sweep-rows';
import { faultStudyView, queryFaultCases, type FaultCaseRow, type FaultStudyView } from './fault-study-rows';
import { loadingViewOf, queryConductors, type ConductorRow, type LoadingView } from './loading-rows';
import { readingRows } from './readings-entry';
import { profileLoads, type ProfileLoad } from './voltage-profile';
import { shownFaultKey, shownOpeningKey, type RunState, type StudiesState } from './study-session';

export interface StudiesViewInput {
  studies: StudiesState;
  sheet: Sheet | null;
  /** The elements as the document has them now, solved or not (the bars a reading can be across). */
  elements: Sheet['elements'] | null;
  base: SolveResult | null;
  active: SolveResult | null;
  trialChanges: readonly WhatIfChange[];
  /** The case on show in words ("What-if: …", "Trial (not saved)"). */
  caseLabel: string;
  /** The fault study's view, made once per result (it is the costly part). */
  faultView: FaultStudyView | null;
}

export function makeFaultView(studies: StudiesState, nameOf: (id: string) => string, kindOf: (id: string) => string | undefined): FaultStudyView | null {
  const f = studies.fault;
  if (!f.result) return null;
  const dateText = f.finishedAt ? new Date(f.finishedAt).toISOString().slice(0, 10) : undefined;
  return faultStudyView(f.result, nameOf, kindOf, { dateText });
}

export interface RunSection {
  running: boolean;
  /** "12 of 40", with the share done for a bar; null when not running. */
  progress: { text: string; fraction: number } | null;
  note: string | null;
  error: string | null;
  stale: boolean;
}

function runSection(r: RunState<unknown>, unit: string, count: (result: unknown) => number, extra = ''): RunSection {
  const running = r.status === 'running';
  const progress = running
    ? r.progress && r.progress.total > 0
      ? { text: `${r.progress.done} of ${r.progress.total} ${unit}`, fraction: r.progress.done / r.progress.total }
      : { text: 'Starting…', fraction: 0 }
    : null;
  const time = (ms: number) => (ms < 1000 ? `${ms.toFixed(0)} ms` : `${(ms / 1000).toFixed(1)} s`);
  const note =
    r.status === 'cancelled'
      ? r.result
        ? 'Stopped. The figures below are from the run before.'
        : 'Stopped before it finished.'
      : r.status === 'done' && r.ms !== null && r.result
        ? `${count(r.result)} cases in ${time(r.ms)} on the ${r.where === 'worker' ? 'worker' : 'page'}${extra}`
        : null;
  return { running, progress, note, error: r.status === 'failed' && r.error ? r.error.message : null, stale: r.stale };
}

export interface FaultSection extends RunSection {
  tolerance: boolean;
  view: FaultStudyView | null;
  rows: FaultCaseRow[];
  shownKey: string | null;
}

export interface SweepSection extends RunSection {
  conductors: 'all' | 'neutrals';
  view: SweepView | null;
  rows: SweepRow[];
  shownKey: string | null;
}

export interface MatchSection extends RunSection {
  result: ReadingsMatchResult | null;
  /** The candidate on the drawing (its changes are the trial). */
  shownDescription: string | null;
}

export interface ProfileSection {
  loads: ProfileLoad[];
  /** What the second mark of each column is, or null when only the base case is on show. */
  shownLabel: string | null;
  standard: string | null;
}

export interface LoadingSection {
  view: LoadingView | null;
  rows: ConductorRow[];
  error: string | null;
}

const sameChanges = (a: readonly WhatIfChange[], b: readonly WhatIfChange[]) => a.length === b.length && a.every((c, i) => JSON.stringify(c) === JSON.stringify(b[i]));

export function studiesView(input: StudiesViewInput) {
  const { studies } = input;
  const f = studies.fault;
  const rows = input.faultView ? queryFaultCases(input.faultView.cases, studies.faultQuery) : [];
  const shown = input.active && input.active !== input.base ? input.active : null;
  const sweepResult = studies.sweep.result as BreakSweepResult | null;
  const sweep = sweepResult ? sweepView(sweepResult) : null;
  let loading: LoadingSection = { view: null, rows: [], error: null };
  if (input.sheet && input.base) {
    try {
      const view = loadingViewOf(input.sheet, input.base, shown);
      loading = { view, rows: queryConductors(view.conductors, studies.loadingQuery), error: null };
    } catch (error) {
      loading = { view: null, rows: [], error: `the loading study could not be read: ${(error as Error).message}` };
    }
  }
  const match = studies.match.result;
  const shownCandidate = match?.groups.flatMap((g) => g.candidates).find((c) => sameChanges(Object.values(c.changes), input.trialChanges));
  return {
    tab: studies.tab,
    fault: {
      ...runSection(f, 'buses', (r) => (r as { cases: unknown[] }).cases.length, f.ranWithTolerance ? ', transformer impedances at −7.5 %' : ''),
      tolerance: f.transformerTolerance,
      view: input.faultView,
      rows,
      shownKey: shownFaultKey(input.trialChanges),
    } satisfies FaultSection,
    sweep: {
      ...runSection(studies.sweep, 'steps', (r) => (r as BreakSweepResult).cases.length),
      conductors: studies.sweepConductors,
      view: sweep,
      rows: sweep ? querySweep(sweep.rows, studies.sweepQuery) : [],
      shownKey: shownOpeningKey(input.trialChanges),
    } satisfies SweepSection,
    match: {
      ...runSection(studies.match, 'candidates', (r) => (r as ReadingsMatchResult).candidatesTried),
      result: match,
      shownDescription: shownCandidate?.description ?? null,
    } satisfies MatchSection,
    loading,
    profile: {
      loads: input.base ? profileLoads(input.base, shown, studies.profileOrder) : [],
      shownLabel: shown ? input.caseLabel : null,
      standard: input.base?.standard.label ?? null,
    } satisfies ProfileSection,
    queries: { fault: studies.faultQuery, sweep: studies.sweepQuery, loading: studies.loadingQuery },
    profileOrder: studies.profileOrder,
    readings: readingRows(studies.readings, input.elements),
  };
}

export type StudiesViewModel = ReturnType<typeof studiesView>;
