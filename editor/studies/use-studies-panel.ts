// The studies panel's view and actions and the marks it puts on the drawing, for the sheet screen. Showing a case
// also brings its element into sight (above the sliding panel on a phone), near enough for its value tags.
import { useMemo } from 'react';
import type { WhatIfChange } from '../../shared/sheet';
import { newId } from '../document/ids';
import type { EditorHandle } from '../ui/use-sheet-editor';
import type { EditorView } from '../ui/use-editor-view';
import type { SweepColumn, SweepRow } from './break-sweep-rows';
import { caseMarks, revealViewport } from './case-marks';
import type { DutyRow, FaultCaseColumn, FaultCaseRow } from './fault-study-rows';
import type { LoadingColumn } from './loading-rows';
import { defaultPointAt } from './reading-across';
import { chooseAcross, parseReadingsCsv, pointWords, toReadings, type CsvProblem, type ReadingEntry } from './readings-entry';
import type { StudyTab } from './study-session';
import { useStudiesView } from './use-studies-view';
import type { ProfileOrder } from './voltage-profile';

export interface StudiesActions {
  onTab: (tab: StudyTab) => void;
  onRunFaults: () => void;
  onRunSweep: () => void;
  onCancel: (which: 'fault' | 'sweep' | 'match') => void;
  onTolerance: (on: boolean) => void;
  onFaultSort: (column: FaultCaseColumn) => void;
  onFaultText: (text: string) => void;
  onFaultToggle: (column: 'faultType' | 'status', value: string) => void;
  onShowFault: (row: FaultCaseRow) => void;
  onShowDuty: (duty: DutyRow) => void;
  onSweepConductors: (which: 'all' | 'neutrals') => void;
  onSweepSort: (column: SweepColumn) => void;
  onSweepText: (text: string) => void;
  onSweepToggle: (value: string) => void;
  onShowOpening: (row: SweepRow) => void;
  onLoadingSort: (column: LoadingColumn) => void;
  onLoadingText: (text: string) => void;
  onLoadingToggle: (column: 'status' | 'conductor', value: string) => void;
  onShowRun: (runId: string) => void;
  /** Adds a reading at the element, across its default bars or element; the new entry's id (null if none). */
  onAddReadingAt: (elementId: string) => string | null;
  /** Puts a reading across another choice its element offers (a key of the row's `across`). */
  onReadingAcross: (id: string, key: string) => void;
  onReadingVolts: (id: string, text: string) => void;
  onRemoveReading: (id: string) => void;
  /** Pasted CSV: the entries are replaced, or nothing changes and the problems come back. */
  onPasteReadings: (text: string) => CsvProblem[];
  /** Runs the match; the problems with the entries come back (nothing runs then). */
  onRunMatch: () => string[];
  onShowCandidate: (changes: Record<string, WhatIfChange>, description: string) => void;
  onClearCase: () => void;
  onProfileOrder: (order: ProfileOrder) => void;
}

export function useStudiesPanel(handle: EditorHandle | null, view: EditorView, isPhone: boolean) {
  const studies = useStudiesView(handle, view);
  const shownResult = view.results.active;
  const trial = view.ui.trialChanges;
  const marks = useMemo(
    () => caseMarks(shownResult, (id) => view.scene.elements.get(id)?.body, trial, (cid) => view.scene.connections.get(cid)?.connection.to.elementId),
    [shownResult, view.scene, trial],
  );
  const actions = useMemo((): StudiesActions => {
    const s = handle?.studies;
    const reveal = (elementId: string) => {
      const placed = handle?.canvas.scene.elements.get(elementId);
      if (!handle || !placed) return;
      const c = handle.canvas;
      // Near enough for the value tags (the canvas hides them when zoomed far out).
      c.setViewport(revealViewport(c.viewport, c.viewSize, placed.bounds, isPhone ? 0.42 : 1, 0.75));
    };
    const showFault = (row: Pick<FaultCaseRow, 'busId' | 'busName' | 'faultType'> & { problem?: string }) => {
      s?.showFaultCase(row);
      if (!row.problem) reveal(row.busId);
    };
    const elements = () => [...(handle?.session.mirror.current.elements.values() ?? [])].map((e) => ({ id: e.id, name: String(e.name ?? ''), kind: String(e.kind) }));
    const nameOf = (id: string) => String(handle?.session.mirror.current.elements.get(id)?.name || id);
    const readings = () => s?.store.get().readings ?? [];
    // The elements as validated, with their defaults filled in (a bus's bars).
    const parsed = () => (handle ? handle.session.reader.read(handle.session.mirror.current).sheet.elements : {});
    return {
      onTab: (tab) => s?.setTab(tab),
      onRunFaults: () => s?.runFaultStudy(),
      onRunSweep: () => s?.runBreakSweep(),
      onCancel: (which) => s?.cancel(which),
      onTolerance: (on) => s?.setTransformerTolerance(on),
      onFaultSort: (column) => s?.sortFaultsBy(column),
      onFaultText: (text) => s?.setFaultQuery({ text }),
      onFaultToggle: (column, value) => s?.toggleFaultFilter(column, value),
      onShowFault: (row) => showFault(row),
      onShowDuty: (d) => {
        const faultType = s?.store.get().fault.result?.duties.find((x) => x.elementId === d.elementId)?.faultType;
        if (faultType) showFault({ busId: d.locationBusId, busName: d.locationName, faultType });
      },
      onSweepConductors: (which) => s?.setSweepConductors(which),
      onSweepSort: (column) => s?.sortSweepBy(column),
      onSweepText: (text) => s?.setSweepQuery({ text }),
      onSweepToggle: (value) => s?.toggleSweepFilter('conductor', value),
      onShowOpening: (row) => {
        if (row.problem) return;
        s?.showChanges([row.change], `${row.conductor} of ${row.runName} open`);
        reveal(row.runId);
      },
      onLoadingSort: (column) => s?.sortLoadingBy(column),
      onLoadingText: (text) => s?.setLoadingQuery({ text }),
      onLoadingToggle: (column, value) => s?.toggleLoadingFilter(column, value),
      onShowRun: (runId) => {
        handle?.actions.selectElements([runId]);
        reveal(runId);
      },
      onAddReadingAt: (elementId) => {
        const e = parsed()[elementId];
        const point = e ? defaultPointAt(e) : null;
        if (!point || !s) return null;
        const entry: ReadingEntry = { id: newId('reading'), point, where: pointWords(point, nameOf), voltsText: '' };
        s.setReadings([...readings(), entry]);
        return entry.id;
      },
      onReadingAcross: (id, key) => s?.setReadings(chooseAcross(readings(), id, key, parsed(), nameOf)),
      onReadingVolts: (id, text) => s?.setReadings(readings().map((r) => (r.id === id ? { ...r, voltsText: text } : r))),
      onRemoveReading: (id) => s?.setReadings(readings().filter((r) => r.id !== id)),
      onPasteReadings: (text) => {
        const parsed = parseReadingsCsv(text, elements(), () => newId('reading'));
        if (!parsed.ok) return parsed.problems;
        s?.setReadings(parsed.entries);
        return [];
      },
      onRunMatch: () => {
        const checked = toReadings(readings());
        if (!checked.ok) return checked.problems;
        s?.runReadingsMatch(checked.readings);
        return [];
      },
      onShowCandidate: (changes, description) => s?.showChanges(Object.values(changes), `Candidate: ${description}`),
      onClearCase: () => s?.clearCase(),
      onProfileOrder: (order) => s?.setProfileOrder(order),
    };
  }, [handle, isPhone]);
  const selected = view.inspector.kind === 'element' && (view.inspector.element.kind === 'load' || view.inspector.element.kind === 'bus') ? { id: view.inspector.element.id, name: String(view.inspector.element.name || view.inspector.element.id) } : null;
  return { marks, view: studies, actions, selected, caution: view.caution };
}
