// Each breaker's (switch's, fuse's) largest pole current against its rating, with the 80 % continuous-load note.
import type { BreakerElement } from '../../shared/sheet';
import type { BreakerResult } from '../results/types';
import type { BreakerLoading } from './types';

export function breakerLoading(breaker: BreakerElement, result: BreakerResult, continuousPercent: number): BreakerLoading {
  const poles: BreakerLoading['poles'] = {};
  let amperes = 0;
  let closed = 0;
  for (const [pole, p] of Object.entries(result.poles) as [keyof BreakerLoading['poles'], { state: string; amperes: number }][]) {
    poles[pole] = p.amperes;
    amperes = Math.max(amperes, p.amperes);
    if (p.state === 'closed') closed++;
  }
  const base = { breakerId: breaker.id, name: breaker.name, device: breaker.device, amperes, poles };
  if (closed === 0 && Object.keys(result.poles).length > 0) return { ...base, status: 'open', note: 'every pole is open' };
  if (breaker.ratingAmperes === undefined) return { ...base, status: 'no-rating', note: 'no rating on the sheet' };
  const percent = (100 * amperes) / breaker.ratingAmperes;
  const withRating = { ...base, ratingAmperes: breaker.ratingAmperes, percentOfRating: percent };
  if (percent > 100) return { ...withRating, status: 'over', note: `${amperes.toFixed(1)} A is above the ${breaker.ratingAmperes} A rating` };
  if (percent > continuousPercent) {
    return {
      ...withRating,
      status: 'above-continuous',
      note: `above ${continuousPercent} % of the rating: too much for a continuous load (3 h or more) on a standard breaker (common practice; NEC 210.20(A)/215.3 size the device at 125 % of the continuous load)`,
    };
  }
  return { ...withRating, status: 'ok', note: `within ${continuousPercent} % of the rating` };
}
