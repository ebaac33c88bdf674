// What every results module reads: the sheet, the solution, the element currents and the tie flows.
import type { Sheet } from '../../shared/sheet';
import type { Solution } from '../solve/solve-network';
import { pinKey } from '../network/types';
import type { ElementCurrents } from './currents';
import type { LiveState } from './types';

export interface ResultContext {
  sheet: Sheet;
  solution: Solution;
  currents: ElementCurrents;
  flows: { re: Float64Array; im: Float64Array };
  openNeutral: boolean;
}

export function findPin(ctx: ResultContext, elementId: string, terminal: string, conductor: string): number | undefined {
  return ctx.solution.network.pinIndex.get(pinKey(elementId, terminal, conductor));
}

export function pinState(ctx: ResultContext, pin: number): LiveState {
  const cls = ctx.solution.classes.classOf[pin];
  return cls < 0 ? 'energised' : ctx.solution.parts.state[cls];
}

export function pinUngrounded(ctx: ResultContext, pin: number): boolean {
  const cls = ctx.solution.classes.classOf[pin];
  return cls >= 0 && ctx.solution.parts.ungrounded[cls];
}

/** The combined state of several pins: any live one makes it live; back-fed wins over energised (a hazard). */
export function combinedState(states: LiveState[]): LiveState | 'partly-energised' {
  if (states.length === 0) return 'de-energised';
  if (states.every((s) => s === 'de-energised')) return 'de-energised';
  if (states.includes('back-fed')) return 'back-fed';
  if (states.includes('de-energised')) return 'partly-energised';
  return 'energised';
}
