// Complex scalars and small dense complex matrices for element stamps (a few conductors at a time).
// Large systems never use these: the sparse LU keeps real and imaginary parts in separate typed arrays.

export interface Complex {
  re: number;
  im: number;
}

export const ZERO: Complex = { re: 0, im: 0 };
export const ONE: Complex = { re: 1, im: 0 };

export const c = (re: number, im = 0): Complex => ({ re, im });
export const add = (a: Complex, b: Complex): Complex => ({ re: a.re + b.re, im: a.im + b.im });
export const sub = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });
export const mul = (a: Complex, b: Complex): Complex => ({
  re: a.re * b.re - a.im * b.im,
  im: a.re * b.im + a.im * b.re,
});
export const scale = (a: Complex, k: number): Complex => ({ re: a.re * k, im: a.im * k });
export const conj = (a: Complex): Complex => ({ re: a.re, im: -a.im });
export const neg = (a: Complex): Complex => ({ re: -a.re, im: -a.im });
export const abs = (a: Complex): number => Math.hypot(a.re, a.im);
export const argDeg = (a: Complex): number => (Math.atan2(a.im, a.re) * 180) / Math.PI;

export function div(a: Complex, b: Complex): Complex {
  const d = b.re * b.re + b.im * b.im;
  if (d === 0) throw new RangeError('complex division by zero');
  return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
}

export const inv = (a: Complex): Complex => div(ONE, a);

/** A phasor from magnitude and angle in degrees. */
export function polar(magnitude: number, angleDeg: number): Complex {
  const t = (angleDeg * Math.PI) / 180;
  return { re: magnitude * Math.cos(t), im: magnitude * Math.sin(t) };
}

/** Row-major dense complex matrix. */
export type ComplexMatrix = Complex[][];

export function zeros(rows: number, cols = rows): ComplexMatrix {
  return Array.from({ length: rows }, () => Array.from({ length: cols }, () => ({ re: 0, im: 0 })));
}

export function identity(n: number): ComplexMatrix {
  const m = zeros(n);
  for (let i = 0; i < n; i++) m[i][i] = { re: 1, im: 0 };
  return m;
}

export function matMul(a: ComplexMatrix, b: ComplexMatrix): ComplexMatrix {
  const rows = a.length;
  const inner = b.length;
  const cols = b[0]?.length ?? 0;
  const out = zeros(rows, cols);
  for (let i = 0; i < rows; i++) {
    for (let k = 0; k < inner; k++) {
      const aik = a[i][k];
      if (aik.re === 0 && aik.im === 0) continue;
      for (let j = 0; j < cols; j++) {
        const bkj = b[k][j];
        out[i][j].re += aik.re * bkj.re - aik.im * bkj.im;
        out[i][j].im += aik.re * bkj.im + aik.im * bkj.re;
      }
    }
  }
  return out;
}

export function matVec(a: ComplexMatrix, x: Complex[]): Complex[] {
  return a.map((row) => row.reduce((acc, aij, j) => add(acc, mul(aij, x[j])), ZERO));
}

export function matAdd(a: ComplexMatrix, b: ComplexMatrix): ComplexMatrix {
  return a.map((row, i) => row.map((v, j) => add(v, b[i][j])));
}

export function matScale(a: ComplexMatrix, k: Complex): ComplexMatrix {
  return a.map((row) => row.map((v) => mul(v, k)));
}

/** Inverse by Gauss–Jordan elimination with partial pivoting; throws when the matrix is singular to working precision. */
export function matInverse(a: ComplexMatrix): ComplexMatrix {
  const n = a.length;
  const m = a.map((row) => row.map((v) => ({ ...v })));
  const out = identity(n);
  const scaleRef = Math.max(1e-300, ...a.flat().map(abs));
  for (let col = 0; col < n; col++) {
    let pivot = col;
    for (let r = col + 1; r < n; r++) if (abs(m[r][col]) > abs(m[pivot][col])) pivot = r;
    if (abs(m[pivot][col]) <= scaleRef * 1e-14) throw new RangeError(`matrix is singular at column ${col}`);
    [m[col], m[pivot]] = [m[pivot], m[col]];
    [out[col], out[pivot]] = [out[pivot], out[col]];
    const p = inv(m[col][col]);
    for (let j = 0; j < n; j++) {
      m[col][j] = mul(m[col][j], p);
      out[col][j] = mul(out[col][j], p);
    }
    for (let r = 0; r < n; r++) {
      if (r === col) continue;
      const f = m[r][col];
      if (f.re === 0 && f.im === 0) continue;
      for (let j = 0; j < n; j++) {
        m[r][j] = sub(m[r][j], mul(f, m[col][j]));
        out[r][j] = sub(out[r][j], mul(f, out[col][j]));
      }
    }
  }
  return out;
}
