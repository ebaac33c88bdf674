// A breaker, fuse or switch: each closed pole (and the unswitched neutral and PE it carries) is a zero-impedance tie.
import type { BreakerElement, PhaseId } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import { poleKey } from './modifications';

export function breakerPoleState(b: BreakerElement, pole: PhaseId): BreakerElement['poleA'] {
  return { A: b.poleA, B: b.poleB, C: b.poleC }[pole];
}

export function buildBreaker(ctx: BuilderContext, b: BreakerElement): void {
  for (const pole of ['A', 'B', 'C'] as const) {
    const state = breakerPoleState(b, pole);
    if (state === 'none') continue;
    const line = ctx.pin(b.id, 'line', pole);
    const load = ctx.pin(b.id, 'load', pole);
    ctx.nominalLinks.push([line, load]);
    if (state === 'closed' && !ctx.mods.openPoles.has(poleKey(b.id, pole))) ctx.tie(line, load, 'breaker-pole', b.id, pole);
  }
  if (b.carriesNeutral) ctx.tie(ctx.pin(b.id, 'line', 'N'), ctx.pin(b.id, 'load', 'N'), 'breaker-neutral', b.id, 'N');
  if (b.carriesGround) ctx.tie(ctx.pin(b.id, 'line', 'PE'), ctx.pin(b.id, 'load', 'PE'), 'breaker-neutral', b.id, 'PE');
}
