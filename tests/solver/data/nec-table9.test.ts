// NEC Chapter 9 Table 9 read back, and the effective impedance Ze at a power factor.
import { describe, expect, it } from 'vitest';
import {
  necAcImpedancePer1000Ft,
  necAcImpedancePer1000FtAt,
  necEffectiveZPer1000Ft,
} from '../../../solver/conductors/nec-table9';

describe('NEC Chapter 9 Table 9, 60 Hz, 75 °C, Ω to neutral per 1000 ft', () => {
  it.each([
    // source: NEC Chapter 9 Table 9 (size, material, raceway, R, XL)
    ['14', 'copper', 'pvc', 3.1, 0.058],
    ['12', 'copper', 'steel', 2.0, 0.068],
    ['12', 'aluminum', 'aluminum', 3.2, 0.054],
    ['2', 'copper', 'aluminum', 0.2, 0.045],
    ['3', 'aluminum', 'aluminum', 0.41, 0.047],
    ['1/0', 'copper', 'steel', 0.12, 0.055],
    ['3/0', 'copper', 'aluminum', 0.082, 0.042],
    ['4/0', 'copper', 'pvc', 0.062, 0.041],
    ['4/0', 'aluminum', 'aluminum', 0.11, 0.041],
    ['250', 'aluminum', 'steel', 0.086, 0.052],
    ['350', 'aluminum', 'aluminum', 0.066, 0.04],
    ['500', 'copper', 'steel', 0.029, 0.048],
    ['500', 'aluminum', 'pvc', 0.043, 0.039],
    // from memory: NEC Chapter 9 Table 9, 600 and 750 kcmil rows
    ['600', 'copper', 'pvc', 0.023, 0.039],
    ['750', 'aluminum', 'steel', 0.031, 0.048],
  ] as const)('%s %s in %s conduit: R %f, X %f', (size, material, raceway, r, x) => {
    expect(necAcImpedancePer1000Ft(size, material, raceway)).toEqual({ rOhms: r, xOhms: x });
  });

  it('gives steel conduit more reactance than PVC for every size', () => {
    // source: NEC Chapter 9 Table 9, the two XL columns
    for (const size of ['14', '6', '1/0', '250', '500', '750'] as const) {
      expect(necAcImpedancePer1000Ft(size, 'copper', 'steel').xOhms).toBeGreaterThan(
        necAcImpedancePer1000Ft(size, 'copper', 'pvc').xOhms,
      );
    }
  });

  it('has no 14 AWG aluminium entry and names it', () => {
    // source: NEC Chapter 9 Table 9 lists no aluminium 14 AWG
    expect(() => necAcImpedancePer1000Ft('14', 'aluminum', 'pvc')).toThrow(RangeError);
    expect(() => necAcImpedancePer1000Ft('14', 'aluminum', 'steel')).toThrow(/14 AWG aluminum/);
  });

  it('moves R (not X) to another temperature with the Table 8 α', () => {
    // source: NEC Chapter 9 Table 8 note, α = 0.00323 for copper
    const at90 = necAcImpedancePer1000FtAt('4/0', 'copper', 'pvc', 90);
    expect(at90.rOhms).toBeCloseTo(0.062 * (1 + 0.00323 * 15), 10);
    expect(at90.xOhms).toBe(0.041);
  });
});

describe('Effective Z at 0.85 power factor, copper in PVC conduit', () => {
  // Tolerance: half a unit of the printed Ze plus the rounding of the printed R and X it is made from.
  const sin85 = Math.sqrt(1 - 0.85 ** 2);
  it.each([
    // source: NEC Chapter 9 Table 9, Ze column at 0.85 pf (size, printed Ze, unit of Ze, unit of R, unit of X)
    ['12', 1.7, 0.1, 0.1, 0.001],
    ['10', 1.1, 0.1, 0.1, 0.001],
    ['4', 0.29, 0.01, 0.01, 0.001],
    ['4/0', 0.074, 0.001, 0.001, 0.001],
    ['500', 0.043, 0.001, 0.001, 0.001],
  ] as const)('%s reads %f', (size, printed, zeUnit, rUnit, xUnit) => {
    const tolerance = (zeUnit + 0.85 * rUnit + sin85 * xUnit) / 2;
    expect(Math.abs(necEffectiveZPer1000Ft(size, 'copper', 'pvc', 0.85) - printed)).toBeLessThanOrEqual(tolerance + 1e-12);
  });

  it('is R at unity power factor and rejects a power factor outside (0, 1]', () => {
    // source: NEC Chapter 9 Table 9 notes, Ze = R cos θ + X sin θ
    expect(necEffectiveZPer1000Ft('4/0', 'copper', 'pvc', 1)).toBe(0.062);
    expect(() => necEffectiveZPer1000Ft('4/0', 'copper', 'pvc', 1.2)).toThrow(/power factor 1.2/);
    expect(() => necEffectiveZPer1000Ft('4/0', 'copper', 'pvc', 0)).toThrow(RangeError);
  });
});
