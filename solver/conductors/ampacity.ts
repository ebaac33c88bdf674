// NEC (NFPA 70) Table 310.16 ampacities (not more than three current-carrying conductors in raceway, cable or earth,
// 30 °C ambient) with the ambient correction of 310.15(B), the adjustment of 310.15(C)(1), the small-conductor
// overcurrent limits of 240.4(D) and the neutral counting rule of 310.15(E). All table values are from memory:
// copper 14 AWG–500 kcmil and aluminium 75 °C 12 AWG–500 kcmil as listed in REFERENCES.md, the aluminium 60 and 90 °C
// columns and the 600 and 750 kcmil rows recalled here.

import type { AwgKcmilSize, ConductorMaterial } from '../../shared/conductor-sizes';
import { formatSize } from '../../shared/conductor-sizes';

export type InsulationTempC = 60 | 75 | 90;
type AmpacityRow = readonly [at60C: number, at75C: number, at90C: number];

const COPPER_AMPERES: Record<AwgKcmilSize, AmpacityRow> = {
  '14': [15, 20, 25],
  '12': [20, 25, 30],
  '10': [30, 35, 40],
  '8': [40, 50, 55],
  '6': [55, 65, 75],
  '4': [70, 85, 95],
  '3': [85, 100, 115],
  '2': [95, 115, 130],
  '1': [110, 130, 145],
  '1/0': [125, 150, 170],
  '2/0': [145, 175, 195],
  '3/0': [165, 200, 225],
  '4/0': [195, 230, 260],
  '250': [215, 255, 290],
  '300': [240, 285, 320],
  '350': [260, 310, 350],
  '400': [280, 335, 380],
  '500': [320, 380, 430],
  '600': [350, 420, 475],
  '750': [400, 475, 535],
};

const ALUMINUM_AMPERES: Record<AwgKcmilSize, AmpacityRow | null> = {
  '14': null,
  '12': [15, 20, 25],
  '10': [25, 30, 35],
  '8': [35, 40, 45],
  '6': [40, 50, 55],
  '4': [55, 65, 75],
  '3': [65, 75, 85],
  '2': [75, 90, 100],
  '1': [85, 100, 115],
  '1/0': [100, 120, 135],
  '2/0': [115, 135, 150],
  '3/0': [130, 155, 175],
  '4/0': [150, 180, 205],
  '250': [170, 205, 230],
  '300': [195, 230, 260],
  '350': [210, 250, 280],
  '400': [225, 270, 305],
  '500': [260, 310, 350],
  '600': [285, 340, 385],
  '750': [320, 385, 435],
};

const COLUMN: Record<InsulationTempC, 0 | 1 | 2> = { 60: 0, 75: 1, 90: 2 };

export const TABLE_310_16_AMBIENT_C = 30;

/** Table 310.16 ampacity before any correction or adjustment. */
export function tableAmpacity(size: AwgKcmilSize, material: ConductorMaterial, insulationTempC: InsulationTempC): number {
  const column = COLUMN[insulationTempC];
  if (column === undefined) throw new RangeError(`insulation rating ${insulationTempC} °C is not a 310.16 column (60, 75, 90)`);
  const table = material === 'copper' ? COPPER_AMPERES : material === 'aluminum' ? ALUMINUM_AMPERES : undefined;
  if (!table) throw new RangeError(`unknown conductor material "${material}"`);
  if (!(size in table)) throw new RangeError(`NEC Table 310.16 has no size "${size}"`);
  const row = table[size];
  if (!row) throw new RangeError(`NEC Table 310.16 has no entry for ${formatSize(size)} ${material}`);
  return row[column];
}

/** 310.15(B) equation: sqrt((Tc − Ta) / (Tc − 30)), the correction for an ambient other than 30 °C. */
export function ambientCorrectionFactor(insulationTempC: number, ambientC: number): number {
  if (!Number.isFinite(ambientC)) throw new RangeError(`ambient temperature ${ambientC} °C is not a number`);
  if (ambientC >= insulationTempC) {
    throw new RangeError(`ambient ${ambientC} °C is at or above the ${insulationTempC} °C insulation rating: no ampacity`);
  }
  return Math.sqrt((insulationTempC - ambientC) / (insulationTempC - TABLE_310_16_AMBIENT_C));
}

// 310.15(C)(1): upper bound of each band of current-carrying conductors and its factor (rows past 20 from memory).
const ADJUSTMENT_BANDS: ReadonlyArray<readonly [maxConductors: number, factor: number]> = [
  [3, 1],
  [6, 0.8],
  [9, 0.7],
  [20, 0.5],
  [30, 0.45],
  [40, 0.4],
  [Infinity, 0.35],
];

/** 310.15(C)(1) factor for the number of current-carrying conductors in one raceway or cable. */
export function moreThanThreeAdjustmentFactor(currentCarryingConductors: number): number {
  if (!Number.isInteger(currentCarryingConductors) || currentCarryingConductors < 1) {
    throw new RangeError(`current-carrying conductor count ${currentCarryingConductors} must be a whole number ≥ 1`);
  }
  for (const [max, factor] of ADJUSTMENT_BANDS) if (currentCarryingConductors <= max) return factor;
  return ADJUSTMENT_BANDS[ADJUSTMENT_BANDS.length - 1][1];
}

// 240.4(D): the largest overcurrent device allowed on the small conductors, whatever their ampacity.
const SMALL_CONDUCTOR_LIMIT_AMPERES: Partial<Record<`${ConductorMaterial} ${AwgKcmilSize}`, number>> = {
  'copper 14': 15,
  'copper 12': 20,
  'copper 10': 30,
  'aluminum 12': 15,
  'aluminum 10': 25,
};

/** 240.4(D) limit, or undefined when the size is not a small conductor. */
export function smallConductorOvercurrentLimit(size: AwgKcmilSize, material: ConductorMaterial): number | undefined {
  return SMALL_CONDUCTOR_LIMIT_AMPERES[`${material} ${size}`];
}

export interface AmpacityInput {
  size: AwgKcmilSize;
  material: ConductorMaterial;
  insulationTempC: InsulationTempC;
  ambientC?: number;
  currentCarryingConductors?: number;
}

export interface AmpacityResult {
  tableAmperes: number;
  ambientFactor: number;
  adjustmentFactor: number;
  /** Table value × ambient factor × adjustment factor. Not capped by 240.4(D), which limits the breaker, not the wire. */
  amperes: number;
  overcurrentLimitAmperes?: number;
}

/** Allowable ampacity after correction and adjustment (termination temperature limits of 110.14(C) not applied). */
export function ampacity(input: AmpacityInput): AmpacityResult {
  const { size, material, insulationTempC } = input;
  const tableAmperes = tableAmpacity(size, material, insulationTempC);
  const ambientFactor = ambientCorrectionFactor(insulationTempC, input.ambientC ?? TABLE_310_16_AMBIENT_C);
  const adjustmentFactor = moreThanThreeAdjustmentFactor(input.currentCarryingConductors ?? 3);
  const result: AmpacityResult = {
    tableAmperes,
    ambientFactor,
    adjustmentFactor,
    amperes: tableAmperes * ambientFactor * adjustmentFactor,
  };
  const limit = smallConductorOvercurrentLimit(size, material);
  if (limit !== undefined) result.overcurrentLimitAmperes = limit;
  return result;
}

export interface NeutralCountingInput {
  system: 'wye-4-wire' | 'split-phase' | 'delta';
  /** Ungrounded (phase) conductors of the circuit that share this neutral: 1, 2 or 3. */
  phasesInCircuit: number;
  nonLinearMajority: boolean;
}

/**
 * 310.15(E): does the neutral count as a current-carrying conductor? A neutral that carries only the unbalance of its
 * circuit does not; the neutral of two phases of a four-wire wye does (it carries about a phase's current), and so does
 * a four-wire wye neutral whose load is mostly non-linear (triplen harmonics add in it). The neutral of a two-wire
 * circuit carries the whole load current and always counts (common practice, no source).
 */
export function neutralCountsAsCurrentCarrying(input: NeutralCountingInput): boolean {
  const { system, phasesInCircuit, nonLinearMajority } = input;
  if (![1, 2, 3].includes(phasesInCircuit)) {
    throw new RangeError(`phasesInCircuit ${phasesInCircuit} must be 1, 2 or 3`);
  }
  if (phasesInCircuit === 1) return true;
  switch (system) {
    case 'wye-4-wire':
      return phasesInCircuit === 2 || nonLinearMajority;
    case 'split-phase':
      if (phasesInCircuit === 3) throw new RangeError('a split-phase system has only two ungrounded conductors');
      // The two halves are 180° apart, so the neutral carries only their difference (odd harmonics too).
      return false;
    case 'delta':
      // The neutral of a four-wire (high-leg) delta serves the 120/240 V part and carries only its unbalance.
      return false;
    default:
      throw new RangeError(`unknown system "${system as string}"`);
  }
}

export interface CurrentCarryingInput {
  /** Phase conductors of the run (A, B, C present). */
  phases: number;
  hasNeutral: boolean;
  /** The system the neutral belongs to; needed when the run has a neutral and a phase. */
  system?: NeutralCountingInput['system'];
  nonLinearMajority: boolean;
  /** The count the sheet gives (conductorsInRaceway), which then stands as given. */
  given?: number;
}

export interface CurrentCarryingCount {
  count: number;
  countFrom: 'sheet' | 'counted';
  /** Whether the neutral was counted; absent without a neutral or when the sheet gives the count. */
  neutralCounted?: boolean;
  /** Why, in words (310.15(E) paragraph). */
  reason?: string;
}

/** Current-carrying conductors of one raceway for 310.15(C)(1), the neutral counted per 310.15(E), with the reason. */
export function countCurrentCarrying(input: CurrentCarryingInput): CurrentCarryingCount {
  const { phases, hasNeutral, system, nonLinearMajority, given } = input;
  if (given !== undefined) return { count: given, countFrom: 'sheet', reason: 'count given on the sheet' };
  if (!hasNeutral || phases === 0 || !system) return { count: Math.max(phases, 1), countFrom: 'counted' };
  const counted = neutralCountsAsCurrentCarrying({ system, phasesInCircuit: Math.min(phases, 3), nonLinearMajority });
  let reason: string;
  if (phases === 1) reason = 'the neutral of a two-wire circuit carries the whole current and counts';
  else if (system === 'wye-4-wire' && phases === 2) reason = 'the neutral counts, 310.15(E)(2): two phases and the neutral of a 4-wire wye';
  else if (system === 'wye-4-wire' && nonLinearMajority) reason = 'the neutral counts, 310.15(E)(3): a 4-wire wye circuit whose load is mostly non-linear';
  else if (system === 'wye-4-wire') reason = 'the neutral is not counted, 310.15(E)(1): it carries only the unbalanced current';
  else if (system === 'split-phase') reason = 'the neutral is not counted, 310.15(E)(1): on 120/240 V it carries only the unbalance of the two halves';
  else reason = 'the neutral is not counted, 310.15(E)(1): on a four-wire delta it carries only the unbalance of the 120/240 V part';
  return { count: phases + (counted ? 1 : 0), countFrom: 'counted', neutralCounted: counted, reason };
}

/** NEC 240.6(A) standard ampere ratings of fuses and inverse-time breakers, up to 6000 A (from memory). */
export const STANDARD_OVERCURRENT_RATINGS_AMPERES = [
  15, 20, 25, 30, 35, 40, 45, 50, 60, 70, 80, 90, 100, 110, 125, 150, 175, 200, 225, 250, 300, 350, 400, 450, 500, 600,
  700, 800, 1000, 1200, 1600, 2000, 2500, 3000, 4000, 5000, 6000,
] as const;

/**
 * The largest overcurrent device that 240.4(B) lets protect a conductor of this ampacity: the ampacity itself when
 * it is a standard rating, else the next standard rating above it as long as that is 800 A or less.
 */
export function largestProtectionAmperes(ampacityAmperes: number): number {
  if (!(ampacityAmperes > 0)) return 0;
  const next = STANDARD_OVERCURRENT_RATINGS_AMPERES.find((r) => r >= ampacityAmperes - 1e-9);
  if (next === undefined) return ampacityAmperes;
  return next <= 800 || Math.abs(next - ampacityAmperes) < 1e-9 ? next : ampacityAmperes;
}
