// Each bus's voltages: conductor phasors against remote earth, line-to-neutral, line-to-line, neutral-to-ground,
// symmetrical components and unbalance on three-phase buses, and their standing against the chosen standard.
import type { BusElement, ConductorId, PhaseId } from '../../shared/sheet';
import { terminalConductors } from '../../shared/sheet';
import { negativeSequenceRatioPercent, nemaUnbalancePercent, symmetricalComponents } from '../sequence';
import type { ResultContext } from './context';
import { combinedState, findPin, pinState, pinUngrounded } from './context';
import { magnitude, minus, phasor, pinVolts } from './phasor';
import { judge, snapNominal } from './standing';
import type { BusResult, LineToLine } from './types';

const PAIRS: [LineToLine, PhaseId, PhaseId][] = [
  ['AB', 'A', 'B'],
  ['BC', 'B', 'C'],
  ['CA', 'C', 'A'],
];

export function busResult(ctx: ResultContext, bus: BusElement): BusResult {
  const { volts, network } = ctx.solution;
  const settings = ctx.sheet.settings;
  const conductors = terminalConductors(bus, 'bars') ?? [];
  const pins = new Map<ConductorId, number>();
  for (const c of conductors) {
    const pin = findPin(ctx, bus.id, 'bars', c);
    if (pin !== undefined) pins.set(c, pin);
  }
  const v = (c: ConductorId) => pinVolts(volts, pins.get(c)!);
  const nom = (c: ConductorId) => network.nominal[pins.get(c)!];
  const phases = (['A', 'B', 'C'] as const).filter((p) => pins.has(p));
  const ungrounded = [...pins.values()].some((pin) => pinUngrounded(ctx, pin));
  const result: BusResult = {
    busId: bus.id,
    name: bus.name,
    role: bus.role,
    state: combinedState(phases.map((p) => pinState(ctx, pins.get(p)!))),
    ungrounded,
    nominal: {},
    conductors: {},
    lineToNeutralVolts: {},
    lineToLineVolts: {},
    neutralToGroundVolts: null,
    phaseToGroundVolts: {},
    standing: { lineToNeutral: {}, lineToLine: {} },
  };
  for (const [c, pin] of pins) {
    const x = pinVolts(volts, pin);
    result.conductors[c] = { phasor: phasor(x.re, x.im), state: pinState(ctx, pin), ungrounded: pinUngrounded(ctx, pin) };
  }
  const ground = pins.has('PE') ? v('PE') : { re: 0, im: 0 };
  const point = bus.role === 'service' ? 'service' : 'utilization';
  const live = result.state !== 'de-energised';
  if (pins.has('N')) {
    for (const p of phases) {
      result.lineToNeutralVolts[p] = magnitude(minus(v(p), v('N')));
      const nominal = snapNominal(magnitude(minus(nom(p), nom('N'))));
      result.nominal.lineToNeutralVolts = Math.max(result.nominal.lineToNeutralVolts ?? 0, nominal);
      const s = live ? judge(settings, nominal, result.lineToNeutralVolts[p]!, point) : undefined;
      if (s) result.standing.lineToNeutral[p] = s;
    }
    result.neutralToGroundVolts = ungrounded ? null : magnitude(minus(v('N'), ground));
  }
  for (const [name, p, q] of PAIRS) {
    if (!pins.has(p) || !pins.has(q)) continue;
    result.lineToLineVolts[name] = magnitude(minus(v(p), v(q)));
    const nominal = snapNominal(magnitude(minus(nom(p), nom(q))));
    result.nominal.lineToLineVolts = Math.max(result.nominal.lineToLineVolts ?? 0, nominal);
    const s = live ? judge(settings, nominal, result.lineToLineVolts[name]!, point) : undefined;
    if (s) result.standing.lineToLine[name] = s;
  }
  for (const p of phases) result.phaseToGroundVolts[p] = ungrounded ? 'ungrounded' : magnitude(minus(v(p), ground));
  if (phases.length === 3 && live) {
    const reference = pins.has('N') ? v('N') : { re: 0, im: 0 };
    const [a, b, c] = phases.map((p) => minus(v(p), reference));
    const seq = symmetricalComponents(a, b, c);
    result.sequence = {
      zero: phasor(seq.zero.re, seq.zero.im),
      positive: phasor(seq.positive.re, seq.positive.im),
      negative: phasor(seq.negative.re, seq.negative.im),
    };
    const ll = PAIRS.map(([, p, q]) => magnitude(minus(v(p), v(q))));
    if (magnitude(seq.positive) > 1e-9 * Math.max(...ll, 1) && ll.every((x) => x > 0)) {
      result.unbalance = {
        nemaPercent: nemaUnbalancePercent(ll[0], ll[1], ll[2]),
        negativeSequencePercent: negativeSequenceRatioPercent(a, b, c),
      };
    }
  }
  return result;
}
