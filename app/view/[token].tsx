// A viewer link's page, open to anyone who has the link: the sheet read-only and live over the link's own socket,
// with its results and what-ifs (trials stay in this browser, never saved) and its pins. To comment a visitor gives
// a name (a guest session); a signed-in person comments under their own. A revoked or expired link says so.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useEffect } from 'react';
import { SheetWorkspace, WorkspaceState } from '@/components/editor/sheet-workspace';
import { TopBar } from '@/components/editor/top-bar';
import { useResponsive } from '@/components/layout/use-responsive';
import { pickFile, PIN_FILE_TYPES } from '@/components/pins/pick-file';
import { ViewLinkAbout, ViewLinkGone } from '@/components/pins/view-link-notes';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { LINK_GONE, useSheetWorkspace } from '@/editor/ui/use-sheet-workspace';
import { isApiError } from '@/shared/client/api-client';
import { useGuestSignIn, useViewLink } from '@/shared/client/pin-queries';

// Whoever looks through a link is one visitor to the editor's session; the server names them on the socket.
const VISITOR = { id: 'visitor', name: 'Visitor' };

export default function ViewLinkScreen() {
  const params = useLocalSearchParams<{ token: string }>();
  const token = String(params.token ?? '');
  const router = useRouter();
  const { isPhone } = useResponsive();
  const info = useViewLink(token);
  const sheetId = info.data?.sheet.id;
  const guest = useGuestSignIn(token);
  const me = info.data?.you ?? null;
  const status = isApiError(info.error) ? info.error.status : null;
  // The socket's close code ends the pins in the workspace; the API's 410 says the same.
  const workspace = useSheetWorkspace({
    editor: sheetId ? { sheetId, editable: false, user: VISITOR, viewLink: token } : null,
    readOnly: true,
    isPhone,
    pins: { place: sheetId && status !== 410 ? { token } : null, me, canModerate: false, pickFile: () => pickFile(PIN_FILE_TYPES) },
  });
  const { handle, view, ready, pins } = workspace;
  const gone = view.link.ended?.code === LINK_GONE || status === 410;

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
      <WorkspaceState>
        {head}
        <ViewLinkGone notFound={!gone} sheetName={info.data?.sheet.name ?? null} />
      </WorkspaceState>
    );
  }
  if (info.error && !info.data) {
    return (
      <WorkspaceState>
        {head}
        <ErrorState title="Could not open the sheet" message={String((info.error as Error).message)} onRetry={() => void info.refetch()} testID="view-error" />
      </WorkspaceState>
    );
  }
  if (!info.data || !ready) {
    return (
      <WorkspaceState>
        {head}
        <LoadingState label="Opening the sheet…" testID="view-loading" />
      </WorkspaceState>
    );
  }

  const { ui } = view;
  const a = ready.actions;
  const found = info.data;
  // On a phone the panel would cover the canvas the visitor is about to tap for the pin.
  const giveName = async (name: string) => {
    await guest.mutateAsync(name);
    if (isPhone && pins.placing) a.closePanel();
  };
  const about = <ViewLinkAbout sheetName={found.sheet.name} projectName={found.project.name} expiresAt={found.link.expiresAt} you={me} onOpenRevisions={() => router.push(`/view/${token}/revisions`)} />;
  const toggle = (panel: 'crew' | 'about') => a.openPanel(ui.panel === panel ? 'none' : panel);

  return (
    <>
      {head}
      <SheetWorkspace
        workspace={workspace}
        ready={ready}
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
        about={{ title: 'About this link', body: about }}
        sheetName={found.sheet.name}
        guest={{ askName: !me, naming: guest.isPending, onGiveName: giveName }}
      />
    </>
  );
}
