// Linear temperature correction of conductor resistance, R2 = R1 [1 + α (T2 − T1)], with α given at the reference T1.

/** α at 75 °C as printed under NEC Chapter 9 Table 8 (source: NEC Chapter 9 Table 8, note). */
export const NEC_ALPHA_AT_75C = { copper: 0.00323, aluminum: 0.0033 } as const;

/** α at 20 °C, the usual figures for annealed copper and EC-grade aluminium (common practice, no source). */
export const IEC_ALPHA_AT_20C = { copper: 0.00393, aluminum: 0.00403 } as const;

// Below this the linear law is meaningless (the resistance would go negative near −234 °C for copper).
const LOWEST_TEMPERATURE_C = -60;
const HIGHEST_TEMPERATURE_C = 250;

export function correctResistance(
  ohmsAtReference: number,
  alphaPerC: number,
  referenceC: number,
  temperatureC: number,
): number {
  if (!Number.isFinite(temperatureC) || temperatureC < LOWEST_TEMPERATURE_C || temperatureC > HIGHEST_TEMPERATURE_C) {
    throw new RangeError(
      `conductor temperature ${temperatureC} °C is outside ${LOWEST_TEMPERATURE_C} to ${HIGHEST_TEMPERATURE_C} °C`,
    );
  }
  return ohmsAtReference * (1 + alphaPerC * (temperatureC - referenceC));
}
