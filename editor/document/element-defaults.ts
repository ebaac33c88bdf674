// What a newly placed element of each kind holds: plain, common values of the trade for a 208Y/120 building
// (a person changes them in the inspector), and the next free name of its kind ("Panel 2").
import type { ElementKind } from '../../shared/sheet';
import type { NewElement } from './commands';

export const ELEMENT_KINDS: ElementKind[] = ['source', 'transformer', 'bus', 'breaker', 'run', 'load', 'electrode'];

/** Plain names for the palette. */
export const KIND_LABEL: Record<ElementKind, string> = {
  source: 'Utility source',
  transformer: 'Transformer',
  bus: 'Panel or bus',
  breaker: 'Breaker',
  run: 'Feeder or cable',
  load: 'Load',
  electrode: 'Ground electrode',
};

const BASE_NAME: Record<ElementKind, string> = {
  source: 'Utility',
  transformer: 'Transformer',
  bus: 'Panel',
  breaker: 'Breaker',
  run: 'Feeder',
  load: 'Load',
  electrode: 'Ground rod',
};

const DEFAULTS: Record<ElementKind, Record<string, unknown>> = {
  source: { system: 'three-phase-wye', nominalVolts: 208, strength: 'infinite', grounding: 'solid' },
  transformer: {
    connection: 'delta-wye-grounded',
    kva: 150,
    primaryVolts: 12470,
    secondaryVolts: 208,
    percentImpedance: 2,
    xOverR: 4,
    secondaryGrounding: 'solid',
  },
  bus: { role: 'panel', phaseA: true, phaseB: true, phaseC: true, neutralBar: true, groundBar: true, neutralGroundBond: false },
  breaker: { device: 'breaker', poleA: 'closed', poleB: 'closed', poleC: 'closed', ratingAmperes: 200 },
  run: {
    lengthFt: 100,
    impedanceFrom: 'nec-table9',
    raceway: 'pvc',
    conductors: { A: { size: '4/0' }, B: { size: '4/0' }, C: { size: '4/0' }, N: { size: '4/0' }, PE: { size: '4' } },
  },
  load: { connection: 'line-to-neutral', loadKind: 'receptacles', givenAs: 'kw', kw: 1.5, powerFactor: 1, ratedVolts: 120 },
  electrode: { ohms: 25 },
};

export function nextName(kind: ElementKind, existingNames: Iterable<string>): string {
  const base = BASE_NAME[kind];
  const taken = new Set(existingNames);
  if (!taken.has(base)) return base;
  for (let n = 2; ; n++) if (!taken.has(`${base} ${n}`)) return `${base} ${n}`;
}

export function newElement(kind: ElementKind, at: { x: number; y: number }, existingNames: Iterable<string>): NewElement {
  return { kind, name: nextName(kind, existingNames), x: at.x, y: at.y, rotationDeg: 0, ...structuredClone(DEFAULTS[kind]) } as NewElement;
}
