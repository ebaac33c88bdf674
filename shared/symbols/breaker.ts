// Breaker, switch or fuse: the trade's single-line breaker (an arc bridging a gap in the line); open, the
// bridge swings away from the line. A fuse is a small outlined box on the line.
import type { SymbolGeometry } from './types';

export type DeviceKind = 'breaker' | 'switch' | 'fuse';

export function breakerSymbol(device: DeviceKind, open: boolean): SymbolGeometry {
  const stems = 'M 0 -34 L 0 -12 M 0 12 L 0 34';
  const bridge =
    device === 'fuse'
      ? 'M -5 -12 L 5 -12 L 5 12 L -5 12 Z M 0 -12 L 0 12'
      : device === 'switch'
        ? open
          ? 'M 0 12 L 12 -10'
          : 'M 0 12 L 0 -12'
        : open
          ? 'M 0 -12 A 12 12 0 0 1 10 -2'
          : 'M 0 -12 A 12 12 0 0 1 0 12';
  const dot = device === 'switch' ? ' M -2 -12 L 2 -12' : '';
  return {
    kind: 'breaker',
    ink: `${stems} ${bridge}${dot}`,
    lanes: [],
    terminals: [
      { name: 'line', x: 0, y: -34, side: 'up' },
      { name: 'load', x: 0, y: 34, side: 'down' },
    ],
    body: { x: -12, y: -16, width: 28, height: 32 },
    label: { x: 18, y: -6, align: 'start' },
    tags: { x: 18, y: 12, align: 'start' },
  };
}
