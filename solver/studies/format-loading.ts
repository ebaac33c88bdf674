// Plain-text tables of a loading study for the command line: conductors, breakers, voltage drop, bonds, then notes.
import { table } from '../results/format-table';
import type { LoadingStudy } from './types';

const num = (v: number | undefined, digits = 1) => (v === undefined ? '' : v.toFixed(digits));

export function formatLoadingStudy(study: LoadingStudy): string {
  const out: string[] = [`Loading and voltage drop${study.whatIf ? ` — what-if ${study.whatIf.name || study.whatIf.id}` : ''}`, ''];
  out.push(
    'Conductors (NEC 310.16, worst first)',
    table(
      ['run', 'cond', 'size', 'amperes', 'ampacity', '%', 'status', 'rule'],
      study.conductors.map((c) => [c.runName || c.runId, c.conductor, c.size ?? '', num(c.amperes), num(c.ampacityAmperes), num(c.percentOfAmpacity), c.status, c.rule?.text ?? c.note ?? '']),
      [false, false, false, true, true, true, false, false],
    ),
    '',
    'Breakers',
    table(
      ['breaker', 'amperes', 'rating', '%', 'status'],
      study.breakers.map((b) => [b.name || b.breakerId, num(b.amperes), num(b.ratingAmperes, 0), num(b.percentOfRating), b.status]),
      [false, true, true, true, false],
    ),
    '',
    'Voltage drop (3 % per run, 5 % in total)',
    table(
      ['run', 'role', 'drop %', 'total %', 'status', 'from'],
      study.voltageDrop.map((d) => [d.name || d.runId, d.role, num(d.dropPercent, 2), num(d.cumulativePercent, 2), d.status, [d.originId, ...d.path].filter(Boolean).join(' > ')]),
      [false, false, true, true, false, false],
    ),
    '',
  );
  if (study.bonds.length) out.push('Neutral-to-ground bonds', ...study.bonds.map((b) => `  ${b.status === 'flagged' ? '! ' : ''}${b.message} (${b.bondAmperes.toFixed(2)} A)`), '');
  out.push('Notes', ...study.notes.map((n) => `  ${n}`), '', study.caution);
  return out.join('\n');
}
