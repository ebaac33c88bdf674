// The canvas's behaviour without React: the scene (geometry) kept current with the document and the drag
// preview, the viewport applied to the page as one transform outside React's render, pointer input fed to the
// tools, and the zoom band the drawing uses for its level of detail.
import type { Point, Rect } from '../../shared/symbols';
import { createToolActions, type ToolActions } from '../tools/actions';
import { ToolMachine } from '../tools/tool-machine';
import type { PointerSample, ToolContext } from '../tools/tool-state';
import type { SheetSession } from '../session/sheet-session';
import { Store } from '../session/store';
import { hitTest, SceneIndex } from './hit-test';
import { buildScene, withMoved, type Scene } from './scene';
import { clampZoom, fitRect, panBy, screenToWorld, zoomAt, type Viewport } from './viewport';

/** Coarse zoom levels: the drawing hides value tags when far out and thins the labels. */
export type ZoomBand = 'far' | 'mid' | 'near';

/** The legend's height over the canvas, kept clear when the sheet is fitted into view. */
const FIT_TOP_INSET = 110;

/** The least zoom at which value tags are drawn (the 'mid' band): where a large sheet opens. */
const READABLE_ZOOM = 0.35;

export function zoomBand(zoom: number): ZoomBand {
  return zoom < READABLE_ZOOM ? 'far' : zoom < 0.7 ? 'mid' : 'near';
}

export interface ViewTargets {
  /** The element that receives the transform (translate + scale). */
  world: { style: { transform: string; transformOrigin?: string; willChange?: string } } | null;
  /** The element whose background draws the dot grid, moved with the view. */
  ground: { style: { backgroundPosition: string; backgroundSize: string } } | null;
}

export class CanvasController {
  viewport: Viewport = { x: 0, y: 0, zoom: 1 };
  readonly view = new Store<{ band: ZoomBand; zoom: number; renderRect: Rect | null }>({ band: 'near', zoom: 1, renderRect: null });
  readonly sceneStore: Store<{ scene: Scene }>;
  readonly actions: ToolActions;
  readonly machine: ToolMachine;
  private base: Scene;
  private index: SceneIndex | null = null;
  private targets: ViewTargets = { world: null, ground: null };
  private size = { width: 0, height: 0 };
  private fitted = false;
  private readonly offs: (() => void)[] = [];
  private frame: number | null = null;
  private viewListeners = new Set<(vp: Viewport) => void>();
  private settleTimer: ReturnType<typeof setTimeout> | null = null;
  private appliedZoom = 1;

  constructor(readonly session: SheetSession) {
    this.base = buildScene(session.mirror.current);
    this.sceneStore = new Store({ scene: this.base });
    this.actions = createToolActions({
      ui: session.ui,
      mirror: session.mirror,
      reader: session.reader,
      commands: session.commands,
      editable: () => session.editable,
      zoom: () => this.viewport.zoom,
      index: () => this.sceneIndex(),
      onDragPreview: (drag) => session.publish({ drag }),
    });
    this.machine = new ToolMachine(() => this.toolContext());
    this.offs.push(session.link.subscribe(() => this.firstView()));
    this.offs.push(session.mirror.subscribe(() => this.rebuild(true)));
    let lastDrag = session.ui.get().drag;
    this.offs.push(
      session.ui.subscribe(() => {
        const drag = session.ui.get().drag;
        if (drag !== lastDrag) {
          lastDrag = drag;
          this.rebuild(false);
        }
      }),
    );
  }

  private rebuild(documentChanged: boolean) {
    const snapshot = this.session.mirror.current;
    if (documentChanged) this.base = buildScene(snapshot, this.base);
    const drag = this.session.ui.get().drag;
    const scene = drag ? withMoved(this.base, snapshot, drag.ids, drag.dx, drag.dy) : this.base;
    this.index = null;
    this.sceneStore.set({ scene });
  }

  /** The first view of a sheet: everything in sight, or an empty sheet's origin near the top middle. */
  private firstView() {
    if (this.fitted || this.size.width <= 0 || !this.session.link.get().synced) return;
    this.fitted = true;
    if (this.base.elements.size > 0) this.openingView();
    else this.setViewport({ x: Math.round(this.size.width / 2), y: Math.round(Math.min(220, this.size.height * 0.3)), zoom: 1 });
  }

  get scene(): Scene {
    return this.sceneStore.get().scene;
  }

  sceneIndex(): SceneIndex {
    // Hit tests use the document's positions, not a drag preview's.
    if (!this.index || this.index.scene !== this.base) this.index = new SceneIndex(this.base);
    return this.index;
  }

  toolContext(): ToolContext {
    return {
      zoom: this.viewport.zoom,
      editable: this.session.editable,
      ui: this.session.ui,
      index: () => this.sceneIndex(),
      hit: (world, terminals) => hitTest(this.sceneIndex(), world, this.viewport.zoom, { terminals }),
      panBy: (dx, dy) => this.setViewport(panBy(this.viewport, dx, dy)),
      actions: this.actions,
    };
  }

  // ----- input

  sample(screen: Point, pointerType: PointerSample['pointerType'], shift = false): PointerSample {
    return { screen, world: screenToWorld(this.viewport, screen), pointerType, shift };
  }

  pointerDown(s: PointerSample) {
    this.machine.down(s);
    this.session.setCursor(s.world);
  }

  pointerMove(s: PointerSample) {
    this.machine.move(s);
    this.session.setCursor(s.world);
  }

  pointerUp(s: PointerSample) {
    this.machine.up(s);
  }

  /** A second finger arrived or the gesture was taken away: drop whatever the tool was doing. */
  cancelGesture() {
    this.machine.cancel();
  }

  hover(screen: Point) {
    this.session.setCursor(screenToWorld(this.viewport, screen));
  }

  // ----- viewport

  attach(targets: ViewTargets) {
    this.targets = targets;
    if (targets.world) {
      targets.world.style.transformOrigin = '0 0';
      // Its own layer: a pan or zoom is composited, not painted again.
      targets.world.style.willChange = 'transform';
    }
    this.apply();
  }

  /**
   * A layer promoted for transforms keeps the raster scale it was drawn at; once a zoom settles, drop and restore
   * the promotion so the drawing is drawn sharp at the new scale.
   */
  private settleZoom() {
    if (this.settleTimer) clearTimeout(this.settleTimer);
    this.settleTimer = setTimeout(() => {
      const world = this.targets.world;
      if (!world) return;
      world.style.willChange = 'auto';
      const raf = typeof requestAnimationFrame === 'function' ? requestAnimationFrame : (f: () => void) => setTimeout(f, 16);
      // Two frames: the first callback runs before the frame that paints without the promotion, so restoring it
      // there would leave the old raster in place.
      raf(() =>
        raf(() => {
          if (this.targets.world === world) world.style.willChange = 'transform';
        }),
      );
    }, 300);
  }

  setSize(width: number, height: number) {
    this.size = { width, height };
    this.firstView();
    this.apply();
  }

  get viewSize() {
    return this.size;
  }

  onViewport(listener: (vp: Viewport) => void): () => void {
    this.viewListeners.add(listener);
    return () => this.viewListeners.delete(listener);
  }

  setViewport(vp: Viewport) {
    this.viewport = { x: vp.x, y: vp.y, zoom: clampZoom(vp.zoom) };
    // One write per frame, whatever the event rate.
    if (this.frame === null) {
      const raf = typeof requestAnimationFrame === 'function' ? requestAnimationFrame : (f: () => void) => setTimeout(f, 16) as unknown as number;
      this.frame = raf(() => {
        this.frame = null;
        this.apply();
      });
    }
  }

  zoomAt(focus: Point, factor: number) {
    this.setViewport(zoomAt(this.viewport, focus, factor));
  }

  /** Shows the whole sheet, below the legend that sits over the canvas's top. */
  fitAll() {
    const b = this.scene.bounds;
    if (this.size.width <= 0) return;
    this.fitted = true;
    const top = Math.min(FIT_TOP_INSET, this.size.height / 4);
    // Room on the right for the value tags beside buses and runs.
    const pad = { x: b.x - 40, y: b.y - 40, width: b.width + 200, height: b.height + 110 };
    const vp = fitRect(this.scene.elements.size ? pad : { x: 0, y: 0, width: 0, height: 0 }, { width: this.size.width, height: this.size.height - top }, 24);
    this.setViewport({ ...vp, y: vp.y + top });
  }

  /**
   * Opening a sheet: the whole of it when its values can still be read so; a large sheet opens instead at the
   * smallest zoom that shows values, at its top (where the sources are), and Fit shows the whole of it.
   */
  private openingView() {
    this.fitAll();
    if (this.viewport.zoom >= READABLE_ZOOM) return;
    const b = this.scene.bounds;
    const sources = [...this.scene.elements.values()].filter((p) => p.element.kind === 'source');
    const centreX = sources.length ? sources.reduce((sum, p) => sum + p.body.x + p.body.width / 2, 0) / sources.length : b.x + b.width / 2;
    const top = Math.min(FIT_TOP_INSET, this.size.height / 4) + 24;
    this.setViewport({ zoom: READABLE_ZOOM, x: this.size.width / 2 - centreX * READABLE_ZOOM, y: top - (b.y - 40) * READABLE_ZOOM });
  }

  /** Where a new element goes when placed from a button (the middle of the view). */
  viewCentre(): Point {
    return screenToWorld(this.viewport, { x: this.size.width / 2, y: this.size.height / 2 });
  }

  private apply() {
    const { x, y, zoom } = this.viewport;
    const world = this.targets.world;
    if (world) world.style.transform = `translate(${x}px, ${y}px) scale(${zoom})`;
    if (zoom !== this.appliedZoom) {
      this.appliedZoom = zoom;
      this.settleZoom();
    }
    const ground = this.targets.ground;
    if (ground) {
      const step = 20 * zoom * (zoom < 0.5 ? 4 : 1);
      ground.style.backgroundSize = `${step}px ${step}px`;
      ground.style.backgroundPosition = `${x}px ${y}px`;
    }
    const band = zoomBand(zoom);
    this.view.set({ band, zoom: this.roundedZoom(zoom), renderRect: this.renderRectFor(zoom) });
    for (const l of this.viewListeners) l(this.viewport);
  }

  /** The zoom as the drawing's marks use it: changes in steps of about 10 %, not on every frame of a pinch. */
  private roundedZoom(zoom: number): number {
    const current = this.view.get().zoom;
    return Math.abs(zoom / current - 1) < 0.1 ? current : zoom;
  }

  /**
   * What the drawing renders: the visible part plus a screen's worth around it, kept while the view stays inside
   * it, so panning re-renders only now and then. Null (everything) until the view has a size.
   */
  private renderRectFor(zoom: number): Rect | null {
    if (this.size.width <= 0) return null;
    const { x, y } = this.viewport;
    const visible = { x: -x / zoom, y: -y / zoom, width: this.size.width / zoom, height: this.size.height / zoom };
    const current = this.view.get().renderRect;
    const inside =
      current &&
      visible.x >= current.x &&
      visible.y >= current.y &&
      visible.x + visible.width <= current.x + current.width &&
      visible.y + visible.height <= current.y + current.height &&
      visible.width * 4 > current.width;
    if (inside) return current;
    return { x: visible.x - visible.width, y: visible.y - visible.height, width: visible.width * 3, height: visible.height * 3 };
  }

  destroy() {
    if (this.settleTimer) clearTimeout(this.settleTimer);
    for (const off of this.offs) off();
    this.machine.cancel();
  }
}
