// The shapes of symbol geometry: plain data in a symbol's own coordinates (drawing units, y down, the symbol's
// centre at 0,0), drawn by the canvas and, later, by the server's SVG, PNG and PDF exports.
import type { ConductorId } from '../sheet/schema';

export interface Point {
  x: number;
  y: number;
}

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** The direction a terminal faces: a connection leaves it that way. */
export type Side = 'up' | 'down' | 'left' | 'right';

export interface TerminalGeometry {
  name: string;
  x: number;
  y: number;
  side: Side;
  /** Bars: a connection lands anywhere within ±span along the bar's length (local x), not at one point. */
  span?: number;
}

/** One conductor of a run drawn apart from the others, so it can be coloured, tapped and marked open. */
export interface ConductorLane {
  conductor: ConductorId;
  /** Straight part of the lane, drawn in the conductor's colour. */
  from: Point;
  to: Point;
  /** Fans joining the lane to the single line at each end. */
  fanIn: Point;
  fanOut: Point;
}

export type TextAlign = 'start' | 'middle' | 'end';

export interface TextAnchor {
  x: number;
  y: number;
  align: TextAlign;
}

export interface SymbolGeometry {
  kind: string;
  /** Every line of the symbol as one SVG path, drawn in the single ink weight. */
  ink: string;
  /** Text drawn inside the symbol (a motor's M), centred at a point. */
  glyph?: { text: string; x: number; y: number };
  lanes: ConductorLane[];
  terminals: TerminalGeometry[];
  /** The part that is pressed to select or move the element (before the finger-size minimum is applied). */
  body: Rect;
  /** Where the name goes. */
  label: TextAnchor;
  /** Where the value tags start; further tags stack downward from there. */
  tags: TextAnchor;
}

/** Stroke width of every line on the drawing, in drawing units. */
export const INK_WIDTH = 2;
/** The drawing's grid, in drawing units; placement snaps to it. */
export const GRID = 20;
/** Line spacing of stacked value tags. */
export const TAG_PITCH = 20;
