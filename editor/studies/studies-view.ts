// What the studies panel shows, from the studies' state and the latest solve: the fault study's rows as the
// query asks, its progress and standing (stale, with the tolerance), and the voltage profile of the base case
// beside the case on show. Plain data for the components.
import type { SolveResult } from '../../solver';
import type { WhatIfChange } from '../../shared/sheet';
import { faultStudyView, queryFaultCases, type FaultCaseRow, type FaultStudyView } from './fault-study-rows';
import { profileLoads, type ProfileLoad } from './voltage-profile';
import { shownFaultKey, type StudiesState } from './study-session';

export interface StudiesViewInput {
  studies: StudiesState;
  base: SolveResult | null;
  active: SolveResult | null;
  trialChanges: readonly WhatIfChange[];
  /** The case on show in words ("What-if: …", "Trial (not saved)"). */
  caseLabel: string;
  nameOf: (id: string) => string;
  kindOf: (id: string) => string | undefined;
  /** The fault study's view, made once per result (it is the costly part). */
  faultView: FaultStudyView | null;
}

export function makeFaultView(studies: StudiesState, nameOf: (id: string) => string, kindOf: (id: string) => string | undefined): FaultStudyView | null {
  const f = studies.fault;
  if (!f.result) return null;
  const dateText = f.finishedAt ? new Date(f.finishedAt).toISOString().slice(0, 10) : undefined;
  return faultStudyView(f.result, nameOf, kindOf, { dateText });
}

export interface FaultSection {
  running: boolean;
  /** "12 of 40 buses", with the share done for a bar; null when not running. */
  progress: { text: string; fraction: number } | null;
  note: string | null;
  error: string | null;
  stale: boolean;
  tolerance: boolean;
  view: FaultStudyView | null;
  rows: FaultCaseRow[];
  shownKey: string | null;
}

export interface ProfileSection {
  loads: ProfileLoad[];
  /** What the second mark of each column is, or null when only the base case is on show. */
  shownLabel: string | null;
  standard: string | null;
}

export function studiesView(input: StudiesViewInput): { tab: StudiesState['tab']; fault: FaultSection; profile: ProfileSection } {
  const { studies } = input;
  const f = studies.fault;
  const running = f.status === 'running';
  const progress = running
    ? f.progress && f.progress.total > 0
      ? { text: `${f.progress.done} of ${f.progress.total} buses`, fraction: f.progress.done / f.progress.total }
      : { text: 'Starting…', fraction: 0 }
    : null;
  const note =
    f.status === 'cancelled'
      ? f.result
        ? 'Stopped. The figures below are from the study before.'
        : 'Stopped before it finished.'
      : f.status === 'done' && f.ms !== null
        ? `${f.result!.cases.length} cases in ${f.ms < 1000 ? `${f.ms.toFixed(0)} ms` : `${(f.ms / 1000).toFixed(1)} s`} on the ${f.where === 'worker' ? 'worker' : 'page'}${f.ranWithTolerance ? ', transformer impedances at −7.5 %' : ''}`
        : null;
  const rows = input.faultView ? queryFaultCases(input.faultView.cases, studies.faultQuery) : [];
  const shown = input.active && input.active !== input.base ? input.active : null;
  return {
    tab: studies.tab,
    fault: {
      running,
      progress,
      note,
      error: f.status === 'failed' && f.error ? f.error.message : null,
      stale: f.stale,
      tolerance: f.transformerTolerance,
      view: input.faultView,
      rows,
      shownKey: shownFaultKey(input.trialChanges),
    },
    profile: {
      loads: input.base ? profileLoads(input.base, shown, studies.profileOrder) : [],
      shownLabel: shown ? input.caseLabel : null,
      standard: input.base?.standard.label ?? null,
    },
  };
}
