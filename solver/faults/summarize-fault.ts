// The figures of one fault: pre-fault voltages, the current at each terminal, sequence currents, X/R and the peak.
import type { PhaseId, ShuntFaultType } from '../../shared/sheet';
import type { Complex } from '../complex';
import { div } from '../complex';
import { phasor } from '../results/phasor';
import { symmetricalComponents } from '../sequence';
import type { FaultCurrents, FaultSystem } from './compensation';
import type { FaultNetwork } from './fault-branches';
import type { FaultOutcomeSummary, FaultReturn, FaultTerminals, FaultTerminalName } from './fault-types';
import { peakFactor } from './peak-factor';

export const PREFAULT_BASIS =
  'pre-fault voltages from the network with every load at its rated-voltage impedance (no load iteration); during the fault every load is that same constant impedance';

const asPhasor = (v: Complex) => phasor(v.re, v.im);

export function summarizeFault(
  fs: FaultSystem,
  type: ShuntFaultType,
  fault: FaultNetwork,
  terminals: FaultTerminals,
  returnPath: FaultReturn | undefined,
  faultOhms: Complex,
  currents: FaultCurrents,
): FaultOutcomeSummary {
  const v0 = (pin: number): Complex => ({ re: fs.prefault.re[pin], im: fs.prefault.im[pin] });
  const drawn = (pin: number | undefined): Complex => (pin === undefined ? { re: 0, im: 0 } : currents.drawn.get(pin) ?? { re: 0, im: 0 });
  const phases = fault.phases;
  const returnPin = type === 'line-to-neutral' ? terminals.neutral : type === 'line-to-ground' || type === 'double-line-to-ground' ? terminals.ground : undefined;
  // The reference the pre-fault voltages are given against: the return, else the neutral bar, else remote earth.
  const reference = returnPin ?? terminals.neutral ?? 0;
  const prefaultVolts: Partial<Record<PhaseId, ReturnType<typeof phasor>>> = {};
  for (const p of phases) {
    const pin = terminals.phases[p]!;
    prefaultVolts[p] = asPhasor({ re: v0(pin).re - v0(reference).re, im: v0(pin).im - v0(reference).im });
  }
  const out: Partial<Record<FaultTerminalName, ReturnType<typeof phasor>>> = {};
  for (const p of ['A', 'B', 'C'] as PhaseId[]) if (terminals.phases[p] !== undefined) out[p] = asPhasor(drawn(terminals.phases[p]));
  if (returnPin !== undefined) {
    // The return carries the fault current back: reported as flowing out of the fault into the return conductor.
    const back = drawn(returnPin);
    const name: FaultTerminalName = type === 'line-to-neutral' ? 'N' : returnPath === 'earth' ? 'earth' : returnPath === 'N' ? 'N' : 'PE';
    out[name] = asPhasor({ re: -back.re, im: -back.im });
  }
  const phaseAmps = phases.map((p) => drawn(terminals.phases[p]));
  let worst = 0;
  phaseAmps.forEach((a, k) => {
    if (Math.hypot(a.re, a.im) > Math.hypot(phaseAmps[worst].re, phaseAmps[worst].im)) worst = k;
  });
  const worstAmps = phaseAmps[worst];
  const symmetricalAmps = Math.hypot(worstAmps.re, worstAmps.im);
  // The loop the largest current flows in: its driving pre-fault voltage over that current.
  const pinOf = (p: PhaseId) => terminals.phases[p]!;
  let driving: Complex;
  if (type === 'three-phase') {
    const mean = phases.reduce((s, p) => ({ re: s.re + v0(pinOf(p)).re / 3, im: s.im + v0(pinOf(p)).im / 3 }), { re: 0, im: 0 });
    driving = { re: v0(pinOf(phases[worst])).re - mean.re, im: v0(pinOf(phases[worst])).im - mean.im };
  } else if (type === 'line-to-line') {
    const other = phases[1 - worst];
    driving = { re: v0(pinOf(phases[worst])).re - v0(pinOf(other)).re, im: v0(pinOf(phases[worst])).im - v0(pinOf(other)).im };
  } else {
    driving = { re: v0(pinOf(phases[worst])).re - v0(reference).re, im: v0(pinOf(phases[worst])).im - v0(reference).im };
  }
  let xOverR = 0;
  const { A, B, C } = terminals.phases;
  const i1 = A !== undefined && B !== undefined && C !== undefined ? symmetricalComponents(drawn(A), drawn(B), drawn(C)).positive : undefined;
  if (i1 && Math.hypot(i1.re, i1.im) > 1e-9 * symmetricalAmps && symmetricalAmps > 0) {
    // On a three-phase bus the loop is the sequence networks' series-parallel connection: E1 / I1
    // (Z1 + Zf, Z1 + Z2 + Zf, Z1 + Z2 + Z0 + 3Zf, Z1 + Z2 ∥ (Z0 + 3Zf)).
    const e1 = symmetricalComponents(v0(A!), v0(B!), v0(C!)).positive;
    const z = div(e1, i1);
    xOverR = z.re > 0 ? z.im / z.re : z.im > 0 ? Infinity : 0;
  } else if (symmetricalAmps > 0) {
    const z = div(driving, worstAmps);
    xOverR = z.re > 0 ? z.im / z.re : z.im > 0 ? Infinity : 0;
  }
  const kappa = peakFactor(xOverR);
  const summary: FaultOutcomeSummary = {
    faultType: type,
    phases,
    ...(returnPin !== undefined && type !== 'line-to-neutral' ? { returnPath } : {}),
    faultOhms,
    prefaultVolts,
    prefaultBasis: PREFAULT_BASIS,
    currents: out,
    symmetricalKa: symmetricalAmps / 1000,
    xOverR,
    peakFactor: kappa,
    peakKa: (kappa * Math.SQRT2 * symmetricalAmps) / 1000,
    ungroundedPart: currents.shifts.size > 0,
  };
  if (terminals.phases.A !== undefined && terminals.phases.B !== undefined && terminals.phases.C !== undefined) {
    const s = symmetricalComponents(drawn(terminals.phases.A), drawn(terminals.phases.B), drawn(terminals.phases.C));
    summary.sequenceCurrents = { zero: asPhasor(s.zero), positive: asPhasor(s.positive), negative: asPhasor(s.negative) };
  }
  return summary;
}
