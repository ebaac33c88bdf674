// Grounding electrode: the trade's ground, three shortening bars under a stem from its lead.
import type { SymbolGeometry } from './types';

export function electrodeSymbol(): SymbolGeometry {
  return {
    kind: 'electrode',
    ink: 'M 0 -26 L 0 0 M -15 0 L 15 0 M -9 7 L 9 7 M -3 14 L 3 14',
    lanes: [],
    terminals: [{ name: 'lead', x: 0, y: -26, side: 'up' }],
    body: { x: -16, y: -8, width: 32, height: 26 },
    label: { x: 22, y: 2, align: 'start' },
    tags: { x: 22, y: 22, align: 'start' },
  };
}
