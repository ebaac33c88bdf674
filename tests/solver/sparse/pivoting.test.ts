// Pivoting and singularity: zero diagonals are solved by row pivoting; singular matrices raise SingularMatrixError.
import { describe, expect, it } from 'vitest';
import { analyse, ComplexTriplets, factor, solve, SingularMatrixError, type ComplexCsc } from '../../../solver/sparse';
import { mathjsSolve, mulberry32, randomNetwork, randomVector, relativeDifference, stampBranch } from './helpers';

/** A network plus ideal voltage sources as modified-nodal rows: unknown source currents with a zero diagonal. */
function withConstraintRows(base: ComplexCsc, sources: number[]): ComplexCsc {
  const n = base.n + sources.length;
  const t = new ComplexTriplets(n);
  for (let j = 0; j < base.n; j++) {
    for (let p = base.colPtr[j]; p < base.colPtr[j + 1]; p++) t.add(base.rowIdx[p], j, base.re[p], base.im[p]);
  }
  sources.forEach((node, k) => {
    const row = base.n + k;
    t.add(row, node, 1, 0); // V(node) = E
    t.add(node, row, 1, 0); // the source current enters node
    t.add(row, row, 0, 0); // explicit zero diagonal, kept in the pattern
  });
  return t.toCsc();
}

describe('pivoting', () => {
  it('solves a matrix whose diagonal has zeros (voltage-source rows), pivoting off the diagonal', () => {
    const rng = mulberry32(21);
    const a = withConstraintRows(randomNetwork(rng, { nodes: 120, topology: 'meshed' }), [3, 40, 77]);
    const b = randomVector(rng, a.n);
    const lu = factor(analyse(a), a);
    expect(lu.offDiagonalPivots).toBeGreaterThan(0);
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(solve(lu, b.re, b.im), mathjsSolve(a, b.re, b.im))).toBeLessThan(1e-9);
  });

  it('solves a permutation-like matrix with no usable diagonal at all', () => {
    // [[0, 2+i, 0], [0, 0, 3], [1, 0, 0]]
    const t = new ComplexTriplets(3);
    t.add(0, 1, 2, 1);
    t.add(1, 2, 3, 0);
    t.add(2, 0, 1, 0);
    const a = t.toCsc();
    const x = solve(factor(analyse(a), a), Float64Array.of(1, 2, 3), Float64Array.of(0, 0, 1));
    // source: mathjs lusolve as independent dense reference
    expect(relativeDifference(x, mathjsSolve(a, Float64Array.of(1, 2, 3), Float64Array.of(0, 0, 1)))).toBeLessThan(1e-12);
  });

  it('prefers a diagonal within the threshold, and takes the larger entry when the diagonal is far too small', () => {
    const build = (diag: number) => {
      const t = new ComplexTriplets(2);
      t.add(0, 0, diag, 0);
      t.add(1, 0, 1, 0);
      t.add(0, 1, 1, 0);
      t.add(1, 1, 1, 0);
      return t.toCsc();
    };
    const natural = { ordering: 'natural' as const };
    // common practice, no source: threshold partial pivoting keeps |a_jj| ≥ 0.1·max|a_ij|
    expect(factor(analyse(build(0.5), natural), build(0.5)).offDiagonalPivots).toBe(0);
    // a swap: column 0 takes row 1, so column 1 is left with row 0
    expect(factor(analyse(build(0.01), natural), build(0.01)).offDiagonalPivots).toBe(2);
    expect(factor(analyse(build(0.01), natural), build(0.01), { pivotTolerance: 0.001 }).offDiagonalPivots).toBe(0);
  });
});

describe('SingularMatrixError', () => {
  it('is thrown for an empty column (structurally singular), naming the column', () => {
    const t = new ComplexTriplets(4);
    for (const i of [0, 1, 3]) t.add(i, i, 1, 0);
    t.add(2, 1, 1, 0); // row 2 has an entry, column 2 none
    const a = t.toCsc();
    // common practice, no source: a column without entries cannot be pivoted
    const err = catchError(() => factor(analyse(a), a));
    expect(err).toBeInstanceOf(SingularMatrixError);
    expect((err as SingularMatrixError).column).toBe(2);
    expect((err as SingularMatrixError).kind).toBe('structural');
  });

  it('is thrown when two columns share their only row (structurally singular)', () => {
    const t = new ComplexTriplets(3);
    t.add(0, 0, 1, 0);
    t.add(0, 1, 1, 1);
    t.add(1, 2, 1, 0);
    t.add(2, 2, 1, 0);
    const a = t.toCsc();
    expect(() => factor(analyse(a), a)).toThrow(SingularMatrixError);
  });

  it('is thrown for a floating network (Laplacian with no shunt: rows sum to zero), not NaN', () => {
    const rng = mulberry32(22);
    const n = 60;
    const t = new ComplexTriplets(n);
    for (let i = 1; i < n; i++) stampBranch(t, i, Math.floor(rng() * i), [rng() + 0.1, -rng() - 0.1]);
    const a = t.toCsc();
    // common practice, no source: the all-ones vector is in the null space of a Laplacian
    const err = catchError(() => factor(analyse(a), a));
    expect(err).toBeInstanceOf(SingularMatrixError);
    expect((err as SingularMatrixError).kind).toBe('numerical');
  });

  it('is thrown for a column of explicit zeros', () => {
    const t = new ComplexTriplets(3);
    t.add(0, 0, 2, 0);
    t.add(1, 1, 0, 0);
    t.add(0, 1, 0, 0);
    t.add(2, 2, 1, 1);
    const a = t.toCsc();
    const err = catchError(() => factor(analyse(a), a));
    expect((err as SingularMatrixError).column).toBe(1);
  });

  it('rejects non-finite matrix values and right-hand sides with their position', () => {
    const a: ComplexCsc = { n: 2, colPtr: Int32Array.of(0, 1, 2), rowIdx: Int32Array.of(0, 1), re: Float64Array.of(1, NaN), im: Float64Array.of(0, 0) };
    expect(() => factor(analyse(a), a)).toThrow(/entry \(1, 1\) is not finite/);
    a.re[1] = 1;
    const lu = factor(analyse(a), a);
    expect(() => solve(lu, Float64Array.of(1, Infinity), Float64Array.of(0, 0))).toThrow(/right-hand side\[1\]/);
    expect(() => solve(lu, Float64Array.of(1), Float64Array.of(0))).toThrow(/lengths 1\/1, expected 2/);
  });
});

function catchError(f: () => unknown): unknown {
  try {
    f();
  } catch (e) {
    return e;
  }
  return undefined;
}
