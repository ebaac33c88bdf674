// The small 208Y/120 system the browser test draws: an ideal source, a feeder, a panel and two resistive 120 V
// loads on phases A and B. Used by unit tests to check the same numbers the browser test reads on the canvas.
import type { SheetInput } from '../../../shared/sheet';

export const LOAD_A_KW = 1.2;
export const LOAD_B_KW = 2.4;

export function smallSystem(neutralOpen = false): SheetInput {
  return {
    formatVersion: 1,
    name: 'Small 208Y/120',
    elements: {
      src: { kind: 'source', id: 'src', name: 'Utility', nominalVolts: 208, x: 0, y: 0 },
      feeder: {
        kind: 'run', id: 'feeder', name: 'Feeder', lengthFt: 50, x: 0, y: 140,
        conductors: { A: { size: '4/0' }, B: { size: '4/0' }, C: { size: '4/0' }, N: { size: '4/0', open: neutralOpen }, PE: { size: '4' } },
      },
      panel: { kind: 'bus', id: 'panel', name: 'Panel', x: 0, y: 280 },
      la: { kind: 'load', id: 'la', name: 'Load A', ratedVolts: 120, kw: LOAD_A_KW, loadKind: 'heating', x: -60, y: 400 },
      lb: { kind: 'load', id: 'lb', name: 'Load B', ratedVolts: 120, kw: LOAD_B_KW, loadKind: 'heating', x: 60, y: 400 },
    },
    connections: {
      c1: { id: 'c1', from: { elementId: 'src', terminal: 'out' }, to: { elementId: 'feeder', terminal: 'from' }, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N' } },
      c2: { id: 'c2', from: { elementId: 'feeder', terminal: 'to' }, to: { elementId: 'panel', terminal: 'bars' }, conductorMap: { A: 'A', B: 'B', C: 'C', N: 'N', PE: 'PE' } },
      c3: { id: 'c3', from: { elementId: 'panel', terminal: 'bars' }, to: { elementId: 'la', terminal: 'supply' }, conductorMap: { A: 'A', N: 'N' } },
      c4: { id: 'c4', from: { elementId: 'panel', terminal: 'bars' }, to: { elementId: 'lb', terminal: 'supply' }, conductorMap: { B: 'A', N: 'N' } },
    },
    whatIfs: {},
  };
}
