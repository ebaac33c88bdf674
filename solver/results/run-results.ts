// Each run's conductor currents (neutral and PE included) against their ampacity, its losses and voltage drop.
import type { ConductorId, RunElement } from '../../shared/sheet';
import { ampacity, countCurrentCarrying } from '../conductors';
import { DEFAULT_NON_LINEAR_MAJORITY } from '../solve/feed-tree';
import type { RunLayout } from '../network/types';
import type { ResultContext } from './context';
import { absorbedVa } from './currents';
import { magnitude, minus, phasor, pinVolts } from './phasor';
import type { RunResult } from './types';

const PHASES: ConductorId[] = ['A', 'B', 'C'];

/** NEC 310.15(E): which system the run's neutral belongs to, read from the nominal phase angles. */
function neutralSystem(ctx: ResultContext, layout: RunLayout): 'wye-4-wire' | 'split-phase' | 'delta' {
  const nominal = ctx.solution.network.nominal;
  const phases = layout.conductors.filter((k) => PHASES.includes(k.conductor));
  if (phases.length === 2) {
    const [a, b] = phases.map((k) => nominal[k.fromPin]);
    const cos = (a.re * b.re + a.im * b.im) / (Math.hypot(a.re, a.im) * Math.hypot(b.re, b.im) || 1);
    return cos < -0.9 ? 'split-phase' : 'wye-4-wire';
  }
  const mags = phases.map((k) => magnitude(nominal[k.fromPin]));
  return Math.max(...mags) - Math.min(...mags) > 0.05 * Math.max(...mags) ? 'delta' : 'wye-4-wire';
}

function currentCarrying(ctx: ResultContext, run: RunElement, layout: RunLayout, nonLinearFraction: number): number {
  const phases = layout.conductors.filter((k) => PHASES.includes(k.conductor)).length;
  const hasNeutral = layout.conductors.some((k) => k.conductor === 'N');
  return countCurrentCarrying({
    phases,
    hasNeutral,
    ...(hasNeutral && phases > 0 ? { system: neutralSystem(ctx, layout) } : {}),
    nonLinearMajority: nonLinearFraction > DEFAULT_NON_LINEAR_MAJORITY,
    ...(run.conductorsInRaceway !== undefined ? { given: run.conductorsInRaceway } : {}),
  }).count;
}

/** nonLinearFraction: the non-linear share of the kW downstream of the run (NEC 310.15(E)(3)). */
export function runResult(ctx: ResultContext, run: RunElement, nonLinearFraction = 0): RunResult | undefined {
  const { network, volts } = ctx.solution;
  const stampIndex = (ctx.stampsByElement.get(run.id) ?? []).find((k) => network.stamps[k].kind === 'run');
  const layout = stampIndex === undefined ? undefined : network.runs.find((r) => r.stampIndex === stampIndex);
  if (!layout) return undefined;
  const currents = ctx.currents.perStamp[layout.stampIndex];
  const count = currentCarrying(ctx, run, layout, nonLinearFraction);
  const result: RunResult = { runId: run.id, name: run.name, conductors: {}, lossKw: absorbedVa(network, layout.stampIndex, volts, ctx.currents).re / 1000 };
  if (layout.conductors.some((k) => k.conductor === 'N') && layout.conductors.some((k) => PHASES.includes(k.conductor))) {
    result.neutralSystem = neutralSystem(ctx, layout);
  }
  layout.conductors.forEach((k, i) => {
    const current = phasor(currents[i].re, currents[i].im);
    const entry: RunResult['conductors'][ConductorId] = { current, open: k.open, addedOhms: k.addedOhms };
    const data = run.conductors[k.conductor]!;
    if (data.size !== undefined && run.impedanceFrom !== 'overhead') {
      try {
        const a = ampacity({ size: data.size, material: data.material, insulationTempC: run.insulationTempC, ambientC: run.ambientC, currentCarryingConductors: count });
        entry.ampacityAmperes = a.amperes * run.parallelSets;
        entry.percentOfAmpacity = (100 * current.magnitude) / entry.ampacityAmperes;
      } catch {
        // sizes outside NEC 310.16 have no ampacity to show
      }
    }
    result.conductors[k.conductor] = entry;
  });
  // Drop along the run (in the direction of the supply) of each phase's voltage to the neutral (line-to-line without one), percent of nominal.
  const byId = new Map(layout.conductors.map((k) => [k.conductor, k]));
  const n = byId.get('N');
  const drops: number[] = [];
  const pairs: [ConductorId, ConductorId][] = n
    ? PHASES.filter((p) => byId.has(p)).map((p) => [p, 'N'])
    : ([['A', 'B'], ['B', 'C'], ['C', 'A']] as [ConductorId, ConductorId][]).filter(([p, q]) => byId.has(p) && byId.has(q));
  for (const [p, q] of pairs) {
    const kp = byId.get(p)!;
    const kq = byId.get(q)!;
    if (kp.open || kq.open) continue;
    const nominal = magnitude(minus(network.nominal[kp.fromPin], network.nominal[kq.fromPin]));
    if (!(nominal > 0)) continue;
    const from = magnitude(minus(pinVolts(volts, kp.fromPin), pinVolts(volts, kq.fromPin)));
    const to = magnitude(minus(pinVolts(volts, kp.toPin), pinVolts(volts, kq.toPin)));
    drops.push((100 * (from - to)) / nominal);
  }
  // Power flows into the run at its 'from' end unless the run is drawn against the supply: then the drop is to → from.
  let pFrom = 0;
  layout.conductors.forEach((k, i) => {
    const v = pinVolts(volts, k.fromPin);
    pFrom += v.re * currents[i].re + v.im * currents[i].im;
  });
  if (pFrom < 0) result.fedFrom = 'to';
  if (drops.length) result.voltageDropPercent = pFrom < 0 ? Math.max(...drops.map((d) => -d)) : Math.max(...drops);
  return result;
}
