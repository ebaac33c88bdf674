// Bus or panelboard: a long bar drawn as a narrow outlined rectangle; connections land anywhere along it.
import type { SymbolGeometry } from './types';

export const BUS_HALF_LENGTH = 80;
const H = 4;

export function busSymbol(): SymbolGeometry {
  const L = BUS_HALF_LENGTH;
  return {
    kind: 'bus',
    ink: `M ${-L} ${-H} L ${L} ${-H} L ${L} ${H} L ${-L} ${H} Z`,
    lanes: [],
    terminals: [{ name: 'bars', x: 0, y: 0, side: 'down', span: L }],
    body: { x: -L, y: -H - 6, width: 2 * L, height: 2 * H + 12 },
    label: { x: -L, y: -14, align: 'start' },
    tags: { x: L + 12, y: -6, align: 'start' },
  };
}
