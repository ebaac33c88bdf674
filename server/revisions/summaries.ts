// Figures read off stored study results: a case in a few numbers, and every base-case voltage keyed for comparison.
import type { CaseSummary } from '../../shared/revisions';
import type { SolveResult } from '../../solver';
import type { CaseOutcome } from './study';

export function caseSummary(c: CaseOutcome): CaseSummary {
  if (!c.ok || !c.result) return { whatIfId: c.whatIfId, name: c.name, ok: false, error: c.error?.message ?? 'not solved' };
  const r = c.result;
  let hi: CaseSummary['highestLoad'];
  let lo: CaseSummary['lowestLoad'];
  for (const load of r.loads) {
    if (load.state === 'de-energised') continue;
    for (const e of load.elements) {
      if (!hi || e.percentOfRating > hi.percentOfRating) hi = { name: `${load.name} ${e.label}`.trim(), percentOfRating: e.percentOfRating, volts: e.volts };
      if (!lo || e.percentOfRating < lo.percentOfRating) lo = { name: `${load.name} ${e.label}`.trim(), percentOfRating: e.percentOfRating, volts: e.volts };
    }
  }
  return {
    whatIfId: c.whatIfId,
    name: c.name,
    ok: true,
    highestLoad: hi,
    lowestLoad: lo,
    sourceKw: r.powerBalance.sourceKw,
    ...(r.fault ? { faultKa: r.fault.symmetricalKa } : {}),
  };
}

export interface KeyedVolts {
  key: string;
  elementId: string;
  name: string;
  label: string;
  volts: number;
}

/** Every voltage of a solve that a reader would look at: each bus's line-to-neutral, line-to-line and N–G, each load's. */
export function keyedVolts(r: SolveResult): Map<string, KeyedVolts> {
  const out = new Map<string, KeyedVolts>();
  const put = (elementId: string, name: string, label: string, volts: number | null | undefined) => {
    if (typeof volts !== 'number' || !Number.isFinite(volts)) return;
    out.set(`${elementId}|${label}`, { key: `${elementId}|${label}`, elementId, name, label, volts });
  };
  for (const b of r.buses) {
    if (b.state === 'de-energised') continue;
    for (const [p, v] of Object.entries(b.lineToNeutralVolts)) put(b.busId, b.name, `${p}–N`, v);
    for (const [pair, v] of Object.entries(b.lineToLineVolts)) put(b.busId, b.name, `${pair[0]}–${pair[1]}`, v);
    put(b.busId, b.name, 'N–G', b.neutralToGroundVolts);
  }
  for (const l of r.loads) {
    if (l.state === 'de-energised') continue;
    for (const e of l.elements) put(l.loadId, l.name, `load ${e.label}`, e.volts);
  }
  return out;
}
