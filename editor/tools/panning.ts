// Panning with one finger (or a viewer's drag anywhere): the view follows the pointer.
import { idle } from './idle';
import type { PointerSample, ToolState } from './tool-state';

export function panning(start: PointerSample): ToolState {
  let last = start.screen;
  return {
    name: 'panning',
    move(ctx, p) {
      ctx.panBy(p.screen.x - last.x, p.screen.y - last.y);
      last = p.screen;
      return this;
    },
    up() {
      return idle;
    },
    cancel() {
      return idle;
    },
  };
}
