// Where a fault at a bus lands: the pins of the bus's bars, and its return (the PE bar, the neutral, remote earth).
import type { PhaseId } from '../../shared/sheet';
import type { BuiltNetwork } from '../network/build-network';
import { EARTH_PIN, pinKey } from '../network/types';
import type { FaultReturn, FaultSpec, FaultTerminals } from './fault-types';

export interface ResolvedTerminals {
  terminals: FaultTerminals;
  present: PhaseId[];
  returnPath: FaultReturn;
}

export function busFaultTerminals(network: BuiltNetwork, spec: FaultSpec): ResolvedTerminals | string {
  const pin = (c: string) => network.pinIndex.get(pinKey(spec.busId, 'bars', c));
  const phases: Partial<Record<PhaseId, number>> = {};
  const present: PhaseId[] = [];
  for (const p of ['A', 'B', 'C'] as PhaseId[]) {
    const found = pin(p);
    if (found !== undefined) {
      phases[p] = found;
      present.push(p);
    }
  }
  if (present.length === 0) return `bus ${spec.busId} has no phase bars in the network`;
  const neutral = pin('N');
  const pe = pin('PE');
  // In a building the fault goes to the bus's equipment ground, and through the bonding back to the source; with no
  // ground bar, or where the sheet says so, to remote earth.
  let returnPath: FaultReturn = spec.to ?? 'PE';
  let ground: number | undefined;
  if (returnPath === 'PE') {
    if (pe === undefined) returnPath = 'earth';
    ground = pe ?? EARTH_PIN;
  } else if (returnPath === 'N') {
    if (neutral === undefined) return `bus ${spec.busId} has no neutral bar for the fault to return on`;
    ground = neutral;
  } else ground = EARTH_PIN;
  return { terminals: { phases, neutral, ground }, present, returnPath };
}
