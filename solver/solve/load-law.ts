// The current a load element wants at its voltage: its constant-impedance, constant-current and constant-power
// shares, and below the low-voltage switch the constant impedance that draws, at the switch voltage, the same
// current as the load's mix would (so the law is continuous and the iteration cannot chatter at the switch).
import type { Complex } from '../complex';
import type { LoadPart } from '../network/types';

/** True when the element's voltage is below the switch (fraction × rated); a zero fraction never switches. */
export function belowSwitch(part: LoadPart, v: Complex, fraction: number): boolean {
  const mag = Math.hypot(v.re, v.im);
  return mag < fraction * part.ratedVolts || mag <= 1e-9 * part.ratedVolts;
}

/** Multiple of the rated admittance that the switched load draws: z + i·Vr/Vs + p·(Vr/Vs)². */
export function switchedAdmittanceFactor(part: LoadPart, fraction: number): number {
  const { impedance, current, power } = part.behaviour;
  if (!(fraction > 0)) return 1; // only reached at zero volts, where the current is zero whatever the factor
  return impedance + current / fraction + power / (fraction * fraction);
}

/**
 * The wanted current at v = vr + j·vi into out[at], out[at + 1] (no objects: the load iteration calls this for
 * every element on every pass); true when the element is switched to constant impedance.
 */
export function wantedCurrentInto(part: LoadPart, vr: number, vi: number, fraction: number, out: Float64Array, at: number): boolean {
  const y = part.y;
  const yvRe = y.re * vr - y.im * vi;
  const yvIm = y.re * vi + y.im * vr;
  const mag = Math.hypot(vr, vi);
  const { impedance, current, power } = part.behaviour;
  if (mag < fraction * part.ratedVolts || mag <= 1e-9 * part.ratedVolts) {
    const k = switchedAdmittanceFactor(part, fraction);
    out[at] = k * yvRe;
    out[at + 1] = k * yvIm;
    // A pure constant-impedance load is the same either side of the switch: it is not reported as switched.
    return impedance < 1;
  }
  const sRe = part.ratedVa.re;
  const sIm = -part.ratedVa.im;
  // Constant current: |S|/V_rated at the load's own power-factor angle behind its terminal voltage.
  const rm = part.ratedVolts * mag;
  const iCurrentRe = (sRe * vr - sIm * vi) / rm;
  const iCurrentIm = (sRe * vi + sIm * vr) / rm;
  // Constant power: conj(S / v) = conj(S) / conj(v).
  const d = vr * vr + vi * vi;
  const iPowerRe = (sRe * vr - sIm * vi) / d;
  const iPowerIm = (sRe * vi + sIm * vr) / d;
  out[at] = impedance * yvRe + current * iCurrentRe + power * iPowerRe;
  out[at + 1] = impedance * yvIm + current * iCurrentIm + power * iPowerIm;
  return false;
}

/** Wirtinger derivatives of the wanted current: δw = A δv + B conj(δv). */
export function wantedDerivatives(part: LoadPart, v: Complex, fraction: number): { a: Complex; b: Complex } {
  if (belowSwitch(part, v, fraction)) {
    const k = switchedAdmittanceFactor(part, fraction);
    return { a: { re: k * part.y.re, im: k * part.y.im }, b: { re: 0, im: 0 } };
  }
  const mag = Math.hypot(v.re, v.im);
  const { impedance, current, power } = part.behaviour;
  const sConj = { re: part.ratedVa.re, im: -part.ratedVa.im };
  const beta = { re: (current * sConj.re) / part.ratedVolts, im: (current * sConj.im) / part.ratedVolts };
  const gamma = { re: power * sConj.re, im: power * sConj.im };
  // β v/|v|: ∂/∂v = β / (2|v|), ∂/∂v̄ = −β v² / (2|v|³); γ / v̄: ∂/∂v̄ = −γ / v̄².
  const v2 = { re: v.re * v.re - v.im * v.im, im: 2 * v.re * v.im };
  const k3 = 1 / (2 * mag * mag * mag);
  const bCurrent = { re: -(beta.re * v2.re - beta.im * v2.im) * k3, im: -(beta.re * v2.im + beta.im * v2.re) * k3 };
  const vbar2 = { re: v2.re, im: -v2.im };
  const d = vbar2.re * vbar2.re + vbar2.im * vbar2.im;
  const bPower = { re: -(gamma.re * vbar2.re + gamma.im * vbar2.im) / d, im: -(gamma.im * vbar2.re - gamma.re * vbar2.im) / d };
  return {
    a: { re: impedance * part.y.re + beta.re / (2 * mag), im: impedance * part.y.im + beta.im / (2 * mag) },
    b: { re: bCurrent.re + bPower.re, im: bCurrent.im + bPower.im },
  };
}
