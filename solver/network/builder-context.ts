// What every element's converter writes into while the network is built: pins, ties, stamps and notes.
import type { Complex, ComplexMatrix } from '../complex';
import type { Sheet } from '../../shared/sheet';
import type { Modifications } from './modifications';
import type { LoadPart, NetworkWarning, PinInfo, RunLayout, SourceLayout, Stamp, Tie, TieKind } from './types';
import { EARTH_PIN, pinKey } from './types';

/** A transformer's windings grouped by unit, kept for the nominal-voltage pass. */
export interface TransformerUnitPins {
  transformerId: string;
  units: { windings: { p: number; q: number; nominalVolts: number; side: 'primary' | 'secondary' }[] }[];
  secondaryNeutralPin?: number;
  secondaryPins: number[];
}

export class BuilderContext {
  readonly pins: PinInfo[] = [{ elementId: '', terminal: 'earth', conductor: 'earth' }];
  readonly pinIndex = new Map<string, number>();
  readonly ties: Tie[] = [];
  readonly stamps: Stamp[] = [];
  readonly loads: LoadPart[] = [];
  readonly runs: RunLayout[] = [];
  readonly sources: SourceLayout[] = [];
  readonly transformers: TransformerUnitPins[] = [];
  /** Nominal (1.0 per unit) EMF ties, pin a − pin b, seeding the nominal-voltage pass. */
  readonly nominalSeeds: { a: number; b: number; volts: Complex; zoneVolts: number }[] = [];
  /** Pin pairs that are one conductor by design even when a switch or a what-if opens them (nominal pass). */
  readonly nominalLinks: [number, number][] = [];
  readonly warnings: NetworkWarning[] = [];
  readonly assumptions = new Set<string>();

  constructor(readonly sheet: Sheet, readonly mods: Modifications) {
    this.pinIndex.set(pinKey('', 'earth', 'earth'), EARTH_PIN);
  }

  /** The pin of an element terminal's conductor, created on first use. */
  pin(elementId: string, terminal: string, conductor: string): number {
    const key = pinKey(elementId, terminal, conductor);
    let index = this.pinIndex.get(key);
    if (index === undefined) {
      index = this.pins.length;
      this.pins.push({ elementId, terminal, conductor });
      this.pinIndex.set(key, index);
    }
    return index;
  }

  /** The pin when it exists, without creating it. */
  findPin(elementId: string, terminal: string, conductor: string): number | undefined {
    return this.pinIndex.get(pinKey(elementId, terminal, conductor));
  }

  /** Aliases another key to an existing pin (every terminal of a bus lands on its bars). */
  alias(elementId: string, terminal: string, conductor: string, pin: number): void {
    this.pinIndex.set(pinKey(elementId, terminal, conductor), pin);
  }

  tie(a: number, b: number, kind: TieKind, elementId: string, conductor: string, offset: Complex = { re: 0, im: 0 }): number {
    this.ties.push({ a, b, offset, kind, elementId, conductor });
    return this.ties.length - 1;
  }

  stamp(stamp: Stamp): number {
    this.stamps.push(stamp);
    return this.stamps.length - 1;
  }

  /** A two-pin admittance (electrode, grounding resistor, degraded lug). */
  stampBranch(kind: Stamp['kind'], elementId: string, p: number, q: number, y: Complex): number {
    const m: ComplexMatrix = [
      [{ ...y }, { re: -y.re, im: -y.im }],
      [{ re: -y.re, im: -y.im }, { ...y }],
    ];
    return this.stamp({ kind, elementId, pins: [p, q], y: m, galvanic: y.re !== 0 || y.im !== 0 ? [[p, q]] : [] });
  }

  warn(message: string, elementId?: string): void {
    this.warnings.push({ message, ...(elementId ? { elementId } : {}) });
  }

  assume(text: string): void {
    this.assumptions.add(text);
  }
}
