// Breakers (pole currents from the tie flows), sources, transformers, electrodes and neutral-to-ground bonds.
import type { BreakerElement, ElectrodeElement, PhaseId, SourceElement, TransformerElement } from '../../shared/sheet';
import { breakerPoleState } from '../network/switch';
import { poleKey } from '../network/modifications';
import type { ResultContext } from './context';
import { absorbedVa } from './currents';
import { magnitude, phasor, pinVolts } from './phasor';
import type { BondResult, BreakerResult, ElectrodeResult, SourceResult, TransformerResult } from './types';

function tieIndex(ctx: ResultContext, kind: string, elementId: string, conductor: string): number {
  return ctx.tieByKey.get(`${kind}|${elementId}|${conductor}`) ?? -1;
}

const flowMagnitude = (ctx: ResultContext, t: number) => (t < 0 ? 0 : Math.hypot(ctx.flows.re[t], ctx.flows.im[t]));

export function breakerResult(ctx: ResultContext, b: BreakerElement, openPoles: Set<string>): BreakerResult {
  const result: BreakerResult = { breakerId: b.id, name: b.name, poles: {} };
  let largest = 0;
  for (const pole of ['A', 'B', 'C'] as PhaseId[]) {
    const state = breakerPoleState(b, pole);
    if (state === 'none') continue;
    const open = state === 'open' || openPoles.has(poleKey(b.id, pole));
    const amperes = open ? 0 : flowMagnitude(ctx, tieIndex(ctx, 'breaker-pole', b.id, pole));
    largest = Math.max(largest, amperes);
    result.poles[pole] = { state: open ? 'open' : 'closed', amperes };
  }
  if (b.ratingAmperes !== undefined) {
    result.ratingAmperes = b.ratingAmperes;
    result.percentOfRating = (100 * largest) / b.ratingAmperes;
  }
  return result;
}

export function sourceResult(ctx: ResultContext, s: SourceElement): SourceResult {
  const layout = ctx.solution.network.sources.find((l) => l.sourceId === s.id);
  const result: SourceResult = { sourceId: s.id, name: s.name, phases: {}, kw: 0, kvar: 0 };
  if (!layout) return result;
  for (const { conductor, tieIndex: t } of layout.emfTies) {
    // The EMF tie runs phase → star; the source delivers the opposite of the flow through it.
    const delivered = { re: -ctx.flows.re[t], im: -ctx.flows.im[t] };
    const e = ctx.solution.network.ties[t].offset;
    result.phases[conductor as PhaseId] = phasor(delivered.re, delivered.im);
    result.kw += (e.re * delivered.re + e.im * delivered.im) / 1000;
    result.kvar += (e.im * delivered.re - e.re * delivered.im) / 1000;
  }
  return result;
}

export function transformerResult(ctx: ResultContext, t: TransformerElement): TransformerResult {
  const { network, volts } = ctx.solution;
  let outRe = 0;
  let outIm = 0;
  let lossKw = 0;
  (ctx.stampsByElement.get(t.id) ?? []).forEach((k) => {
    const stamp = network.stamps[k];
    if (stamp.kind !== 'transformer') return;
    lossKw += absorbedVa(network, k, volts, ctx.currents).re / 1000;
    stamp.pins.forEach((pin, i) => {
      if (network.pins[pin].terminal !== 'secondary') return;
      const v = pinVolts(volts, pin);
      const c = ctx.currents.perStamp[k][i];
      // Current into the winding at a secondary pin is the opposite of what it delivers.
      outRe -= v.re * c.re + v.im * c.im;
      outIm -= v.im * c.re - v.re * c.im;
    });
  });
  const kva = Math.hypot(outRe, outIm) / 1000;
  return { transformerId: t.id, name: t.name, kva, kw: outRe / 1000, kvar: outIm / 1000, percentOfRating: (100 * kva) / t.kva, lossKw };
}

export function electrodeResult(ctx: ResultContext, e: ElectrodeElement): ElectrodeResult {
  const { network, volts } = ctx.solution;
  const lead = network.pinIndex.get(`${e.id}|lead|PE`);
  if (lead === undefined) return { electrodeId: e.id, name: e.name, amperes: 0, volts: 0 };
  const stampIndex = (ctx.stampsByElement.get(e.id) ?? []).find((k) => network.stamps[k].kind === 'electrode') ?? -1;
  const amperes = stampIndex >= 0 ? magnitude(ctx.currents.perStamp[stampIndex][0]) : flowMagnitude(ctx, tieIndex(ctx, 'solid-ground', e.id, 'PE'));
  return { electrodeId: e.id, name: e.name, amperes, volts: magnitude(pinVolts(volts, lead)) };
}

export function bondResults(ctx: ResultContext): BondResult[] {
  const out: BondResult[] = [];
  ctx.solution.network.ties.forEach((tie, t) => {
    if (tie.kind !== 'bond') return;
    const bus = ctx.sheet.elements[tie.elementId];
    const permitted = bus?.kind === 'bus' && (bus.role === 'service' || bus.role === 'separately-derived');
    out.push({ busId: tie.elementId, amperes: flowMagnitude(ctx, t), permitted });
  });
  return out;
}
