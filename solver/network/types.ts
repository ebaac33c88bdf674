// The network the solver works on: pins (one per conductor of each element terminal), zero-impedance ties between
// pins, admittance stamps over pins, and the loads' elements. Everything is in volts, amperes, siemens.
import type { Complex, ComplexMatrix } from '../complex';
import type { ConductorId, LoadKind } from '../../shared/sheet';

/** A conductor of an element's terminal (or an internal point such as a source's star point). Pin 0 is remote earth. */
export interface PinInfo {
  elementId: string;
  terminal: string;
  conductor: string;
}

export type TieKind =
  | 'connection'
  | 'bus-bar'
  | 'bond'
  | 'breaker-pole'
  | 'breaker-neutral'
  | 'source-emf'
  | 'source-neutral'
  | 'solid-ground';

/** A zero-impedance tie: V(a) − V(b) = offset (zero except for an ideal source's EMF). */
export interface Tie {
  a: number;
  b: number;
  offset: Complex;
  kind: TieKind;
  elementId: string;
  conductor: string;
}

export type StampKind =
  | 'run'
  | 'source-impedance'
  | 'transformer'
  | 'load'
  | 'electrode'
  | 'grounding'
  | 'degraded-connection';

/** An admittance block over pins: the currents into the element at its pins are y · v(pins) (minus its sources). */
export interface Stamp {
  kind: StampKind;
  elementId: string;
  pins: number[];
  y: ComplexMatrix;
  /** Pin pairs joined galvanically inside the element (a transformer joins only the two ends of each winding). */
  galvanic: [number, number][];
  /** For loads: the index of the load element this stamp belongs to. */
  loadElement?: number;
}

export interface LoadBehaviour {
  impedance: number;
  current: number;
  power: number;
}

/** One two-terminal element of a load (a three-phase load has three). */
export interface LoadPart {
  loadId: string;
  /** e.g. "A–N", "A–B" in the load's own conductor names. */
  label: string;
  p: number;
  q: number;
  /** Complex power at rated voltage, VA (kW × 1000 + j kvar × 1000), already scaled by any what-if. */
  ratedVa: Complex;
  ratedVolts: number;
  behaviour: LoadBehaviour;
  loadKind: LoadKind;
  /** Admittance stamped at rated voltage, conj(S) / |V|². */
  y: Complex;
  stampIndex: number;
}

/** Where each conductor of a run sits in its stamp, for currents and openings. */
export interface RunLayout {
  runId: string;
  stampIndex: number;
  conductors: { conductor: ConductorId; fromPin: number; toPin: number; open: boolean; addedOhms: number }[];
  /** Series impedance of each conductor (no openings), ohms, for the results' drop and assumptions. */
  impedanceOhms: ComplexMatrix;
  mutualCoupling: boolean;
}

export interface SourceLayout {
  sourceId: string;
  /** Ties carrying the EMF of each phase, star point → phase. */
  emfTies: { conductor: ConductorId; tieIndex: number }[];
  starPin: number;
}

export interface NetworkWarning {
  elementId?: string;
  message: string;
}

export interface Network {
  pins: PinInfo[];
  /** Map "elementId|terminal|conductor" → pin (bus terminals all alias the bars). */
  pinIndex: Map<string, number>;
  ties: Tie[];
  stamps: Stamp[];
  loads: LoadPart[];
  runs: RunLayout[];
  sources: SourceLayout[];
  /** Nominal (no-load, ideal) voltage phasor of every pin against remote earth, for zones, scaling and standing. */
  nominal: Complex[];
  warnings: NetworkWarning[];
  assumptions: string[];
}

export const EARTH_PIN = 0;
export const pinKey = (elementId: string, terminal: string, conductor: string) => `${elementId}|${terminal}|${conductor}`;
