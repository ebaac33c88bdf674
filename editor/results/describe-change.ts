// A what-if change in plain words, naming the elements ("Open N of Feeder 2", "3 Ω on N at the lug of …").
import type { ShuntFaultType, WhatIfChange } from '../../shared/sheet';
import { FAULT_TYPE_LABEL } from '../studies/fault-labels';

/** A typed figure as typed ("3", "0.15"); a fitted one (a study's) to three significant figures. */
function figure(v: unknown): string {
  const x = Number(v);
  if (!Number.isFinite(x)) return String(v);
  return String(x).length > 6 ? String(Number(x.toPrecision(3))) : String(x);
}

export function describeChange(change: WhatIfChange | Record<string, unknown>, nameOf: (id: string) => string): string {
  const c = change as Record<string, unknown>;
  const n = (k: string) => nameOf(String(c[k]));
  switch (c.kind) {
    case 'open-conductor':
      return `Open ${c.conductor} of ${n('runId')}`;
    case 'degrade-conductor':
      return `${figure(c.addedOhms)} Ω in series with ${c.conductor} of ${n('runId')}`;
    case 'open-pole':
      return `Open pole ${c.pole} of ${n('breakerId')}`;
    case 'open-connection':
      return `Open ${c.conductor} of a connection`;
    case 'degrade-connection':
      return `${figure(c.ohms)} Ω on ${c.conductor} of a connection`;
    case 'scale-loads':
      return `Loads ${c.scope === 'panel' ? 'of' : 'fed from'} ${n('elementId')} × ${figure(c.factor)}`;
    case 'shunt-fault': {
      const r = Number(c.faultOhms ?? 0);
      const x = Number(c.faultReactanceOhms ?? 0);
      const through = r === 0 && x === 0 ? 'bolted' : `through ${r} + j${x} Ω`;
      return `${FAULT_TYPE_LABEL[c.faultType as ShuntFaultType] ?? 'Shunt'} fault at ${n('busId')}, ${through}`;
    }
    default:
      return String(c.kind ?? 'change');
  }
}
