// Plain-text tables of a solve's results for the command line: bus voltages, load voltages with their standing,
// conductor currents, then the checks, warnings, assumptions and the caution.
import type { BusResult, LoadResult, RunResult, SolveResult, Standing } from './types';

export function table(headers: string[], rows: string[][], rightAlign: boolean[]): string {
  const widths = headers.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? '').length)));
  const line = (cells: string[]) =>
    cells.map((c, i) => (rightAlign[i] ? c.padStart(widths[i]) : c.padEnd(widths[i]))).join('  ').trimEnd();
  return [line(headers), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

const num = (v: number | undefined, digits = 1) => (v === undefined ? '' : v.toFixed(digits));
const MARK: Record<Standing['standing'], string> = { normal: '', tolerable: ' ~', outside: ' !' };
const marked = (v: number | undefined, s: Standing | undefined) => (v === undefined ? '' : `${v.toFixed(1)}${s ? MARK[s.standing] : ''}`);

function busRows(buses: BusResult[]): string[][] {
  return buses.map((b) => [
    b.name || b.busId,
    b.state + (b.ungrounded ? ', ungrounded' : ''),
    marked(b.lineToNeutralVolts.A, b.standing.lineToNeutral.A),
    marked(b.lineToNeutralVolts.B, b.standing.lineToNeutral.B),
    marked(b.lineToNeutralVolts.C, b.standing.lineToNeutral.C),
    marked(b.lineToLineVolts.AB, b.standing.lineToLine.AB),
    marked(b.lineToLineVolts.BC, b.standing.lineToLine.BC),
    marked(b.lineToLineVolts.CA, b.standing.lineToLine.CA),
    b.neutralToGroundVolts === null ? '' : num(b.neutralToGroundVolts, 2),
    b.unbalance ? num(b.unbalance.nemaPercent, 2) : '',
  ]);
}

function loadRows(loads: LoadResult[], openNeutral: boolean): string[][] {
  return loads.flatMap((l) =>
    l.elements.map((e, i) => [
      i === 0 ? l.name || l.loadId : '',
      e.label,
      num(e.volts),
      num(e.percentOfRating),
      ...(openNeutral ? [num(e.constantImpedanceVolts)] : []),
      num(e.kw, 2),
      num(e.amperes),
      e.model + (e.switchedToImpedance ? ' (switched)' : ''),
      e.standing?.standing ?? (l.state === 'de-energised' ? 'de-energised' : ''),
    ]),
  );
}

function runRows(runs: RunResult[]): string[][] {
  const cell = (r: RunResult, c: 'A' | 'B' | 'C' | 'N' | 'PE') => {
    const k = r.conductors[c];
    if (!k) return '';
    if (k.open) return 'open';
    const pct = k.percentOfAmpacity === undefined ? '' : ` (${k.percentOfAmpacity.toFixed(0)}%)`;
    return `${k.current.magnitude.toFixed(1)}${pct}`;
  };
  return runs.map((r) => [r.name || r.runId, cell(r, 'A'), cell(r, 'B'), cell(r, 'C'), cell(r, 'N'), cell(r, 'PE'), num(r.voltageDropPercent, 2)]);
}

export function formatResults(r: SolveResult): string {
  const out: string[] = [];
  out.push(`${r.sheetName || 'Sheet'} — ${r.whatIf ? `what-if "${r.whatIf.name || r.whatIf.id}"` : 'base case'}`);
  out.push(`Standard: ${r.standard.label} (~ outside Range A or the normal band, ! outside both)`);
  const pb = r.powerBalance;
  out.push(
    `Solved in ${r.convergence.iterations} load iteration${r.convergence.iterations === 1 ? '' : 's'} ` +
      `(${r.convergence.method}, mismatch ${r.convergence.mismatch.toExponential(1)}), KCL residual ${r.kclResidual.toExponential(1)}, ` +
      `${r.linearSolve.unknowns} unknowns (${r.linearSolve.method})`,
  );
  out.push(
    `Power: source ${pb.sourceKw.toFixed(2)} kW ${pb.sourceKvar.toFixed(2)} kvar = loads ${pb.loadKw.toFixed(2)} kW + losses ` +
      `${pb.lossKw.toFixed(2)} kW (balance within ${pb.mismatchPercent.toExponential(1)} %)`,
  );
  out.push('', 'Bus voltages (V)');
  out.push(table(['bus', 'state', 'A-N', 'B-N', 'C-N', 'A-B', 'B-C', 'C-A', 'N-G', 'unbal %'], busRows(r.buses), [false, false, true, true, true, true, true, true, true, true]));
  out.push('', 'Load voltages');
  const loadHeaders = ['load', 'element', 'volts', '% rated', ...(r.openNeutral ? ['if const Z'] : []), 'kW', 'A', 'model', 'standing'];
  out.push(table(loadHeaders, loadRows(r.loads, r.openNeutral), loadHeaders.map((h) => !['load', 'element', 'model', 'standing'].includes(h))));
  out.push('', 'Conductor currents (A, % of ampacity)');
  out.push(table(['run', 'A', 'B', 'C', 'N', 'PE', 'drop %'], runRows(r.runs), [false, true, true, true, true, true, true]));
  const breakers = r.breakers.filter((b) => b.percentOfRating !== undefined);
  if (breakers.length) {
    out.push('', 'Breaker loading');
    out.push(
      table(
        ['breaker', 'A', 'B', 'C', '% of rating'],
        breakers.map((b) => [b.name || b.breakerId, ...(['A', 'B', 'C'] as const).map((p) => (b.poles[p] ? (b.poles[p]!.state === 'open' ? 'open' : b.poles[p]!.amperes.toFixed(1)) : '')), num(b.percentOfRating, 0)]),
        [false, true, true, true, true],
      ),
    );
  }
  if (r.warnings.length) out.push('', 'Warnings', ...r.warnings.map((w) => `- ${w.message}`));
  out.push('', 'Assumptions', ...r.assumptions.map((a) => `- ${a}`));
  out.push('', r.caution);
  return out.join('\n');
}
