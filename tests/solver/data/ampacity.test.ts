// NEC 310.16 ampacity with the 310.15 corrections and adjustments, 240.4(D) limits and the 310.15(E) neutral rule.
import { describe, expect, it } from 'vitest';
import {
  ambientCorrectionFactor,
  ampacity,
  moreThanThreeAdjustmentFactor,
  neutralCountsAsCurrentCarrying,
  smallConductorOvercurrentLimit,
  tableAmpacity,
} from '../../../solver/conductors/ampacity';
import { AWG_KCMIL_SIZES } from '../../../shared/conductor-sizes';

describe('NEC Table 310.16, 30 °C, not more than three current-carrying conductors', () => {
  it.each([
    // source: NEC Table 310.16, from memory (size, material, 60 / 75 / 90 °C amperes)
    ['14', 'copper', [15, 20, 25]],
    ['12', 'copper', [20, 25, 30]],
    ['10', 'copper', [30, 35, 40]],
    ['6', 'copper', [55, 65, 75]],
    ['1/0', 'copper', [125, 150, 170]],
    ['4/0', 'copper', [195, 230, 260]],
    ['500', 'copper', [320, 380, 430]],
    ['600', 'copper', [350, 420, 475]],
    ['750', 'copper', [400, 475, 535]],
    ['12', 'aluminum', [15, 20, 25]],
    ['10', 'aluminum', [25, 30, 35]],
    ['2', 'aluminum', [75, 90, 100]],
    ['4/0', 'aluminum', [150, 180, 205]],
    ['500', 'aluminum', [260, 310, 350]],
    ['750', 'aluminum', [320, 385, 435]],
  ] as const)('%s %s: %j A', (size, material, [a60, a75, a90]) => {
    expect(tableAmpacity(size, material, 60)).toBe(a60);
    expect(tableAmpacity(size, material, 75)).toBe(a75);
    expect(tableAmpacity(size, material, 90)).toBe(a90);
  });

  it.each([
    // source: NEC Table 310.16, aluminium 75 °C column, from memory (as listed in REFERENCES.md)
    ['8', 40], ['6', 50], ['4', 65], ['3', 75], ['1', 100], ['1/0', 120], ['2/0', 135], ['3/0', 155],
    ['250', 205], ['300', 230], ['350', 250], ['400', 270],
  ] as const)('aluminium %s at 75 °C is %i A', (size, amperes) => {
    expect(tableAmpacity(size, 'aluminum', 75)).toBe(amperes);
  });

  it('rises with size and insulation rating in every column', () => {
    // common practice, no source: a larger conductor or a hotter rating never carries less
    for (const material of ['copper', 'aluminum'] as const) {
      const sizes = AWG_KCMIL_SIZES.filter((s) => !(material === 'aluminum' && s === '14'));
      for (let i = 0; i < sizes.length; i++) {
        expect(tableAmpacity(sizes[i], material, 60)).toBeLessThan(tableAmpacity(sizes[i], material, 75));
        expect(tableAmpacity(sizes[i], material, 75)).toBeLessThan(tableAmpacity(sizes[i], material, 90));
        if (i > 0) {
          for (const t of [60, 75, 90] as const) {
            expect(tableAmpacity(sizes[i], material, t)).toBeGreaterThan(tableAmpacity(sizes[i - 1], material, t));
          }
        }
      }
    }
  });

  it('has no 14 AWG aluminium entry', () => {
    // source: NEC Table 310.16 starts aluminium at 12 AWG (from memory)
    expect(() => tableAmpacity('14', 'aluminum', 75)).toThrow(/14 AWG aluminum/);
    expect(() => ampacity({ size: '14', material: 'aluminum', insulationTempC: 90 })).toThrow(RangeError);
  });
});

describe('310.15(B) ambient correction sqrt((Tc − Ta) / (Tc − 30))', () => {
  it.each([
    // source: NEC 310.15(B) equation; the printed factors of Table 310.15(B)(1), from memory
    [75, 40, 0.88],
    [90, 40, 0.91],
    [60, 45, 0.71],
    [75, 50, 0.75],
    [90, 50, 0.82],
    [75, 10, 1.2],
  ] as const)('%i °C insulation at %i °C ambient: %f', (tc, ta, printed) => {
    expect(Math.abs(ambientCorrectionFactor(tc, ta) - printed)).toBeLessThanOrEqual(0.005);
  });

  it('is exactly 1 at 30 °C and refuses an ambient at or above the rating', () => {
    // source: NEC Table 310.16 is written for 30 °C
    expect(ambientCorrectionFactor(75, 30)).toBe(1);
    expect(() => ambientCorrectionFactor(60, 60)).toThrow(/at or above the 60 °C/);
  });
});

describe('310.15(C)(1) adjustment for more than three current-carrying conductors', () => {
  it.each([
    // source: NEC 310.15(C)(1), 4–6 80 %, 7–9 70 %, 10–20 50 % (recalled); 21–30 45 %, 31–40 40 %, 41+ 35 % (from memory)
    [1, 1], [3, 1], [4, 0.8], [6, 0.8], [7, 0.7], [9, 0.7], [10, 0.5], [20, 0.5],
    [21, 0.45], [30, 0.45], [31, 0.4], [40, 0.4], [41, 0.35], [120, 0.35],
  ] as const)('%i conductors: %f', (count, factor) => {
    expect(moreThanThreeAdjustmentFactor(count)).toBe(factor);
  });

  it('refuses a count that is not a whole number ≥ 1', () => {
    expect(() => moreThanThreeAdjustmentFactor(0)).toThrow(/≥ 1/);
    expect(() => moreThanThreeAdjustmentFactor(4.5)).toThrow(RangeError);
  });

  it('combines table, ambient and adjustment: six 12 AWG THHN copper at 40 °C', () => {
    // source: NEC 310.16 (30 A at 90 °C, from memory), 310.15(B) equation, 310.15(C)(1) 80 % for 4–6 (recalled)
    const result = ampacity({ size: '12', material: 'copper', insulationTempC: 90, ambientC: 40, currentCarryingConductors: 6 });
    expect(result.tableAmperes).toBe(30);
    expect(result.adjustmentFactor).toBe(0.8);
    expect(result.amperes).toBeCloseTo(30 * Math.sqrt(50 / 60) * 0.8, 10);
    expect(result.overcurrentLimitAmperes).toBe(20);
  });
});

describe('240.4(D) small-conductor overcurrent limits', () => {
  it.each([
    // source: NEC 240.4(D) (recalled)
    ['14', 'copper', 15], ['12', 'copper', 20], ['10', 'copper', 30], ['12', 'aluminum', 15], ['10', 'aluminum', 25],
  ] as const)('%s %s: %i A', (size, material, limit) => {
    expect(smallConductorOvercurrentLimit(size, material)).toBe(limit);
    expect(ampacity({ size, material, insulationTempC: 75 }).overcurrentLimitAmperes).toBe(limit);
  });

  it('sets no limit on 8 AWG and larger', () => {
    // source: NEC 240.4(D) covers 18 AWG to 10 AWG only
    expect(smallConductorOvercurrentLimit('8', 'copper')).toBeUndefined();
    expect('overcurrentLimitAmperes' in ampacity({ size: '8', material: 'aluminum', insulationTempC: 75 })).toBe(false);
  });
});

describe('310.15(E) neutral counting', () => {
  it('counts the neutral of two phases and a neutral from a four-wire wye', () => {
    // source: NEC 310.15(E)(2)
    expect(neutralCountsAsCurrentCarrying({ system: 'wye-4-wire', phasesInCircuit: 2, nonLinearMajority: false })).toBe(true);
  });

  it('counts a four-wire wye neutral only when the load is mostly non-linear', () => {
    // source: NEC 310.15(E)(1) and (E)(3)
    expect(neutralCountsAsCurrentCarrying({ system: 'wye-4-wire', phasesInCircuit: 3, nonLinearMajority: false })).toBe(false);
    expect(neutralCountsAsCurrentCarrying({ system: 'wye-4-wire', phasesInCircuit: 3, nonLinearMajority: true })).toBe(true);
  });

  it('does not count a 120/240 V three-wire neutral, which carries only the unbalance', () => {
    // source: NEC 310.15(E)(1)
    expect(neutralCountsAsCurrentCarrying({ system: 'split-phase', phasesInCircuit: 2, nonLinearMajority: true })).toBe(false);
  });

  it('counts the neutral of a two-wire circuit', () => {
    // common practice, no source: a two-wire circuit's neutral carries the whole load current
    expect(neutralCountsAsCurrentCarrying({ system: 'split-phase', phasesInCircuit: 1, nonLinearMajority: false })).toBe(true);
  });

  it('rejects a phase count the system cannot have', () => {
    expect(() => neutralCountsAsCurrentCarrying({ system: 'split-phase', phasesInCircuit: 3, nonLinearMajority: false })).toThrow(
      /split-phase/,
    );
    expect(() => neutralCountsAsCurrentCarrying({ system: 'wye-4-wire', phasesInCircuit: 4, nonLinearMajority: false })).toThrow(
      /1, 2 or 3/,
    );
  });
});
