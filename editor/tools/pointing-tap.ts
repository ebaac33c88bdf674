// The cut and place tools: a tap cuts what is under it or places the chosen element there; moving pans instead.
import { idle } from './idle';
import { panning } from './panning';
import { moved, type PointerSample, type ToolState } from './tool-state';

export function pointingTap(start: PointerSample): ToolState {
  return {
    name: 'pointing-tap',
    move(ctx, p) {
      if (!moved(start, p)) return this;
      return panning(start).move!(ctx, p);
    },
    up(ctx) {
      const { tool } = ctx.ui.get();
      if (tool === 'cut') ctx.actions.cutAt(start.world);
      else if (tool === 'place') ctx.actions.placeAt(start.world);
      return idle;
    },
    cancel() {
      return idle;
    },
  };
}
