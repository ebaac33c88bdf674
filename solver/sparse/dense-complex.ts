// A small dense complex solve (the m×m capacitance system of a low-rank update), on typed arrays: factored once
// where one system has several right-hand sides (a load iteration's solves), or factored and solved in one call.

/**
 * LU of a small dense complex matrix in place (row-major, partial pivoting; the multipliers below the diagonal).
 * The row swaps, or undefined when a pivot's magnitude is at most `pivotFloor`: the caller then refactors instead.
 */
export function denseComplexFactor(m: number, re: Float64Array, im: Float64Array, pivotFloor: number): Int32Array | undefined {
  const floor2 = pivotFloor * pivotFloor;
  const pivots = new Int32Array(m);
  for (let k = 0; k < m; k++) {
    let piv = k;
    let best = -1;
    for (let i = k; i < m; i++) {
      const v = re[i * m + k] ** 2 + im[i * m + k] ** 2;
      if (v > best) {
        best = v;
        piv = i;
      }
    }
    if (!(best > floor2)) return undefined;
    pivots[k] = piv;
    if (piv !== k) {
      for (let j = 0; j < m; j++) {
        swap(re, k * m + j, piv * m + j);
        swap(im, k * m + j, piv * m + j);
      }
    }
    const invRe = re[k * m + k] / best;
    const invIm = -im[k * m + k] / best;
    for (let i = k + 1; i < m; i++) {
      const ar = re[i * m + k];
      const ai = im[i * m + k];
      const fr = ar * invRe - ai * invIm;
      const fi = ar * invIm + ai * invRe;
      re[i * m + k] = fr;
      im[i * m + k] = fi;
      if (fr === 0 && fi === 0) continue;
      for (let j = k + 1; j < m; j++) {
        const br = re[k * m + j];
        const bi = im[k * m + j];
        re[i * m + j] -= fr * br - fi * bi;
        im[i * m + j] -= fr * bi + fi * br;
      }
    }
  }
  return pivots;
}

/** Solves S z = r in place (r becomes z) with the factors and row swaps of denseComplexFactor. */
export function denseComplexSolveFactored(m: number, re: Float64Array, im: Float64Array, pivots: Int32Array, rRe: Float64Array, rIm: Float64Array): void {
  // The factorization swapped whole rows, multipliers included, so the swaps all come first (as LAPACK's getrs).
  for (let k = 0; k < m; k++) {
    const p = pivots[k];
    if (p !== k) {
      swap(rRe, k, p);
      swap(rIm, k, p);
    }
  }
  for (let k = 0; k < m; k++) {
    for (let i = k + 1; i < m; i++) {
      const fr = re[i * m + k];
      const fi = im[i * m + k];
      if (fr === 0 && fi === 0) continue;
      rRe[i] -= fr * rRe[k] - fi * rIm[k];
      rIm[i] -= fr * rIm[k] + fi * rRe[k];
    }
  }
  for (let k = m - 1; k >= 0; k--) {
    let sr = rRe[k];
    let si = rIm[k];
    for (let j = k + 1; j < m; j++) {
      sr -= re[k * m + j] * rRe[j] - im[k * m + j] * rIm[j];
      si -= re[k * m + j] * rIm[j] + im[k * m + j] * rRe[j];
    }
    const dr = re[k * m + k];
    const di = im[k * m + k];
    const d2 = dr * dr + di * di;
    rRe[k] = (sr * dr + si * di) / d2;
    rIm[k] = (si * dr - sr * di) / d2;
  }
}

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
  const pivots = denseComplexFactor(m, sRe, sIm, pivotFloor);
  if (!pivots) return false;
  denseComplexSolveFactored(m, sRe, sIm, pivots, rRe, rIm);
  return true;
}

/**
 * K = I + D G of a low-rank update (m×m row-major, D the change and G = UᵀW), with the size of its terms before
 * they cancel: a change that leaves part of the network floating makes K singular by cancellation, so the pivot
 * floor is taken relative to that size, not to K's entries.
 */
export function capacitanceMatrix(m: number, dRe: Float64Array, dIm: Float64Array, gRe: Float64Array, gIm: Float64Array): { kRe: Float64Array; kIm: Float64Array; termScale: number } {
  const kRe = new Float64Array(m * m);
  const kIm = new Float64Array(m * m);
  let termScale = 1;
  for (let a = 0; a < m; a++) {
    for (let b = 0; b < m; b++) {
      let sr = a === b ? 1 : 0;
      let si = 0;
      let terms = a === b ? 1 : 0;
      for (let c = 0; c < m; c++) {
        const dr = dRe[a * m + c];
        const di = dIm[a * m + c];
        const gr = gRe[c * m + b];
        const gi = gIm[c * m + b];
        sr += dr * gr - di * gi;
        si += dr * gi + di * gr;
        terms += Math.hypot(dr, di) * Math.hypot(gr, gi);
      }
      if (terms > termScale) termScale = terms;
      kRe[a * m + b] = sr;
      kIm[a * m + b] = si;
    }
  }
  return { kRe, kIm, termScale };
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}
