// Cable or feeder run: one line at each end that fans out into its conductors, drawn apart (A, B, C, N, PE in
// that order) in the middle so each one can be coloured, tapped and marked open.
import type { ConductorId } from '../sheet/schema';
import type { ConductorLane, SymbolGeometry } from './types';

const END = 60;
const FAN = 36;
const LANE = 24;
export const LANE_SPACING = 7;
const ORDER: ConductorId[] = ['A', 'B', 'C', 'N', 'PE'];

export function runSymbol(conductors: readonly ConductorId[]): SymbolGeometry {
  const present = ORDER.filter((c) => conductors.includes(c));
  const width = (present.length - 1) * LANE_SPACING;
  const lanes: ConductorLane[] = present.map((conductor, i) => {
    const x = -width / 2 + i * LANE_SPACING;
    return { conductor, from: { x, y: -LANE }, to: { x, y: LANE }, fanIn: { x: 0, y: -FAN }, fanOut: { x: 0, y: FAN } };
  });
  const half = Math.max(width / 2, 6);
  return {
    kind: 'run',
    ink: `M 0 ${-END} L 0 ${-FAN} M 0 ${FAN} L 0 ${END}`,
    lanes,
    terminals: [
      { name: 'from', x: 0, y: -END, side: 'up' },
      { name: 'to', x: 0, y: END, side: 'down' },
    ],
    body: { x: -half - 4, y: -FAN, width: 2 * half + 8, height: 2 * FAN },
    label: { x: -half - 12, y: -6, align: 'end' },
    tags: { x: half + 12, y: -LANE + 4, align: 'start' },
  };
}
