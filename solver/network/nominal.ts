// Nominal voltages: the no-load, ideal phasor of every pin (sources at 1.0 per unit, transformers at their rated
// ratio, no taps), spread through conductors and windings. It sets each pin's voltage zone (for the row scaling),
// the nominal of every bus and load (for percent of rating and the voltage standard), and never depends on openings.
import type { Complex } from '../complex';
import type { BuilderContext } from './builder-context';
import { EARTH_PIN } from './types';

export interface NominalVoltages {
  phasors: Complex[];
  /** The zone's largest nominal magnitude (line-to-neutral of a wye, the high leg of a delta), or 1 where unknown. */
  zoneVolts: Float64Array;
}

interface Edge {
  to: number;
  /** nominal(to) = nominal(from) + offset */
  offset: Complex;
}

export function nominalVoltages(ctx: BuilderContext): NominalVoltages {
  const n = ctx.pins.length;
  const adjacency: Edge[][] = Array.from({ length: n }, () => []);
  const link = (a: number, b: number, aMinusB: Complex) => {
    if (a === EARTH_PIN || b === EARTH_PIN) return; // earth joins every zone: it is zero, not a path
    adjacency[b].push({ to: a, offset: aMinusB });
    adjacency[a].push({ to: b, offset: { re: -aMinusB.re, im: -aMinusB.im } });
  };
  const zero = { re: 0, im: 0 };
  for (const tie of ctx.ties) if (tie.kind !== 'source-emf' || (tie.offset.re === 0 && tie.offset.im === 0)) link(tie.a, tie.b, zero);
  for (const seed of ctx.nominalSeeds) link(seed.a, seed.b, seed.volts);
  for (const run of ctx.runs) for (const k of run.conductors) link(k.fromPin, k.toPin, zero);
  for (const [a, b] of ctx.nominalLinks) link(a, b, zero);
  for (const stamp of ctx.stamps) if (stamp.kind === 'source-impedance') for (const [p, q] of stamp.galvanic) link(p, q, zero);

  const phasors: (Complex | undefined)[] = new Array(n).fill(undefined);
  const zoneVolts = new Float64Array(n).fill(1);
  phasors[EARTH_PIN] = zero;
  const queue: number[] = [];
  const assign = (pin: number, value: Complex, zone: number) => {
    if (phasors[pin] !== undefined) return;
    phasors[pin] = value;
    zoneVolts[pin] = zone;
    queue.push(pin);
  };
  let head = 0;
  const spread = () => {
    while (head < queue.length) {
      const pin = queue[head++];
      const v = phasors[pin]!;
      for (const e of adjacency[pin]) assign(e.to, { re: v.re + e.offset.re, im: v.im + e.offset.im }, zoneVolts[pin]);
    }
  };
  for (const seed of ctx.nominalSeeds) assign(seed.b, zero, seed.zoneVolts);
  spread();

  const done = new Set<string>();
  let progress = true;
  while (progress) {
    progress = false;
    for (const t of ctx.transformers) {
      if (done.has(t.transformerId)) continue;
      const primaries = t.units.map((u) => u.windings[0]);
      if (primaries.some((w) => phasors[w.p] === undefined || phasors[w.q] === undefined)) continue;
      done.add(t.transformerId);
      progress = true;
      const secondary = secondaryPhasors(t, phasors as Complex[]);
      const zone = Math.max(...[...secondary.values()].map((v) => Math.hypot(v.re, v.im)), 1);
      for (const [pin, value] of secondary) assign(pin, value, zone);
      spread();
    }
  }
  return { phasors: phasors.map((v) => v ?? zero), zoneVolts };
}

/** Secondary pins from the primary winding voltages: the neutral at zero, or a delta centred on zero. */
function secondaryPhasors(t: BuilderContext['transformers'][number], phasors: Complex[]): Map<number, Complex> {
  const edges = new Map<number, Edge[]>();
  const add = (from: number, e: Edge) => edges.set(from, [...(edges.get(from) ?? []), e]);
  for (const unit of t.units) {
    const [primary, ...rest] = unit.windings;
    const pv = { re: phasors[primary.p].re - phasors[primary.q].re, im: phasors[primary.p].im - phasors[primary.q].im };
    for (const w of rest) {
      const k = w.nominalVolts / primary.nominalVolts;
      const wv = { re: pv.re * k, im: pv.im * k }; // V(p) − V(q)
      add(w.q, { to: w.p, offset: wv });
      add(w.p, { to: w.q, offset: { re: -wv.re, im: -wv.im } });
    }
  }
  const out = new Map<number, Complex>();
  const anchor = t.secondaryNeutralPin ?? t.secondaryPins[0];
  if (anchor === undefined) return out;
  out.set(anchor, { re: 0, im: 0 });
  const queue = [anchor];
  for (let head = 0; head < queue.length; head++) {
    const pin = queue[head];
    for (const e of edges.get(pin) ?? []) {
      if (out.has(e.to)) continue;
      const v = out.get(pin)!;
      out.set(e.to, { re: v.re + e.offset.re, im: v.im + e.offset.im });
      queue.push(e.to);
    }
  }
  if (t.secondaryNeutralPin === undefined) {
    // A delta without a neutral: centre it on zero, as a grounded-wye equivalent would be.
    let re = 0;
    let im = 0;
    for (const v of out.values()) {
      re += v.re;
      im += v.im;
    }
    re /= out.size;
    im /= out.size;
    for (const [pin, v] of out) out.set(pin, { re: v.re - re, im: v.im - im });
  }
  return out;
}
