// Utility source: the trade's AC source, a circle with one wave in it, on a stem down to its terminal.
import type { SymbolGeometry } from './types';

const R = 24;

export function sourceSymbol(): SymbolGeometry {
  return {
    kind: 'source',
    ink: [
      `M ${-R} 0 A ${R} ${R} 0 1 0 ${R} 0 A ${R} ${R} 0 1 0 ${-R} 0`,
      'M -13 0 C -9 -11 -4 -11 0 0 C 4 11 9 11 13 0',
      `M 0 ${R} L 0 44`,
    ].join(' '),
    lanes: [],
    terminals: [{ name: 'out', x: 0, y: 44, side: 'down' }],
    body: { x: -R - 2, y: -R - 2, width: 2 * R + 4, height: 2 * R + 4 },
    label: { x: R + 10, y: -6, align: 'start' },
    tags: { x: R + 10, y: 14, align: 'start' },
  };
}
