// Transformer: the trade's two windings as two overlapping circles, primary above and secondary below.
import type { SymbolGeometry } from './types';

const R = 18;
const C = 11;

export function transformerSymbol(): SymbolGeometry {
  const circle = (cy: number) => `M ${-R} ${cy} A ${R} ${R} 0 1 0 ${R} ${cy} A ${R} ${R} 0 1 0 ${-R} ${cy}`;
  return {
    kind: 'transformer',
    ink: [circle(-C), circle(C), `M 0 ${-C - R} L 0 -50`, `M 0 ${C + R} L 0 50`].join(' '),
    lanes: [],
    terminals: [
      { name: 'primary', x: 0, y: -50, side: 'up' },
      { name: 'secondary', x: 0, y: 50, side: 'down' },
    ],
    body: { x: -R - 2, y: -C - R - 2, width: 2 * R + 4, height: 2 * (C + R) + 4 },
    label: { x: R + 10, y: -8, align: 'start' },
    tags: { x: R + 10, y: 12, align: 'start' },
  };
}
