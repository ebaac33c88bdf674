// Idle: nothing pressed. A press starts the state that fits the tool and what is under it.
import { pointingCanvas } from './pointing-canvas';
import { pointingElement } from './pointing-element';
import { pointingTap } from './pointing-tap';
import { pointingTerminal } from './pointing-terminal';
import type { ToolState } from './tool-state';

export const idle: ToolState = {
  name: 'idle',
  down(ctx, p) {
    const { tool } = ctx.ui.get();
    if (tool === 'cut' || tool === 'place') return pointingTap(p);
    const hit = ctx.hit(p.world, ctx.editable);
    if (hit.kind === 'terminal') return pointingTerminal(p, hit);
    if (hit.kind === 'element') return pointingElement(p, hit.elementId);
    return pointingCanvas(p, hit.kind === 'connection' ? hit.connectionId : null);
  },
};
