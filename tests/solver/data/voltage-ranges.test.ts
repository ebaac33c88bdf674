// Standing of voltages against ANSI C84.1 Table 1 and IEC 60038, with boundary cases on both sides.
import { describe, expect, it } from 'vitest';
import { judgeVoltage } from '../../../solver/standards/voltage-ranges';

const ansi = (nominalVolts: number, volts: number, point: 'service' | 'utilization', lighting?: boolean) =>
  judgeVoltage({ standard: 'ansi-c84.1', nominalVolts, volts, point, lighting });
const standing = (...args: Parameters<typeof ansi>) => ansi(...args).standing;

describe('ANSI C84.1 Table 1, 120 V nominal', () => {
  it('service: Range A 114–126 V, Range B 110–127 V, limits inclusive', () => {
    // source: ANSI C84.1 Table 1, from memory (Range A at the service is ±5 %, seen)
    expect(ansi(120, 120, 'service').normalRange).toEqual([114, 126]);
    expect(ansi(120, 120, 'service').tolerableRange).toEqual([110, 127]);
    expect(standing(120, 114, 'service')).toBe('normal');
    expect(standing(120, 113.9, 'service')).toBe('tolerable');
    expect(standing(120, 126, 'service')).toBe('normal');
    expect(standing(120, 126.1, 'service')).toBe('tolerable');
    expect(standing(120, 110, 'service')).toBe('tolerable');
    expect(standing(120, 109.9, 'service')).toBe('outside');
    expect(standing(120, 127, 'service')).toBe('tolerable');
    expect(standing(120, 127.1, 'service')).toBe('outside');
  });

  it('utilization: minimum 108 V in A and 104 V in B for lighting circuits, maximum 125 V in A', () => {
    // source: ANSI C84.1 Table 1 and its notes, from memory
    expect(ansi(120, 120, 'utilization').normalRange).toEqual([108, 125]);
    expect(ansi(120, 120, 'utilization').tolerableRange).toEqual([104, 127]);
    expect(standing(120, 108, 'utilization')).toBe('normal');
    expect(standing(120, 107.9, 'utilization')).toBe('tolerable');
    expect(standing(120, 104, 'utilization')).toBe('tolerable');
    expect(standing(120, 103.9, 'utilization')).toBe('outside');
    expect(standing(120, 125.1, 'utilization')).toBe('tolerable');
  });

  it('utilization without lighting: minimum 110 V in A and 106 V in B', () => {
    // source: ANSI C84.1 Table 1 notes, from memory
    expect(ansi(120, 120, 'utilization', false).normalRange).toEqual([110, 125]);
    expect(ansi(120, 120, 'utilization', false).tolerableRange).toEqual([106, 127]);
    expect(standing(120, 109, 'utilization', false)).toBe('tolerable');
    expect(standing(120, 109, 'utilization', true)).toBe('normal');
    expect(standing(120, 105.9, 'utilization', false)).toBe('outside');
  });
});

describe('ANSI C84.1 Table 1, three-phase rows', () => {
  it('208Y/120: A 197–218, B 191–220, utilization minimum 187 (A) and 180 (B)', () => {
    // source: ANSI C84.1 Table 1, from memory
    expect(ansi(208, 208, 'service').normalRange).toEqual([197, 218]);
    expect(ansi(208, 208, 'service').tolerableRange).toEqual([191, 220]);
    expect(ansi(208, 208, 'utilization').normalRange[0]).toBe(187);
    expect(ansi(208, 208, 'utilization').tolerableRange[0]).toBe(180);
    expect(standing(208, 196.9, 'service')).toBe('tolerable');
    expect(standing(208, 220.1, 'service')).toBe('outside');
    expect(standing(208, 179.9, 'utilization')).toBe('outside');
  });

  it('480Y/277: A 456–504 (263–291), B 440–508 (254–293), utilization minimum 432/249 (A), 416/240 (B)', () => {
    // source: ANSI C84.1 Table 1, from memory
    expect(ansi(480, 480, 'service').normalRange).toEqual([456, 504]);
    expect(ansi(480, 480, 'service').tolerableRange).toEqual([440, 508]);
    expect(ansi(277, 277, 'service').normalRange).toEqual([263, 291]);
    expect(ansi(277, 277, 'service').tolerableRange).toEqual([254, 293]);
    expect(ansi(480, 480, 'utilization').normalRange[0]).toBe(432);
    expect(ansi(480, 480, 'utilization').tolerableRange[0]).toBe(416);
    expect(ansi(277, 277, 'utilization').normalRange[0]).toBe(249);
    expect(ansi(277, 277, 'utilization').tolerableRange[0]).toBe(240);
    expect(standing(480, 504, 'service')).toBe('normal');
    expect(standing(480, 504.5, 'service')).toBe('tolerable');
    expect(standing(480, 439.5, 'service')).toBe('outside');
  });

  it('agrees with the 120 V row scaled by nominal / 120 to within the table rounding (1 V)', () => {
    // source: ANSI C84.1 Table 1 is built on a 120 V base (from memory); a nominal without a row is scaled
    const scaled = ansi(600, 600, 'service');
    expect(scaled.normalRange).toEqual([570, 630]);
    expect(scaled.tolerableRange).toEqual([550, 635]);
    for (const nominal of [208, 277, 480]) {
      const row = ansi(nominal, nominal, 'service');
      expect(Math.abs(row.normalRange[0] - (114 * nominal) / 120)).toBeLessThan(1);
      expect(Math.abs(row.tolerableRange[1] - (127 * nominal) / 120)).toBeLessThan(1);
    }
  });

  it('names the standard in its label', () => {
    expect(ansi(120, 120, 'service').label).toMatch(/ANSI C84\.1/);
  });
});

describe('IEC 60038, ±10 %', () => {
  const iec = (nominalVolts: number, volts: number) =>
    judgeVoltage({ standard: 'iec-60038', nominalVolts, volts, point: 'service' });

  it('230 V: 207–253 V normal, limits inclusive, outside beyond', () => {
    // source: IEC 60038, 230/400 V ±10 % at the supply terminals (recalled)
    const r = iec(230, 230);
    expect(r.normalRange[0]).toBeCloseTo(207, 10);
    expect(r.normalRange[1]).toBeCloseTo(253, 10);
    expect(iec(230, 207.0001).standing).toBe('normal');
    expect(iec(230, 206.9).standing).toBe('outside');
    expect(iec(230, 252.9999).standing).toBe('normal');
    expect(iec(230, 253.1).standing).toBe('outside');
    expect(r.label).toMatch(/IEC 60038/);
  });

  it('400 V: 360–440 V', () => {
    // source: IEC 60038, 230/400 V ±10 % (recalled)
    expect(iec(400, 359).standing).toBe('outside');
    expect(iec(400, 361).standing).toBe('normal');
    expect(iec(400, 441).standing).toBe('outside');
  });
});

describe('bad input', () => {
  it('names the bad value', () => {
    expect(() => ansi(0, 120, 'service')).toThrow(/nominal voltage 0/);
    expect(() => ansi(120, Number.NaN, 'service')).toThrow(/voltage NaN/);
    expect(() => judgeVoltage({ standard: 'en-50160' as never, nominalVolts: 230, volts: 230, point: 'service' })).toThrow(
      /en-50160/,
    );
  });
});
