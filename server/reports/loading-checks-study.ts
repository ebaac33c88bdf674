// The loading checks of a revision's base case as report tables: a summary first, then the conductors (with the
// ampacity rule applied), the breakers, the voltage drop per run and along each path, and the bonds, worst first.
import type { Sheet } from '../../shared/sheet';
import { loadingStudy, type LoadingStudy } from '../../solver';
import type { ExtraStudy, StudyTable } from './extra-studies';
import { fixed, limitRows } from './study-rows';

/** Rows per table on the page; the rest are counted. Conductor rows carry their rule and run tall. */
const ROW_LIMIT = 25;
const CONDUCTOR_LIMIT = 15;

const STATUS_WORDS: Record<string, string> = {
  ok: 'ok',
  high: 'high (≥ 80 %)',
  over: 'OVER',
  'not-rated': 'not rated',
  'above-continuous': 'above 80 % (continuous)',
  'no-rating': 'no rating',
  open: 'open',
  'over-run': 'OVER 3 % (run)',
  'over-total': 'OVER 5 % (total)',
  'no-data': 'no data',
  flagged: 'FLAGGED',
};
const word = (s: string) => STATUS_WORDS[s] ?? s;

function summaryTable(s: LoadingStudy): StudyTable {
  const m = s.summary;
  const line = (check: string, count: number, limit: string): (string | number)[] => [check, count, count === 0 ? 'none' : 'see below', limit];
  return {
    title: 'Loading checks: summary',
    columns: ['Check', 'Count', 'Finding', 'Limit'],
    widths: [34, 9, 14, 43],
    align: ['left', 'right', 'left', 'left'],
    rows: [
      line('Conductors over their ampacity', m.conductorsOver, 'NEC 310.16 with 310.15 adjustments'),
      line('Conductors at 80 % or more of ampacity', m.conductorsHigh, '80 % of ampacity (common practice)'),
      line('Runs protected above their conductors', m.runsUnprotected, 'NEC 240.4(B), 240.4(D)'),
      line('Breakers over their rating', m.breakersOver, '100 % of the rating'),
      line('Breakers above 80 % of their rating', m.breakersAboveContinuous, '80 % for a continuous load (common practice)'),
      line('Runs over 3 % drop', m.runsOverDrop, '3 % per run (NEC 210.19(A), 215.2(A) informational notes)'),
      line('Paths over 5 % total drop', m.pathsOverTotalDrop, '5 % feeder plus branch (same notes)'),
      line('Neutral-to-ground bonds flagged', m.bondsFlagged, 'NEC 250.24(A)(5), 250.142(B)'),
    ],
  };
}

function conductorTable(s: LoadingStudy): StudyTable {
  const rows = s.conductors.map((c) => {
    const extra = [c.smallConductor?.exceeded ? `240.4(D): ${c.smallConductor.limitAmperes} A limit exceeded` : '', c.protection?.exceeded ? `240.4(B): breaker ${c.protection.breakerRatingAmperes} A above ${c.protection.largestAllowedAmperes} A allowed` : '', c.note ?? '']
      .filter(Boolean)
      .join('; ');
    return [
      c.runName,
      c.conductor,
      c.size ? `${c.size} ${c.material === 'aluminum' ? 'Al' : c.material === 'copper' ? 'Cu' : c.material}` : '—',
      fixed(c.amperes),
      fixed(c.ampacityAmperes),
      fixed(c.percentOfAmpacity, 0),
      word(c.status),
      [c.rule?.text, extra].filter(Boolean).join('. ') || '—',
    ];
  });
  return {
    title: 'Conductors (worst first)',
    columns: ['Run', 'Cond.', 'Size', 'Amps', 'Ampacity', '% amp.', 'Status', 'Rule applied'],
    widths: [16, 6, 8, 7, 9, 7, 9, 38],
    align: ['left', 'left', 'left', 'right', 'right', 'right', 'left', 'left'],
    rows: limitRows(rows, CONDUCTOR_LIMIT, 8),
  };
}

function breakerTable(s: LoadingStudy): StudyTable {
  const rows = s.breakers.map((b) => [b.name, b.device, fixed(b.amperes), fixed(b.ratingAmperes, 0), fixed(b.percentOfRating, 0), word(b.status), b.note]);
  return {
    title: 'Breakers, switches and fuses (worst first)',
    columns: ['Device', 'Kind', 'Largest pole A', 'Rating A', '% rating', 'Status', 'Note'],
    widths: [20, 9, 11, 9, 9, 14, 28],
    align: ['left', 'left', 'right', 'right', 'right', 'left', 'left'],
    rows: limitRows(rows, ROW_LIMIT, 7),
  };
}

function dropTable(s: LoadingStudy, sheet: Sheet): StudyTable {
  const nameOf = (id: string) => sheet.elements[id]?.name || id;
  const rows = s.voltageDrop.map((d) => [d.name, d.role, fixed(d.dropPercent, 2), fixed(d.cumulativePercent, 2), word(d.status), [d.originId ? nameOf(d.originId) : '', ...d.path.map(nameOf)].filter(Boolean).join(' → ')]);
  return {
    title: 'Voltage drop per run and from the start of its zone (3 % / 5 %)',
    columns: ['Run', 'Role', 'Run drop %', 'Cumulative %', 'Status', 'Path from the zone’s start'],
    widths: [20, 8, 10, 13, 13, 36],
    align: ['left', 'left', 'right', 'right', 'left', 'left'],
    rows: limitRows(rows, ROW_LIMIT, 6),
  };
}

function bondTable(s: LoadingStudy): StudyTable {
  const rows = s.bonds.map((b) => [b.name, b.role, b.permitted ? 'yes' : 'no', fixed(b.bondAmperes, 2), word(b.status), b.message]);
  return {
    title: 'Neutral-to-ground bonds',
    columns: ['Bus', 'Role', 'Bond allowed', 'Bond A', 'Status', 'Finding'],
    widths: [20, 10, 11, 11, 10, 38],
    align: ['left', 'left', 'left', 'right', 'left', 'left'],
    rows: limitRows(rows, ROW_LIMIT, 6),
    notes: [...s.notes, s.caution],
  };
}

export const loadingChecksStudy: ExtraStudy = {
  id: 'loading-checks',
  title: 'Loading checks',
  run(sheet) {
    const out = loadingStudy(sheet);
    if (!out.ok) throw new Error(`the base case could not be solved: ${out.error.message}`);
    const s = out.study;
    const tables = [summaryTable(s), conductorTable(s), breakerTable(s), dropTable(s, sheet), bondTable(s)];
    if (s.bonds.length === 0) tables[tables.length - 1] = { title: 'Notes on the loading checks', columns: [], rows: [], notes: [...s.notes, s.caution] };
    return tables;
  },
};
