// A grounding electrode: its resistance from the lead to remote earth (pin 0); zero ohms is a solid tie.
import { c } from '../complex';
import type { ElectrodeElement } from '../../shared/sheet';
import type { BuilderContext } from './builder-context';
import { EARTH_PIN } from './types';

export function buildElectrode(ctx: BuilderContext, e: ElectrodeElement): void {
  const lead = ctx.pin(e.id, 'lead', 'PE');
  if (e.ohms === 0) ctx.tie(lead, EARTH_PIN, 'solid-ground', e.id, 'PE');
  else ctx.stampBranch('electrode', e.id, lead, EARTH_PIN, c(1 / e.ohms));
}
