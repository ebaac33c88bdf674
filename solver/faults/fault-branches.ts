// The little network a shunt fault adds at its terminals: branches through the fault impedance between the faulted
// conductors, a common point for a three-phase fault, and the joined phases of a double-line-to-ground fault.
import type { PhaseId, ShuntFaultType } from '../../shared/sheet';
import type { Complex } from '../complex';
import type { FaultTerminals } from './fault-types';

/** A pin (≥ 0, 0 being remote earth) or an internal point of the fault (−1 − its index). */
export type FaultNode = number;
export const internalNode = (k: number): FaultNode => -1 - k;

export interface FaultBranch {
  from: FaultNode;
  to: FaultNode;
  ohms: Complex;
}

export interface FaultNetwork {
  branches: FaultBranch[];
  internalCount: number;
  phases: PhaseId[];
}

const ZERO_OHMS: Complex = { re: 0, im: 0 };

/** The phases a fault involves: the ones asked for, else the usual ones among the bus's phases. */
export function faultPhases(type: ShuntFaultType, present: PhaseId[], asked?: PhaseId[]): PhaseId[] | string {
  const needed = type === 'three-phase' ? 3 : type === 'line-to-line' || type === 'double-line-to-ground' ? 2 : 1;
  if (asked && asked.length > 0) {
    const missing = asked.filter((p) => !present.includes(p));
    if (missing.length > 0) return `the bus has no phase ${missing.join(', ')}`;
    if (asked.length !== needed) return `a ${type} fault involves ${needed} phase${needed > 1 ? 's' : ''}, not ${asked.length}`;
    return asked;
  }
  if (present.length < needed) return `a ${type} fault needs ${needed} phases; the bus has ${present.length}`;
  if (needed === 3) return present.slice(0, 3);
  // Two phases: B–C on a three-phase bus (the textbook choice), otherwise the two there are.
  if (needed === 2) return present.length === 3 ? ['B', 'C'] : present.slice(0, 2);
  return present.slice(0, 1);
}

export function faultNetwork(type: ShuntFaultType, phases: PhaseId[], terminals: FaultTerminals, ohms: Complex): FaultNetwork | string {
  const pin = (p: PhaseId) => terminals.phases[p]!;
  switch (type) {
    case 'three-phase':
      // Each phase through the fault impedance to a common point that is not grounded.
      return { branches: phases.map((p) => ({ from: pin(p), to: internalNode(0), ohms })), internalCount: 1, phases };
    case 'line-to-line':
      return { branches: [{ from: pin(phases[0]), to: pin(phases[1]), ohms }], internalCount: 0, phases };
    case 'line-to-ground':
      if (terminals.ground === undefined) return 'the fault has no return terminal';
      return { branches: [{ from: pin(phases[0]), to: terminals.ground, ohms }], internalCount: 0, phases };
    case 'line-to-neutral':
      if (terminals.neutral === undefined) return 'the bus has no neutral bar for a line-to-neutral fault';
      return { branches: [{ from: pin(phases[0]), to: terminals.neutral, ohms }], internalCount: 0, phases };
    case 'double-line-to-ground':
      if (terminals.ground === undefined) return 'the fault has no return terminal';
      // The two phases joined solidly, and the joint through the fault impedance to the return.
      return {
        branches: [
          { from: pin(phases[0]), to: internalNode(0), ohms: ZERO_OHMS },
          { from: pin(phases[1]), to: internalNode(0), ohms: ZERO_OHMS },
          { from: internalNode(0), to: terminals.ground, ohms },
        ],
        internalCount: 1,
        phases,
      };
  }
}
