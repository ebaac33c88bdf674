// NEC (NFPA 70) Chapter 9 Table 8: DC resistance of stranded uncoated conductors at 75 °C, ohms per 1000 ft.
// Values 14 AWG–500 kcmil as read in a reproduction of the table; 600 and 750 kcmil from memory of the same table.

import type { AwgKcmilSize, ConductorMaterial } from '../../shared/conductor-sizes';
import { formatSize } from '../../shared/conductor-sizes';
import { correctResistance, NEC_ALPHA_AT_75C } from './temperature';

interface Table8Row {
  copper: number;
  aluminum: number | null; // the table lists no 14 AWG aluminium
}

const TABLE_8_OHMS_PER_1000FT_AT_75C: Record<AwgKcmilSize, Table8Row> = {
  '14': { copper: 3.14, aluminum: null },
  '12': { copper: 1.98, aluminum: 3.25 },
  '10': { copper: 1.24, aluminum: 2.04 },
  '8': { copper: 0.778, aluminum: 1.28 },
  '6': { copper: 0.491, aluminum: 0.808 },
  '4': { copper: 0.308, aluminum: 0.508 },
  '3': { copper: 0.245, aluminum: 0.403 },
  '2': { copper: 0.194, aluminum: 0.319 },
  '1': { copper: 0.154, aluminum: 0.253 },
  '1/0': { copper: 0.122, aluminum: 0.201 },
  '2/0': { copper: 0.0967, aluminum: 0.159 },
  '3/0': { copper: 0.0766, aluminum: 0.126 },
  '4/0': { copper: 0.0608, aluminum: 0.1 },
  '250': { copper: 0.0515, aluminum: 0.0847 },
  '300': { copper: 0.0429, aluminum: 0.0707 },
  '350': { copper: 0.0367, aluminum: 0.0605 },
  '400': { copper: 0.0321, aluminum: 0.0529 },
  '500': { copper: 0.0258, aluminum: 0.0424 },
  '600': { copper: 0.0214, aluminum: 0.0353 }, // from memory
  '750': { copper: 0.0171, aluminum: 0.0282 }, // from memory
};

export const NEC_TABLE_8_REFERENCE_C = 75;

/** DC resistance per 1000 ft at the given conductor temperature (°C), corrected with the table's α. */
export function necDcOhmsPer1000Ft(
  size: AwgKcmilSize,
  material: ConductorMaterial,
  temperatureC = NEC_TABLE_8_REFERENCE_C,
): number {
  const row = TABLE_8_OHMS_PER_1000FT_AT_75C[size];
  if (!row) throw new RangeError(`NEC Chapter 9 Table 8 has no size "${size}"`);
  const ohms = row[material];
  if (ohms === undefined) throw new RangeError(`unknown conductor material "${material}"`);
  if (ohms === null) throw new RangeError(`NEC Chapter 9 Table 8 has no entry for ${formatSize(size)} ${material}`);
  return correctResistance(ohms, NEC_ALPHA_AT_75C[material], NEC_TABLE_8_REFERENCE_C, temperatureC);
}
