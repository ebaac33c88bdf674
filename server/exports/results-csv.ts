// The results of the base case and every what-if as CSV: one row per value a reader checks (bus voltages, load
// voltages, conductor currents, breaker loading), one column per case, so a spreadsheet lines them up. The further
// studies (loading checks, break sweep, voltage profile) follow, each table as its own block under a blank line.
import type { SolveResult } from '../../solver';
import type { StudyResults } from '../revisions/study';

interface Row {
  key: string;
  element: string;
  kind: string;
  quantity: string;
  unit: string;
}

const fmt = (v: number) => (Number.isFinite(v) ? String(Math.round(v * 1000) / 1000) : '');

/** One CSV field (RFC 4180 quoting); text that a spreadsheet would run as a formula gets a leading apostrophe. */
export function csvField(v: string): string {
  const safe = /^[=+@\t\r]/.test(v) || (v.startsWith('-') && !/^-\d+(\.\d+)?$/.test(v)) ? `'${v}` : v;
  return /[",\n\r]/.test(safe) || /^\s|\s$/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/** Every reported value of one solve, keyed so the same value of another case lands in the same row. */
export function resultValues(r: SolveResult): Map<string, Row & { value: number }> {
  const out = new Map<string, Row & { value: number }>();
  const put = (key: string, element: string, kind: string, quantity: string, unit: string, value: number | null | undefined) => {
    if (typeof value === 'number' && Number.isFinite(value)) out.set(key, { key, element, kind, quantity, unit, value });
  };
  for (const b of r.buses) {
    for (const [p, v] of Object.entries(b.lineToNeutralVolts)) put(`bus|${b.busId}|${p}N`, b.name, 'bus', `${p}-N`, 'V', v);
    for (const [pair, v] of Object.entries(b.lineToLineVolts)) put(`bus|${b.busId}|${pair}`, b.name, 'bus', `${pair[0]}-${pair[1]}`, 'V', v);
    put(`bus|${b.busId}|NG`, b.name, 'bus', 'N-G', 'V', b.neutralToGroundVolts);
    put(`bus|${b.busId}|unbalance`, b.name, 'bus', 'voltage unbalance (NEMA)', '%', b.unbalance?.nemaPercent);
  }
  for (const l of r.loads) {
    for (const e of l.elements) {
      put(`load|${l.loadId}|${e.label}|V`, l.name, 'load', `${e.label} voltage`, 'V', e.volts);
      put(`load|${l.loadId}|${e.label}|pct`, l.name, 'load', `${e.label} percent of rating`, '%', e.percentOfRating);
      put(`load|${l.loadId}|${e.label}|A`, l.name, 'load', `${e.label} current`, 'A', e.amperes);
    }
    put(`load|${l.loadId}|kW`, l.name, 'load', 'power', 'kW', l.kw);
  }
  for (const run of r.runs) {
    for (const [c, k] of Object.entries(run.conductors)) {
      if (!k) continue;
      put(`run|${run.runId}|${c}|A`, run.name, 'run', `${c} current`, 'A', k.current.magnitude);
      put(`run|${run.runId}|${c}|pct`, run.name, 'run', `${c} percent of ampacity`, '%', k.percentOfAmpacity);
    }
    put(`run|${run.runId}|drop`, run.name, 'run', 'voltage drop', '%', run.voltageDropPercent);
  }
  for (const br of r.breakers) {
    for (const [p, pole] of Object.entries(br.poles)) put(`breaker|${br.breakerId}|${p}`, br.name, 'breaker', `pole ${p} current`, 'A', pole?.amperes);
    put(`breaker|${br.breakerId}|pct`, br.name, 'breaker', 'percent of rating', '%', br.percentOfRating);
  }
  for (const t of r.transformers) put(`transformer|${t.transformerId}|pct`, t.name, 'transformer', 'percent of rating', '%', t.percentOfRating);
  if (r.fault) put('fault|ka', r.fault.busId, 'fault', 'symmetrical fault current', 'kA', r.fault.symmetricalKa);
  return out;
}

export function resultsCsv(results: StudyResults): string {
  const cases = [results.base, ...results.whatIfs];
  const values = cases.map((c) => (c.ok && c.result ? resultValues(c.result) : new Map<string, Row & { value: number }>()));
  const rows = new Map<string, Row>();
  for (const v of values) for (const [k, row] of v) if (!rows.has(k)) rows.set(k, row);
  const header = ['element', 'kind', 'quantity', 'unit', ...cases.map((c) => c.name)];
  const lines = [header.map(csvField).join(',')];
  for (const [key, row] of rows) {
    lines.push([row.element, row.kind, row.quantity, row.unit, ...values.map((v) => (v.has(key) ? fmt(v.get(key)!.value) : ''))].map(csvField).join(','));
  }
  const failed = cases.filter((c) => !c.ok);
  for (const c of failed) lines.push(['(case not solved)', '', c.name, '', c.error?.message ?? ''].map(csvField).join(','));
  lines.push(...studyBlocks(results));
  return lines.join('\r\n') + '\r\n';
}

/** Each further study's tables: a blank line, a line naming the study and table, the column titles, the rows. */
function studyBlocks(results: StudyResults): string[] {
  const out: string[] = [];
  for (const study of results.extra ?? []) {
    if (!study.ok) {
      out.push('', [`study: ${study.title}`, `not run: ${study.error ?? ''}`].map(csvField).join(','));
      continue;
    }
    for (const t of study.tables) {
      if (t.columns.length === 0) continue;
      out.push('', [`study: ${study.title}`, t.title].map(csvField).join(','), t.columns.map(csvField).join(','));
      for (const row of t.rows) out.push(row.map((c) => csvField(c === null ? '' : String(c))).join(','));
    }
  }
  return out;
}
