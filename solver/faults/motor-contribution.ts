// Motors feeding a fault: during the fault a contributing motor is a source behind its subtransient reactance X"d
// instead of its load impedance. The pre-fault state stays that of the constant-impedance network: the internal EMF
// E" = V_pre (1 − Y_load / Y"), so the motor's current Y" (V − E") = Y" V + (Y_load − Y") V_pre is a fixed
// correction current (the same mechanism as the load iteration's) beside the admittance Y" = 1 / (j X"d).
import type { Sheet } from '../../shared/sheet';
import type { Complex } from '../complex';
import type { BuiltNetwork } from '../network/build-network';
import type { PinVoltages } from '../solve/load-iteration';

/**
 * Subtransient reactance of an induction motor on its own kVA base when the sheet gives none: common practice
 * (IEEE Std 141 gives about 0.17 pu for induction motors, from memory); it makes a motor feed about 1 / 0.17 ≈ 6 times
 * its rated current into a fault at its terminals.
 */
export const MOTOR_SUBTRANSIENT_DEFAULT_PU = 0.17;

export interface MotorContribution {
  /** The network with each contributing motor's stamp at Y" = 1 / (j X"d). */
  network: BuiltNetwork;
  /** Per load element: the correction current (Y_load − Y") V_pre of contributing motors, zero elsewhere. */
  corrections: Complex[];
  motorIds: string[];
}

/** The fault-time network when some motor contributes, else undefined (nothing changes). */
export function motorContribution(sheet: Sheet, network: BuiltNetwork, prefault: PinVoltages, corrections: Complex[]): MotorContribution | undefined {
  const stamps = network.stamps.slice();
  const next = corrections.map((c) => ({ ...c }));
  const motorIds = new Set<string>();
  network.loads.forEach((part, k) => {
    const load = sheet.elements[part.loadId];
    if (load?.kind !== 'load' || load.loadKind !== 'motor' || !load.contributesToFaults) return;
    // The motor's own kVA base per element: its rated (what-if scaled) apparent power; a motor scaled to 0 is off.
    const va = Math.hypot(part.ratedVa.re, part.ratedVa.im);
    if (!(va > 0)) return;
    const xOhms = ((load.subtransientReactancePu ?? MOTOR_SUBTRANSIENT_DEFAULT_PU) * part.ratedVolts * part.ratedVolts) / va;
    const ym: Complex = { re: 0, im: -1 / xOhms };
    const v = { re: prefault.re[part.p] - prefault.re[part.q], im: prefault.im[part.p] - prefault.im[part.q] };
    const dy = { re: part.y.re - ym.re, im: part.y.im - ym.im };
    next[k] = { re: next[k].re + dy.re * v.re - dy.im * v.im, im: next[k].im + dy.re * v.im + dy.im * v.re };
    const old = stamps[part.stampIndex];
    stamps[part.stampIndex] = {
      ...old,
      y: [
        [{ ...ym }, { re: -ym.re, im: -ym.im }],
        [{ re: -ym.re, im: -ym.im }, { ...ym }],
      ],
    };
    motorIds.add(part.loadId);
  });
  if (motorIds.size === 0) return undefined;
  return { network: { ...network, stamps }, corrections: next, motorIds: [...motorIds] };
}
