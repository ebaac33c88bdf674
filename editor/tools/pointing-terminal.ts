// Pressing a terminal: moving draws a new connection from it; a tap selects its element.
import type { Hit } from '../canvas/hit-test';
import { connecting } from './connecting';
import { idle } from './idle';
import { moved, type PointerSample, type ToolState } from './tool-state';

export function pointingTerminal(start: PointerSample, hit: Extract<Hit, { kind: 'terminal' }>): ToolState {
  return {
    name: 'pointing-terminal',
    move(ctx, p) {
      if (!moved(start, p)) return this;
      return connecting({ elementId: hit.elementId, terminal: hit.terminal, point: hit.point }).move!(ctx, p);
    },
    up(ctx) {
      ctx.actions.select(new Set([hit.elementId]));
      return idle;
    },
    cancel() {
      return idle;
    },
  };
}
