// The loading and voltage-drop study over one solve: conductors against ampacity, breakers against rating, voltage
// drop per run and from the start of each zone, misplaced neutral-to-ground bonds. NEC rules; IEC later.
import type { Sheet } from '../../shared/sheet';
import { CAUTION } from '../results/derive';
import type { SolveResult } from '../results/types';
import { solveSheet } from '../solve/solve-sheet';
import type { SolveFailure } from '../solve/solve-network';
import { bondFindings } from './bonds';
import { breakerLoading } from './breaker-loading';
import { conductorLoadings } from './conductor-loading';
import { DEFAULT_NON_LINEAR_KINDS, DEFAULT_NON_LINEAR_MAJORITY, feedTree, nonLinearShares } from '../solve/feed-tree';
import type { BreakerLoading, ConductorLoading, LoadingStudy, LoadingStudyOptions, VoltageDropEntry } from './types';
import { voltageDrops } from './voltage-drop';

export const LOADING_STUDY_NOTES = [
  'Ampacity: NEC Table 310.16 (not more than three current-carrying conductors in raceway, cable or earth, 30 °C) with the 310.15(B) ambient correction (its equation, which reproduces Table 310.15(B)(1)) and the 310.15(C)(1) adjustment; each parallel set is taken to be in its own raceway; the neutral is counted per 310.15(E); termination temperature limits (110.14(C)) are not applied. Table values from memory.',
  'Protection: the breaker upstream of a run may be at most the conductor’s ampacity, or the next standard rating above it up to 800 A (NEC 240.4(B), standard ratings of 240.6(A)), and at most 15/20/30 A on 14/12/10 AWG copper (240.4(D)); from memory.',
  'IEC users get the same conductor check from a table of their own (IEC 60364-5-52) in a later release; IEC runs are listed as not rated for now.',
  'Breakers: the largest pole current against the rating; above 80 % is flagged for continuous loads (common practice: a standard breaker carries at most 80 % of its rating continuously).',
  'Voltage drop: each run’s largest phase-to-neutral (or line-to-line) drop in percent of nominal, and the sum over the runs from the source or transformer that starts its zone; 3 % on a feeder or branch circuit and 5 % in total are the guidance of the informational notes to NEC 210.19(A) and 215.2(A), not requirements.',
  'Bonds: a neutral-to-ground bond belongs at the service and at each separately derived system only; elsewhere its current is neutral current carried on the equipment ground.',
];

type Outcome = { ok: true; study: LoadingStudy } | { ok: false; error: SolveFailure };

const worstConductorFirst = (a: ConductorLoading, b: ConductorLoading) => (b.percentOfAmpacity ?? -1) - (a.percentOfAmpacity ?? -1);
const worstBreakerFirst = (a: BreakerLoading, b: BreakerLoading) => (b.percentOfRating ?? -1) - (a.percentOfRating ?? -1);
const worstDropFirst = (a: VoltageDropEntry, b: VoltageDropEntry) => (b.cumulativePercent ?? -1) - (a.cumulativePercent ?? -1);

/** The study from a result already solved for the sheet (and what-if). */
export function loadingStudyOf(sheet: Sheet, result: SolveResult, options: Omit<LoadingStudyOptions, 'whatIfId' | 'result'> = {}): LoadingStudy {
  const tree = feedTree(sheet);
  const majority = options.nonLinearMajorityFraction ?? DEFAULT_NON_LINEAR_MAJORITY;
  const shares = nonLinearShares(sheet, tree, new Map(result.loads.map((l) => [l.loadId, l.kw])), options.nonLinearLoadKinds ?? DEFAULT_NON_LINEAR_KINDS);
  const conductors: ConductorLoading[] = [];
  for (const r of result.runs) {
    const run = sheet.elements[r.runId];
    if (run?.kind !== 'run') continue;
    conductors.push(...conductorLoadings(sheet, tree, run, r, { nonLinearFraction: shares.get(r.runId) ?? 0 }, majority));
  }
  const continuous = options.continuousLoadPercent ?? 80;
  const breakers = result.breakers.flatMap((b) => {
    const e = sheet.elements[b.breakerId];
    return e?.kind === 'breaker' ? [breakerLoading(e, b, continuous)] : [];
  });
  const runLimit = options.runDropLimitPercent ?? 3;
  const totalLimit = options.totalDropLimitPercent ?? 5;
  const voltageDrop = voltageDrops(sheet, tree, result.runs, runLimit, totalLimit);
  const bonds = bondFindings(sheet, tree, result.bonds, result.runs);
  conductors.sort(worstConductorFirst);
  breakers.sort(worstBreakerFirst);
  voltageDrop.sort(worstDropFirst);
  bonds.sort((a, b) => Number(a.permitted) - Number(b.permitted) || b.bondAmperes - a.bondAmperes);
  return {
    ...(result.whatIf ? { whatIf: result.whatIf } : {}),
    conductors,
    breakers,
    voltageDrop,
    bonds,
    summary: {
      conductorsOver: conductors.filter((c) => c.status === 'over').length,
      conductorsHigh: conductors.filter((c) => c.status === 'high').length,
      runsUnprotected: new Set(conductors.filter((c) => c.protection?.exceeded || c.smallConductor?.exceeded).map((c) => c.runId)).size,
      breakersOver: breakers.filter((b) => b.status === 'over').length,
      breakersAboveContinuous: breakers.filter((b) => b.status === 'above-continuous').length,
      runsOverDrop: voltageDrop.filter((d) => d.dropPercent !== undefined && d.dropPercent > runLimit).length,
      pathsOverTotalDrop: voltageDrop.filter((d) => d.status === 'over-total').length,
      bondsFlagged: bonds.filter((b) => b.status === 'flagged').length,
    },
    notes: [...LOADING_STUDY_NOTES],
    caution: CAUTION,
  };
}

/** Solves the sheet (or uses options.result) and studies its loading, voltage drop and bonds. */
export function loadingStudy(sheet: Sheet, options: LoadingStudyOptions = {}): Outcome {
  const { whatIfId, result, ...rest } = options;
  let solved = result;
  if (!solved) {
    const outcome = solveSheet(sheet, whatIfId ? { whatIfId } : {});
    if (!outcome.ok) return outcome;
    solved = outcome.result;
  }
  if (solved.fault) {
    return { ok: false, error: { code: 'not-supported', message: `a loading study needs a load-flow result; ${whatIfId ? `what-if ${whatIfId}` : 'the result given'} is a shunt fault`, elementIds: [solved.fault.busId] } };
  }
  try {
    return { ok: true, study: loadingStudyOf(sheet, solved, rest) };
  } catch (error) {
    return { ok: false, error: { code: 'internal', message: `the loading study failed unexpectedly: ${(error as Error).message}`, elementIds: [] } };
  }
}
