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

export function wantedCurrent(part: LoadPart, v: Complex, fraction: number): { current: Complex; switched: boolean } {
  const y = part.y;
  const yv = { re: y.re * v.re - y.im * v.im, im: y.re * v.im + y.im * v.re };
  if (belowSwitch(part, v, fraction)) {
    const k = switchedAdmittanceFactor(part, fraction);
    // A pure constant-impedance load is the same either side of the switch: it is not reported as switched.
    return { current: { re: k * yv.re, im: k * yv.im }, switched: part.behaviour.impedance < 1 };
  }
  const mag = Math.hypot(v.re, v.im);
  const { impedance, current, power } = part.behaviour;
  const sConj = { re: part.ratedVa.re, im: -part.ratedVa.im };
  // Constant current: |S|/V_rated at the load's own power-factor angle behind its terminal voltage.
  const iCurrent = { re: (sConj.re * v.re - sConj.im * v.im) / (part.ratedVolts * mag), im: (sConj.re * v.im + sConj.im * v.re) / (part.ratedVolts * mag) };
  // Constant power: conj(S / v) = conj(S) / conj(v).
  const d = v.re * v.re + v.im * v.im;
  const iPower = { re: (sConj.re * v.re - sConj.im * v.im) / d, im: (sConj.re * v.im + sConj.im * v.re) / d };
  return {
    current: {
      re: impedance * yv.re + current * iCurrent.re + power * iPower.re,
      im: impedance * yv.im + current * iCurrent.im + power * iPower.im,
    },
    switched: false,
  };
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
