// Pressing empty canvas (or a connection): a tap selects the connection or clears the selection; moving pans by
// touch and draws a selection box with a mouse; a long press then a move draws the box by touch.
import { boxSelecting } from './box-selecting';
import { idle } from './idle';
import { panning } from './panning';
import { moved, type PointerSample, type ToolState } from './tool-state';

export function pointingCanvas(start: PointerSample, connectionId: string | null): ToolState {
  let longPressed = false;
  return {
    name: 'pointing-canvas',
    move(ctx, p) {
      if (!moved(start, p)) return this;
      if (longPressed || start.pointerType === 'mouse') return boxSelecting(start, p.shift).move!(ctx, p);
      return panning(start).move!(ctx, p);
    },
    longPress(ctx) {
      longPressed = true;
      ctx.actions.say('Drag to select everything in a box');
      return this;
    },
    up(ctx) {
      if (connectionId) ctx.actions.selectConnection(connectionId);
      else if (!longPressed) ctx.actions.select(new Set());
      return idle;
    },
    cancel() {
      return idle;
    },
  };
}
