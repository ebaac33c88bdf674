// What the editor shows and does apart from the document: the tool, the selection, the case on show (base case or
// a what-if), trial changes that are never saved, and the previews of gestures in progress.
import type { ConductorId, ElementKind, WhatIfChange } from '../../shared/sheet';
import type { Point, Rect } from '../../shared/symbols';

export type ToolName = 'select' | 'cut' | 'place';

/** The sliding panels on a phone (side panes on a wide screen show the inspector and results together). */
export type PanelName = 'none' | 'palette' | 'inspector' | 'results' | 'pins' | 'crew' | 'about' | 'cautions' | 'schedule' | 'import-sheet' | 'studies';

export interface ConnectPreview {
  from: { elementId: string; terminal: string; point: Point };
  to: Point;
  target: { elementId: string; terminal: string; point: Point } | null;
}

/** A cut that needs the person to say which conductor or pole (they are too close together to tap apart). */
export type CutChooser =
  | { kind: 'run'; elementId: string; conductors: ConductorId[] }
  | { kind: 'breaker'; elementId: string; poles: ('A' | 'B' | 'C')[] }
  | { kind: 'connection'; connectionId: string; conductors: ConductorId[] };

export interface EditorMessage {
  text: string;
  tone: 'info' | 'danger';
  /** Grows with each message, so the same text twice still shows. */
  serial: number;
}

export interface EditorUiState {
  tool: ToolName;
  placeKind: ElementKind | null;
  selection: ReadonlySet<string>;
  selectedConnection: string | null;
  /** The what-if on show; null is the base case. */
  whatIfId: string | null;
  trialChanges: WhatIfChange[];
  drag: { ids: ReadonlySet<string>; dx: number; dy: number } | null;
  box: Rect | null;
  connecting: ConnectPreview | null;
  chooser: CutChooser | null;
  message: EditorMessage | null;
  panel: PanelName;
  /** The bus whose phasor diagram is open. */
  phasorBusId: string | null;
  /** The panel whose schedule is open (or was last). */
  scheduleBusId: string | null;
}

export const EMPTY_SELECTION: ReadonlySet<string> = new Set();

export function initialUiState(): EditorUiState {
  return {
    tool: 'select',
    placeKind: null,
    selection: EMPTY_SELECTION,
    selectedConnection: null,
    whatIfId: null,
    trialChanges: [],
    drag: null,
    box: null,
    connecting: null,
    chooser: null,
    message: null,
    panel: 'none',
    phasorBusId: null,
    scheduleBusId: null,
  };
}
