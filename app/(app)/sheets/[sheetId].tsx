// A sheet's page: the editor on the sheet's live document (the drawing, its results, the crew), with the sheet's
// record one tap away in its details panel.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useMemo, type ReactNode } from 'react';
import { View } from 'react-native';
import { SheetCanvas } from '@/components/canvas/sheet-canvas';
import { Cautions } from '@/components/editor/cautions';
import { CrewList } from '@/components/editor/crew-list';
import { CutChooser } from '@/components/editor/cut-chooser';
import { EditorLayout } from '@/components/editor/editor-layout';
import { Inspector } from '@/components/editor/inspector';
import { Legend } from '@/components/editor/legend';
import { Palette } from '@/components/editor/palette';
import { PhasorDiagram } from '@/components/editor/phasor-diagram';
import { ResultsPanel } from '@/components/editor/results-panel';
import { SelectionPeek } from '@/components/editor/selection-peek';
import { SolveFailureNote } from '@/components/editor/solve-failure-note';
import { PaneSection, SlidingPanel } from '@/components/editor/sliding-panel';
import { Toast } from '@/components/editor/toast';
import { ToolBar } from '@/components/editor/tool-bar';
import { TopBar } from '@/components/editor/top-bar';
import { ViewButtons } from '@/components/editor/view-buttons';
import { ToolButton } from '@/components/editor/tool-button';
import { PinLayer } from '@/components/pins/pin-layer';
import { PinPanel } from '@/components/pins/pin-panel';
import { pickFile, PIN_FILE_TYPES } from '@/components/pins/pick-file';
import { useResponsive } from '@/components/layout/use-responsive';
import { SheetDetail } from '@/components/projects/sheet-detail';
import { CoverPanel } from '@/components/schedule/cover-panel';
import { SchedulePane } from '@/components/schedule/schedule-pane';
import { SheetImportForm } from '@/components/schedule/sheet-import-form';
import { StudiesPanel } from '@/components/studies/studies-panel';
import { useTheme } from '@/components/theme/use-theme';
import { Button, IconButton } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { useCanvasBindings, useSheetEditor } from '@/editor/ui/use-sheet-editor';
import { useEditorView } from '@/editor/ui/use-editor-view';
import { scheduleActions } from '@/editor/ui/schedule-actions';
import { useScheduleView } from '@/editor/ui/use-schedule-view';
import { MAX_CSV_BYTES } from '@/editor/schedule/schedule-csv';
import { MAX_SHEET_JSON_BYTES } from '@/editor/import/sheet-import';
import { usePinBoard } from '@/editor/ui/use-pin-board';
import { useStudiesPanel } from '@/editor/studies/use-studies-panel';
import { isApiError } from '@/shared/client/api-client';
import { useSession, useSheet } from '@/shared/client/queries';

export default function SheetScreen() {
  const params = useLocalSearchParams<{ sheetId: string; pin?: string }>();
  const sheetId = String(params.sheetId ?? '');
  const router = useRouter();
  const { color, scheme } = useTheme();
  const { isPhone } = useResponsive();
  const sheet = useSheet(sheetId);
  const session = useSession();
  // A malformed id (400) is as missing as an unknown one (404) or someone else's (403).
  const missing = isApiError(sheet.error) && [400, 403, 404].includes(sheet.error.status);
  const user = session.data?.user;
  const role = sheet.data?.project.role;
  const handle = useSheetEditor(role && user ? { sheetId, editable: role !== 'viewer', user: { id: user.id, name: user.name || user.email } } : null);
  const view = useEditorView(handle);
  const bindings = useCanvasBindings(handle);
  const studies = useStudiesPanel(handle, view, isPhone);
  const a = handle?.actions;
  const sa = useMemo(() => (handle ? scheduleActions(handle.session) : null), [handle]);
  const scheduleView = useScheduleView(handle, view.snapshot, view.results.active ?? view.results.base, view.ui.scheduleBusId);
  const pins = usePinBoard({
    handle,
    place: sheetId ? { sheetId } : null,
    scene: view.scene,
    nameOf: (id) => view.snapshot.elements.get(id)?.name || 'an element',
    me: user ? { id: user.id } : null,
    canModerate: !!role && role !== 'viewer',
    showPanel: () => a?.openPanel('pins'),
    hidePanel: () => a?.closePanel(),
    initialPinNumber: params.pin ? Number(params.pin) : null,
    pickFile: () => pickFile(PIN_FILE_TYPES),
    visibleShare: isPhone ? 0.42 : 1,
  });

  const goBack = () => (sheet.data ? router.dismissTo(`/projects/${sheet.data.project.id}`) : router.replace('/'));

  if (missing || sheet.error || !sheet.data || !handle || !a || !sa || !bindings.gesture) {
    return (
      <View style={{ flex: 1, backgroundColor: color.ground, justifyContent: 'center' }}>
        <Stack.Screen options={{ title: 'Sheet · Phasewright', headerTitle: 'Sheet' }} />
        {missing ? (
          <EmptyState
            icon="slash"
            title="Sheet not found"
            message="It may have been deleted, or you are not a member of its project."
            action={<Button label="All projects" variant="secondary" onPress={() => router.replace('/')} />}
            testID="sheet-missing"
          />
        ) : sheet.error ? (
          <ErrorState title="Could not load the sheet" message={String((sheet.error as Error).message)} onRetry={() => void sheet.refetch()} testID="sheet-error" />
        ) : (
          <LoadingState label="Opening the sheet…" testID="sheet-loading" />
        )}
      </View>
    );
  }

  const { ui } = view;
  const found = sheet.data;
  const inspector = (
    <Inspector
      subject={view.inspector}
      editable={view.editable}
      changeDestination={view.changeDestination}
      onSave={a.saveFields}
      onSetPhases={a.setLoadPhases}
      onRotate={a.rotateSelection}
      onDuplicate={a.duplicateSelection}
      onDelete={a.deleteSelection}
      onAddChange={a.addChange}
      onOpenSchedule={sa.openSchedule}
    />
  );
  // On a wide screen the phasor diagram has its own section at the top of the side pane, in sight of the tap.
  const results = (
    <ResultsPanel
      {...view.resultsPanel}
      phasor={isPhone ? view.resultsPanel.phasor : null}
      editable={view.editable}
      convention={view.convention}
      onShowCase={a.showCase}
      onAddWhatIf={a.addWhatIf}
      onRemoveWhatIf={a.removeWhatIf}
      onRemoveChange={(changeId) => ui.whatIfId && a.removeChange(ui.whatIfId, changeId)}
      onRemoveTrial={a.removeTrial}
      onClearTrial={a.clearTrial}
      onKeepTrial={a.keepTrial}
      onShowFailure={a.selectElements}
      onClosePhasor={() => a.showPhasor(null)}
    />
  );
  const palette = <Palette chosen={ui.placeKind} onChoose={a.choosePlace} columns={isPhone ? 2 : 1} />;
  const say = (text: string) => handle.canvas.actions.say(text);
  const about = (
    <View style={{ gap: 12 }}>
      <SheetDetail sheet={found.sheet} project={found.project} onOpenProject={goBack} onOpenRevisions={() => router.push(`/revisions/${sheetId}`)} embedded />
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: 8 }}>
        <Button label="Panel schedules" icon="list" variant="secondary" compact onPress={sa.openSchedules} testID="open-schedules" />
        {view.editable ? <Button label="Import a sheet (JSON)" icon="upload" variant="secondary" compact onPress={sa.openSheetImport} testID="open-sheet-import" /> : null}
      </View>
    </View>
  );
  const schedule = (
    <SchedulePane
      schedule={scheduleView.schedule}
      panels={scheduleView.panels}
      caseLabel={view.caseLabel}
      editable={view.editable}
      isPhone={isPhone}
      maxCsvBytes={MAX_CSV_BYTES}
      onChoosePanel={sa.choosePanel}
      onEditCircuit={(loadId, edit) => (ui.scheduleBusId ? sa.editCircuit(ui.scheduleBusId, loadId, edit) : 'No panel chosen')}
      onReadCsv={sa.readCsv}
      onImportCircuits={sa.importCircuits}
      onMessage={say}
    />
  );
  const sheetImport = (
    <SheetImportForm sheetName={found.sheet.name} maxBytes={MAX_SHEET_JSON_BYTES} onRead={sa.readSheetText} onReplace={sa.replaceSheet} onDone={say} onCancel={sa.close} />
  );
  const cautions = <Cautions caution={view.caution} assumptions={view.assumptions} standardLabel={view.standardLabel} />;
  const crew = <CrewList crew={view.crew} status={view.link.status} />;
  const pinPanel = <PinPanel {...pins.panel} askName={false} naming={false} onGiveName={async () => undefined} />;

  const panels: Record<string, { title: string; body: ReactNode; testID: string } | null> = {
    none: null,
    palette: view.editable ? { title: 'Add an element', body: palette, testID: 'panel-palette' } : null,
    inspector: { title: view.inspector.kind === 'element' ? view.inspector.element.name || 'Element' : 'Details', body: inspector, testID: 'panel-inspector' },
    results: { title: 'Results', body: results, testID: 'panel-results' },
    pins: { title: 'Pins', body: pinPanel, testID: 'panel-pins' },
    crew: { title: 'Crew', body: crew, testID: 'panel-crew' },
    about: { title: 'Sheet details', body: about, testID: 'panel-about' },
    cautions: { title: 'Cautions', body: cautions, testID: 'panel-cautions' },
    schedule: { title: 'Panel schedule', body: schedule, testID: 'panel-schedule-view' },
    'import-sheet': view.editable ? { title: 'Import a sheet', body: sheetImport, testID: 'panel-sheet-import' } : null,
    studies: isPhone ? { title: 'Studies', body: <StudiesPanel layout="cards" view={studies.view} actions={studies.actions} selected={studies.selected} caution={studies.caution} />, testID: 'panel-studies' } : null,
  };
  const open = panels[ui.panel];
  const covering = !isPhone && (ui.panel === 'schedule' || ui.panel === 'import-sheet') ? open : null;
  const wideExtra = !isPhone && (ui.panel === 'crew' || ui.panel === 'about' || ui.panel === 'cautions') ? open : null;

  return (
    <>
      <Stack.Screen options={{ title: `${found.sheet.name} · Phasewright`, headerShown: false }} />
      <EditorLayout
        isPhone={isPhone}
        topBar={
          <TopBar
            sheetName={found.sheet.name}
            caseLabel={view.caseLabel}
            readOnly={!view.editable}
            crew={view.crew}
            status={view.link.status}
            synced={view.link.synced}
            compact={isPhone}
            onBack={goBack}
            onCrew={() => a.openPanel(ui.panel === 'crew' ? 'none' : 'crew')}
            onAbout={() => a.openPanel(ui.panel === 'about' ? 'none' : 'about')}
          />
        }
        canvas={
          <SheetCanvas
            scene={view.scene}
            drawn={view.results.drawn}
            selection={ui.selection}
            selectedConnection={ui.selectedConnection}
            errorIds={view.errorIds}
            others={view.others}
            box={ui.box}
            connecting={ui.connecting}
            drag={ui.drag}
            documentOpen={view.documentOpen}
            band={view.view.band}
            zoom={view.view.zoom}
            renderRect={view.view.renderRect}
            scheme={scheme}
            convention={view.convention}
            showTerminals={view.editable && ui.tool === 'select'}
            marks={studies.marks}
            gesture={bindings.gesture}
            onGroundNode={bindings.onGroundNode}
            onWorldNode={bindings.onWorldNode}
            onSize={bindings.onSize}
          />
        }
        canvasLayer={<PinLayer {...pins.layer} />}
        overlay={
          <>
            <Legend standardLabel={view.standardLabel} compact={isPhone} onCautions={() => a.openPanel('cautions')} />
            {view.scene.elements.size === 0 && view.link.synced ? (
              <Text variant="small" tone="muted" testID="empty-sheet-hint" pointerEvents="none">
                {view.editable ? 'An empty sheet: add a source, a panel and loads, then drag from a terminal to connect.' : 'Nothing is drawn on this sheet yet.'}
              </Text>
            ) : null}
            {view.resultsPanel.failure ? <SolveFailureNote {...view.resultsPanel.failure} compact={!isPhone} onShowWhere={a.selectElements} /> : null}
            {ui.chooser ? (
              <CutChooser chooser={ui.chooser} title={view.chooserTitle} open={view.chooserOpen} convention={view.convention} onChoose={(w) => a.chooseCut(ui.chooser!, w)} onClose={a.closeChooser} />
            ) : null}
          </>
        }
        corner={<ViewButtons onFit={a.fit} onZoomIn={() => a.zoomBy(1.25)} onZoomOut={() => a.zoomBy(0.8)} compact={isPhone} />}
        footnote={<Toast message={ui.message} onDismiss={a.dismissMessage} />}
        toolBar={
          <ToolBar
            tool={ui.tool}
            editable={view.editable}
            canUndo={view.history.canUndo}
            canRedo={view.history.canRedo}
            resultsOpen={ui.panel === 'results'}
            showAdd={isPhone}
            showResults={isPhone}
            onTool={a.setTool}
            onAdd={() => a.openPanel(ui.panel === 'palette' ? 'none' : 'palette')}
            onUndo={a.undo}
            onRedo={a.redo}
            onResults={() => a.openPanel(ui.panel === 'results' ? 'none' : 'results')}
            extra={
              // A phone's bar has room for one: the pins panel, whose first button adds a pin.
              isPhone ? (
                <ToolButton icon="flag" label="Pins" active={ui.panel === 'pins' || pins.placing} onPress={() => (pins.placing ? pins.cancelPlacing() : a.openPanel(ui.panel === 'pins' ? 'none' : 'pins'))} testID="tool-pins" />
              ) : (
                <ToolButton icon="flag" label="Pin" active={pins.placing} onPress={pins.placing ? pins.cancelPlacing : pins.startPin} testID="tool-pin" />
              )
            }
            studiesOpen={ui.panel === 'studies'}
            onStudies={() => a.openPanel(ui.panel === 'studies' ? 'none' : 'studies')}
          />
        }
        leftPane={view.editable ? <PaneSection title="Add an element">{palette}</PaneSection> : null}
        rightPane={
          <>
            {wideExtra ? (
              <PaneSection title={wideExtra.title} testID={wideExtra.testID} action={<Button label="Close" variant="quiet" compact onPress={a.closePanel} testID={`${wideExtra.testID}-close`} />}>
                {wideExtra.body}
              </PaneSection>
            ) : null}
            {view.resultsPanel.phasor ? (
              <PaneSection title="Phasor diagram" testID="pane-phasor" action={<IconButton icon="x" label="Close the phasor diagram" onPress={() => a.showPhasor(null)} />}>
                <PhasorDiagram busName={view.resultsPanel.phasor.busName} view={view.resultsPanel.phasor.view} convention={view.convention} />
              </PaneSection>
            ) : null}
            <PaneSection title="Pins" testID="pane-pins">
              {pinPanel}
            </PaneSection>
            <PaneSection title="Inspector" testID="pane-inspector">
              {inspector}
            </PaneSection>
            <PaneSection title="Results" testID="pane-results">
              {results}
            </PaneSection>
          </>
        }
        peek={
          view.inspector.kind === 'element' || view.inspector.kind === 'connection' || view.inspector.kind === 'many' ? (
            <SelectionPeek
              title={view.inspector.kind === 'element' ? view.inspector.element.name || view.inspector.kindLabel : view.inspector.kind === 'many' ? `${view.inspector.count} selected` : 'Connection'}
              subtitle={view.inspector.kind === 'element' ? view.inspector.kindLabel : view.inspector.kind === 'connection' ? `${view.inspector.fromName} → ${view.inspector.toName}` : 'Rotate, duplicate or delete together'}
              isBus={view.inspector.kind === 'element' && view.inspector.element.kind === 'bus'}
              onDetails={() => a.openPanel('inspector')}
              onPhasors={() => a.openPanel('results')}
            />
          ) : null
        }
        bottomPane={!isPhone && ui.panel === 'studies' ? <StudiesPanel layout="table" view={studies.view} actions={studies.actions} selected={studies.selected} caution={studies.caution} onClose={a.closePanel} /> : null}
        panel={
          open ? (
            <SlidingPanel title={open.title} onClose={a.closePanel} testID={open.testID} maxHeightPercent={ui.panel === 'schedule' || ui.panel === 'import-sheet' ? 86 : undefined}>
              {open.body}
            </SlidingPanel>
          ) : null
        }
        cover={covering ? <CoverPanel title={covering.title} onClose={a.closePanel} testID={covering.testID}>{covering.body}</CoverPanel> : null}
      />
    </>
  );
}
