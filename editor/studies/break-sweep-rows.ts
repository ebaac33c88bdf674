// The break sweep as the studies panel shows it: one row per opened conductor with the worst over- and
// under-voltage any load sees, how far outside the standard, and the counts; sortable and filterable, and the
// what-if change that shows the row on the drawing.
import type { BreakCase, BreakSweepResult, LoadExcursion } from '../../solver';
import { queryRows, type CellValue, type TableQuery } from './table-query';

export type SweepColumn = 'run' | 'conductor' | 'severity' | 'over' | 'under' | 'outside' | 'dead';

export interface SweepRow {
  key: string;
  runId: string;
  runName: string;
  conductor: string;
  over?: { text: string; percent: number; beyondPercent: number; load: string };
  under?: { text: string; percent: number; beyondPercent: number; load: string };
  severityPercent: number;
  loadsOutside: number;
  loadsTolerable: number;
  loadsWithoutVoltage: number;
  /** Solved with the sheet's load laws (the worst few are), not only at constant impedance. */
  refined: boolean;
  problem?: string;
  standing: 'outside' | 'tolerable' | 'normal' | 'plain';
  change: BreakCase['change'];
}

export interface SweepView {
  rows: SweepRow[];
  summary: string;
  base: string;
  standard: string;
  assumptions: string[];
  cancelled: boolean;
}

function excursion(e: LoadExcursion | undefined) {
  if (!e) return undefined;
  return { text: `${e.volts.toFixed(1)} V (${e.percentOfNominal.toFixed(0)} %)`, percent: e.percentOfNominal, beyondPercent: e.beyondPercent, load: `${e.loadName} ${e.element}` };
}

export function sweepView(result: BreakSweepResult): SweepView {
  const rows = result.cases.map(
    (c): SweepRow => ({
      key: `${c.runId}|${c.conductor}`,
      runId: c.runId,
      runName: c.runName,
      conductor: c.conductor,
      over: excursion(c.worstOver),
      under: excursion(c.worstUnder),
      severityPercent: c.severityPercent,
      loadsOutside: c.loadsOutside,
      loadsTolerable: c.loadsTolerable,
      loadsWithoutVoltage: c.loadsWithoutVoltage,
      refined: c.loadModel === 'sheet',
      problem: c.problem,
      standing: c.problem ? 'plain' : c.loadsOutside > 0 ? 'outside' : c.loadsTolerable > 0 ? 'tolerable' : 'normal',
      change: c.change,
    }),
  );
  const harmful = rows.filter((r) => r.loadsOutside > 0).length;
  const summary = `${harmful} of ${result.total} openings put a load outside ${result.standard.split(' (')[0]}${result.cancelled ? ` (stopped after ${rows.length})` : ''}`;
  const b = result.base;
  const base = `Base case: ${b.loadsOutside} loads outside, worst ${b.worstOver ? `${b.worstOver.volts.toFixed(1)} V high` : '—'} / ${b.worstUnder ? `${b.worstUnder.volts.toFixed(1)} V low` : '—'}`;
  return { rows, summary, base, standard: result.standard, assumptions: result.assumptions, cancelled: result.cancelled };
}

export function sweepCell(row: SweepRow, key: SweepColumn): CellValue {
  switch (key) {
    case 'run':
      return row.runName;
    case 'conductor':
      return row.conductor;
    case 'severity':
      return row.problem ? undefined : row.severityPercent;
    case 'over':
      return row.over?.percent;
    case 'under':
      return row.under?.percent;
    case 'outside':
      return row.loadsOutside;
    case 'dead':
      return row.loadsWithoutVoltage;
  }
}

export function querySweep(rows: readonly SweepRow[], query: TableQuery<SweepColumn>): SweepRow[] {
  return queryRows(rows, query, sweepCell, (r) => `${r.runName} ${r.runId} ${r.over?.load ?? ''} ${r.under?.load ?? ''}`);
}
