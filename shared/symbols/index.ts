// Element symbols as data: one module per element kind, chosen here from an element's (possibly unvalidated)
// fields. Pure data and small pure functions, no React: the canvas and the server's exports draw the same thing.
import type { ConductorId } from '../sheet/schema';
import { breakerSymbol, type DeviceKind } from './breaker';
import { busSymbol } from './bus';
import { electrodeSymbol } from './electrode';
import { loadSymbol } from './load';
import { runSymbol } from './run';
import { sourceSymbol } from './source';
import { transformerSymbol } from './transformer';
import type { SymbolGeometry } from './types';

export * from './types';
export * from './placement';
export { BUS_HALF_LENGTH } from './bus';
export { LANE_SPACING } from './run';
export * from './ink';
export * from './tag-shapes';
export { elementDetail } from './element-detail';

/** The fields of an element that its symbol depends on; everything optional because readers tolerate bad data. */
export interface SymbolSource {
  kind: string;
  conductors?: Partial<Record<ConductorId, { open?: boolean } | undefined>>;
  device?: string;
  poleA?: string;
  poleB?: string;
  poleC?: string;
  loadKind?: string;
}

const cache = new Map<string, SymbolGeometry>();

function memo(key: string, make: () => SymbolGeometry): SymbolGeometry {
  let found = cache.get(key);
  if (!found) {
    found = make();
    cache.set(key, found);
  }
  return found;
}

/** A breaker draws open when every pole it has is open. */
export function breakerDrawnOpen(e: SymbolSource): boolean {
  const poles = [e.poleA ?? 'closed', e.poleB ?? 'closed', e.poleC ?? 'closed'].filter((p) => p !== 'none');
  return poles.length > 0 && poles.every((p) => p === 'open');
}

export function symbolOf(element: SymbolSource): SymbolGeometry {
  switch (element.kind) {
    case 'source':
      return memo('source', sourceSymbol);
    case 'transformer':
      return memo('transformer', transformerSymbol);
    case 'bus':
      return memo('bus', busSymbol);
    case 'run': {
      const present = Object.keys(element.conductors ?? {}) as ConductorId[];
      return memo(`run:${[...present].sort().join(',')}`, () => runSymbol(present.length ? present : ['A']));
    }
    case 'breaker': {
      const device = (['breaker', 'switch', 'fuse'].includes(element.device ?? '') ? element.device : 'breaker') as DeviceKind;
      const open = breakerDrawnOpen(element);
      return memo(`breaker:${device}:${open}`, () => breakerSymbol(device, open));
    }
    case 'load': {
      const motor = element.loadKind === 'motor';
      return memo(`load:${motor}`, () => loadSymbol(motor));
    }
    case 'electrode':
      return memo('electrode', electrodeSymbol);
    default:
      // An unknown kind (a newer format) still gets a plain box so the drawing never loses it.
      return memo('unknown', () => ({
        kind: 'unknown',
        ink: 'M -16 -16 L 16 -16 L 16 16 L -16 16 Z',
        lanes: [],
        terminals: [],
        body: { x: -16, y: -16, width: 32, height: 32 },
        label: { x: 22, y: 0, align: 'start' },
        tags: { x: 22, y: 20, align: 'start' },
      }));
  }
}
