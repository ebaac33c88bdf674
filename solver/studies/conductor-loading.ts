// Each run conductor's current against its NEC 310.16 ampacity, corrected for ambient (310.15(B)), adjusted for more
// than three current-carrying conductors (310.15(C)(1)) with the neutral counted where 310.15(E) counts it, and the
// small-conductor limit of 240.4(D) against the breaker upstream. The rule applied is stated with each figure.
import { formatSize } from '../../shared/conductor-sizes';
import type { ConductorId, RunElement, Sheet } from '../../shared/sheet';
import { ampacity, neutralCountsAsCurrentCarrying, smallConductorOvercurrentLimit, type InsulationTempC } from '../conductors';
import type { RunResult } from '../results/types';
import { nearestUpstream, type FeedTree } from './feed-tree';
import type { AmpacityRule, ConductorLoading } from './types';

const PHASES: ConductorId[] = ['A', 'B', 'C'];
export const HIGH_LOADING_PERCENT = 80;

export interface CircuitLoadShare {
  /** Share of the kW downstream of the run that is non-linear (0 when nothing is downstream). */
  nonLinearFraction: number;
}

/** Why the neutral counts or not, 310.15(E), in words. */
function neutralReason(system: NonNullable<RunResult['neutralSystem']>, phases: number, nonLinear: boolean): { counted: boolean; text: string } {
  if (phases === 1) return { counted: true, text: 'the neutral of a two-wire circuit carries the whole current and counts' };
  const counted = neutralCountsAsCurrentCarrying({ system, phasesInCircuit: Math.min(phases, 3), nonLinearMajority: nonLinear });
  if (system === 'wye-4-wire' && phases === 2) return { counted, text: 'the neutral counts, 310.15(E)(2): two phases and the neutral of a 4-wire wye' };
  if (system === 'wye-4-wire' && nonLinear) return { counted, text: 'the neutral counts, 310.15(E)(3): a 4-wire wye circuit whose load is mostly non-linear' };
  if (system === 'wye-4-wire') return { counted, text: 'the neutral is not counted, 310.15(E)(1): it carries only the unbalanced current' };
  if (system === 'split-phase') return { counted, text: 'the neutral is not counted, 310.15(E)(1): on 120/240 V it carries only the unbalance of the two halves' };
  return { counted, text: 'the neutral is not counted, 310.15(E)(1): on a four-wire delta it carries only the unbalance of the 120/240 V part' };
}

function ruleFor(run: RunElement, result: RunResult, share: CircuitLoadShare, majority: number): Omit<AmpacityRule, 'tableAmperes' | 'ambientFactor' | 'adjustmentFactor' | 'text'> & { reason?: string } {
  const phases = PHASES.filter((p) => run.conductors[p]).length;
  const hasNeutral = run.conductors.N !== undefined;
  const base = { table: 'NEC 310.16' as const, insulationTempC: run.insulationTempC as InsulationTempC, ambientC: run.ambientC };
  if (run.conductorsInRaceway !== undefined) return { ...base, currentCarrying: run.conductorsInRaceway, countFrom: 'sheet', reason: 'count given on the sheet' };
  if (!hasNeutral || phases === 0 || !result.neutralSystem) return { ...base, currentCarrying: Math.max(phases, 1), countFrom: 'counted' };
  const { counted, text } = neutralReason(result.neutralSystem, phases, share.nonLinearFraction > majority);
  return { ...base, currentCarrying: phases + (counted ? 1 : 0), countFrom: 'counted', neutralCounted: counted, reason: text };
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
  const basis = ruleFor(run, result, share, majority);
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
    if (run.impedanceFrom === 'iec-60228' || data.size === undefined) {
      row.note = 'no NEC 310.16 size: IEC users get the same check from a table of their own in a later release';
      continue;
    }
    if (run.impedanceFrom === 'overhead') {
      row.note = 'an overhead conductor in free air is not rated by NEC 310.16';
      continue;
    }
    try {
      const a = ampacity({ size: data.size, material: data.material, insulationTempC: run.insulationTempC, ambientC: run.ambientC, currentCarryingConductors: basis.currentCarrying });
      const amperes = a.amperes * run.parallelSets;
      const metal = data.material === 'copper' ? 'Cu' : 'Al';
      const text =
        `NEC 310.16 ${formatSize(data.size)} ${metal} ${run.insulationTempC} °C ${a.tableAmperes} A` +
        ` × ${a.ambientFactor.toFixed(3)} (310.15(B), ${run.ambientC} °C ambient)` +
        ` × ${a.adjustmentFactor} (310.15(C)(1), ${basis.currentCarrying} current-carrying${basis.reason ? `: ${basis.reason}` : ''})` +
        ` × ${run.parallelSets} set${run.parallelSets > 1 ? 's' : ''} = ${amperes.toFixed(1)} A`;
      const { reason: _reason, ...rest } = basis;
      row.rule = { ...rest, tableAmperes: a.tableAmperes, ambientFactor: a.ambientFactor, adjustmentFactor: a.adjustmentFactor, text };
      row.ampacityAmperes = amperes;
      row.percentOfAmpacity = (100 * row.amperes) / amperes;
      row.status = row.percentOfAmpacity > 100 ? 'over' : row.percentOfAmpacity >= HIGH_LOADING_PERCENT ? 'high' : 'ok';
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
