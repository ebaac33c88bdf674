// Pressing an element: a tap selects it (shift adds), a long press adds it to the selection or takes it out
// (multi-select by touch), and moving starts a drag of the selection (or a pan for a viewer).
import { dragging } from './dragging';
import { idle } from './idle';
import { panning } from './panning';
import { moved, type PointerSample, type ToolState } from './tool-state';

export function pointingElement(start: PointerSample, elementId: string): ToolState {
  let longPressed = false;
  return {
    name: 'pointing-element',
    move(ctx, p) {
      if (!moved(start, p)) return this;
      if (!ctx.editable) return panning(p).move!(ctx, p);
      const { selection } = ctx.ui.get();
      const ids = selection.has(elementId) ? selection : new Set([elementId]);
      if (!selection.has(elementId)) ctx.actions.select(ids);
      return dragging(start, ids).move!(ctx, p);
    },
    longPress(ctx) {
      longPressed = true;
      ctx.actions.toggleInSelection(elementId);
      return this;
    },
    up(ctx, p) {
      if (!longPressed) {
        if (p.shift) ctx.actions.toggleInSelection(elementId);
        else ctx.actions.select(new Set([elementId]));
      }
      return idle;
    },
    cancel() {
      return idle;
    },
  };
}
