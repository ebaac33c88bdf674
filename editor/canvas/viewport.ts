// The view onto the drawing: a translation in screen pixels and a zoom. Pure math here; the controller applies it
// to the page as one transform outside React's render.
import type { Point } from '../../shared/symbols';

export interface Viewport {
  x: number;
  y: number;
  zoom: number;
}

export const MIN_ZOOM = 0.1;
export const MAX_ZOOM = 4;

export function screenToWorld(vp: Viewport, p: Point): Point {
  return { x: (p.x - vp.x) / vp.zoom, y: (p.y - vp.y) / vp.zoom };
}

export function worldToScreen(vp: Viewport, p: Point): Point {
  return { x: p.x * vp.zoom + vp.x, y: p.y * vp.zoom + vp.y };
}

export function clampZoom(z: number): number {
  return Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, z));
}

/** Zooms by `factor` keeping the world point under `focus` (screen) where it is. */
export function zoomAt(vp: Viewport, focus: Point, factor: number): Viewport {
  const zoom = clampZoom(vp.zoom * factor);
  const k = zoom / vp.zoom;
  return { zoom, x: focus.x - (focus.x - vp.x) * k, y: focus.y - (focus.y - vp.y) * k };
}

export function panBy(vp: Viewport, dx: number, dy: number): Viewport {
  return { ...vp, x: vp.x + dx, y: vp.y + dy };
}

/** The viewport that shows `rect` (drawing units) centred in a view of the given size, with a margin. */
export function fitRect(rect: { x: number; y: number; width: number; height: number }, view: { width: number; height: number }, margin = 48, maxZoom = 1.25): Viewport {
  if (rect.width <= 0 && rect.height <= 0) return { x: view.width / 2 - rect.x, y: view.height / 2 - rect.y, zoom: 1 };
  const zoom = clampZoom(Math.min(maxZoom, (view.width - 2 * margin) / Math.max(rect.width, 1), (view.height - 2 * margin) / Math.max(rect.height, 1)));
  return { zoom, x: view.width / 2 - (rect.x + rect.width / 2) * zoom, y: view.height / 2 - (rect.y + rect.height / 2) * zoom };
}

/** Snaps a drawing coordinate to the grid. */
export function snap(v: number, grid: number): number {
  return Math.round(v / grid) * grid;
}
