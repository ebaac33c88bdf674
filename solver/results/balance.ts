// The checks every solve reports: the relative KCL residual at the nodes, and the power balance
// (source power = load power + losses, by Tellegen's theorem when the voltages and currents are consistent).
import type { ResultContext } from './context';
import { absorbedVa } from './currents';
import type { PowerBalance, SourceResult } from './types';

export function kclResidual(ctx: ResultContext): number {
  const { classes } = ctx.solution;
  let worst = 0;
  let scale = 0;
  for (let cls = 0; cls < classes.classCount; cls++) {
    let re = 0;
    let im = 0;
    let abs = 0;
    for (const pin of classes.members[cls]) {
      re += ctx.currents.injRe[pin];
      im += ctx.currents.injIm[pin];
      abs += ctx.currents.injAbs[pin];
    }
    worst = Math.max(worst, Math.hypot(re, im));
    scale = Math.max(scale, abs);
  }
  // A dead network carries only rounding: measure it against a thousandth of the loads' rated currents.
  const floor = 1e-3 * ctx.solution.network.loads.reduce((s, p) => s + Math.hypot(p.ratedVa.re, p.ratedVa.im) / p.ratedVolts, 0);
  scale = Math.max(scale, floor);
  return scale > 0 ? worst / scale : 0;
}

export function powerBalance(ctx: ResultContext, sources: SourceResult[]): PowerBalance {
  const { network, volts } = ctx.solution;
  let loadRe = 0;
  let loadIm = 0;
  let lossRe = 0;
  let lossIm = 0;
  network.stamps.forEach((stamp, k) => {
    const s = absorbedVa(network, k, volts, ctx.currents);
    if (stamp.kind === 'load') {
      loadRe += s.re;
      loadIm += s.im;
    } else {
      lossRe += s.re;
      lossIm += s.im;
    }
  });
  loadRe += ctx.extraAbsorbedVa?.re ?? 0;
  loadIm += ctx.extraAbsorbedVa?.im ?? 0;
  const sourceKw = sources.reduce((a, s) => a + s.kw, 0);
  const sourceKvar = sources.reduce((a, s) => a + s.kvar, 0);
  const missRe = sourceKw * 1000 - loadRe - lossRe;
  const missIm = sourceKvar * 1000 - loadIm - lossIm;
  // A dead network: against a thousandth of the loads' rated power rather than rounding.
  const ratedVa = network.loads.reduce((s, p) => s + Math.hypot(p.ratedVa.re, p.ratedVa.im), 0);
  const reference = Math.max(Math.hypot(sourceKw, sourceKvar) * 1000, Math.hypot(loadRe, loadIm), 1e-3 * ratedVa);
  return {
    sourceKw,
    sourceKvar,
    loadKw: loadRe / 1000,
    loadKvar: loadIm / 1000,
    lossKw: lossRe / 1000,
    lossKvar: lossIm / 1000,
    mismatchPercent: reference > 0 ? (100 * Math.hypot(missRe, missIm)) / reference : 0,
  };
}
