// IEC 60228 class 2 resistance read back, temperature correction, and LV cable reactance at 50 and 60 Hz.
import { describe, expect, it } from 'vitest';
import { iecDcOhmsPerKm, iecImpedancePerKm } from '../../../solver/conductors/iec-60228';
import { METRIC_SIZES_MM2 } from '../../../shared/conductor-sizes';

describe('IEC 60228 Table 2, class 2, maximum DC resistance at 20 °C (Ω/km)', () => {
  it.each([
    // source: IEC 60228 Table 2, class 2, from memory (as listed in REFERENCES.md)
    [1.5, 'copper', 12.1],
    [2.5, 'copper', 7.41],
    [6, 'copper', 3.08],
    [10, 'aluminum', 3.08],
    [16, 'copper', 1.15],
    [35, 'aluminum', 0.868],
    [50, 'copper', 0.387],
    [95, 'aluminum', 0.32],
    [185, 'copper', 0.0991],
    [240, 'copper', 0.0754],
    [240, 'aluminum', 0.125],
  ] as const)('%f mm² %s reads %f', (mm2, material, ohms) => {
    expect(iecDcOhmsPerKm(mm2, material)).toBe(ohms);
  });

  it('has no class 2 aluminium below 10 mm²', () => {
    // source: IEC 60228 Table 2, from memory: the aluminium column starts at 10 mm²
    expect(() => iecDcOhmsPerKm(6, 'aluminum')).toThrow(/6 mm² aluminum/);
  });

  it('scales as 1/area: resistance × area stays within 17.2–19.8 Ω·mm²/km for copper', () => {
    // common practice, no source: annealed copper 17.24 Ω·mm²/km at 20 °C plus stranding and tolerance allowance
    for (const mm2 of METRIC_SIZES_MM2) {
      const product = iecDcOhmsPerKm(mm2, 'copper') * mm2;
      expect(product).toBeGreaterThan(17.2);
      expect(product).toBeLessThan(19.8);
    }
  });
});

describe('IEC 60228 temperature correction R2 = R1 [1 + α20 (T2 − 20)]', () => {
  it('moves 95 mm² copper and aluminium to 70 °C', () => {
    // source: REFERENCES.md α at 20 °C, 0.00393 copper, 0.00403 aluminium (common practice, no source)
    expect(iecDcOhmsPerKm(95, 'copper', 70)).toBeCloseTo(0.193 * (1 + 0.00393 * 50), 12);
    expect(iecDcOhmsPerKm(95, 'aluminum', 70)).toBeCloseTo(0.32 * (1 + 0.00403 * 50), 12);
  });

  it('uses 70 °C as the default operating temperature of the impedance', () => {
    // common practice, no source: PVC-insulated LV cable runs at most at 70 °C
    expect(iecImpedancePerKm(25, 'copper', 50).rOhms).toBeCloseTo(iecDcOhmsPerKm(25, 'copper', 70), 12);
  });
});

describe('LV cable reactance', () => {
  it('is a typical 0.07–0.10 Ω/km at 50 Hz that does not grow with size', () => {
    // common practice, no source: multicore LV cable reactance is about 0.08 Ω/km at 50 Hz
    let previous = Infinity;
    for (const mm2 of METRIC_SIZES_MM2) {
      const x = iecImpedancePerKm(mm2, 'copper', 50).xOhms;
      expect(x).toBeGreaterThanOrEqual(0.07);
      expect(x).toBeLessThanOrEqual(0.1);
      expect(x).toBeLessThanOrEqual(previous);
      previous = x;
    }
  });

  it('scales with frequency: the 60 Hz value is 6/5 of the 50 Hz value, R unchanged', () => {
    // source: REFERENCES.md (inductive reactance is proportional to frequency, X = 2πfL)
    for (const mm2 of [1.5, 25, 240] as const) {
      const at50 = iecImpedancePerKm(mm2, 'copper', 50, 20);
      const at60 = iecImpedancePerKm(mm2, 'copper', 60, 20);
      expect(at60.xOhms / at50.xOhms).toBeCloseTo(6 / 5, 12);
      expect(at60.rOhms).toBe(at50.rOhms);
    }
  });

  it('rejects another frequency', () => {
    expect(() => iecImpedancePerKm(25, 'copper', 400 as never)).toThrow(/400 Hz/);
  });
});
