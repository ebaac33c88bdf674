// The numeric fields' reader: plain numbers, expressions and quantities with units of the field's kind.
import { describe, expect, it } from 'vitest';
import { formatQuantity, parseQuantity } from '../../editor/quantity/parse-quantity';

const value = (text: string, unit: Parameters<typeof parseQuantity>[1]) => {
  const r = parseQuantity(text, unit);
  if (!r.ok) throw new Error(r.message);
  return r.value;
};

describe('parseQuantity', () => {
  it('reads a plain number in the field unit', () => {
    expect(value('150', 'ft')).toBe(150);
    expect(value(' 2.5 ', 'percent')).toBe(2.5);
  });

  it('converts lengths: 45 m is 147.64 ft', () => {
    // source: 1 ft = 0.3048 m exactly (international foot, 1959 agreement)
    expect(value('45 m', 'ft')).toBeCloseTo(45 / 0.3048, 9);
    expect(value('150 ft', 'ft')).toBe(150);
    expect(value('150ft', 'ft')).toBe(150);
    // source: 1 mile = 5280 ft (definition)
    expect(value('0.5 mi', 'ft')).toBeCloseTo(2640, 9);
  });

  it('evaluates expressions: 208/sqrt(3) is the line-to-neutral voltage of a 208 V system', () => {
    // source: V_LN = V_LL / sqrt(3) for a balanced wye, common practice, no source
    expect(value('208/sqrt(3)', 'V')).toBeCloseTo(120.0889, 4);
    expect(value('12.47 kV', 'V')).toBeCloseTo(12470, 9);
    expect(value('3 * 40', 'A')).toBe(120);
  });

  it('converts power, current and resistance prefixes', () => {
    expect(value('1500 W', 'kW')).toBeCloseTo(1.5, 12);
    expect(value('0.15 MVA', 'kVA')).toBeCloseTo(150, 12);
    expect(value('22000 A', 'kA')).toBeCloseTo(22, 12);
    expect(value('25 Ω', 'ohm')).toBe(25);
    expect(value('250 mohm', 'ohm')).toBeCloseTo(0.25, 12);
    // P = V·I for a resistive load (Ohm's and Joule's laws, common practice, no source)
    expect(value('10 A * 120 V', 'kW')).toBeCloseTo(1.2, 12);
  });

  it('accepts a trailing percent sign in a percentage field', () => {
    expect(value('2.5 %', 'percent')).toBe(2.5);
  });

  it('refuses a unit of the wrong kind and says what it wanted', () => {
    const r = parseQuantity('45 kg', 'ft');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/not a length.*150 ft or 45 m/);
    const v = parseQuantity('3 ft', 'V');
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.message).toMatch(/not a voltage/);
  });

  it('refuses text, empties, units on plain numbers and non-finite results', () => {
    for (const [text, unit, pattern] of [
      ['abc', 'ft', /Cannot read "abc"/],
      ['', 'kW', /Empty/],
      ['1/0', 'A', /not a finite number/],
      ['5 m', 'number', /has a unit/],
      ['[1, 2]', 'V', /not a single number/],
      ['ft', 'ft', /no number/],
    ] as const) {
      const r = parseQuantity(text, unit);
      expect(r.ok, `${text} should be refused`).toBe(false);
      if (!r.ok) expect(r.message).toMatch(pattern);
    }
  });

  it('refuses functions that could change the parser itself', () => {
    expect(parseQuantity('import({x: 1})', 'number').ok).toBe(false);
    expect(parseQuantity('createUnit("foo")', 'number').ok).toBe(false);
    expect(parseQuantity('evaluate("1+1")', 'number').ok).toBe(false);
  });

  it('formats numbers for the fields with up to six significant figures', () => {
    expect(formatQuantity(147.63779527559)).toBe('147.638');
    expect(formatQuantity(150)).toBe('150');
    expect(formatQuantity(undefined)).toBe('');
  });
});
