// Modified Carson's equations, Kron reduction and sequence impedances against Kersting's Example 4.1 (the 4 Node Test
// Feeder pole) and the IEEE 13 Node Test Feeder configuration 601; mathjs as an independent dense check of Kron.
import { describe, expect, it } from 'vitest';
import * as math from 'mathjs';
import {
  carsonConstants,
  carsonPrimitiveOhmsPerMile,
  kronReduce,
  phaseToSequence,
  type OverheadConductor,
} from '../../../solver/conductors/carson';
import type { Complex, ComplexMatrix } from '../../../solver/complex';

// Printed precision: half a unit of the 4th decimal plus 0.1 % for the rounding of the published inputs (GMR 3 figures).
function expectPrinted(actual: Complex, re: number, im: number) {
  const tol = (v: number) => 0.00005 + 0.001 * Math.abs(v);
  expect(Math.abs(actual.re - re), `re ${actual.re} vs ${re}`).toBeLessThanOrEqual(tol(re));
  expect(Math.abs(actual.im - im), `im ${actual.im} vs ${im}`).toBeLessThanOrEqual(tol(im));
}

// source: IEEE PES 4 Node Test Feeder (Kersting, Radial Distribution Test Feeders, 2001), pole and conductors
const POLE_FT: Record<'a' | 'b' | 'c' | 'n', [number, number]> = { a: [0, 28], b: [2.5, 28], c: [7, 28], n: [4, 24] };
const ACSR_336_400 = { gmrFt: 0.0244, rOhmsPerMile: 0.306 };
const ACSR_4_0_NEUTRAL = { gmrFt: 0.00814, rOhmsPerMile: 0.592 };
const at = (p: [number, number], k: { gmrFt: number; rOhmsPerMile: number }): OverheadConductor => ({
  xFt: p[0],
  yFt: p[1],
  ...k,
});
const fourNodeLine = [
  at(POLE_FT.a, ACSR_336_400),
  at(POLE_FT.b, ACSR_336_400),
  at(POLE_FT.c, ACSR_336_400),
  at(POLE_FT.n, ACSR_4_0_NEUTRAL),
];

describe("Carson's constants", () => {
  it('reduce to 0.0953, 0.12134 and 7.93402 at 60 Hz and 100 Ω·m', () => {
    // source: Kersting, Distribution System Modeling and Analysis, Example 4.1 (modified Carson's equations)
    const k = carsonConstants(60, 100);
    expect(k.earthROhmsPerMile).toBeCloseTo(0.0953, 4);
    expect(k.reactanceFactorOhmsPerMile).toBeCloseTo(0.12134, 5);
    // the book's 7.93402 is within the rounding of the printed 7.6786 (±0.00005) of 7.6786 + ½ ln(100/60)
    expect(k.lnConstant).toBeCloseTo(7.93402, 4);
  });

  it('give at 50 Hz five sixths of the 60 Hz earth resistance', () => {
    // source: Carson's earth-return resistance π²f·10⁻⁴ Ω/km is proportional to frequency
    expect(carsonConstants(50, 100).earthROhmsPerMile / carsonConstants(60, 100).earthROhmsPerMile).toBeCloseTo(5 / 6, 12);
  });
});

describe('4 Node Test Feeder line (Kersting, Example 4.1)', () => {
  const primitive = carsonPrimitiveOhmsPerMile(fourNodeLine, 60, 100);

  it('primitive matrix', () => {
    // source: Kersting, Distribution System Modeling and Analysis, Example 4.1, primitive impedances (REFERENCES.md)
    expectPrinted(primitive[0][0], 0.4013, 1.4133);
    expectPrinted(primitive[1][1], 0.4013, 1.4133);
    expectPrinted(primitive[3][3], 0.6873, 1.5465);
    expectPrinted(primitive[0][1], 0.0953, 0.8515);
    expectPrinted(primitive[1][2], 0.0953, 0.7802);
    expectPrinted(primitive[2][0], 0.0953, 0.7266);
    expectPrinted(primitive[0][3], 0.0953, 0.7524);
    expectPrinted(primitive[1][3], 0.0953, 0.7865);
    expectPrinted(primitive[2][3], 0.0953, 0.7674);
    expect(primitive[3][1]).toEqual(primitive[1][3]);
  });

  it('Kron-reduced phase impedance matrix', () => {
    // source: Kersting, Distribution System Modeling and Analysis, Example 4.1, phase impedance matrix (REFERENCES.md)
    const zabc = kronReduce(primitive, 3);
    expect(zabc.length).toBe(3);
    expectPrinted(zabc[0][0], 0.4576, 1.078);
    expectPrinted(zabc[0][1], 0.156, 0.5017);
    expectPrinted(zabc[0][2], 0.1535, 0.3849);
    expectPrinted(zabc[1][1], 0.4666, 1.0482);
    expectPrinted(zabc[1][2], 0.158, 0.4236);
    expectPrinted(zabc[2][2], 0.4615, 1.0651);
    expectPrinted(zabc[2][1], 0.158, 0.4236);
  });

  it('zero- and positive-sequence impedances', () => {
    // source: Kersting, Example 4.1 (z0, z1); z1 = 0.3061 + j0.6270 Ω/mile also in the 4 Node Test Feeder document
    const z012 = phaseToSequence(kronReduce(primitive, 3));
    expectPrinted(z012[0][0], 0.7735, 1.9373);
    expectPrinted(z012[1][1], 0.3061, 0.627);
    expectPrinted(z012[2][2], 0.3061, 0.627);
  });

  it('Kron reduction agrees with an independent mathjs Schur complement', () => {
    // source: mathjs as an independent dense reference (Zabc = Zij − Zin Znn⁻¹ Znj)
    const toMath = (m: ComplexMatrix) => math.matrix(m.map((row) => row.map((v) => math.complex(v.re, v.im))));
    const z = toMath(primitive);
    const zij = math.subset(z, math.index([0, 1, 2], [0, 1, 2]));
    const zin = math.subset(z, math.index([0, 1, 2], [3]));
    const znj = math.subset(z, math.index([3], [0, 1, 2]));
    const znn = math.subset(z, math.index([3], [3]));
    const reference = math.subtract(zij, math.multiply(math.multiply(zin, math.inv(znn)), znj)) as math.Matrix;
    const refArray = reference.toArray() as unknown as math.Complex[][];
    const ours = kronReduce(primitive, 3);
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        expect(ours[i][j].re).toBeCloseTo(refArray[i][j].re, 12);
        expect(ours[i][j].im).toBeCloseTo(refArray[i][j].im, 12);
      }
    }
  });
});

describe('IEEE 13 Node Test Feeder configuration 601', () => {
  // source: IEEE 13 Node Test Feeder, configuration 601 phase impedance matrix (seen), Ω/mile, phases a, b, c
  const printed601 = {
    aa: [0.3465, 1.0179], ab: [0.156, 0.5017], ac: [0.158, 0.4236],
    bb: [0.3375, 1.0478], bc: [0.1535, 0.3849], cc: [0.3414, 1.0348],
  } as const;
  // from memory: 556,500 26/7 ACSR GMR 0.0313 ft, r 0.1859 Ω/mile; 4/0 6/1 ACSR neutral as in the 4 Node feeder;
  // spacing 500 is the 4 Node pole.
  const ACSR_556_500 = { gmrFt: 0.0313, rOhmsPerMile: 0.1859 };
  const positions = [POLE_FT.a, POLE_FT.b, POLE_FT.c];

  /** Phase matrix when phase p (0 = A, 1 = B, 2 = C) hangs at pole position placement[p]. */
  function phaseMatrixFor(placement: number[]): ComplexMatrix {
    const byPosition = kronReduce(
      carsonPrimitiveOhmsPerMile([...positions.map((p) => at(p, ACSR_556_500)), at(POLE_FT.n, ACSR_4_0_NEUTRAL)], 60, 100),
      3,
    );
    return [0, 1, 2].map((i) => [0, 1, 2].map((j) => byPosition[placement[i]][placement[j]]));
  }

  function matchesPrinted(z: ComplexMatrix): boolean {
    const tol = (v: number) => 0.00005 + 0.001 * Math.abs(v);
    const cells: Array<[number, number, readonly [number, number]]> = [
      [0, 0, printed601.aa], [0, 1, printed601.ab], [0, 2, printed601.ac],
      [1, 1, printed601.bb], [1, 2, printed601.bc], [2, 2, printed601.cc],
    ];
    return cells.every(([i, j, [re, im]]) => Math.abs(z[i][j].re - re) <= tol(re) && Math.abs(z[i][j].im - im) <= tol(im));
  }

  it('is reproduced with phasing B A C: phase B at position 1, A at 2, C at 3', () => {
    // source: IEEE 13 Node Test Feeder, configuration 601 = phasing B A C N on spacing 500 (phasing from memory)
    const z = phaseMatrixFor([1, 0, 2]); // A at position 2, B at position 1, C at position 3
    expectPrinted(z[0][0], ...printed601.aa);
    expectPrinted(z[0][1], ...printed601.ab);
    expectPrinted(z[0][2], ...printed601.ac);
    expectPrinted(z[1][1], ...printed601.bb);
    expectPrinted(z[1][2], ...printed601.bc);
    expectPrinted(z[2][2], ...printed601.cc);
  });

  it('is reproduced by no other placement of the phases on the pole', () => {
    // source: IEEE 13 Node Test Feeder configuration 601; the diagonal tells the three positions apart (their
    // distances to the neutral differ), so exactly one of the six placements can match
    const placements = [[0, 1, 2], [0, 2, 1], [1, 0, 2], [1, 2, 0], [2, 0, 1], [2, 1, 0]];
    const matching = placements.filter((p) => matchesPrinted(phaseMatrixFor(p)));
    expect(matching).toEqual([[1, 0, 2]]);
  });
});

describe('bad input', () => {
  it('names the conductor with a bad GMR, overlapping conductors, and bad frequency or resistivity', () => {
    expect(() => carsonPrimitiveOhmsPerMile([{ xFt: 0, yFt: 0, gmrFt: 0, rOhmsPerMile: 1 }], 60, 100)).toThrow(/conductor 0/);
    const twice = [fourNodeLine[0], { ...fourNodeLine[0] }];
    expect(() => carsonPrimitiveOhmsPerMile(twice, 60, 100)).toThrow(/conductors 0 and 1/);
    expect(() => carsonPrimitiveOhmsPerMile(fourNodeLine, 0, 100)).toThrow(/frequency/);
    expect(() => carsonPrimitiveOhmsPerMile(fourNodeLine, 60, -5)).toThrow(/resistivity/);
  });

  it('rejects a keep count outside 1..n and a non-3×3 sequence transform', () => {
    const z = carsonPrimitiveOhmsPerMile(fourNodeLine, 60, 100);
    expect(() => kronReduce(z, 0)).toThrow(/keep 0/);
    expect(() => kronReduce(z, 5)).toThrow(/keep 5/);
    expect(() => phaseToSequence(z)).toThrow(/3×3/);
  });
});
