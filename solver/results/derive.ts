// Turns a solution into the results of the solve: every bus, load, run, breaker, source, transformer, electrode
// and bond, the checks (KCL residual, power balance), warnings for hazards, and the assumptions made.
import type { Sheet } from '../../shared/sheet';
import type { Solution } from '../solve/solve-network';
import type { Modifications } from '../network/modifications';
import { elementCurrents } from './currents';
import { tieFlows } from './tie-flows';
import { indexSolution, type ResultContext } from './context';
import { busResult } from './bus-results';
import { loadResult } from './load-results';
import { runResult } from './run-results';
import { feedTree, nonLinearShares } from '../solve/feed-tree';
import { bondResults, breakerResult, electrodeResult, sourceResult, transformerResult } from './equipment-results';
import { kclResidual, powerBalance } from './balance';
import { standardLabel } from './standing';
import type { ResultWarning, RunResult, SolveResult } from './types';

export const CAUTION =
  'Results are an engineering estimate from the data entered; they do not replace measurement, the local electrical code, ' +
  "the utility's requirements or a licensed professional's judgement. Never work on energised equipment without the " +
  'protection that the applicable safety standard requires.';

const GENERAL_ASSUMPTIONS = [
  'Remote earth is the zero-volt reference; electrodes and grounding resistors are resistances to it.',
  'Loads are stamped at rated voltage; constant-current and constant-power shares are iterated to convergence.',
  'Runs have no shunt capacitance; transformers have no magnetising branch beyond the exciting current given.',
];

export interface DeriveInput {
  sheet: Sheet;
  solution: Solution;
  mods: Modifications;
  openNeutral: boolean;
  warnings: ResultWarning[];
  /** Currents drawn out of pins by something that is not a stamp (a shunt fault): pin, amperes drawn. */
  extraInjections?: { pin: number; re: number; im: number }[];
}

export function deriveResults({ sheet, solution, mods, openNeutral, warnings, extraInjections = [] }: DeriveInput): SolveResult {
  const currents = elementCurrents(solution.network, solution.volts, solution.corrections);
  let extraRe = 0;
  let extraIm = 0;
  for (const { pin, re, im } of extraInjections) {
    currents.injRe[pin] += re;
    currents.injIm[pin] += im;
    currents.injAbs[pin] += Math.hypot(re, im);
    // Power absorbed by the extra path, Σ V conj(I), for the balance.
    extraRe += solution.volts.re[pin] * re + solution.volts.im[pin] * im;
    extraIm += solution.volts.im[pin] * re - solution.volts.re[pin] * im;
  }
  const flows = tieFlows(solution.network, solution.classes, currents);
  const ctx: ResultContext = { sheet, solution, currents, flows, openNeutral, extraAbsorbedVa: { re: extraRe, im: extraIm }, ...indexSolution(solution) };
  const elements = Object.values(sheet.elements);
  const buses = elements.flatMap((e) => (e.kind === 'bus' ? [busResult(ctx, e)] : []));
  const loads = elements.flatMap((e) => (e.kind === 'load' ? [loadResult(ctx, e)] : []));
  // NEC 310.15(E)(3) counts a 4-wire wye neutral when most of the load downstream is non-linear.
  const shares = nonLinearShares(sheet, feedTree(sheet), new Map(loads.map((l) => [l.loadId, l.kw])));
  const runs = elements.flatMap((e) => (e.kind === 'run' ? [runResult(ctx, e, shares.get(e.id) ?? 0)].filter((r): r is RunResult => r !== undefined) : []));
  const breakers = elements.flatMap((e) => (e.kind === 'breaker' ? [breakerResult(ctx, e, mods.openPoles)] : []));
  const sources = elements.flatMap((e) => (e.kind === 'source' ? [sourceResult(ctx, e)] : []));
  const transformers = elements.flatMap((e) => (e.kind === 'transformer' ? [transformerResult(ctx, e)] : []));
  const electrodes = elements.flatMap((e) => (e.kind === 'electrode' ? [electrodeResult(ctx, e)] : []));
  const bonds = bondResults(ctx);

  const out: ResultWarning[] = [...warnings, ...solution.network.warnings];
  if (sources.length === 0) out.push({ message: 'the sheet has no source: everything is de-energised' });
  for (const bus of buses) {
    if (bus.state === 'back-fed' || Object.values(bus.conductors).some((k) => k?.state === 'back-fed')) {
      const which = Object.entries(bus.conductors).filter(([, k]) => k?.state === 'back-fed').map(([c]) => c);
      out.push({ elementId: bus.busId, message: `hazard: ${bus.name || bus.busId} is back-fed (${which.join(', ')} live only through loads)` });
    }
    if (bus.ungrounded && bus.state !== 'de-energised') {
      out.push({ elementId: bus.busId, message: `${bus.name || bus.busId} has no path to earth: phase-to-ground voltages are not defined (ungrounded)` });
    }
  }
  for (const bond of bonds) {
    if (!bond.permitted) {
      out.push({
        elementId: bond.busId,
        message: `a neutral-to-ground bond at ${bond.busId} is not at the service or a separately derived system: it puts ${bond.amperes.toFixed(1)} A of neutral current on the ground path`,
      });
    }
  }
  const balance = powerBalance(ctx, sources);
  return {
    sheetName: sheet.name,
    ...(mods.whatIfId ? { whatIf: { id: mods.whatIfId, name: sheet.whatIfs[mods.whatIfId]?.name ?? '' } } : {}),
    standard: { id: sheet.settings.voltageStandard, label: standardLabel(sheet.settings) },
    frequencyHz: sheet.settings.frequencyHz,
    convergence: { iterations: solution.iterations, mismatch: solution.mismatch, tolerance: sheet.settings.loadMismatchTolerance, method: solution.iterationMethod },
    kclResidual: kclResidual(ctx),
    powerBalance: balance,
    linearSolve: { ...solution.linear },
    openNeutral,
    buses,
    loads,
    runs,
    breakers,
    sources,
    transformers,
    electrodes,
    bonds,
    warnings: out,
    assumptions: [...GENERAL_ASSUMPTIONS, ...solution.network.assumptions],
    caution: CAUTION,
  };
}
