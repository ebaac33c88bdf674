// A viewer link's page, open to anyone who has the link: the sheet read-only and live over the link's own socket,
// with its results and what-ifs (trials stay in this browser, never saved) and its pins. To comment a visitor gives
// a name (a guest session); a signed-in person comments under their own. A revoked or expired link says so.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useEffect, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { SheetCanvas } from '@/components/canvas/sheet-canvas';
import { Cautions } from '@/components/editor/cautions';
import { CrewList } from '@/components/editor/crew-list';
import { CutChooser } from '@/components/editor/cut-chooser';
import { EditorLayout } from '@/components/editor/editor-layout';
import { Inspector } from '@/components/editor/inspector';
import { Legend } from '@/components/editor/legend';
import { ResultsPanel } from '@/components/editor/results-panel';
import { SelectionPeek } from '@/components/editor/selection-peek';
import { PaneSection, SlidingPanel } from '@/components/editor/sliding-panel';
import { Toast } from '@/components/editor/toast';
import { ToolBar } from '@/components/editor/tool-bar';
import { ToolButton } from '@/components/editor/tool-button';
import { TopBar } from '@/components/editor/top-bar';
import { ViewButtons } from '@/components/editor/view-buttons';
import { useResponsive } from '@/components/layout/use-responsive';
import { PinLayer } from '@/components/pins/pin-layer';
import { PinPanel } from '@/components/pins/pin-panel';
import { pickFile, PIN_FILE_TYPES } from '@/components/pins/pick-file';
import { ViewLinkAbout, ViewLinkGone } from '@/components/pins/view-link-notes';
import { space } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { useEditorView } from '@/editor/ui/use-editor-view';
import { usePinBoard } from '@/editor/ui/use-pin-board';
import { useCanvasBindings, useSheetEditor } from '@/editor/ui/use-sheet-editor';
import { isApiError } from '@/shared/client/api-client';
import { useGuestSignIn, useViewLink } from '@/shared/client/pin-queries';

// Whoever looks through a link is one visitor to the editor's session; the server names them on the socket.
const VISITOR = { id: 'visitor', name: 'Visitor' };

export default function ViewLinkScreen() {
  const params = useLocalSearchParams<{ token: string }>();
  const token = String(params.token ?? '');
  const router = useRouter();
  const { color, scheme } = useTheme();
  const { isPhone } = useResponsive();
  const info = useViewLink(token);
  const sheetId = info.data?.sheet.id;
  const handle = useSheetEditor(sheetId ? { sheetId, editable: false, user: VISITOR, viewLink: token } : null);
  const view = useEditorView(handle);
  const bindings = useCanvasBindings(handle);
  const guest = useGuestSignIn(token);
  const a = handle?.actions;
  const me = info.data?.you ?? null;
  const status = isApiError(info.error) ? info.error.status : null;
  const gone = view.link.ended?.code === 4410 || status === 410;
  const pins = usePinBoard({
    handle,
    place: sheetId && !gone ? { token } : null,
    scene: view.scene,
    nameOf: (id) => view.snapshot.elements.get(id)?.name || 'an element',
    me,
    canModerate: false,
    showPanel: () => a?.openPanel('pins'),
    hidePanel: () => a?.closePanel(),
    pickFile: () => pickFile(PIN_FILE_TYPES),
    visibleShare: isPhone ? 0.42 : 1,
  });

  // While the socket is down, ask whether the link still works: a revoked link refuses the socket with a 410
  // that a browser cannot read, while the API says so plainly.
  const linkDown = !!handle && view.link.status !== 'connected';
  const { refetch } = info;
  useEffect(() => {
    if (!linkDown) return;
    const timer = setInterval(() => void refetch(), 3000);
    return () => clearInterval(timer);
  }, [linkDown, refetch]);

  const head = <Stack.Screen options={{ title: `${info.data?.sheet.name ?? 'Sheet'} · Phasewright` }} />;

  if (gone || status === 404 || status === 400) {
    return (
      <View style={[styles.fill, { backgroundColor: color.ground }]}>
        {head}
        <ViewLinkGone notFound={!gone} sheetName={info.data?.sheet.name ?? null} />
      </View>
    );
  }
  if (info.error && !info.data) {
    return (
      <View style={[styles.fill, { backgroundColor: color.ground }]}>
        {head}
        <ErrorState title="Could not open the sheet" message={String((info.error as Error).message)} onRetry={() => void info.refetch()} testID="view-error" />
      </View>
    );
  }
  if (!info.data || !handle || !a || !bindings.gesture) {
    return (
      <View style={[styles.fill, { backgroundColor: color.ground }]}>
        {head}
        <LoadingState label="Opening the sheet…" testID="view-loading" />
      </View>
    );
  }

  const { ui } = view;
  const found = info.data;
  // On a phone the panel would cover the canvas the visitor is about to tap for the pin.
  const giveName = async (name: string) => {
    await guest.mutateAsync(name);
    if (isPhone && pins.placing) a.closePanel();
  };
  const inspector = (
    <Inspector
      subject={view.inspector}
      editable={false}
      changeDestination={view.changeDestination}
      onSave={() => undefined}
      onSetPhases={() => undefined}
      onRotate={() => undefined}
      onDuplicate={() => undefined}
      onDelete={() => undefined}
      onAddChange={a.addChange}
    />
  );
  const results = (
    <ResultsPanel
      {...view.resultsPanel}
      editable={false}
      convention={view.convention}
      onShowCase={a.showCase}
      onAddWhatIf={() => undefined}
      onRemoveWhatIf={() => undefined}
      onRemoveChange={() => undefined}
      onRemoveTrial={a.removeTrial}
      onClearTrial={a.clearTrial}
      onKeepTrial={() => undefined}
      onShowFailure={a.selectElements}
      onClosePhasor={() => a.showPhasor(null)}
    />
  );
  const pinPanel = <PinPanel {...pins.panel} askName={!me} naming={guest.isPending} onGiveName={giveName} />;
  const about = <ViewLinkAbout sheetName={found.sheet.name} projectName={found.project.name} expiresAt={found.link.expiresAt} you={me} onOpenRevisions={() => router.push(`/view/${token}/revisions`)} />;
  const cautions = <Cautions caution={view.caution} assumptions={view.assumptions} standardLabel={view.standardLabel} />;
  const panels: Record<string, { title: string; body: ReactNode; testID: string } | null> = {
    inspector: { title: view.inspector.kind === 'element' ? view.inspector.element.name || 'Element' : 'Details', body: inspector, testID: 'panel-inspector' },
    results: { title: 'Results', body: results, testID: 'panel-results' },
    pins: { title: 'Pins', body: pinPanel, testID: 'panel-pins' },
    crew: { title: 'Crew', body: <CrewList crew={view.crew} status={view.link.status} />, testID: 'panel-crew' },
    about: { title: 'About this link', body: about, testID: 'panel-about' },
    cautions: { title: 'Cautions', body: cautions, testID: 'panel-cautions' },
  };
  const open = panels[ui.panel] ?? null;
  const wideExtra = !isPhone && (ui.panel === 'crew' || ui.panel === 'about' || ui.panel === 'cautions') ? open : null;
  const toggle = (panel: 'pins' | 'results' | 'crew' | 'about') => a.openPanel(ui.panel === panel ? 'none' : panel);

  return (
    <>
      {head}
      <EditorLayout
        isPhone={isPhone}
        topBar={
          <TopBar
            sheetName={found.sheet.name}
            caseLabel={view.caseLabel}
            readOnly
            crew={view.crew}
            status={view.link.status}
            synced={view.link.synced}
            compact={isPhone}
            onCrew={() => toggle('crew')}
            onAbout={() => toggle('about')}
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
            showTerminals={false}
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
                Nothing is drawn on this sheet yet.
              </Text>
            ) : null}
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
            editable={false}
            canUndo={false}
            canRedo={false}
            resultsOpen={ui.panel === 'results'}
            showAdd={false}
            showResults={isPhone}
            onTool={a.setTool}
            onAdd={() => undefined}
            onUndo={() => undefined}
            onRedo={() => undefined}
            onResults={() => toggle('results')}
            extra={
              // A phone's bar has room for one: the pins panel, whose first button adds a pin.
              isPhone ? (
                <ToolButton icon="flag" label="Pins" active={ui.panel === 'pins' || pins.placing} onPress={() => (pins.placing ? pins.cancelPlacing() : toggle('pins'))} testID="tool-pins" />
              ) : (
                <ToolButton icon="flag" label="Pin" active={pins.placing} onPress={pins.placing ? pins.cancelPlacing : pins.startPin} testID="tool-pin" />
              )
            }
          />
        }
        leftPane={null}
        rightPane={
          <>
            {wideExtra ? (
              <PaneSection title={wideExtra.title} testID={wideExtra.testID}>
                {wideExtra.body}
              </PaneSection>
            ) : null}
            <PaneSection title="Pins" testID="pane-pins">
              {pinPanel}
            </PaneSection>
            <PaneSection title="Details" testID="pane-inspector">
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
              subtitle={view.inspector.kind === 'element' ? view.inspector.kindLabel : view.inspector.kind === 'connection' ? `${view.inspector.fromName} → ${view.inspector.toName}` : 'Several elements'}
              isBus={view.inspector.kind === 'element' && view.inspector.element.kind === 'bus'}
              onDetails={() => a.openPanel('inspector')}
              onPhasors={() => a.openPanel('results')}
          />
          ) : null
        }
        panel={open ? <SlidingPanel title={open.title} onClose={a.closePanel} testID={open.testID}>{open.body}</SlidingPanel> : null}
      />
    </>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1, justifyContent: 'center', gap: space.md },
});
