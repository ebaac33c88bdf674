// Each load's voltage per element, percent of rating, power, the model that produced it, its standing at the
// equipment (utilization range) and, under an open neutral, its constant-impedance answer beside it.
import type { LoadElement } from '../../shared/sheet';
import type { LoadModel } from '../solve/load-iteration';
import type { ResultContext } from './context';
import { combinedState, pinState } from './context';
import { magnitude, minus, pinVolts } from './phasor';
import { judge, snapNominal } from './standing';
import type { LiveState, LoadElementResult, LoadResult } from './types';

export function loadResult(ctx: ResultContext, load: LoadElement): LoadResult {
  const { network, volts, constantImpedanceVolts, models } = ctx.solution;
  const elements: LoadElementResult[] = [];
  const states: LiveState[] = [];
  let kw = 0;
  let kvar = 0;
  const usedModels = new Set<LoadModel>();
  // Dead when every conductor that should carry a phase voltage is dead; back-fed when any is live through loads.
  const mine = (ctx.partsByLoad.get(load.id) ?? []).map((k) => network.loads[k]);
  const hotPins = mine.flatMap((p) => [p.p, p.q]).filter((pin) => magnitude(network.nominal[pin]) > 1e-3 * network.zoneVolts[pin]);
  const dead = hotPins.length > 0 && hotPins.every((pin) => pinState(ctx, pin) === 'de-energised');
  (ctx.partsByLoad.get(load.id) ?? []).forEach((k) => {
    const part = network.loads[k];
    const v = minus(pinVolts(volts, part.p), pinVolts(volts, part.q));
    const current = ctx.currents.perStamp[part.stampIndex][0];
    const sRe = v.re * current.re + v.im * current.im;
    const sIm = v.im * current.re - v.re * current.im;
    const model: LoadModel = models[k].switched ? 'constant-impedance' : models[k].model;
    usedModels.add(model);
    const nominalVolts = snapNominal(magnitude(minus(network.nominal[part.p], network.nominal[part.q])));
    states.push(pinState(ctx, part.p), pinState(ctx, part.q));
    const magnitudeVolts = magnitude(v);
    const element: LoadElementResult = {
      label: part.label,
      volts: magnitudeVolts,
      angleDeg: (Math.atan2(v.im, v.re) * 180) / Math.PI,
      ratedVolts: part.ratedVolts,
      nominalVolts,
      percentOfRating: (100 * magnitudeVolts) / part.ratedVolts,
      kw: sRe / 1000,
      kvar: sIm / 1000,
      amperes: magnitude(current),
      model,
      switchedToImpedance: models[k].switched,
    };
    const standing = !dead ? judge(ctx.sheet.settings, nominalVolts, magnitudeVolts, 'utilization', load.loadKind === 'lighting') : undefined;
    if (standing) element.standing = standing;
    if (ctx.openNeutral) element.constantImpedanceVolts = magnitude(minus(pinVolts(constantImpedanceVolts, part.p), pinVolts(constantImpedanceVolts, part.q)));
    elements.push(element);
    kw += element.kw;
    kvar += element.kvar;
  });
  const worst = elements.reduce((w, e) => (Math.abs(e.percentOfRating - 100) > Math.abs(w - 100) ? e.percentOfRating : w), 100);
  const combined = combinedState(states);
  return {
    loadId: load.id,
    name: load.name,
    loadKind: load.loadKind,
    connection: load.connection,
    state: dead ? 'de-energised' : combined === 'partly-energised' ? 'energised' : combined,
    model: usedModels.size === 1 ? [...usedModels][0] : 'mix',
    elements,
    kw,
    kvar,
    worstPercentOfRating: elements.length ? worst : 0,
  };
}
