// Each run conductor's current against its NEC 310.16 ampacity, corrected for ambient (310.15(B)), adjusted for more
// than three current-carrying conductors (310.15(C)(1)) with the neutral counted where 310.15(E) counts it, and the
// protection of 240.4(B) and the small-conductor limit of 240.4(D) against the breaker upstream. The rule applied is stated with each figure.
import { formatSize } from '../../shared/conductor-sizes';
import type { ConductorId, RunElement, Sheet } from '../../shared/sheet';
import { ampacity, countCurrentCarrying, largestProtectionAmperes, smallConductorOvercurrentLimit, type InsulationTempC } from '../conductors';
import type { RunResult } from '../results/types';
import { nearestUpstream, type FeedTree } from '../solve/feed-tree';
import type { ConductorLoading } from './types';

const PHASES: ConductorId[] = ['A', 'B', 'C'];
export const HIGH_LOADING_PERCENT = 80;

export interface CircuitLoadShare {
  /** Share of the kW downstream of the run that is non-linear (0 when nothing is downstream). */
  nonLinearFraction: number;
}

function currentCarryingBasis(run: RunElement, result: RunResult, share: CircuitLoadShare, majority: number) {
  const phases = PHASES.filter((p) => run.conductors[p]).length;
  const hasNeutral = run.conductors.N !== undefined;
  return countCurrentCarrying({
    phases,
    hasNeutral,
    ...(result.neutralSystem ? { system: result.neutralSystem } : {}),
    nonLinearMajority: share.nonLinearFraction > majority,
    ...(run.conductorsInRaceway !== undefined ? { given: run.conductorsInRaceway } : {}),
  });
}

export function conductorLoadings(
  sheet: Sheet,
  tree: FeedTree,
  run: RunElement,
  result: RunResult,
  share: CircuitLoadShare,
  majority: number,
): ConductorLoading[] {
  const out: ConductorLoading[] = [];
  const basis = currentCarryingBasis(run, result, share, majority);
  const breakerId = nearestUpstream(sheet, tree, run.id, 'breaker');
  const breaker = breakerId ? sheet.elements[breakerId] : undefined;
  const breakerRating = breaker?.kind === 'breaker' ? breaker.ratingAmperes : undefined;
  for (const [conductor, entry] of Object.entries(result.conductors) as [ConductorId, NonNullable<RunResult['conductors'][ConductorId]>][]) {
    const data = run.conductors[conductor];
    if (!data) continue;
    const row: ConductorLoading = {
      runId: run.id,
      runName: run.name,
      conductor,
      ...(data.size !== undefined ? { size: data.size } : {}),
      material: data.material,
      parallelSets: run.parallelSets,
      amperes: entry.current.magnitude,
      open: entry.open,
      status: 'not-rated',
    };
    out.push(row);
    if (conductor === 'PE') {
      row.note = 'an equipment grounding conductor is sized by NEC 250.122, not by ampacity';
      continue;
    }
    if (run.impedanceFrom === 'overhead') {
      row.note = 'an overhead conductor in free air is not rated by NEC 310.16';
      continue;
    }
    if (run.impedanceFrom === 'iec-60228') {
      row.note = 'an IEC 60228 size: IEC users get the same check from a table of their own in a later release';
      continue;
    }
    if (data.size === undefined) {
      row.note = 'no AWG or kcmil size on the sheet: no NEC 310.16 ampacity';
      continue;
    }
    try {
      const a = ampacity({ size: data.size, material: data.material, insulationTempC: run.insulationTempC, ambientC: run.ambientC, currentCarryingConductors: basis.count });
      const amperes = a.amperes * run.parallelSets;
      const metal = data.material === 'copper' ? 'Cu' : 'Al';
      const text =
        `NEC 310.16 ${formatSize(data.size)} ${metal} ${run.insulationTempC} °C ${a.tableAmperes} A` +
        ` × ${a.ambientFactor.toFixed(3)} (310.15(B), ${run.ambientC} °C ambient)` +
        ` × ${a.adjustmentFactor} (310.15(C)(1), ${basis.count} current-carrying${basis.reason ? `: ${basis.reason}` : ''})` +
        ` × ${run.parallelSets} set${run.parallelSets > 1 ? 's' : ''} = ${amperes.toFixed(1)} A`;
      row.rule = {
        table: 'NEC 310.16',
        insulationTempC: run.insulationTempC as InsulationTempC,
        tableAmperes: a.tableAmperes,
        ambientC: run.ambientC,
        ambientFactor: a.ambientFactor,
        currentCarrying: basis.count,
        countFrom: basis.countFrom,
        adjustmentFactor: a.adjustmentFactor,
        ...(basis.neutralCounted !== undefined ? { neutralCounted: basis.neutralCounted } : {}),
        text,
      };
      row.ampacityAmperes = amperes;
      row.percentOfAmpacity = (100 * row.amperes) / amperes;
      row.status = row.percentOfAmpacity > 100 ? 'over' : row.percentOfAmpacity >= HIGH_LOADING_PERCENT ? 'high' : 'ok';
      if (breakerId && breakerRating !== undefined && PHASES.includes(conductor)) {
        const largest = largestProtectionAmperes(amperes);
        row.protection = { breakerId, breakerRatingAmperes: breakerRating, largestAllowedAmperes: largest, exceeded: breakerRating > largest + 1e-9 };
        if (row.protection.exceeded) row.note = `240.4(B): ${amperes.toFixed(1)} A of ampacity may be protected at ${largest} A at most; ${breakerId} is ${breakerRating} A`;
      }
      const limit = smallConductorOvercurrentLimit(data.size, data.material);
      if (limit !== undefined && PHASES.includes(conductor)) {
        row.smallConductor = {
          limitAmperes: limit,
          ...(breakerId ? { breakerId } : {}),
          ...(breakerRating !== undefined ? { breakerRatingAmperes: breakerRating } : {}),
          exceeded: breakerRating !== undefined && breakerRating > limit * run.parallelSets,
        };
        if (row.smallConductor.exceeded) row.note = `240.4(D): ${formatSize(data.size)} ${metal} may be protected at ${limit} A at most; ${breakerId} is ${breakerRating} A`;
      }
    } catch (error) {
      row.note = (error as Error).message;
    }
  }
  return out;
}
