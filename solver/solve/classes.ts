// Merges the network's zero-impedance ties into classes: one unknown voltage per class, every pin its class
// voltage plus a known offset, remote earth's class the reference. Contradictory ties are reported, not thrown.
import { OffsetUnionFind } from '../network/union-find';
import type { Network } from '../network/types';
import { EARTH_PIN } from '../network/types';

export interface PinClasses {
  /** Class of each pin, or −1 for the earth class (the reference at zero volts). */
  classOf: Int32Array;
  /** V(pin) − V(class). */
  offsetRe: Float64Array;
  offsetIm: Float64Array;
  classCount: number;
  /** Pins of each class. */
  members: number[][];
  /** Ties that joined classes (a spanning forest); the others were redundant and carry no current. */
  treeTies: number[];
  /** The union-find root pin of each class, and of the earth class. */
  rootPin: Int32Array;
  earthRootPin: number;
}

export type ClassOutcome = { ok: true; classes: PinClasses } | { ok: false; message: string; elementIds: string[] };

export function mergeTies(network: Network): ClassOutcome {
  const pinCount = network.pins.length;
  const uf = new OffsetUnionFind(pinCount, EARTH_PIN);
  for (let t = 0; t < network.ties.length; t++) {
    const tie = network.ties[t];
    if (uf.union(tie.a, tie.b, tie.offset, t) === 'conflict') {
      const pin = (p: number) => network.pins[p];
      const elementIds = [...new Set([tie.elementId, pin(tie.a).elementId, pin(tie.b).elementId].filter((id) => id))];
      return {
        ok: false,
        message:
          `ideal sources are shorted or in parallel at different voltages where ${tie.kind} ${tie.elementId} (${tie.conductor}) ` +
          `joins ${describe(network, tie.a)} to ${describe(network, tie.b)}`,
        elementIds,
      };
    }
  }
  const earthRoot = uf.find(EARTH_PIN).root;
  const classOf = new Int32Array(pinCount);
  const offsetRe = new Float64Array(pinCount);
  const offsetIm = new Float64Array(pinCount);
  const classOfRoot = new Map<number, number>();
  const members: number[][] = [];
  const roots: number[] = [];
  for (let pin = 0; pin < pinCount; pin++) {
    const f = uf.find(pin);
    offsetRe[pin] = f.re;
    offsetIm[pin] = f.im;
    if (f.root === earthRoot) {
      classOf[pin] = -1;
      continue;
    }
    let cls = classOfRoot.get(f.root);
    if (cls === undefined) {
      cls = members.length;
      classOfRoot.set(f.root, cls);
      members.push([]);
      roots.push(f.root);
    }
    classOf[pin] = cls;
    members[cls].push(pin);
  }
  return {
    ok: true,
    classes: {
      classOf,
      offsetRe,
      offsetIm,
      classCount: members.length,
      members,
      treeTies: uf.treeTies,
      rootPin: Int32Array.from(roots),
      earthRootPin: earthRoot,
    },
  };
}

export function describe(network: Network, pin: number): string {
  const p = network.pins[pin];
  return p.elementId ? `${p.elementId} ${p.terminal} ${p.conductor}` : 'remote earth';
}
