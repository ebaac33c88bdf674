// Load: the trade's load arrow on a stem from its supply terminal; a motor is a circle with an M.
import type { SymbolGeometry } from './types';

export function loadSymbol(motor: boolean): SymbolGeometry {
  const ink = motor
    ? 'M 0 -30 L 0 -16 M -16 0 A 16 16 0 1 0 16 0 A 16 16 0 1 0 -16 0'
    : 'M 0 -30 L 0 -6 M -11 -6 L 11 -6 L 0 13 Z';
  return {
    kind: 'load',
    ink,
    ...(motor ? { glyph: { text: 'M', x: 0, y: 0 } } : {}),
    lanes: [],
    terminals: [{ name: 'supply', x: 0, y: -30, side: 'up' }],
    body: { x: -17, y: -17, width: 34, height: 34 },
    label: { x: 0, y: 32, align: 'middle' },
    tags: { x: 0, y: 66, align: 'middle' },
  };
}
