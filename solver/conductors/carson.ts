// Modified Carson's equations for overhead lines (any frequency and earth resistivity), Kron reduction, and the
// phase-to-sequence transform of a 3×3 phase impedance matrix. Units: ohms per mile, distances in feet.

import type { ComplexMatrix } from '../complex';
import { matInverse, matMul, sub, zeros } from '../complex';
import { fortescueMatrix, inverseFortescueMatrix } from '../sequence';

export interface OverheadConductor {
  xFt: number;
  yFt: number;
  gmrFt: number;
  rOhmsPerMile: number;
}

// Constants of the modified equations in ohms per mile with feet (Kersting, Distribution System Modeling and
// Analysis, ch. 4): earth resistance π²f·10⁻⁴ Ω/km = 0.00158836 f Ω/mile; reactance 4πf·10⁻⁴·ln(…) Ω/km
// = 0.00202237 f Ω/mile; 7.6786 + ½ ln(ρ/f) collects the earth-return terms.
const EARTH_R_PER_HZ = 0.00158836;
const REACTANCE_PER_HZ = 0.00202237;
const EARTH_CONSTANT = 7.6786;

/** The three numbers that set a modified Carson matrix: earth R, reactance factor and the ln constant. */
export function carsonConstants(frequencyHz: number, earthOhmM: number) {
  if (!(frequencyHz > 0) || !Number.isFinite(frequencyHz)) throw new RangeError(`frequency ${frequencyHz} Hz must be positive`);
  if (!(earthOhmM > 0) || !Number.isFinite(earthOhmM)) {
    throw new RangeError(`earth resistivity ${earthOhmM} Ω·m must be positive`);
  }
  return {
    earthROhmsPerMile: EARTH_R_PER_HZ * frequencyHz,
    reactanceFactorOhmsPerMile: REACTANCE_PER_HZ * frequencyHz,
    lnConstant: EARTH_CONSTANT + 0.5 * Math.log(earthOhmM / frequencyHz),
  };
}

/** Primitive impedance matrix (one row per conductor, no reduction) in ohms per mile. */
export function carsonPrimitiveOhmsPerMile(
  conductors: OverheadConductor[],
  frequencyHz: number,
  earthOhmM: number,
): ComplexMatrix {
  if (conductors.length === 0) throw new RangeError('Carson matrix needs at least one conductor');
  conductors.forEach((k, i) => {
    if (![k.xFt, k.yFt].every(Number.isFinite)) throw new RangeError(`conductor ${i}: position must be finite`);
    if (!(k.gmrFt > 0)) throw new RangeError(`conductor ${i}: GMR ${k.gmrFt} ft must be positive`);
    if (!(k.rOhmsPerMile >= 0)) throw new RangeError(`conductor ${i}: resistance ${k.rOhmsPerMile} Ω/mile must be ≥ 0`);
  });
  const { earthROhmsPerMile, reactanceFactorOhmsPerMile, lnConstant } = carsonConstants(frequencyHz, earthOhmM);
  const n = conductors.length;
  const z = zeros(n);
  for (let i = 0; i < n; i++) {
    const ki = conductors[i];
    z[i][i] = {
      re: ki.rOhmsPerMile + earthROhmsPerMile,
      im: reactanceFactorOhmsPerMile * (Math.log(1 / ki.gmrFt) + lnConstant),
    };
    for (let j = i + 1; j < n; j++) {
      const kj = conductors[j];
      const dFt = Math.hypot(ki.xFt - kj.xFt, ki.yFt - kj.yFt);
      if (dFt <= ki.gmrFt || dFt <= kj.gmrFt) {
        throw new RangeError(`conductors ${i} and ${j} are ${dFt} ft apart: they overlap`);
      }
      const zij = { re: earthROhmsPerMile, im: reactanceFactorOhmsPerMile * (Math.log(1 / dFt) + lnConstant) };
      z[i][j] = zij;
      z[j][i] = { ...zij };
    }
  }
  return z;
}

/** Kron reduction: eliminates conductors keep..n−1 (grounded neutrals at zero volts), Zij − Zin Znn⁻¹ Znj. */
export function kronReduce(z: ComplexMatrix, keep: number): ComplexMatrix {
  const n = z.length;
  if (z.some((row) => row.length !== n)) throw new RangeError('Kron reduction needs a square matrix');
  if (!Number.isInteger(keep) || keep < 1 || keep > n) throw new RangeError(`keep ${keep} must be 1..${n}`);
  if (keep === n) return z.map((row) => row.map((v) => ({ ...v })));
  const block = (r0: number, r1: number, c0: number, c1: number) =>
    z.slice(r0, r1).map((row) => row.slice(c0, c1).map((v) => ({ ...v })));
  const zij = block(0, keep, 0, keep);
  const zin = block(0, keep, keep, n);
  const znj = block(keep, n, 0, keep);
  const znn = block(keep, n, keep, n);
  const correction = matMul(matMul(zin, matInverse(znn)), znj);
  return zij.map((row, i) => row.map((v, j) => sub(v, correction[i][j])));
}

/** Sequence impedance matrix A⁻¹ Z A, rows and columns in 0, 1, 2 order. */
export function phaseToSequence(zabc: ComplexMatrix): ComplexMatrix {
  if (zabc.length !== 3 || zabc.some((row) => row.length !== 3)) {
    throw new RangeError('phase-to-sequence transform needs a 3×3 matrix');
  }
  return matMul(matMul(inverseFortescueMatrix(), zabc), fortescueMatrix());
}
