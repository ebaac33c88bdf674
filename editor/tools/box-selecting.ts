// Drawing a selection box: everything the box touches is selected when it is let go (shift adds to what was).
import { idle } from './idle';
import type { PointerSample, ToolState } from './tool-state';

export function boxSelecting(start: PointerSample, adding: boolean): ToolState {
  const rectTo = (p: PointerSample) => ({
    x: Math.min(start.world.x, p.world.x),
    y: Math.min(start.world.y, p.world.y),
    width: Math.abs(p.world.x - start.world.x),
    height: Math.abs(p.world.y - start.world.y),
  });
  return {
    name: 'box-selecting',
    move(ctx, p) {
      ctx.ui.set({ box: rectTo(p) });
      return this;
    },
    up(ctx, p) {
      const ids = ctx.index().inRect(rectTo(p));
      ctx.ui.set({ box: null });
      const current = ctx.ui.get().selection;
      ctx.actions.select(new Set(adding ? [...current, ...ids] : ids));
      return idle;
    },
    cancel(ctx) {
      ctx.ui.set({ box: null });
      return idle;
    },
  };
}
