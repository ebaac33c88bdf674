// NEC Chapter 9 Table 8 read back, and its temperature correction.
import { describe, expect, it } from 'vitest';
import { necDcOhmsPer1000Ft } from '../../../solver/conductors/nec-table8';
import { AWG_KCMIL_SIZES } from '../../../shared/conductor-sizes';

describe('NEC Chapter 9 Table 8, DC resistance at 75 °C', () => {
  it.each([
    // source: NEC Chapter 9 Table 8 (uncoated copper / aluminium, Ω per 1000 ft)
    ['14', 'copper', 3.14],
    ['12', 'copper', 1.98],
    ['12', 'aluminum', 3.25],
    ['8', 'aluminum', 1.28],
    ['4', 'copper', 0.308],
    ['1/0', 'aluminum', 0.201],
    ['2/0', 'copper', 0.0967],
    ['4/0', 'copper', 0.0608],
    ['4/0', 'aluminum', 0.1],
    ['250', 'aluminum', 0.0847],
    ['500', 'copper', 0.0258],
    ['500', 'aluminum', 0.0424],
    // from memory: NEC Chapter 9 Table 8, 600 and 750 kcmil rows
    ['600', 'copper', 0.0214],
    ['750', 'aluminum', 0.0282],
  ] as const)('%s %s reads %f Ω', (size, material, ohms) => {
    expect(necDcOhmsPer1000Ft(size, material)).toBe(ohms);
  });

  it('falls as the size grows, and aluminium is about 1.64 times copper', () => {
    // common practice, no source: resistance is monotone in size; EC aluminium has 61 % of copper's conductivity
    for (let i = 1; i < AWG_KCMIL_SIZES.length; i++) {
      const smaller = AWG_KCMIL_SIZES[i - 1];
      const larger = AWG_KCMIL_SIZES[i];
      expect(necDcOhmsPer1000Ft(larger, 'copper')).toBeLessThan(necDcOhmsPer1000Ft(smaller, 'copper'));
      if (i >= 2) expect(necDcOhmsPer1000Ft(larger, 'aluminum')).toBeLessThan(necDcOhmsPer1000Ft(smaller, 'aluminum'));
      const ratio = necDcOhmsPer1000Ft(larger, 'aluminum') / necDcOhmsPer1000Ft(larger, 'copper');
      expect(ratio).toBeGreaterThan(1.6);
      expect(ratio).toBeLessThan(1.7);
    }
  });

  it('has no 14 AWG aluminium entry and says so', () => {
    // source: NEC Chapter 9 Table 8 lists no aluminium 14 AWG
    expect(() => necDcOhmsPer1000Ft('14', 'aluminum')).toThrow(RangeError);
    expect(() => necDcOhmsPer1000Ft('14', 'aluminum')).toThrow(/14 AWG aluminum/);
  });

  it('rejects a size the table does not have', () => {
    expect(() => necDcOhmsPer1000Ft('18' as never, 'copper')).toThrow(/no size "18"/);
  });
});

describe('Table 8 temperature correction R2 = R1 [1 + α (T2 − 75)]', () => {
  it('moves 12 AWG copper to 90 °C and 4/0 aluminium to 20 °C', () => {
    // source: NEC Chapter 9 Table 8 note, α = 0.00323 copper, 0.00330 aluminium
    expect(necDcOhmsPer1000Ft('12', 'copper', 90)).toBeCloseTo(1.98 * (1 + 0.00323 * 15), 10);
    expect(necDcOhmsPer1000Ft('4/0', 'aluminum', 20)).toBeCloseTo(0.1 * (1 - 0.0033 * 55), 10);
  });

  it('agrees with the 20 °C coefficients of copper and aluminium referred to 75 °C', () => {
    // common practice, no source: α20 = 0.00393 (Cu), 0.00403 (Al); α at T is 1 / (1/α20 + T − 20).
    // Going 75 → 20 °C with the NEC α and back with α20 must return the table value within the 3-digit rounding of α.
    for (const [material, alpha20] of [['copper', 0.00393], ['aluminum', 0.00403]] as const) {
      const at20 = necDcOhmsPer1000Ft('1/0', material, 20);
      const backAt75 = at20 * (1 + alpha20 * 55);
      expect(Math.abs(backAt75 / necDcOhmsPer1000Ft('1/0', material) - 1)).toBeLessThan(1e-3);
    }
  });

  it('refuses an absurd temperature', () => {
    expect(() => necDcOhmsPer1000Ft('12', 'copper', 900)).toThrow(/900 °C/);
  });
});
