// react-native-gesture-handler's Manual gesture for the canvas: it sees every finger from its first contact.
// One finger goes to the tools (their own state machines tell taps, long presses and drags apart). Two fingers
// pinch and pan the view: the drawing point under the fingers' first centre stays under their current centre,
// scaled by how far apart they are now against when the second finger landed, so the view follows the fingers
// exactly (the library's Pinch reports scale only from its activation threshold on). A second finger cancels
// whatever the first had started.
//
// The callbacks keep their state in one object: the gesture library's compiler copies the plain values a callback
// closes over when the gesture is made, but objects are shared by reference.
import { Gesture, PointerType, type GestureTouchEvent, type TouchData } from 'react-native-gesture-handler';
import type { CanvasController } from '../canvas/canvas-controller';
import { clampZoom, type Viewport } from '../canvas/viewport';
import type { PointerSample } from '../tools/tool-state';

const kindOf = (t: PointerType): PointerSample['pointerType'] => (t === PointerType.MOUSE ? 'mouse' : t === PointerType.STYLUS ? 'pen' : 'touch');

interface GestureState {
  down: Set<number>;
  primary: number | null;
  /** Two fingers are (or were, in this gesture) down: the view's gesture, not the tools'. */
  twoFinger: boolean;
  /** The view and the two fingers when the second landed. */
  base: Viewport;
  fingers: [number, number] | null;
  centre0: { x: number; y: number };
  span0: number;
}

function pair(touches: TouchData[], ids: [number, number]): [TouchData, TouchData] | null {
  const a = touches.find((t) => t.id === ids[0]);
  const b = touches.find((t) => t.id === ids[1]);
  return a && b ? [a, b] : null;
}

export function canvasGesture(controller: CanvasController, keys: { shift: boolean }) {
  const st: GestureState = { down: new Set(), primary: null, twoFinger: false, base: controller.viewport, fingers: null, centre0: { x: 0, y: 0 }, span0: 1 };

  const sampleOf = (e: GestureTouchEvent, id: number) => {
    const t = e.allTouches.find((x) => x.id === id) ?? e.changedTouches.find((x) => x.id === id);
    return t ? controller.sample({ x: t.x, y: t.y }, kindOf(e.pointerType), keys.shift) : null;
  };

  const startTwoFinger = (e: GestureTouchEvent) => {
    const ids = [...st.down].slice(0, 2) as [number, number];
    const p = pair(e.allTouches, ids);
    if (!p) return;
    st.fingers = ids;
    st.base = controller.viewport;
    st.centre0 = { x: (p[0].x + p[1].x) / 2, y: (p[0].y + p[1].y) / 2 };
    st.span0 = Math.max(1, Math.hypot(p[0].x - p[1].x, p[0].y - p[1].y));
  };

  const moveTwoFinger = (e: GestureTouchEvent) => {
    if (!st.fingers) return;
    const p = pair(e.allTouches, st.fingers);
    if (!p) return;
    const centre = { x: (p[0].x + p[1].x) / 2, y: (p[0].y + p[1].y) / 2 };
    const span = Math.max(1, Math.hypot(p[0].x - p[1].x, p[0].y - p[1].y));
    const b = st.base;
    const zoom = clampZoom(b.zoom * (span / st.span0));
    const wx = (st.centre0.x - b.x) / b.zoom;
    const wy = (st.centre0.y - b.y) / b.zoom;
    controller.setViewport({ zoom, x: centre.x - wx * zoom, y: centre.y - wy * zoom });
  };

  return Gesture.Manual()
    .runOnJS(true)
    .onTouchesDown((e, manager) => {
      for (const t of e.changedTouches) st.down.add(t.id);
      if (st.down.size === 1 && st.primary === null && !st.twoFinger) {
        st.primary = e.changedTouches[0].id;
        const s = sampleOf(e, st.primary);
        if (s) controller.pointerDown(s);
        manager.activate();
      } else if (st.down.size >= 2) {
        if (!st.twoFinger) controller.cancelGesture();
        st.twoFinger = true;
        st.primary = null;
        startTwoFinger(e);
        manager.activate();
      }
    })
    .onTouchesMove((e) => {
      if (st.twoFinger) return moveTwoFinger(e);
      if (st.primary === null) return;
      const s = sampleOf(e, st.primary);
      if (s) controller.pointerMove(s);
    })
    .onTouchesUp((e, manager) => {
      for (const t of e.changedTouches) {
        if (t.id === st.primary && !st.twoFinger) {
          const s = sampleOf(e, t.id);
          if (s) controller.pointerUp(s);
        }
        st.down.delete(t.id);
      }
      // One of two fingers lifted: the other keeps panning from where the view is now.
      if (st.twoFinger && st.down.size >= 2) startTwoFinger(e);
      else if (st.twoFinger) st.fingers = null;
      if (st.down.size === 0) {
        st.primary = null;
        st.twoFinger = false;
        st.fingers = null;
        manager.end();
      }
    })
    .onTouchesCancelled((_e, manager) => {
      st.down.clear();
      st.primary = null;
      st.twoFinger = false;
      st.fingers = null;
      controller.cancelGesture();
      manager.end();
    });
}
