// Currents of every element at its pins from the solved voltages (i = Y v, plus a load's correction current),
// and the net current each pin sends into elements, which the tie flows and the KCL residual start from.
import type { Complex } from '../complex';
import type { BuiltNetwork } from '../network/build-network';
import type { PinVoltages } from '../solve/load-iteration';

export interface ElementCurrents {
  /** Per stamp, the current into the element at each of its pins. */
  perStamp: Complex[][];
  /** Per pin, the sum of the currents it sends into elements (re, im), and the sum of their magnitudes. */
  injRe: Float64Array;
  injIm: Float64Array;
  injAbs: Float64Array;
}

export function elementCurrents(network: BuiltNetwork, volts: PinVoltages, corrections: Complex[]): ElementCurrents {
  const count = network.pins.length;
  const injRe = new Float64Array(count);
  const injIm = new Float64Array(count);
  const injAbs = new Float64Array(count);
  const perStamp = network.stamps.map((stamp) => {
    const currents = stamp.pins.map((_, i) => {
      let re = 0;
      let im = 0;
      stamp.pins.forEach((pj, j) => {
        const y = stamp.y[i][j];
        re += y.re * volts.re[pj] - y.im * volts.im[pj];
        im += y.re * volts.im[pj] + y.im * volts.re[pj];
      });
      return { re, im };
    });
    if (stamp.loadElement !== undefined) {
      const corr = corrections[stamp.loadElement];
      currents[0] = { re: currents[0].re + corr.re, im: currents[0].im + corr.im };
      currents[1] = { re: currents[1].re - corr.re, im: currents[1].im - corr.im };
    }
    stamp.pins.forEach((pin, i) => {
      injRe[pin] += currents[i].re;
      injIm[pin] += currents[i].im;
      injAbs[pin] += Math.hypot(currents[i].re, currents[i].im);
    });
    return currents;
  });
  return { perStamp, injRe, injIm, injAbs };
}

/** Complex power absorbed by a stamp, Σ V conj(I), VA. */
export function absorbedVa(network: BuiltNetwork, stampIndex: number, volts: PinVoltages, currents: ElementCurrents): Complex {
  const stamp = network.stamps[stampIndex];
  let re = 0;
  let im = 0;
  stamp.pins.forEach((pin, i) => {
    const c = currents.perStamp[stampIndex][i];
    re += volts.re[pin] * c.re + volts.im[pin] * c.im;
    im += volts.im[pin] * c.re - volts.re[pin] * c.im;
  });
  return { re, im };
}
