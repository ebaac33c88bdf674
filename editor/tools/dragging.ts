// Dragging the selection: the offset (snapped to the grid) is a preview, shown here and sent to the others
// through presence; the move is written as one transaction when the finger lifts.
import { GRID } from '../../shared/symbols';
import { snap } from '../canvas/viewport';
import { idle } from './idle';
import type { PointerSample, ToolState } from './tool-state';

export function dragging(start: PointerSample, ids: ReadonlySet<string>): ToolState {
  let dx = 0;
  let dy = 0;
  return {
    name: 'dragging',
    move(ctx, p) {
      dx = snap(p.world.x - start.world.x, GRID);
      dy = snap(p.world.y - start.world.y, GRID);
      ctx.actions.previewDrag(ids, dx, dy);
      return this;
    },
    up(ctx) {
      ctx.actions.previewDrag(null, 0, 0);
      if (dx !== 0 || dy !== 0) ctx.actions.moveBy(ids, dx, dy);
      return idle;
    },
    cancel(ctx) {
      ctx.actions.previewDrag(null, 0, 0);
      return idle;
    },
  };
}
