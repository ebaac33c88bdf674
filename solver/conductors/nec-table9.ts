// NEC (NFPA 70) Chapter 9 Table 9: AC resistance and reactance of 600 V cables, three single conductors in conduit,
// 60 Hz, 75 °C, ohms to neutral per 1000 ft. Values 14 AWG–500 kcmil as read in reproductions of the table;
// 600 and 750 kcmil from memory of the same table. These are positive-sequence (phase-to-neutral) ohms.

import type { AwgKcmilSize, ConductorMaterial, RacewayKind } from '../../shared/conductor-sizes';
import { formatSize } from '../../shared/conductor-sizes';
import { correctResistance, NEC_ALPHA_AT_75C } from './temperature';

// Column order of the printed table.
type Table9Row = readonly [
  xPvcOrAluminum: number,
  xSteel: number,
  rCopperPvc: number,
  rCopperAluminum: number,
  rCopperSteel: number,
  rAluminumPvc: number | null,
  rAluminumAluminum: number | null,
  rAluminumSteel: number | null,
];

const TABLE_9_OHMS_PER_1000FT: Record<AwgKcmilSize, Table9Row> = {
  '14': [0.058, 0.073, 3.1, 3.1, 3.1, null, null, null],
  '12': [0.054, 0.068, 2.0, 2.0, 2.0, 3.2, 3.2, 3.2],
  '10': [0.05, 0.063, 1.2, 1.2, 1.2, 2.0, 2.0, 2.0],
  '8': [0.052, 0.065, 0.78, 0.78, 0.78, 1.3, 1.3, 1.3],
  '6': [0.051, 0.064, 0.49, 0.49, 0.49, 0.81, 0.81, 0.81],
  '4': [0.048, 0.06, 0.31, 0.31, 0.31, 0.51, 0.51, 0.51],
  '3': [0.047, 0.059, 0.25, 0.25, 0.25, 0.4, 0.41, 0.4],
  '2': [0.045, 0.057, 0.19, 0.2, 0.2, 0.32, 0.32, 0.32],
  '1': [0.046, 0.057, 0.15, 0.16, 0.16, 0.25, 0.26, 0.25],
  '1/0': [0.044, 0.055, 0.12, 0.13, 0.12, 0.2, 0.21, 0.2],
  '2/0': [0.043, 0.054, 0.1, 0.1, 0.1, 0.16, 0.16, 0.16],
  '3/0': [0.042, 0.052, 0.077, 0.082, 0.079, 0.13, 0.13, 0.13],
  '4/0': [0.041, 0.051, 0.062, 0.067, 0.063, 0.1, 0.11, 0.1],
  '250': [0.041, 0.052, 0.052, 0.057, 0.054, 0.085, 0.09, 0.086],
  '300': [0.041, 0.051, 0.044, 0.049, 0.045, 0.071, 0.076, 0.072],
  '350': [0.04, 0.05, 0.038, 0.043, 0.039, 0.061, 0.066, 0.063],
  '400': [0.04, 0.049, 0.033, 0.038, 0.035, 0.054, 0.059, 0.055],
  '500': [0.039, 0.048, 0.027, 0.032, 0.029, 0.043, 0.048, 0.045],
  '600': [0.039, 0.048, 0.023, 0.028, 0.025, 0.036, 0.041, 0.038], // from memory
  '750': [0.038, 0.048, 0.019, 0.024, 0.021, 0.029, 0.034, 0.031], // from memory
};

const R_COLUMN: Record<ConductorMaterial, Record<RacewayKind, number>> = {
  copper: { pvc: 2, aluminum: 3, steel: 4 },
  aluminum: { pvc: 5, aluminum: 6, steel: 7 },
};

export const NEC_TABLE_9_REFERENCE_C = 75;

export interface SeriesImpedanceOhms {
  rOhms: number;
  xOhms: number;
}

/** Table 9 R and XL per 1000 ft at 75 °C, 60 Hz. */
export function necAcImpedancePer1000Ft(
  size: AwgKcmilSize,
  material: ConductorMaterial,
  raceway: RacewayKind,
): SeriesImpedanceOhms {
  const row = TABLE_9_OHMS_PER_1000FT[size];
  if (!row) throw new RangeError(`NEC Chapter 9 Table 9 has no size "${size}"`);
  const columns = R_COLUMN[material];
  if (!columns) throw new RangeError(`unknown conductor material "${material}"`);
  const rColumn = columns[raceway];
  if (rColumn === undefined) throw new RangeError(`unknown raceway "${raceway}"`);
  const rOhms = row[rColumn];
  if (rOhms === null) throw new RangeError(`NEC Chapter 9 Table 9 has no entry for ${formatSize(size)} ${material}`);
  // Steel conduit raises the reactance; PVC and aluminium conduit share one column.
  const xOhms = raceway === 'steel' ? row[1] : row[0];
  return { rOhms, xOhms };
}

/**
 * Table 9 values with R moved to another conductor temperature by the Table 8 α (our choice: the table prints
 * 75 °C only; the AC/DC ratio is taken as independent of temperature, common practice, no source).
 */
export function necAcImpedancePer1000FtAt(
  size: AwgKcmilSize,
  material: ConductorMaterial,
  raceway: RacewayKind,
  temperatureC: number,
): SeriesImpedanceOhms {
  const { rOhms, xOhms } = necAcImpedancePer1000Ft(size, material, raceway);
  return {
    rOhms: correctResistance(rOhms, NEC_ALPHA_AT_75C[material], NEC_TABLE_9_REFERENCE_C, temperatureC),
    xOhms,
  };
}

/** Effective impedance Ze = R cos θ + X sin θ per 1000 ft at a lagging power factor, as in the notes to Table 9. */
export function necEffectiveZPer1000Ft(
  size: AwgKcmilSize,
  material: ConductorMaterial,
  raceway: RacewayKind,
  powerFactor: number,
): number {
  if (!(powerFactor > 0 && powerFactor <= 1)) {
    throw new RangeError(`power factor ${powerFactor} must be in (0, 1]`);
  }
  const { rOhms, xOhms } = necAcImpedancePer1000Ft(size, material, raceway);
  const sinTheta = Math.sqrt(1 - powerFactor * powerFactor);
  return rOhms * powerFactor + xOhms * sinTheta;
}
