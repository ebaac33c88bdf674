// A sheet on screen, for the editor and for a viewer link's page alike: the canvas with its legend, notes and pins,
// the tool bar, and the panels (inspector, results with what-ifs and trials, pins, crew, cautions, details) in the
// side pane on a wide screen or sliding up on a phone. Read-only (a viewer link's page) leaves out the palette,
// studies, schedules, imports and the solve-failure note; a visitor's trials stay in the browser as in any
// non-editable session. The top bar and the details panel are the screen's own.
import type { ReactNode } from 'react';
import { View } from 'react-native';
import { SheetCanvas } from '@/components/canvas/sheet-canvas';
import { PinLayer } from '@/components/pins/pin-layer';
import { PinPanel } from '@/components/pins/pin-panel';
import { CoverPanel } from '@/components/schedule/cover-panel';
import { SchedulePane } from '@/components/schedule/schedule-pane';
import { SheetImportForm } from '@/components/schedule/sheet-import-form';
import { StudiesPanel } from '@/components/studies/studies-panel';
import { space } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { Button, IconButton } from '@/components/ui/button';
import { Text } from '@/components/ui/text';
import { MAX_SHEET_JSON_BYTES } from '@/editor/import/sheet-import';
import { MAX_CSV_BYTES } from '@/editor/schedule/schedule-csv';
import type { PanelName } from '@/editor/session/editor-state';
import type { ReadySheet, SheetWorkspace as Workspace } from '@/editor/ui/use-sheet-workspace';
import { Cautions } from './cautions';
import { CrewList } from './crew-list';
import { CutChooser } from './cut-chooser';
import { EditorLayout } from './editor-layout';
import { Inspector } from './inspector';
import { Legend } from './legend';
import { Palette } from './palette';
import { PhasorDiagram } from './phasor-diagram';
import { ResultsPanel } from './results-panel';
import { SelectionPeek } from './selection-peek';
import { PaneSection, SlidingPanel } from './sliding-panel';
import { SolveFailureNote } from './solve-failure-note';
import { Toast } from './toast';
import { ToolBar } from './tool-bar';
import { ToolButton } from './tool-button';
import { ViewButtons } from './view-buttons';

export interface SheetWorkspaceProps {
  workspace: Workspace;
  ready: ReadySheet;
  isPhone: boolean;
  topBar: ReactNode;
  /** The details panel: the sheet's record in the editor, the link's terms on a viewer link's page. */
  about: { title: string; body: ReactNode };
  /** The sheet's stored name, for the sheet import until the document has a name of its own. */
  sheetName: string;
  /** On a viewer link's page a visitor gives a name before writing a pin. */
  guest?: { askName: boolean; naming: boolean; onGiveName: (name: string) => Promise<void> };
}

type Panel = { title: string; body: ReactNode; testID: string };

export function SheetWorkspace({ workspace, ready, isPhone, topBar, about, sheetName, guest }: SheetWorkspaceProps) {
  const { scheme } = useTheme();
  const { view, bindings, pins, studies, schedule, readOnly } = workspace;
  const { ui } = view;
  const a = ready.actions;
  const sa = schedule?.actions ?? null;
  const toggle = (panel: PanelName) => a.openPanel(ui.panel === panel ? 'none' : panel);

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
      onOpenSchedule={sa?.openSchedule}
    />
  );
  // On a wide editor the phasor diagram has its own section at the top of the side pane, in sight of the tap.
  const phasorPane = !isPhone && !readOnly;
  const results = (
    <ResultsPanel
      {...view.resultsPanel}
      phasor={phasorPane ? null : view.resultsPanel.phasor}
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
  const say = (text: string) => ready.handle.canvas.actions.say(text);
  const pinPanel = <PinPanel {...pins.panel} askName={guest?.askName ?? false} naming={guest?.naming ?? false} onGiveName={guest?.onGiveName ?? (async () => undefined)} />;
  const cautions = <Cautions caution={view.caution} assumptions={view.assumptions} standardLabel={view.standardLabel} />;
  const studiesPanel = (layout: 'cards' | 'table') =>
    studies ? <StudiesPanel layout={layout} view={studies.view} actions={studies.actions} selected={studies.selected} caution={studies.caution} onClose={layout === 'table' ? a.closePanel : undefined} /> : null;

  const panels: Partial<Record<PanelName, Panel | null>> = {
    palette: view.editable ? { title: 'Add an element', body: palette, testID: 'panel-palette' } : null,
    inspector: { title: view.inspector.kind === 'element' ? view.inspector.element.name || 'Element' : 'Details', body: inspector, testID: 'panel-inspector' },
    results: { title: 'Results', body: results, testID: 'panel-results' },
    pins: { title: 'Pins', body: pinPanel, testID: 'panel-pins' },
    crew: { title: 'Crew', body: <CrewList crew={view.crew} status={view.link.status} />, testID: 'panel-crew' },
    about: { ...about, testID: 'panel-about' },
    cautions: { title: 'Cautions', body: cautions, testID: 'panel-cautions' },
  };
  if (sa && schedule) {
    panels.schedule = {
      title: 'Panel schedule',
      testID: 'panel-schedule-view',
      body: (
        <SchedulePane
          schedule={schedule.view.schedule}
          panels={schedule.view.panels}
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
      ),
    };
    panels['import-sheet'] = view.editable
      ? {
          title: 'Import a sheet',
          testID: 'panel-sheet-import',
          body: <SheetImportForm sheetName={sheetName} maxBytes={MAX_SHEET_JSON_BYTES} onRead={sa.readSheetText} onReplace={sa.replaceSheet} onDone={say} onCancel={sa.close} />,
        }
      : null;
  }
  if (isPhone && studies) panels.studies = { title: 'Studies', body: studiesPanel('cards'), testID: 'panel-studies' };

  const open = panels[ui.panel] ?? null;
  const wide = ui.panel === 'schedule' || ui.panel === 'import-sheet';
  const covering = !isPhone && wide ? open : null;
  const wideExtra = !isPhone && (ui.panel === 'crew' || ui.panel === 'about' || ui.panel === 'cautions') ? open : null;
  const peekable = view.inspector.kind === 'element' || view.inspector.kind === 'connection' || view.inspector.kind === 'many';

  return (
    <EditorLayout
      isPhone={isPhone}
      topBar={topBar}
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
          marks={studies?.marks}
          gesture={ready.gesture}
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
          {view.resultsPanel.failure && !readOnly ? <SolveFailureNote {...view.resultsPanel.failure} compact={!isPhone} onShowWhere={a.selectElements} /> : null}
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
          onAdd={() => toggle('palette')}
          onUndo={a.undo}
          onRedo={a.redo}
          onResults={() => toggle('results')}
          extra={
            // A phone's bar has room for one: the pins panel, whose first button adds a pin.
            isPhone ? (
              <ToolButton icon="flag" label="Pins" active={ui.panel === 'pins' || pins.placing} onPress={() => (pins.placing ? pins.cancelPlacing() : toggle('pins'))} testID="tool-pins" />
            ) : (
              <ToolButton icon="flag" label="Pin" active={pins.placing} onPress={pins.placing ? pins.cancelPlacing : pins.startPin} testID="tool-pin" />
            )
          }
          studiesOpen={studies ? ui.panel === 'studies' : undefined}
          onStudies={studies ? () => toggle('studies') : undefined}
        />
      }
      leftPane={view.editable ? <PaneSection title="Add an element">{palette}</PaneSection> : null}
      rightPane={
        <>
          {wideExtra ? (
            <PaneSection
              title={wideExtra.title}
              testID={wideExtra.testID}
              action={readOnly ? undefined : <Button label="Close" variant="quiet" compact onPress={a.closePanel} testID={`${wideExtra.testID}-close`} />}
            >
              {wideExtra.body}
            </PaneSection>
          ) : null}
          {phasorPane && view.resultsPanel.phasor ? (
            <PaneSection title="Phasor diagram" testID="pane-phasor" action={<IconButton icon="x" label="Close the phasor diagram" onPress={() => a.showPhasor(null)} />}>
              <PhasorDiagram busName={view.resultsPanel.phasor.busName} view={view.resultsPanel.phasor.view} convention={view.convention} />
            </PaneSection>
          ) : null}
          <PaneSection title="Pins" testID="pane-pins">
            {pinPanel}
          </PaneSection>
          <PaneSection title={readOnly ? 'Details' : 'Inspector'} testID="pane-inspector">
            {inspector}
          </PaneSection>
          <PaneSection title="Results" testID="pane-results">
            {results}
          </PaneSection>
        </>
      }
      peek={
        peekable ? (
          <SelectionPeek
            title={view.inspector.kind === 'element' ? view.inspector.element.name || view.inspector.kindLabel : view.inspector.kind === 'many' ? `${view.inspector.count} selected` : 'Connection'}
            subtitle={
              view.inspector.kind === 'element'
                ? view.inspector.kindLabel
                : view.inspector.kind === 'connection'
                  ? `${view.inspector.fromName} → ${view.inspector.toName}`
                  : readOnly
                    ? 'Several elements'
                    : 'Rotate, duplicate or delete together'
            }
            isBus={view.inspector.kind === 'element' && view.inspector.element.kind === 'bus'}
            onDetails={() => a.openPanel('inspector')}
            onPhasors={() => a.openPanel('results')}
          />
        ) : null
      }
      bottomPane={!isPhone && ui.panel === 'studies' ? studiesPanel('table') : null}
      panel={
        open ? (
          <SlidingPanel title={open.title} onClose={a.closePanel} testID={open.testID} maxHeightPercent={wide ? 86 : undefined}>
            {open.body}
          </SlidingPanel>
        ) : null
      }
      cover={
        covering ? (
          <CoverPanel title={covering.title} onClose={a.closePanel} testID={covering.testID}>
            {covering.body}
          </CoverPanel>
        ) : null
      }
    />
  );
}

/** The page behind the workspace while the sheet opens, or instead of it when the sheet cannot be shown. */
export function WorkspaceState({ children }: { children: ReactNode }) {
  const { color } = useTheme();
  return <View style={{ flex: 1, backgroundColor: color.ground, justifyContent: 'center', gap: space.md }}>{children}</View>;
}
