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
  /** Power absorbed outside the stamps (a shunt fault's path), VA; counted with the loads in the balance. */
  extraAbsorbedVa?: { re: number; im: number };
  /** Indexes built once per solve: load elements and stamps by element id, ties by kind|element|conductor. */
  partsByLoad: Map<string, number[]>;
  stampsByElement: Map<string, number[]>;
  tieByKey: Map<string, number>;
}

export function indexSolution(solution: Solution): Pick<ResultContext, 'partsByLoad' | 'stampsByElement' | 'tieByKey'> {
  const partsByLoad = new Map<string, number[]>();
  solution.network.loads.forEach((p, k) => partsByLoad.set(p.loadId, [...(partsByLoad.get(p.loadId) ?? []), k]));
  const stampsByElement = new Map<string, number[]>();
  solution.network.stamps.forEach((s, k) => {
    const list = stampsByElement.get(s.elementId);
    if (list) list.push(k);
    else stampsByElement.set(s.elementId, [k]);
  });
  const tieByKey = new Map<string, number>();
  solution.network.ties.forEach((t, k) => {
    const key = `${t.kind}|${t.elementId}|${t.conductor}`;
    if (!tieByKey.has(key)) tieByKey.set(key, k);
  });
  return { partsByLoad, stampsByElement, tieByKey };
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
