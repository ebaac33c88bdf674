// Fortescue's symmetrical components, NEMA MG-1 voltage unbalance and the negative-sequence ratio.

import type { Complex, ComplexMatrix } from './complex';
import { abs, add, c, mul, ONE, polar, scale } from './complex';

/** The operator a = 1∠120°. */
export const A_OPERATOR: Complex = polar(1, 120);
const A_SQUARED: Complex = polar(1, 240);

/** A, with [Va Vb Vc]ᵀ = A [V0 V1 V2]ᵀ. */
export function fortescueMatrix(): ComplexMatrix {
  return [
    [ONE, ONE, ONE],
    [ONE, A_SQUARED, A_OPERATOR],
    [ONE, A_OPERATOR, A_SQUARED],
  ];
}

/** A⁻¹ = (1/3) conj(A), written out rather than inverted. */
export function inverseFortescueMatrix(): ComplexMatrix {
  const third = c(1 / 3);
  return [
    [third, third, third],
    [third, scale(A_OPERATOR, 1 / 3), scale(A_SQUARED, 1 / 3)],
    [third, scale(A_SQUARED, 1 / 3), scale(A_OPERATOR, 1 / 3)],
  ];
}

export interface SequenceComponents {
  zero: Complex;
  positive: Complex;
  negative: Complex;
}

/** Zero, positive and negative sequence of a phase-a-referenced set (phase order a-b-c, b lagging a). */
export function symmetricalComponents(va: Complex, vb: Complex, vc: Complex): SequenceComponents {
  const third = (x: Complex) => scale(x, 1 / 3);
  return {
    zero: third(add(add(va, vb), vc)),
    positive: third(add(add(va, mul(A_OPERATOR, vb)), mul(A_SQUARED, vc))),
    negative: third(add(add(va, mul(A_SQUARED, vb)), mul(A_OPERATOR, vc))),
  };
}

/** NEMA MG-1: 100 × (largest deviation from the average line voltage) / average, from three line-to-line magnitudes. */
export function nemaUnbalancePercent(vab: number, vbc: number, vca: number): number {
  const volts = [vab, vbc, vca];
  if (volts.some((v) => !Number.isFinite(v) || v < 0)) {
    throw new RangeError(`line voltages ${volts.join(', ')} must be finite and not negative`);
  }
  const average = (vab + vbc + vca) / 3;
  if (average === 0) throw new RangeError('unbalance of three zero voltages is undefined');
  const largestDeviation = Math.max(...volts.map((v) => Math.abs(v - average)));
  return (100 * largestDeviation) / average;
}

/** |V2| / |V1| × 100 % (the IEC 61000-4-30 definition of voltage unbalance). */
export function negativeSequenceRatioPercent(va: Complex, vb: Complex, vc: Complex): number {
  const { positive, negative } = symmetricalComponents(va, vb, vc);
  const v1 = abs(positive);
  // Relative test: a + a² + 1 leaves a rounding residue, never an exact zero.
  if (v1 <= 1e-12 * Math.max(abs(va), abs(vb), abs(vc))) throw new RangeError('negative-sequence ratio is undefined with no positive sequence');
  return (100 * abs(negative)) / v1;
}
