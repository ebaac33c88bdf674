// Browser input the gesture library leaves to us: the mouse wheel and trackpad (a non-passive listener, so the
// page itself never scrolls or zooms: ctrl/⌘ + wheel and trackpad pinches zoom, plain wheel pans), hover for the
// cursor the crew sees, touch-action none, and the shift key for adding to a selection.
import type { CanvasController } from '../canvas/canvas-controller';

const LINE_PX = 16;

export function attachDomInput(node: HTMLElement, controller: CanvasController, keys: { shift: boolean }): () => void {
  node.style.touchAction = 'none';
  (node.style as unknown as Record<string, string>).webkitUserSelect = 'none';
  node.style.userSelect = 'none';
  const onWheel = (e: WheelEvent) => {
    e.preventDefault();
    const rect = node.getBoundingClientRect();
    const focus = { x: e.clientX - rect.left, y: e.clientY - rect.top };
    const scale = e.deltaMode === 1 ? LINE_PX : e.deltaMode === 2 ? rect.height : 1;
    if (e.ctrlKey || e.metaKey) controller.zoomAt(focus, Math.exp(-e.deltaY * scale * 0.01));
    else controller.setViewport({ ...controller.viewport, x: controller.viewport.x - e.deltaX * scale, y: controller.viewport.y - e.deltaY * scale });
  };
  const onMove = (e: PointerEvent) => {
    if (e.pointerType !== 'mouse') return;
    const rect = node.getBoundingClientRect();
    controller.hover({ x: e.clientX - rect.left, y: e.clientY - rect.top });
  };
  const onKey = (e: KeyboardEvent) => (keys.shift = e.shiftKey);
  // Safari's own pinch events would zoom the page.
  const stop = (e: Event) => e.preventDefault();
  node.addEventListener('wheel', onWheel, { passive: false });
  node.addEventListener('pointermove', onMove);
  node.addEventListener('gesturestart', stop);
  window.addEventListener('keydown', onKey);
  window.addEventListener('keyup', onKey);
  return () => {
    node.removeEventListener('wheel', onWheel);
    node.removeEventListener('pointermove', onMove);
    node.removeEventListener('gesturestart', stop);
    window.removeEventListener('keydown', onKey);
    window.removeEventListener('keyup', onKey);
  };
}
