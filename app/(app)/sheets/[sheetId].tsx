// A sheet's page: the editor on the sheet's live document (the drawing, its results, the crew), with the sheet's
// record one tap away in its details panel.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { SheetWorkspace, WorkspaceState } from '@/components/editor/sheet-workspace';
import { TopBar } from '@/components/editor/top-bar';
import { pickFile, PIN_FILE_TYPES } from '@/components/pins/pick-file';
import { useResponsive } from '@/components/layout/use-responsive';
import { SheetDetail } from '@/components/projects/sheet-detail';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { useSheetWorkspace } from '@/editor/ui/use-sheet-workspace';
import { isApiError } from '@/shared/client/api-client';
import { useSession, useSheet } from '@/shared/client/queries';

export default function SheetScreen() {
  const params = useLocalSearchParams<{ sheetId: string; pin?: string }>();
  const sheetId = String(params.sheetId ?? '');
  const router = useRouter();
  const { isPhone } = useResponsive();
  const sheet = useSheet(sheetId);
  const session = useSession();
  // A malformed id (400) is as missing as an unknown one (404) or someone else's (403).
  const missing = isApiError(sheet.error) && [400, 403, 404].includes(sheet.error.status);
  const user = session.data?.user;
  const role = sheet.data?.project.role;
  const workspace = useSheetWorkspace({
    editor: role && user ? { sheetId, editable: role !== 'viewer', user: { id: user.id, name: user.name || user.email } } : null,
    readOnly: false,
    isPhone,
    pins: {
      place: sheetId ? { sheetId } : null,
      me: user ? { id: user.id } : null,
      canModerate: !!role && role !== 'viewer',
      initialPinNumber: params.pin ? Number(params.pin) : null,
      pickFile: () => pickFile(PIN_FILE_TYPES),
    },
  });
  const { view, ready } = workspace;
  const sa = workspace.schedule?.actions;

  const goBack = () => (sheet.data ? router.dismissTo(`/projects/${sheet.data.project.id}`) : router.replace('/'));

  if (missing || sheet.error || !sheet.data || !ready || !sa) {
    return (
      <WorkspaceState>
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
      </WorkspaceState>
    );
  }

  const { ui } = view;
  const a = ready.actions;
  const found = sheet.data;
  const about = (
    <View style={{ gap: 12 }}>
      <SheetDetail sheet={found.sheet} project={found.project} onOpenProject={goBack} onOpenRevisions={() => router.push(`/revisions/${sheetId}`)} embedded />
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: 8 }}>
        <Button label="Panel schedules" icon="list" variant="secondary" compact onPress={sa.openSchedules} testID="open-schedules" />
        {view.editable ? <Button label="Import a sheet (JSON)" icon="upload" variant="secondary" compact onPress={sa.openSheetImport} testID="open-sheet-import" /> : null}
      </View>
    </View>
  );

  return (
    <>
      <Stack.Screen options={{ title: `${found.sheet.name} · Phasewright`, headerShown: false }} />
      <SheetWorkspace
        workspace={workspace}
        ready={ready}
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
        about={{ title: 'Sheet details', body: about }}
        sheetName={found.sheet.name}
      />
    </>
  );
}
