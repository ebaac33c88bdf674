// IEC 60228 Table 2, class 2 (stranded) conductors: maximum DC resistance at 20 °C in ohms per km, plain copper and
// aluminium (values recalled, as listed in REFERENCES.md), with a typical low-voltage cable reactance.

import type { ConductorMaterial, MetricSizeMm2 } from '../../shared/conductor-sizes';
import { correctResistance, IEC_ALPHA_AT_20C } from './temperature';

interface Table2Row {
  copper: number;
  aluminum: number | null; // class 2 aluminium starts at 10 mm²
}

const TABLE_2_OHMS_PER_KM_AT_20C: Record<MetricSizeMm2, Table2Row> = {
  1.5: { copper: 12.1, aluminum: null },
  2.5: { copper: 7.41, aluminum: null },
  4: { copper: 4.61, aluminum: null },
  6: { copper: 3.08, aluminum: null },
  10: { copper: 1.83, aluminum: 3.08 },
  16: { copper: 1.15, aluminum: 1.91 },
  25: { copper: 0.727, aluminum: 1.2 },
  35: { copper: 0.524, aluminum: 0.868 },
  50: { copper: 0.387, aluminum: 0.641 },
  70: { copper: 0.268, aluminum: 0.443 },
  95: { copper: 0.193, aluminum: 0.32 },
  120: { copper: 0.153, aluminum: 0.253 },
  150: { copper: 0.124, aluminum: 0.206 },
  185: { copper: 0.0991, aluminum: 0.164 },
  240: { copper: 0.0754, aluminum: 0.125 },
};

// Reactance per km at 50 Hz of a multicore LV cable (cores touching), a typical figure per size that falls slowly
// as the cores grow (common practice, no source). Single cores spaced apart have more.
const MULTICORE_REACTANCE_OHMS_PER_KM_50HZ: Record<MetricSizeMm2, number> = {
  1.5: 0.1,
  2.5: 0.095,
  4: 0.092,
  6: 0.088,
  10: 0.084,
  16: 0.081,
  25: 0.08,
  35: 0.078,
  50: 0.077,
  70: 0.075,
  95: 0.075,
  120: 0.074,
  150: 0.074,
  185: 0.074,
  240: 0.073,
};

export const IEC_60228_REFERENCE_C = 20;
/** Maximum operating temperature of PVC insulation, the usual figure for LV voltage-drop work (common practice). */
export const PVC_OPERATING_C = 70;

function tableRow(mm2: MetricSizeMm2): Table2Row {
  const row = TABLE_2_OHMS_PER_KM_AT_20C[mm2];
  if (!row) throw new RangeError(`IEC 60228 Table 2 has no size ${mm2} mm²`);
  return row;
}

/** Maximum DC resistance per km at the given temperature, corrected with α at 20 °C. */
export function iecDcOhmsPerKm(
  mm2: MetricSizeMm2,
  material: ConductorMaterial,
  temperatureC = IEC_60228_REFERENCE_C,
): number {
  const row = tableRow(mm2);
  const ohms = row[material];
  if (ohms === undefined) throw new RangeError(`unknown conductor material "${material}"`);
  if (ohms === null) throw new RangeError(`IEC 60228 Table 2 (class 2) has no entry for ${mm2} mm² ${material}`);
  return correctResistance(ohms, IEC_ALPHA_AT_20C[material], IEC_60228_REFERENCE_C, temperatureC);
}

/**
 * Series impedance per km of a multicore LV cable. R is the DC resistance at temperature (skin effect is at most
 * a few per cent up to 240 mm² at these frequencies, ignored); X is the typical 50 Hz figure scaled with frequency.
 */
export function iecImpedancePerKm(
  mm2: MetricSizeMm2,
  material: ConductorMaterial,
  frequencyHz: 50 | 60,
  temperatureC = PVC_OPERATING_C,
): { rOhms: number; xOhms: number } {
  if (frequencyHz !== 50 && frequencyHz !== 60) throw new RangeError(`frequency ${frequencyHz} Hz must be 50 or 60`);
  const rOhms = iecDcOhmsPerKm(mm2, material, temperatureC);
  const xOhms = MULTICORE_REACTANCE_OHMS_PER_KM_50HZ[mm2] * (frequencyHz / 50);
  return { rOhms, xOhms };
}
