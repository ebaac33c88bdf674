// The shape of a tool: small state machines, one state per file, each with a few optional handlers that return
// the next state. Tools never draw: they change the editor's state (previews) and call actions at a gesture's end.
import type { Point } from '../../shared/symbols';
import type { SceneIndex, Hit } from '../canvas/hit-test';
import type { Store } from '../session/store';
import type { EditorUiState } from '../session/editor-state';
import type { ToolActions } from './actions';

export interface PointerSample {
  screen: Point;
  world: Point;
  pointerType: 'touch' | 'mouse' | 'pen';
  /** Shift held (a mouse adds to the selection). */
  shift: boolean;
}

export interface ToolContext {
  readonly zoom: number;
  /** Editors and owners; a viewer only looks (and tries what-ifs locally). */
  readonly editable: boolean;
  readonly ui: Store<EditorUiState>;
  index(): SceneIndex;
  hit(world: Point, terminals: boolean): Hit;
  panBy(dxScreen: number, dyScreen: number): void;
  actions: ToolActions;
}

export interface ToolState {
  readonly name: string;
  down?(ctx: ToolContext, p: PointerSample): ToolState;
  move?(ctx: ToolContext, p: PointerSample): ToolState;
  up?(ctx: ToolContext, p: PointerSample): ToolState;
  longPress?(ctx: ToolContext): ToolState;
  cancel?(ctx: ToolContext): ToolState;
}

/** How far a press may wander, in screen pixels, and still be a tap or a long press. */
export function slopPx(p: PointerSample): number {
  return p.pointerType === 'mouse' ? 4 : 10;
}

export function moved(a: PointerSample, b: PointerSample): boolean {
  return Math.hypot(a.screen.x - b.screen.x, a.screen.y - b.screen.y) > slopPx(a);
}

export const LONG_PRESS_MS = 500;
