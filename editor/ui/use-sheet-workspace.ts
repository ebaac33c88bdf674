// What a screen that shows a sheet needs from the editor, in one call: the session and its view, the canvas's
// bindings and the pins; for the editor screen also the studies and the panel schedules (a viewer link's page
// offers neither). `ready` is set once the session and the canvas's gesture exist.
import { useMemo } from 'react';
import type { PinPlace } from '../../shared/client/api-client';
import { useStudiesPanel } from '../studies/use-studies-panel';
import { scheduleActions } from './schedule-actions';
import { useEditorView } from './use-editor-view';
import { usePinBoard, type PinBoardOptions } from './use-pin-board';
import { useScheduleView } from './use-schedule-view';
import { useCanvasBindings, useSheetEditor, type EditorHandle } from './use-sheet-editor';

/** The socket's close code for a viewer link that was revoked or expired: its pins are gone with it. */
export const LINK_GONE = 4410;

export interface SheetWorkspaceOptions {
  /** The sheet to open and as whom; null until both are known. */
  editor: Parameters<typeof useSheetEditor>[0];
  /** A viewer link's page: no studies, schedules or imports. */
  readOnly: boolean;
  isPhone: boolean;
  pins: Pick<PinBoardOptions, 'me' | 'canModerate' | 'initialPinNumber' | 'pickFile'> & { place: PinPlace | null };
}

export function useSheetWorkspace(o: SheetWorkspaceOptions) {
  const handle = useSheetEditor(o.editor);
  const view = useEditorView(handle);
  const bindings = useCanvasBindings(handle);
  const full = o.readOnly ? null : handle;
  const studies = useStudiesPanel(full, view, o.isPhone);
  const schedule = useMemo(() => (full ? scheduleActions(full.session) : null), [full]);
  const scheduleView = useScheduleView(full, view.snapshot, view.results.active ?? view.results.base, view.ui.scheduleBusId);
  const a = handle?.actions;
  const pins = usePinBoard({
    ...o.pins,
    handle,
    place: view.link.ended?.code === LINK_GONE ? null : o.pins.place,
    scene: view.scene,
    nameOf: (id) => view.snapshot.elements.get(id)?.name || 'an element',
    showPanel: () => a?.openPanel('pins'),
    hidePanel: () => a?.closePanel(),
    // A phone's panel covers the lower part of the canvas.
    visibleShare: o.isPhone ? 0.42 : 1,
  });
  const gesture = bindings.gesture;
  const ready: ReadySheet | null = handle && gesture && (o.readOnly || schedule) ? { handle, actions: handle.actions, gesture } : null;
  return {
    readOnly: o.readOnly,
    handle,
    view,
    bindings,
    pins,
    studies: o.readOnly ? null : studies,
    schedule: schedule ? { actions: schedule, view: scheduleView } : null,
    ready,
  };
}

/** The session and the canvas's gesture once both exist. */
export interface ReadySheet {
  handle: EditorHandle;
  actions: EditorHandle['actions'];
  gesture: NonNullable<ReturnType<typeof useCanvasBindings>['gesture']>;
}

export type SheetWorkspace = ReturnType<typeof useSheetWorkspace>;
