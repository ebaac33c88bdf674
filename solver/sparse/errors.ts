// Errors raised by the sparse LU, carrying where the trouble is.

/** The matrix has no usable pivot for a column: structurally singular (no candidate row) or numerically singular. */
export class SingularMatrixError extends Error {
  /** Column of the original (unpermuted) matrix whose pivot failed. */
  readonly column: number;
  /** 'structural' when no unpivoted row has an entry in the column, 'numerical' when every candidate is (near) zero. */
  readonly kind: 'structural' | 'numerical';

  constructor(column: number, kind: 'structural' | 'numerical', detail = '') {
    super(`matrix is ${kind}ly singular at column ${column}${detail ? `: ${detail}` : ''}`);
    this.name = 'SingularMatrixError';
    this.column = column;
    this.kind = kind;
  }
}
