// A small dense complex solve (the m×m capacitance system of a low-rank update), on typed arrays.

/**
 * Solves S z = r in place (r becomes z) by Gaussian elimination with partial pivoting; S is m×m row-major and is
 * overwritten. Returns false when a pivot's magnitude is at most pivotFloor: the caller then refactors instead.
 */
export function denseComplexSolveInPlace(
  m: number,
  sRe: Float64Array,
  sIm: Float64Array,
  rRe: Float64Array,
  rIm: Float64Array,
  pivotFloor: number,
): boolean {
  const floor2 = pivotFloor * pivotFloor;
  for (let k = 0; k < m; k++) {
    let piv = k;
    let best = -1;
    for (let i = k; i < m; i++) {
      const v = sRe[i * m + k] ** 2 + sIm[i * m + k] ** 2;
      if (v > best) {
        best = v;
        piv = i;
      }
    }
    if (!(best > floor2)) return false;
    if (piv !== k) {
      for (let j = 0; j < m; j++) {
        swap(sRe, k * m + j, piv * m + j);
        swap(sIm, k * m + j, piv * m + j);
      }
      swap(rRe, k, piv);
      swap(rIm, k, piv);
    }
    const pr = sRe[k * m + k];
    const pi = sIm[k * m + k];
    const invRe = pr / best;
    const invIm = -pi / best;
    for (let i = k + 1; i < m; i++) {
      const ar = sRe[i * m + k];
      const ai = sIm[i * m + k];
      const fr = ar * invRe - ai * invIm;
      const fi = ar * invIm + ai * invRe;
      if (fr === 0 && fi === 0) continue;
      for (let j = k + 1; j < m; j++) {
        const br = sRe[k * m + j];
        const bi = sIm[k * m + j];
        sRe[i * m + j] -= fr * br - fi * bi;
        sIm[i * m + j] -= fr * bi + fi * br;
      }
      rRe[i] -= fr * rRe[k] - fi * rIm[k];
      rIm[i] -= fr * rIm[k] + fi * rRe[k];
    }
  }
  for (let k = m - 1; k >= 0; k--) {
    let sr = rRe[k];
    let si = rIm[k];
    for (let j = k + 1; j < m; j++) {
      sr -= sRe[k * m + j] * rRe[j] - sIm[k * m + j] * rIm[j];
      si -= sRe[k * m + j] * rIm[j] + sIm[k * m + j] * rRe[j];
    }
    const dr = sRe[k * m + k];
    const di = sIm[k * m + k];
    const d2 = dr * dr + di * di;
    rRe[k] = (sr * dr + si * di) / d2;
    rIm[k] = (si * dr - sr * di) / d2;
  }
  return true;
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}
