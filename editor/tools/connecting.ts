// Drawing a connection: a line follows the finger and snaps to the terminal it would land on; letting go over a
// terminal connects the two (the conductors are matched by the editor), anywhere else draws nothing.
import type { Point } from '../../shared/symbols';
import { dropTarget } from '../canvas/hit-test';
import { idle } from './idle';
import type { ToolState } from './tool-state';

export function connecting(from: { elementId: string; terminal: string; point: Point }): ToolState {
  let target: { elementId: string; terminal: string; point: Point } | null = null;
  return {
    name: 'connecting',
    move(ctx, p) {
      target = dropTarget(ctx.index(), p.world, ctx.zoom, from.elementId);
      ctx.ui.set({ connecting: { from, to: target?.point ?? p.world, target } });
      return this;
    },
    up(ctx) {
      ctx.ui.set({ connecting: null });
      if (target) ctx.actions.connect(from, target);
      else ctx.actions.say('Let go over a terminal to connect');
      return idle;
    },
    cancel(ctx) {
      ctx.ui.set({ connecting: null });
      return idle;
    },
  };
}
