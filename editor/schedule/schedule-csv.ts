// Reads a panel schedule from CSV (papaparse) and checks every row (zod) against the panel it goes into: either
// every circuit, ready to place, or every problem with its line number and column. Nothing is placed while any
// row is bad. Pure: no document, no React.
//
// Our columns (a header row is required; names are matched without regard to case, spaces, "_" or "-"):
//   circuit       required  the panel's circuit number(s), as on the panel: "7", "2,4"
//   description   required  what the circuit feeds
//   phases        required  A, B or C (line-to-neutral; "AN" too), AB, BC or CA (line-to-line),
//                           ABC (three-phase delta) or ABCN (three-phase wye); "-", "–", "/", "," and spaces are ignored
//   load          required  a number with an optional unit: kW (the default), W, kVA, VA or A
//   power factor  optional  above 0 and at most 1 (also "pf"; a percent such as "95 %" is read as 0.95); default 1
//   behaviour     optional  impedance, current, power, or "by kind" (empty): how the load behaves with voltage
//   kind          optional  lighting, receptacles (default), motor, electronics or heating
//   breaker       optional  the circuit breaker's rating in amperes ("20" or "20 A"); a breaker is drawn when given
//   volts         optional  the load's rated voltage; default the panel's nominal line-to-neutral or line-to-line
import Papa from 'papaparse';
import { z } from 'zod';
import { LOAD_KINDS, type LoadConnection, type LoadKind, type PhaseId } from '../../shared/sheet';

export const MAX_CSV_BYTES = 1_000_000;
export const MAX_CSV_ROWS = 500;

export const CSV_COLUMNS = ['circuit', 'description', 'phases', 'load', 'power factor', 'behaviour', 'kind', 'breaker', 'volts'] as const;
export type CsvColumn = (typeof CSV_COLUMNS)[number];
export const REQUIRED_COLUMNS: readonly CsvColumn[] = ['circuit', 'description', 'phases', 'load'];
const ALIASES: Record<string, CsvColumn> = { pf: 'power factor', powerfactor: 'power factor', behavior: 'behaviour', loadkind: 'kind', ratedvolts: 'volts', voltage: 'volts' };

export interface ImportedCircuit {
  line: number;
  circuit: string;
  description: string;
  /** The panel's phases, in the load's own order. */
  phases: PhaseId[];
  connection: LoadConnection;
  givenAs: 'kw' | 'amperes';
  kw: number;
  amperes: number;
  powerFactor: number;
  behaviour: 'by-kind' | 'impedance' | 'current' | 'power';
  loadKind: LoadKind;
  breakerAmperes?: number;
  ratedVolts: number;
}

export interface RowProblem {
  line: number;
  column?: CsvColumn;
  message: string;
}

export interface PreviewRow {
  line: number;
  /** The row's cells under our column names, as written. */
  cells: Partial<Record<CsvColumn, string>>;
  circuit: ImportedCircuit | null;
  problems: RowProblem[];
}

export interface PanelTarget {
  /** The panel's phase bars. */
  phases: readonly PhaseId[];
  hasNeutral: boolean;
  /** Nominal voltages, when known from a solve; rows without a volts column need them. */
  lineToNeutralVolts?: number;
  lineToLineVolts?: number;
  /** Circuits the panel already has (a clash is a problem). */
  existingCircuits?: ReadonlyMap<string, string>;
}

export type CsvReadResult =
  | { ok: true; rows: PreviewRow[]; circuits: ImportedCircuit[]; ignoredColumns: string[] }
  | { ok: false; fileProblems: string[]; rows: PreviewRow[]; problems: RowProblem[]; ignoredColumns: string[] };

const normalHeader = (h: string) => h.replace(/^\uFEFF/, '').trim().toLowerCase().replace(/[\s_-]+/g, '');
const COLUMN_BY_KEY = new Map<string, CsvColumn>([...CSV_COLUMNS.map((c) => [normalHeader(c), c] as const), ...Object.entries(ALIASES)]);

// ---------------------------------------------------------------------------------------------------------------
// Cell readers (zod): each turns the text of a cell into a value or an issue with a plain message.

const PHASE_SETS: Record<string, { phases: PhaseId[]; connection: LoadConnection }> = {
  A: { phases: ['A'], connection: 'line-to-neutral' },
  B: { phases: ['B'], connection: 'line-to-neutral' },
  C: { phases: ['C'], connection: 'line-to-neutral' },
  AN: { phases: ['A'], connection: 'line-to-neutral' },
  BN: { phases: ['B'], connection: 'line-to-neutral' },
  CN: { phases: ['C'], connection: 'line-to-neutral' },
  AB: { phases: ['A', 'B'], connection: 'line-to-line' },
  BC: { phases: ['B', 'C'], connection: 'line-to-line' },
  CA: { phases: ['C', 'A'], connection: 'line-to-line' },
  BA: { phases: ['A', 'B'], connection: 'line-to-line' },
  CB: { phases: ['B', 'C'], connection: 'line-to-line' },
  AC: { phases: ['C', 'A'], connection: 'line-to-line' },
  ABC: { phases: ['A', 'B', 'C'], connection: 'three-phase-delta' },
  ABCN: { phases: ['A', 'B', 'C'], connection: 'three-phase-wye' },
};

const text = (what: string, max: number) =>
  z.string().trim().min(1, `${what} is empty`).max(max, `${what} must be at most ${max} characters`);

const phasesCell = z.string().transform((raw, ctx) => {
  const key = raw.toUpperCase().replace(/[\s,/\-–]+/g, '');
  const set = PHASE_SETS[key];
  if (!set) {
    ctx.addIssue({ code: 'custom', message: `unknown phases "${raw.trim()}" (use A, B, C, AB, BC, CA, ABC or ABCN)` });
    return z.NEVER;
  }
  return set;
});

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;
function readNumber(raw: string): number | null {
  const t = raw.trim().replace(/,/g, '.');
  return NUMBER.test(t) ? Number(t) : null;
}

const loadCell = z.string().transform((raw, ctx) => {
  const m = /^\s*([^a-zA-Z%]+?)\s*(kw|w|kva|va|a)?\s*$/i.exec(raw);
  const value = m ? readNumber(m[1]) : null;
  if (!m || value === null || !Number.isFinite(value)) {
    ctx.addIssue({ code: 'custom', message: `"${raw.trim()}" is not a load (a number with kW, W, kVA, VA or A)` });
    return z.NEVER;
  }
  if (value < 0) {
    ctx.addIssue({ code: 'custom', message: 'a load must not be negative' });
    return z.NEVER;
  }
  return { value, unit: (m[2] ?? 'kw').toLowerCase() as 'kw' | 'w' | 'kva' | 'va' | 'a' };
});

const powerFactorCell = z.string().transform((raw, ctx) => {
  if (raw.trim() === '') return 1;
  const percent = /%\s*$/.test(raw);
  const n = readNumber(raw.replace(/%\s*$/, ''));
  const pf = n === null ? null : percent ? n / 100 : n;
  if (pf === null || !(pf > 0 && pf <= 1)) {
    ctx.addIssue({ code: 'custom', message: `power factor "${raw.trim()}" must be a number above 0 and at most 1` });
    return z.NEVER;
  }
  return pf;
});

const BEHAVIOUR_WORDS: Record<string, ImportedCircuit['behaviour']> = {
  '': 'by-kind',
  bykind: 'by-kind',
  kind: 'by-kind',
  impedance: 'impedance',
  constantimpedance: 'impedance',
  z: 'impedance',
  current: 'current',
  constantcurrent: 'current',
  i: 'current',
  power: 'power',
  constantpower: 'power',
  p: 'power',
};
const behaviourCell = z.string().transform((raw, ctx) => {
  const b = BEHAVIOUR_WORDS[raw.trim().toLowerCase().replace(/[\s_-]+/g, '')];
  if (!b) {
    ctx.addIssue({ code: 'custom', message: `unknown behaviour "${raw.trim()}" (use impedance, current, power or by kind)` });
    return z.NEVER;
  }
  return b;
});

const kindCell = z.string().transform((raw, ctx) => {
  const k = raw.trim().toLowerCase();
  if (k === '') return 'receptacles' as LoadKind;
  if (!(LOAD_KINDS as readonly string[]).includes(k)) {
    ctx.addIssue({ code: 'custom', message: `unknown kind "${raw.trim()}" (use ${LOAD_KINDS.join(', ')})` });
    return z.NEVER;
  }
  return k as LoadKind;
});

const optionalPositive = (what: string, unit: RegExp) =>
  z.string().transform((raw, ctx) => {
    if (raw.trim() === '') return undefined;
    const n = readNumber(raw.replace(unit, ''));
    if (n === null || !(n > 0) || !Number.isFinite(n)) {
      ctx.addIssue({ code: 'custom', message: `${what} "${raw.trim()}" must be a number above zero` });
      return z.NEVER;
    }
    return n;
  });

const rowSchema = z.object({
  circuit: text('circuit', 20),
  description: text('description', 200),
  phases: phasesCell,
  load: loadCell,
  'power factor': powerFactorCell,
  behaviour: behaviourCell,
  kind: kindCell,
  breaker: optionalPositive('breaker rating', /\s*a\s*$/i),
  volts: optionalPositive('volts', /\s*v\s*$/i),
});

// ---------------------------------------------------------------------------------------------------------------

function checkRow(line: number, cells: Partial<Record<CsvColumn, string>>, panel: PanelTarget): { circuit: ImportedCircuit | null; problems: RowProblem[] } {
  const filled = Object.fromEntries(CSV_COLUMNS.map((c) => [c, cells[c] ?? ''])) as Record<CsvColumn, string>;
  const parsed = rowSchema.safeParse(filled);
  if (!parsed.success) {
    return { circuit: null, problems: parsed.error.issues.map((i) => ({ line, column: i.path[0] as CsvColumn, message: i.message })) };
  }
  const r = parsed.data;
  const problems: RowProblem[] = [];
  const missing = r.phases.phases.filter((p) => !panel.phases.includes(p));
  if (missing.length) problems.push({ line, column: 'phases', message: `the panel has no phase ${missing.join(', ')}` });
  const needsNeutral = r.phases.connection === 'line-to-neutral' || r.phases.connection === 'three-phase-wye';
  if (needsNeutral && !panel.hasNeutral) problems.push({ line, column: 'phases', message: 'the panel has no neutral bar for a line-to-neutral load' });
  const lineToLine = r.phases.connection !== 'line-to-neutral';
  const ratedVolts = r.volts ?? (lineToLine ? panel.lineToLineVolts : panel.lineToNeutralVolts);
  if (ratedVolts === undefined) problems.push({ line, column: 'volts', message: 'volts is needed: the panel’s voltage is not known until the sheet solves' });
  if (problems.length) return { circuit: null, problems };
  const pf = r['power factor'];
  const unit = r.load.unit;
  const givenAs = unit === 'a' ? 'amperes' : 'kw';
  const kw = unit === 'kw' ? r.load.value : unit === 'w' ? r.load.value / 1000 : unit === 'kva' ? r.load.value * pf : unit === 'va' ? (r.load.value * pf) / 1000 : 0;
  return {
    circuit: {
      line,
      circuit: r.circuit,
      description: r.description,
      phases: r.phases.phases,
      connection: r.phases.connection,
      givenAs,
      kw,
      amperes: givenAs === 'amperes' ? r.load.value : 0,
      powerFactor: pf,
      behaviour: r.behaviour,
      loadKind: r.kind,
      ...(r.breaker !== undefined ? { breakerAmperes: r.breaker } : {}),
      ratedVolts: ratedVolts!,
    },
    problems: [],
  };
}

/** Size in bytes of the text as UTF-8 (what a file on disk would be). */
function byteLength(s: string): number {
  let n = 0;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    if (c < 0x80) n += 1;
    else if (c < 0x800) n += 2;
    else if (c >= 0xd800 && c <= 0xdbff) {
      n += 4;
      i++;
    } else n += 3;
  }
  return n;
}

const fail = (fileProblems: string[], rows: PreviewRow[] = [], ignoredColumns: string[] = []): CsvReadResult => ({
  ok: false,
  fileProblems,
  rows,
  problems: rows.flatMap((r) => r.problems),
  ignoredColumns,
});

export function readScheduleCsv(csv: string, panel: PanelTarget): CsvReadResult {
  const bytes = byteLength(csv);
  if (bytes > MAX_CSV_BYTES) {
    return fail([`the file is too large: ${(bytes / 1e6).toFixed(1)} MB, at most ${MAX_CSV_BYTES / 1e6} MB (a panel schedule is a few kilobytes)`]);
  }
  const body = csv.replace(/^\uFEFF/, '').replace(/\r\n?/g, '\n');
  if (body.trim() === '') return fail(['the file is empty: it needs a header row and at least one circuit']);

  // Each record with the line it starts on (quoted cells may hold line breaks, so lines are counted, not rows).
  const records: { line: number; data: string[] }[] = [];
  const parseErrors: string[] = [];
  let start = 0;
  let line = 1;
  Papa.parse<string[]>(body, {
    delimitersToGuess: [',', ';', '\t'],
    step: (r) => {
      const end = r.meta.cursor;
      // Blank lines before the record belong to no row.
      let at = start;
      while (at < end && body[at] === '\n') {
        at++;
        line++;
      }
      const recordLine = line;
      for (let i = at; i < end; i++) if (body[i] === '\n') line++;
      start = end;
      for (const e of r.errors) if (e.code !== 'UndetectableDelimiter') parseErrors.push(`line ${recordLine}: ${e.message}`);
      if (r.data.length === 1 && r.data[0].trim() === '') return;
      records.push({ line: recordLine, data: r.data });
    },
  });
  if (parseErrors.length) return fail(parseErrors);
  if (records.length === 0) return fail(['the file is empty: it needs a header row and at least one circuit']);

  const [header, ...dataRows] = records;
  const columns = header.data.map((h) => COLUMN_BY_KEY.get(normalHeader(h)) ?? null);
  const ignoredColumns = header.data.filter((_, i) => columns[i] === null).map((h) => h.trim()).filter(Boolean);
  const fileProblems: string[] = [];
  const missing = REQUIRED_COLUMNS.filter((c) => !columns.includes(c));
  if (missing.length) fileProblems.push(`line ${header.line}: missing column${missing.length > 1 ? 's' : ''} ${missing.join(', ')} (the header row needs ${REQUIRED_COLUMNS.join(', ')})`);
  const twice = CSV_COLUMNS.filter((c) => columns.filter((x) => x === c).length > 1);
  if (twice.length) fileProblems.push(`line ${header.line}: column${twice.length > 1 ? 's' : ''} ${twice.join(', ')} given twice`);
  if (dataRows.length === 0) fileProblems.push('the file has a header row but no circuits');
  if (dataRows.length > MAX_CSV_ROWS) fileProblems.push(`the file has ${dataRows.length} circuits, at most ${MAX_CSV_ROWS}`);
  if (fileProblems.length) return fail(fileProblems, [], ignoredColumns);

  const seen = new Map<string, number>();
  const rows: PreviewRow[] = dataRows.map(({ line: rowLine, data }) => {
    const cells: Partial<Record<CsvColumn, string>> = {};
    columns.forEach((c, i) => {
      if (c && data[i] !== undefined) cells[c] = data[i];
    });
    const problems: RowProblem[] = [];
    if (data.length < header.data.length) {
      const absent = columns.slice(data.length).filter((c): c is CsvColumn => c !== null && REQUIRED_COLUMNS.includes(c));
      if (absent.length) problems.push({ line: rowLine, message: `the row has ${data.length} of ${header.data.length} columns: no ${absent.join(', ')}` });
    } else if (data.length > header.data.length) {
      problems.push({ line: rowLine, message: `the row has ${data.length} columns, the header ${header.data.length}` });
    }
    if (problems.length) return { line: rowLine, cells, circuit: null, problems };
    const checked = checkRow(rowLine, cells, panel);
    const circuitLabel = (cells.circuit ?? '').trim();
    if (circuitLabel) {
      const first = seen.get(circuitLabel);
      if (first !== undefined) checked.problems.push({ line: rowLine, column: 'circuit', message: `circuit ${circuitLabel} is also on line ${first}` });
      else seen.set(circuitLabel, rowLine);
      const taken = panel.existingCircuits?.get(circuitLabel);
      if (taken) checked.problems.push({ line: rowLine, column: 'circuit', message: `circuit ${circuitLabel} is already on the panel (${taken})` });
    }
    return { line: rowLine, cells, circuit: checked.problems.length ? null : checked.circuit, problems: checked.problems };
  });

  const problems = rows.flatMap((r) => r.problems);
  if (problems.length) return { ok: false, fileProblems: [], rows, problems, ignoredColumns };
  return { ok: true, rows, circuits: rows.map((r) => r.circuit!), ignoredColumns };
}
