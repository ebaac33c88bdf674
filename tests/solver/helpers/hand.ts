// Independent hand calculations with mathjs complex numbers (never the solver's own complex helpers).
import { complex, add, subtract, multiply, divide, abs, conj, type Complex } from 'mathjs';

export type C = Complex;
export const cx = (re: number, im = 0): C => complex(re, im);
export const polarC = (mag: number, deg: number): C => complex({ r: mag, phi: (deg * Math.PI) / 180 });
export const mag = (z: C): number => abs(z) as unknown as number;

/** Impedance of a constant-impedance load of P watts at a power factor (lagging) on its rated voltage: V² / conj(S). */
export function loadImpedance(ratedVolts: number, watts: number, powerFactor = 1): C {
  const q = watts * Math.tan(Math.acos(powerFactor));
  return divide(cx(ratedVolts * ratedVolts), conj(cx(watts, q))) as C;
}

/**
 * Millman's theorem for a floating star point: branches of EMF e_k (against the reference) through z_k meet at
 * the star, which also returns to the reference through `returns` impedances. Returns the star voltage.
 */
export function millman(branches: { e: C; z: C }[], returns: C[] = []): C {
  let num: C = cx(0);
  let den: C = cx(0);
  for (const b of branches) {
    const y = divide(cx(1), b.z) as C;
    num = add(num, multiply(y, b.e)) as C;
    den = add(den, y) as C;
  }
  for (const z of returns) den = add(den, divide(cx(1), z)) as C;
  return divide(num, den) as C;
}

export { add, subtract, multiply, divide };
