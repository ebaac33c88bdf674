// Small helpers to read solved voltages as phasors.
import type { Complex } from '../complex';
import type { PinVoltages } from '../solve/load-iteration';
import type { PhasorValue } from './types';

export function phasor(re: number, im: number): PhasorValue {
  const clean = (x: number) => (Math.abs(x) < 1e-300 ? 0 : x);
  return { re: clean(re), im: clean(im), magnitude: Math.hypot(re, im), angleDeg: (Math.atan2(im, re) * 180) / Math.PI };
}

export const pinVolts = (volts: PinVoltages, pin: number): Complex => ({ re: volts.re[pin], im: volts.im[pin] });

export const minus = (a: Complex, b: Complex): Complex => ({ re: a.re - b.re, im: a.im - b.im });

export const magnitude = (a: Complex): number => Math.hypot(a.re, a.im);
