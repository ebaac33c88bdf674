// The studies panel's props and the marks it puts on the drawing, for the sheet screen: the view from
// useStudiesView and the study session's actions as callbacks. Showing a case also brings its bus into sight
// (above the sliding panel on a phone).
import { useMemo } from 'react';
import type { EditorHandle } from '../ui/use-sheet-editor';
import type { EditorView } from '../ui/use-editor-view';
import { caseMarks, revealViewport } from './case-marks';
import type { DutyRow, FaultCaseRow } from './fault-study-rows';
import { useStudiesView } from './use-studies-view';

export function useStudiesPanel(handle: EditorHandle | null, view: EditorView, isPhone: boolean) {
  const studies = useStudiesView(handle, view);
  const state = handle?.studies.store.get();
  const shownResult = view.results.active;
  const marks = useMemo(
    () => caseMarks(shownResult, (id) => view.scene.elements.get(id)?.body),
    [shownResult, view.scene],
  );
  const actions = useMemo(() => {
    const s = handle?.studies;
    const reveal = (busId: string) => {
      const placed = handle?.canvas.scene.elements.get(busId);
      if (!handle || !placed) return;
      const c = handle.canvas;
      // Near enough for the value tags (the canvas hides them when zoomed far out).
      c.setViewport(revealViewport(c.viewport, c.viewSize, placed.bounds, isPhone ? 0.42 : 1, 0.75));
    };
    const showCase = (row: Pick<FaultCaseRow, 'busId' | 'busName' | 'faultType'> & { problem?: string }) => {
      s?.showFaultCase(row);
      if (!row.problem) reveal(row.busId);
    };
    return {
      onTab: (tab: 'faults' | 'profile') => s?.setTab(tab),
      onRun: () => s?.runFaultStudy(),
      onCancel: () => s?.cancel(),
      onTolerance: (on: boolean) => s?.setTransformerTolerance(on),
      onSort: (column: Parameters<NonNullable<typeof s>['sortFaultsBy']>[0]) => s?.sortFaultsBy(column),
      onText: (text: string) => s?.setFaultQuery({ text }),
      onToggle: (column: 'faultType' | 'status', value: string) => s?.toggleFaultFilter(column, value),
      onShowCase: (row: FaultCaseRow) => showCase(row),
      onShowDuty: (d: DutyRow) => {
        const faultType = handle?.studies.store.get().fault.result?.duties.find((x) => x.elementId === d.elementId)?.faultType;
        if (faultType) showCase({ busId: d.locationBusId, busName: d.locationName, faultType });
      },
      onClearCase: () => s?.clearCase(),
      onProfileOrder: (order: 'name' | 'base-voltage' | 'shown-voltage') => s?.setProfileOrder(order),
    };
  }, [handle, isPhone]);
  return {
    marks,
    props: {
      tab: studies.tab,
      fault: studies.fault,
      profile: studies.profile,
      query: state?.faultQuery ?? { sort: null, text: '', only: {} },
      profileOrder: state?.profileOrder ?? ('name' as const),
      caution: view.caution,
      ...actions,
    },
  };
}
