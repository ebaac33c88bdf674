// Opens a sheet in the editor for a screen: the session (document, websocket, presence, solving) and the canvas
// controller, made in an effect and torn down with the screen, plus the input bindings for the canvas's nodes.
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { resolveApiBaseUrl } from '../../shared/client/api-base-url';
import { CanvasController } from '../canvas/canvas-controller';
import { attachDomInput } from '../gestures/dom-input';
import { attachShortcuts } from '../gestures/shortcuts';
import { canvasGesture } from '../gestures/touch-gestures';
import { SheetSession } from '../session/sheet-session';
import type { SolveMode } from '../solve/solve-scheduler';
import { StudySession } from '../studies/study-session';
import { editorActions, type EditorActions } from './editor-actions';

export interface EditorHandle {
  session: SheetSession;
  canvas: CanvasController;
  actions: EditorActions;
  studies: StudySession;
}

/** ?solveIn=worker or ?solveIn=main forces where the sheet is solved (tests and benchmarks). */
function solveModeFromUrl(): SolveMode {
  if (typeof window === 'undefined') return 'auto';
  const v = new URLSearchParams(window.location.search).get('solveIn');
  return v === 'worker' || v === 'main' ? v : 'auto';
}

export function useSheetEditor(
  options: { sheetId: string; editable: boolean; user: { id: string; name: string }; viewLink?: string } | null,
): EditorHandle | null {
  const [handle, setHandle] = useState<EditorHandle | null>(null);
  const key = options ? `${options.sheetId}|${options.editable}|${options.user.id}|${options.viewLink ?? ''}` : '';
  useEffect(() => {
    if (!options) return;
    const http = resolveApiBaseUrl();
    const session = new SheetSession({
      sheetId: options.sheetId,
      wsBase: http.replace(/^http/, 'ws'),
      editable: options.editable,
      user: options.user,
      viewLink: options.viewLink,
      solveMode: solveModeFromUrl(),
      workerUrl: typeof Worker !== 'undefined' ? `${http}/solve-worker.js` : undefined,
    });
    const canvas = new CanvasController(session);
    session.connect();
    const studies = new StudySession(session, (text) => canvas.actions.say(text));
    const made = { session, canvas, actions: editorActions(session, canvas), studies };
    setHandle(made);
    // A probe for the benchmark and browser tests, only when asked for in the address.
    const probe = typeof window !== 'undefined' && new URLSearchParams(window.location.search).has('probe');
    if (probe) (window as unknown as Record<string, unknown>).__phasewright = made;
    return () => {
      if (probe) delete (window as unknown as Record<string, unknown>).__phasewright;
      studies.destroy();
      canvas.destroy();
      session.destroy();
      setHandle(null);
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [key]);
  return handle;
}

/** The canvas's bindings: its gesture, and callbacks for its ground and world nodes and its size. */
export function useCanvasBindings(handle: EditorHandle | null) {
  const keys = useRef({ shift: false });
  const [ground, setGround] = useState<HTMLElement | null>(null);
  const gesture = useMemo(() => (handle ? canvasGesture(handle.canvas, keys.current) : null), [handle]);
  const world = useRef<HTMLElement | null>(null);
  const onGroundNode = useCallback(
    (node: HTMLElement | null) => {
      setGround(node);
      handle?.canvas.attach({ world: world.current, ground: node });
    },
    [handle],
  );
  const onWorldNode = useCallback(
    (node: HTMLElement | null) => {
      world.current = node;
      handle?.canvas.attach({ world: node, ground });
    },
    [handle, ground],
  );
  const onSize = useCallback((w: number, h: number) => handle?.canvas.setSize(w, h), [handle]);
  useEffect(() => {
    if (!handle || !ground || typeof window === 'undefined') return;
    handle.canvas.attach({ world: world.current, ground });
    const offInput = attachDomInput(ground, handle.canvas, keys.current);
    const a = handle.actions;
    const offKeys = attachShortcuts(
      window,
      {
        undo: a.undo,
        redo: a.redo,
        deleteSelection: a.deleteSelection,
        duplicate: a.duplicateSelection,
        rotate: a.rotateSelection,
        escape: a.escape,
        selectTool: () => a.setTool('select'),
        cutTool: () => a.setTool('cut'),
        nudge: a.nudge,
        fit: a.fit,
      },
      () => handle.session.editable,
    );
    return () => {
      offInput();
      offKeys();
    };
  }, [handle, ground]);
  return { gesture, onGroundNode, onWorldNode, onSize };
}
