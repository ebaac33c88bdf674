// The loading and voltage-drop study as the studies panel shows it, read from the solve on show (a fault case
// has no load flow: then the base case's): each conductor against its NEC 310.16 ampacity, breakers against
// their ratings, voltage drop per run and from the source against 3 % and 5 %, and misplaced bonds.
import type { Sheet } from '../../shared/sheet';
import { loadingStudyOf, type LoadingStudy, type SolveResult } from '../../solver';
import { queryRows, type CellValue, type TableQuery } from './table-query';

export type LoadingColumn = 'run' | 'conductor' | 'amperes' | 'ampacity' | 'percent' | 'status';
type Standing = 'outside' | 'tolerable' | 'normal' | 'plain';

export interface ConductorRow {
  key: string;
  runId: string;
  runName: string;
  conductor: string;
  size: string;
  amperes: number;
  ampacityAmperes?: number;
  percent?: number;
  status: string;
  statusLabel: string;
  standing: Standing;
  rule?: string;
}

export interface LoadingView {
  /** Which case the figures are of. */
  caseNote: string;
  conductors: ConductorRow[];
  breakers: { key: string; name: string; amperes: number; ratingAmperes?: number; percent?: number; statusLabel: string; standing: Standing; note: string }[];
  drops: { key: string; name: string; role: string; dropPercent?: number; cumulativePercent?: number; statusLabel: string; standing: Standing }[];
  bonds: { key: string; name: string; message: string; standing: Standing }[];
  summary: string;
  notes: string[];
}

const CONDUCTOR_STATUS: Record<string, [string, Standing]> = {
  over: ['Over its ampacity', 'outside'],
  high: ['Above 80 %', 'tolerable'],
  ok: ['Within', 'normal'],
  'not-rated': ['Not rated here', 'plain'],
};
const BREAKER_STATUS: Record<string, [string, Standing]> = {
  over: ['Over its rating', 'outside'],
  'above-continuous': ['Above 80 % (continuous)', 'tolerable'],
  ok: ['Within', 'normal'],
  'no-rating': ['No rating', 'plain'],
  open: ['Open', 'plain'],
};
const DROP_STATUS: Record<string, [string, Standing]> = {
  'over-total': ['Over 5 % from the source', 'outside'],
  'over-run': ['Over 3 % in this run', 'tolerable'],
  ok: ['Within', 'normal'],
  'no-data': ['No figure', 'plain'],
};

/** The study of the case on show, or of the base case when the case on show is a fault (no load flow). */
export function loadingViewOf(sheet: Sheet, base: SolveResult, shown: SolveResult | null): LoadingView {
  const of = shown && !shown.fault ? shown : base;
  const study: LoadingStudy = loadingStudyOf(sheet, of);
  const caseNote = shown?.fault ? 'The case on show is a fault: these figures are of the base case.' : of.whatIf ? `Of the case on show: ${of.whatIf.name}.` : 'Of the base case.';
  const s = study.summary;
  const summary = [
    `${s.conductorsOver} conductors over their ampacity`,
    `${s.breakersOver} breakers over their rating`,
    `${s.runsOverDrop} runs over 3 % drop, ${s.pathsOverTotalDrop} over 5 % from the source`,
    ...(s.bondsFlagged ? [`${s.bondsFlagged} misplaced bonds`] : []),
  ].join(' · ');
  return {
    caseNote,
    summary,
    notes: study.notes,
    conductors: study.conductors.map((c) => {
      const [statusLabel, standing] = CONDUCTOR_STATUS[c.status] ?? [c.status, 'plain'];
      return {
        key: `${c.runId}|${c.conductor}`,
        runId: c.runId,
        runName: c.runName,
        conductor: c.conductor,
        size: c.size ? `${c.parallelSets > 1 ? `${c.parallelSets} × ` : ''}${c.size} ${c.material === 'aluminum' ? 'Al' : 'Cu'}` : '—',
        amperes: c.amperes,
        ampacityAmperes: c.ampacityAmperes,
        percent: c.percentOfAmpacity,
        status: c.status,
        statusLabel,
        standing,
        rule: c.rule?.text ?? c.note,
      };
    }),
    breakers: study.breakers.map((b) => {
      const [statusLabel, standing] = BREAKER_STATUS[b.status] ?? [b.status, 'plain'];
      return { key: b.breakerId, name: b.name, amperes: b.amperes, ratingAmperes: b.ratingAmperes, percent: b.percentOfRating, statusLabel, standing, note: b.note };
    }),
    drops: study.voltageDrop.map((d) => {
      const [statusLabel, standing] = DROP_STATUS[d.status] ?? [d.status, 'plain'];
      return { key: d.runId, name: d.name, role: d.role, dropPercent: d.dropPercent, cumulativePercent: d.cumulativePercent, statusLabel, standing };
    }),
    bonds: study.bonds.map((b) => ({ key: b.busId, name: b.name, message: b.message, standing: b.status === 'flagged' ? ('outside' as const) : ('normal' as const) })),
  };
}

export function conductorCell(row: ConductorRow, key: LoadingColumn): CellValue {
  switch (key) {
    case 'run':
      return row.runName;
    case 'conductor':
      return row.conductor;
    case 'amperes':
      return row.amperes;
    case 'ampacity':
      return row.ampacityAmperes;
    case 'percent':
      return row.percent;
    case 'status':
      return row.status;
  }
}

export function queryConductors(rows: readonly ConductorRow[], query: TableQuery<LoadingColumn>): ConductorRow[] {
  return queryRows(rows, query, conductorCell, (r) => `${r.runName} ${r.runId} ${r.size}`);
}
