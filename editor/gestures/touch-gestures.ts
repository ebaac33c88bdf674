// react-native-gesture-handler gestures for the canvas: one pointer goes to the tools (a Manual gesture, so the
// tools' own state machines tell taps, long presses and drags apart); two fingers pinch and pan the view. A
// second finger cancels whatever the first had started.
//
// The callbacks keep their state in one object: the gesture library's compiler copies the plain values a callback
// closes over when the gesture is made, but objects are shared by reference.
import { Gesture, PointerType, type GestureTouchEvent } from 'react-native-gesture-handler';
import type { CanvasController } from '../canvas/canvas-controller';
import { clampZoom, panBy, type Viewport } from '../canvas/viewport';
import type { PointerSample } from '../tools/tool-state';

const kindOf = (t: PointerType): PointerSample['pointerType'] => (t === PointerType.MOUSE ? 'mouse' : t === PointerType.STYLUS ? 'pen' : 'touch');

interface GestureState {
  down: Set<number>;
  primary: number | null;
  twoFinger: boolean;
  /** Two-finger gestures running (the pan and the pinch each count one). */
  active: number;
  base: Viewport;
  tx: number;
  ty: number;
  scale: number;
  focal: { x: number; y: number };
}

export function canvasGesture(controller: CanvasController, keys: { shift: boolean }) {
  const st: GestureState = {
    down: new Set(),
    primary: null,
    twoFinger: false,
    active: 0,
    base: controller.viewport,
    tx: 0,
    ty: 0,
    scale: 1,
    focal: { x: 0, y: 0 },
  };

  const sampleOf = (e: GestureTouchEvent, id: number) => {
    const t = e.allTouches.find((x) => x.id === id) ?? e.changedTouches.find((x) => x.id === id);
    return t ? controller.sample({ x: t.x, y: t.y }, kindOf(e.pointerType), keys.shift) : null;
  };

  const pointers = Gesture.Manual()
    .runOnJS(true)
    .onTouchesDown((e, manager) => {
      for (const t of e.changedTouches) st.down.add(t.id);
      if (st.down.size === 1 && st.primary === null) {
        st.primary = e.changedTouches[0].id;
        st.twoFinger = false;
        const s = sampleOf(e, st.primary);
        if (s) controller.pointerDown(s);
        manager.activate();
      } else if (!st.twoFinger) {
        st.twoFinger = true;
        controller.cancelGesture();
      }
    })
    .onTouchesMove((e) => {
      if (st.twoFinger || st.primary === null) return;
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
      if (st.down.size === 0) {
        st.primary = null;
        st.twoFinger = false;
        manager.end();
      }
    })
    .onTouchesCancelled((_e, manager) => {
      st.down.clear();
      st.primary = null;
      st.twoFinger = false;
      controller.cancelGesture();
      manager.end();
    });

  // Two fingers: the pan's translation (from the first touch, no threshold) moves the view, and the pinch's scale
  // zooms it about the fingers' current centre; both are applied to the view as it was when two fingers landed.
  const applyTwoFinger = () => {
    const moved = panBy(st.base, st.tx, st.ty);
    if (st.scale === 1) return controller.setViewport(moved);
    const zoom = clampZoom(moved.zoom * st.scale);
    const k = zoom / moved.zoom;
    controller.setViewport({ zoom, x: st.focal.x - (st.focal.x - moved.x) * k, y: st.focal.y - (st.focal.y - moved.y) * k });
  };
  const begin = () => {
    if (st.active++ > 0) return;
    st.base = controller.viewport;
    st.tx = 0;
    st.ty = 0;
    st.scale = 1;
  };
  const finish = () => {
    st.active = Math.max(0, st.active - 1);
  };

  const pan = Gesture.Pan()
    .runOnJS(true)
    .minPointers(2)
    .minDistance(0)
    .onStart(begin)
    .onUpdate((e) => {
      st.tx = e.translationX;
      st.ty = e.translationY;
      applyTwoFinger();
    })
    .onFinalize(finish);

  const pinch = Gesture.Pinch()
    .runOnJS(true)
    .onStart((e) => {
      begin();
      st.focal = { x: e.focalX, y: e.focalY };
    })
    .onUpdate((e) => {
      st.scale = e.scale;
      st.focal = { x: e.focalX, y: e.focalY };
      applyTwoFinger();
    })
    .onFinalize(() => {
      // Later pan updates keep the zoom reached.
      if (st.scale !== 1) {
        const vp = controller.viewport;
        st.base = { zoom: vp.zoom, x: vp.x - st.tx, y: vp.y - st.ty };
        st.scale = 1;
      }
      finish();
    });

  return Gesture.Simultaneous(pointers, pan, pinch);
}
