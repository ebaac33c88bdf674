// Fortescue's symmetrical components, NEMA MG-1 voltage unbalance and the negative-sequence ratio.
import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import {
  fortescueMatrix,
  inverseFortescueMatrix,
  negativeSequenceRatioPercent,
  nemaUnbalancePercent,
  symmetricalComponents,
} from '../../../solver/sequence';
import { abs, identity, matMul, matVec, polar, type Complex } from '../../../solver/complex';

const expectComplex = (actual: Complex, expected: { re: number; im: number }, digits = 10) => {
  expect(actual.re).toBeCloseTo(expected.re, digits);
  expect(actual.im).toBeCloseTo(expected.im, digits);
};

describe('symmetricalComponents', () => {
  it('finds only positive sequence in a balanced a-b-c set', () => {
    // source: Fortescue; a balanced set with b lagging a by 120° is pure positive sequence (common practice)
    const s = symmetricalComponents(polar(277, 10), polar(277, -110), polar(277, 130));
    expectComplex(s.positive, polar(277, 10));
    expect(abs(s.zero)).toBeLessThan(1e-9);
    expect(abs(s.negative)).toBeLessThan(1e-9);
  });

  it('finds only negative sequence when b and c are swapped', () => {
    // source: Fortescue; an a-c-b set is pure negative sequence (common practice)
    const s = symmetricalComponents(polar(120, 0), polar(120, 120), polar(120, -120));
    expectComplex(s.negative, polar(120, 0));
    expect(abs(s.positive)).toBeLessThan(1e-9);
  });

  it('matches mathjs on an unbalanced set', () => {
    // source: mathjs complex arithmetic as an independent check of V0 = (Va+Vb+Vc)/3, V1 = (Va+aVb+a²Vc)/3,
    // V2 = (Va+a²Vb+aVc)/3
    const va = polar(7107, -0.3);
    const vb = polar(6900, -125);
    const vc = polar(7300, 112);
    const m = (v: Complex) => math.complex(v.re, v.im);
    const a = math.complex({ r: 1, phi: (2 * Math.PI) / 3 });
    const a2 = math.multiply(a, a) as math.Complex;
    const third = (x: math.Complex) => math.divide(x, 3) as math.Complex;
    const sum = (...xs: math.Complex[]) => xs.reduce((acc, x) => math.add(acc, x) as math.Complex);
    const v0 = third(sum(m(va), m(vb), m(vc)));
    const v1 = third(sum(m(va), math.multiply(a, m(vb)) as math.Complex, math.multiply(a2, m(vc)) as math.Complex));
    const v2 = third(sum(m(va), math.multiply(a2, m(vb)) as math.Complex, math.multiply(a, m(vc)) as math.Complex));
    const s = symmetricalComponents(va, vb, vc);
    expectComplex(s.zero, v0, 8);
    expectComplex(s.positive, v1, 8);
    expectComplex(s.negative, v2, 8);
    expect(abs(s.negative)).toBeGreaterThan(50);
  });

  it('recombines through A, and A⁻¹ A is the identity', () => {
    // source: Fortescue's transform [Va Vb Vc]ᵀ = A [V0 V1 V2]ᵀ
    const phases = [polar(1.02, 3), polar(0.97, -118), polar(1.0, 121)];
    const s = symmetricalComponents(phases[0], phases[1], phases[2]);
    const back = matVec(fortescueMatrix(), [s.zero, s.positive, s.negative]);
    back.forEach((v, i) => expectComplex(v, phases[i], 12));
    const product = matMul(inverseFortescueMatrix(), fortescueMatrix());
    const eye = identity(3);
    product.forEach((row, i) => row.forEach((v, j) => expectComplex(v, eye[i][j], 12)));
  });

  it('splits a set with one phase lost into 1/3 zero, 2/3 positive, 1/3 negative', () => {
    // common practice, no source: Va = 1∠0, Vb = 1∠−120°, Vc = 0 by hand from the Fortescue sums
    const s = symmetricalComponents(polar(1, 0), polar(1, -120), { re: 0, im: 0 });
    expect(abs(s.zero)).toBeCloseTo(1 / 3, 12);
    expect(abs(s.positive)).toBeCloseTo(2 / 3, 12);
    expect(abs(s.negative)).toBeCloseTo(1 / 3, 12);
  });
});

describe('NEMA MG-1 voltage unbalance', () => {
  it('gives 1.1 % for 462, 463 and 455 V', () => {
    // source: NEMA MG-1 (REFERENCES.md): average 460 V, largest deviation 5 V
    expect(nemaUnbalancePercent(462, 463, 455)).toBeCloseTo(1.087, 3);
    expect(Number(nemaUnbalancePercent(462, 463, 455).toFixed(1))).toBe(1.1);
    expect(nemaUnbalancePercent(455, 462, 463)).toBeCloseTo(nemaUnbalancePercent(462, 463, 455), 12);
  });

  it('is zero for equal voltages and refuses nonsense', () => {
    // source: NEMA MG-1 definition
    expect(nemaUnbalancePercent(480, 480, 480)).toBe(0);
    expect(() => nemaUnbalancePercent(480, Number.NaN, 480)).toThrow(/line voltages/);
    expect(() => nemaUnbalancePercent(0, 0, 0)).toThrow(RangeError);
  });
});

describe('negative-sequence ratio |V2| / |V1|', () => {
  it('recovers a 2 % negative sequence built into a set with mathjs', () => {
    // source: IEC 61000-4-30 definition; the set is V1 = 1∠0 plus V2 = 0.02∠40° composed independently with mathjs
    const a = math.complex({ r: 1, phi: (2 * Math.PI) / 3 });
    const a2 = math.multiply(a, a) as math.Complex;
    const v1 = math.complex(1, 0);
    const v2 = math.complex({ r: 0.02, phi: (40 * Math.PI) / 180 });
    const phase = (k1: math.Complex, k2: math.Complex) =>
      math.add(math.multiply(k1, v1), math.multiply(k2, v2)) as math.Complex;
    const one = math.complex(1, 0);
    const [va, vb, vc] = [phase(one, one), phase(a2, a), phase(a, a2)].map((z) => ({ re: z.re, im: z.im }));
    expect(negativeSequenceRatioPercent(va, vb, vc)).toBeCloseTo(2, 10);
  });

  it('is zero for a balanced set, and undefined with no positive sequence', () => {
    // source: IEC 61000-4-30 definition
    expect(negativeSequenceRatioPercent(polar(230, 0), polar(230, -120), polar(230, 120))).toBeLessThan(1e-9);
    expect(() => negativeSequenceRatioPercent(polar(1, 0), polar(1, 0), polar(1, 0))).toThrow(/no positive sequence/);
  });
});
