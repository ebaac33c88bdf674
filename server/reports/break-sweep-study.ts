// The break sweep as report tables: each run conductor opened in turn, the top cases ranked by how far a load's
// voltage goes outside the sheet's standard. The sweep is kept per sheet so the voltage profile reuses its worst case.
import type { Sheet } from '../../shared/sheet';
import { breakSweepSync, type BreakCase, type BreakSweepOptions, type BreakSweepResult, type LoadExcursion } from '../../solver';
import type { ExtraStudy } from './extra-studies';
import { fixed, limitRows } from './study-rows';

/** The report's sweep: every run conductor, the loads at constant impedance with the worst ten refined (the solver's defaults). */
export const REPORT_SWEEP_OPTIONS: BreakSweepOptions = { conductors: 'all', loadModel: 'constant-impedance', refineWorst: 10 };
const TOP_CASES = 12;

const sweeps = new WeakMap<Sheet, BreakSweepResult>();

/** The report's sweep of a sheet, computed once per sheet object. */
export function reportSweep(sheet: Sheet): BreakSweepResult {
  const cached = sweeps.get(sheet);
  if (cached) return cached;
  const out = breakSweepSync(sheet, REPORT_SWEEP_OPTIONS);
  if (!out.ok) throw new Error(`the base case could not be solved: ${out.error.message}`);
  sweeps.set(sheet, out.value);
  return out.value;
}

const excursion = (e?: LoadExcursion) => (e ? `${fixed(e.volts)} V (${fixed(e.percentOfNominal)} %) ${e.loadName} ${e.element}` : 'no load has voltage');

/** The opened conductor as a reader names it. */
export const openedName = (c: Pick<BreakCase, 'runName' | 'conductor'>) => `${c.conductor === 'N' ? 'neutral' : c.conductor === 'PE' ? 'protective conductor' : `phase ${c.conductor}`} of ${c.runName}`;

export const breakSweepStudy: ExtraStudy = {
  id: 'break-sweep',
  title: 'Break sweep',
  run(sheet) {
    const r = reportSweep(sheet);
    const refined = r.cases.filter((c) => c.loadModel === 'sheet').length;
    const rows = r.cases.map((c, i) => [
      i + 1,
      openedName(c),
      c.problem ? `not solved: ${c.problem}` : excursion(c.worstOver),
      c.problem ? '' : excursion(c.worstUnder),
      fixed(c.severityPercent, 1),
      `${c.loadsOutside} / ${c.loadsWithoutVoltage}`,
    ]);
    return [
      {
        title: 'Top cases of the break sweep (worst first)',
        columns: ['#', 'Opened conductor', 'Highest load voltage (% of nominal)', 'Lowest load voltage (% of nominal)', 'Beyond range %', 'Loads outside / without voltage'],
        widths: [4, 24, 24, 24, 10, 14],
        align: ['right', 'left', 'left', 'left', 'right', 'right'],
        rows: limitRows(rows, TOP_CASES, 6),
        notes: [
          `${r.cases.length} case${r.cases.length === 1 ? '' : 's'} swept of ${r.total}${r.cancelled ? ' (stopped early)' : ''}: every run conductor opened alone, in turn. Load model: constant impedance at rated voltage in every case (the series-divider answer of common practice); the worst ${refined} solved again with the sheet's load laws.`,
          `Judged by ${r.standard}. "Beyond range" is how far the worse of the two load voltages lies outside the normal range, in percent of nominal (0 when inside). Base case: highest ${excursion(r.base.worstOver)}, lowest ${excursion(r.base.worstUnder)}.`,
          'Loads without voltage are below 5 % of nominal: their supply is lost rather than abnormal.',
          // The load-model assumption is said in the first line.
          ...r.assumptions.filter((a) => !/rated-voltage impedance/.test(a)),
        ],
      },
    ];
  },
};
