// The panel schedule as plain props for the components: the chosen panel's schedule for the case on show, the
// panels to choose from, and the case's name. Components never see the document or the solver.
import { useMemo } from 'react';
import type { SolveResult } from '../../solver';
import type { MirrorSnapshot } from '../document/sheet-mirror';
import { panelSchedule, type PanelSchedule } from '../schedule/panel-schedule';
import type { EditorHandle } from './use-sheet-editor';

export interface ScheduleView {
  schedule: PanelSchedule | null;
  panels: { id: string; name: string }[];
}

export function useScheduleView(handle: EditorHandle | null, snapshot: MirrorSnapshot, shown: SolveResult | null, busId: string | null): ScheduleView {
  const session = handle?.session;
  return useMemo(() => {
    if (!session) return { schedule: null, panels: [] };
    const sheet = session.reader.read(snapshot).sheet;
    const panels = Object.values(sheet.elements)
      // Junctions (a pole top, a tap) have no circuits of their own; a panel picked on the drawing is kept.
      .filter((e) => e.kind === 'bus' && (e.role !== 'junction' || e.id === busId))
      .map((e) => ({ id: e.id, name: e.name || e.id }))
      .sort((a, b) => a.name.localeCompare(b.name, undefined, { numeric: true }));
    return { schedule: busId ? panelSchedule(sheet, busId, shown) : null, panels };
  }, [session, snapshot, shown, busId]);
}
