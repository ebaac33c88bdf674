// A bus or panelboard: one pin per bar (every connection lands on the same bars), and the neutral-to-ground bond.
import type { BusElement } from '../../shared/sheet';
import { terminalConductors } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';

export function buildBus(ctx: BuilderContext, bus: BusElement): void {
  for (const conductor of terminalConductors(bus, 'bars') ?? []) ctx.pin(bus.id, 'bars', conductor);
  if (bus.neutralGroundBond && bus.neutralBar && bus.groundBar) {
    ctx.tie(ctx.pin(bus.id, 'bars', 'N'), ctx.pin(bus.id, 'bars', 'PE'), 'bond', bus.id, 'N');
  }
}
