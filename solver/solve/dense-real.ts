// Gaussian elimination with partial pivoting on a small dense real system (row-major); undefined when singular.
export function solveDenseReal(a: Float64Array, b: Float64Array, m: number): Float64Array | undefined {
  const A = Float64Array.from(a);
  const x = Float64Array.from(b);
  for (let col = 0; col < m; col++) {
    let p = col;
    for (let r = col + 1; r < m; r++) if (Math.abs(A[r * m + col]) > Math.abs(A[p * m + col])) p = r;
    if (!(Math.abs(A[p * m + col]) > 0)) return undefined;
    if (p !== col) {
      for (let k = 0; k < m; k++) [A[p * m + k], A[col * m + k]] = [A[col * m + k], A[p * m + k]];
      [x[p], x[col]] = [x[col], x[p]];
    }
    const pivot = A[col * m + col];
    for (let r = col + 1; r < m; r++) {
      const f = A[r * m + col] / pivot;
      if (f === 0) continue;
      for (let k = col; k < m; k++) A[r * m + k] -= f * A[col * m + k];
      x[r] -= f * x[col];
    }
  }
  for (let r = m - 1; r >= 0; r--) {
    let s = x[r];
    for (let k = r + 1; k < m; k++) s -= A[r * m + k] * x[k];
    x[r] = s / A[r * m + r];
    if (!Number.isFinite(x[r])) return undefined;
  }
  return x;
}
