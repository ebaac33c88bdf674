// Currents through zero-impedance ties (breaker poles, connections, bonds, an ideal source's EMF), found on the
// spanning forest of each merged class: each tie carries what the pins beyond it send into elements.
// Redundant ties (a loop of zero-impedance paths) carry none: the split among parallel ties is not determined.
import type { BuiltNetwork } from '../network/build-network';
import type { PinClasses } from '../solve/classes';
import type { ElementCurrents } from './currents';

/** Per tie, the current flowing from its pin a to its pin b through the tie. */
export function tieFlows(network: BuiltNetwork, classes: PinClasses, currents: ElementCurrents): { re: Float64Array; im: Float64Array } {
  const ties = network.ties;
  const re = new Float64Array(ties.length);
  const im = new Float64Array(ties.length);
  const adjacency = new Map<number, number[]>();
  for (const t of classes.treeTies) {
    for (const pin of [ties[t].a, ties[t].b]) adjacency.set(pin, [...(adjacency.get(pin) ?? []), t]);
  }
  const roots = [...classes.rootPin, classes.earthRootPin];
  const visited = new Set<number>();
  for (const root of roots) {
    if (visited.has(root)) continue;
    // Breadth-first from the root, then subtree sums from the leaves up.
    const order: number[] = [root];
    const parentTie = new Map<number, number>();
    visited.add(root);
    for (let k = 0; k < order.length; k++) {
      const pin = order[k];
      for (const t of adjacency.get(pin) ?? []) {
        const other = ties[t].a === pin ? ties[t].b : ties[t].a;
        if (visited.has(other)) continue;
        visited.add(other);
        parentTie.set(other, t);
        order.push(other);
      }
    }
    const sumRe = new Map<number, number>();
    const sumIm = new Map<number, number>();
    for (const pin of order) {
      sumRe.set(pin, currents.injRe[pin]);
      sumIm.set(pin, currents.injIm[pin]);
    }
    for (let k = order.length - 1; k > 0; k--) {
      const pin = order[k];
      const t = parentTie.get(pin)!;
      const parent = ties[t].a === pin ? ties[t].b : ties[t].a;
      const sRe = sumRe.get(pin)!;
      const sIm = sumIm.get(pin)!;
      // The subtree sends s into elements, so the tie brings s from the parent to the pin.
      const sign = ties[t].b === pin ? 1 : -1;
      re[t] = sign * sRe;
      im[t] = sign * sIm;
      sumRe.set(parent, sumRe.get(parent)! + sRe);
      sumIm.set(parent, sumIm.get(parent)! + sIm);
    }
  }
  return { re, im };
}
