// Which parts of the network are live: energised (a path to a source through conductors, and through windings
// from a live phase), back-fed
// (live only through loads from a live phase: a hazard), de-energised (no path to a source, or reached only through
// loads from a neutral or ground at its potential); and which live parts have no galvanic path to earth
// (ungrounded: they get one reference tie and their phase-to-ground is not defined).
import type { BuiltNetwork } from '../network/build-network';
import type { PinClasses } from './classes';

export type ClassState = 'energised' | 'back-fed' | 'de-energised';

export interface Parts {
  state: ClassState[];
  /** No path of any kind to a source: left out of the solve (a unit tie holds it at zero). */
  isolated: boolean[];
  /** True for classes of a solved part without a galvanic path to earth. */
  ungrounded: boolean[];
  /** One class per ungrounded part: where its reference tie goes. */
  referenceTies: number[];
  /** Galvanic group of each class (joined by conductors, loads and winding ends), and the earth's group. */
  groupOf: Int32Array;
  earthGroup: number;
}

const nonZero = (v: { re: number; im: number }) => v.re !== 0 || v.im !== 0;

/** A pin is a live phase when its nominal voltage is not that of a neutral or ground. */
function livePhase(network: BuiltNetwork, pin: number): boolean {
  const v = network.nominal[pin];
  return Math.hypot(v.re, v.im) > 1e-3 * network.zoneVolts[pin];
}

export function findParts(network: BuiltNetwork, classes: PinClasses): Parts {
  const n = classes.classCount;
  const EARTH = n; // the earth class as a graph node
  const node = (pin: number) => (classes.classOf[pin] < 0 ? EARTH : classes.classOf[pin]);
  const strong: number[][] = Array.from({ length: n + 1 }, () => []);
  const all: number[][] = Array.from({ length: n + 1 }, () => []);
  const loadPairs: [number, number][] = [];
  const windingPairs: [number, number][] = [];
  for (const stamp of network.stamps) {
    for (let i = 0; i < stamp.pins.length; i++) {
      for (let j = 0; j < stamp.pins.length; j++) {
        if (i === j || !nonZero(stamp.y[i][j])) continue;
        const a = node(stamp.pins[i]);
        const b = node(stamp.pins[j]);
        if (a === b) continue;
        all[a].push(b);
        if (stamp.kind === 'load') loadPairs.push([stamp.pins[i], stamp.pins[j]]);
        else if (stamp.kind === 'transformer') windingPairs.push([stamp.pins[i], stamp.pins[j]]);
        else strong[a].push(b);
      }
    }
  }
  const bfs = (seeds: number[], edges: number[][], mark: Uint8Array, allowed: (v: number) => boolean) => {
    const queue = seeds.filter((v) => {
      if (mark[v] || !allowed(v)) return false;
      mark[v] = 1;
      return true;
    });
    for (let head = 0; head < queue.length; head++) {
      const v = queue[head];
      for (const w of edges[v]) {
        if (mark[w] || !allowed(w)) continue;
        mark[w] = 1;
        queue.push(w);
      }
    }
  };
  const sourceNodes = network.sources.flatMap((s) => [s.starPin, ...s.emfTies.map((t) => network.ties[t.tieIndex].a)]).map(node);
  const energised = new Uint8Array(n + 1);
  bfs(sourceNodes, strong, energised, () => true);
  // A transformer passes energy on only from a live phase: a winding whose line end is dead, reached from its
  // neutral end alone, does not energise the other side.
  for (let grew = true; grew; ) {
    grew = false;
    const seeds = windingPairs.filter(([p, q]) => energised[node(p)] && livePhase(network, p) && !energised[node(q)]).map(([, q]) => node(q));
    if (seeds.length === 0) break;
    const before = energised.reduce((a, b) => a + b, 0);
    bfs(seeds, strong, energised, () => true);
    grew = energised.reduce((a, b) => a + b, 0) > before;
  }
  const reached = new Uint8Array(n + 1);
  bfs([...Array(n + 1).keys()].filter((v) => energised[v]), all, reached, () => true);

  // Back-fed: beyond a load from a live phase (not from a neutral at its own potential), then onward.
  const backFed = new Uint8Array(n + 1);
  const seeds = loadPairs.filter(([p, q]) => energised[node(p)] && livePhase(network, p) && !energised[node(q)]).map(([, q]) => node(q));
  bfs(seeds, all, backFed, (v) => !energised[v]);

  const state: ClassState[] = new Array(n);
  const isolated: boolean[] = new Array(n);
  for (let v = 0; v < n; v++) {
    state[v] = energised[v] ? 'energised' : backFed[v] ? 'back-fed' : 'de-energised';
    isolated[v] = !reached[v];
  }

  // Galvanic groups: classes joined by conductors, loads and winding ends (not across windings).
  const parent = Int32Array.from({ length: n + 1 }, (_, i) => i);
  const find = (x: number): number => {
    while (parent[x] !== x) {
      parent[x] = parent[parent[x]];
      x = parent[x];
    }
    return x;
  };
  for (const stamp of network.stamps) {
    for (const [p, q] of stamp.galvanic) {
      const a = find(node(p));
      const b = find(node(q));
      if (a !== b) parent[a] = b;
    }
  }
  const earthGroup = find(EARTH);
  const ungrounded = new Array<boolean>(n).fill(false);
  const referenceTies: number[] = [];
  const tiedGroups = new Set<number>();
  for (let v = 0; v < n; v++) {
    if (isolated[v]) continue;
    const g = find(v);
    if (g === earthGroup) continue;
    ungrounded[v] = true;
    if (!tiedGroups.has(g)) {
      tiedGroups.add(g);
      referenceTies.push(v);
    }
  }
  const groupOf = new Int32Array(n);
  for (let v = 0; v < n; v++) groupOf[v] = find(v);
  return { state, isolated, ungrounded, referenceTies, groupOf, earthGroup };
}
