// The studies panel's view, read from the open sheet's stores: re-made when a study answers, a query changes,
// or a solve answers (the profile and the loading follow the case on show).
import { useMemo } from 'react';
import { Store } from '../session/store';
import type { EditorHandle } from '../ui/use-sheet-editor';
import { useStore } from '../ui/use-store';
import type { EditorView } from '../ui/use-editor-view';
import { initialStudies } from './study-session';
import { makeFaultView, studiesView } from './studies-view';

const EMPTY = new Store(initialStudies());

export function useStudiesView(handle: EditorHandle | null, view: EditorView) {
  const studies = useStore(handle?.studies.store ?? EMPTY, (s) => s);
  const { snapshot, results, ui, caseLabel } = view;
  const nameOf = useMemo(() => (id: string) => snapshot.elements.get(id)?.name || id, [snapshot]);
  const kindOf = useMemo(() => (id: string) => snapshot.elements.get(id)?.kind as string | undefined, [snapshot]);
  // The sheet the latest solve answered for (the loading study reads it beside the result).
  const read = useMemo(() => (handle ? handle.session.reader.read(snapshot).sheet : null), [handle, snapshot]);
  const sheet = results.base ? read : null;
  // Names are read when the study answers; a rename after it shows once the study is run again (it is stale then).
  // eslint-disable-next-line react-hooks/exhaustive-deps
  const faultView = useMemo(() => makeFaultView(studies, nameOf, kindOf), [studies.fault.result, studies.fault.finishedAt]);
  return useMemo(
    () => studiesView({ studies, sheet, elements: read?.elements ?? null, base: results.base, active: results.active, trialChanges: ui.trialChanges, caseLabel, faultView }),
    [studies, sheet, read, results.base, results.active, ui.trialChanges, caseLabel, faultView],
  );
}
