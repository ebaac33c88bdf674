// A sheet's revisions seen through a viewer link: no account needed to look, compare or download; a name (a guest
// session) or a signed-in account to review or approve. Nothing here can issue or restore.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { Linking, ScrollView, StyleSheet, View } from 'react-native';
import { GuestNameForm } from '@/components/revisions/guest-name-form';
import { RevisionDetail } from '@/components/revisions/revision-detail';
import { RevisionList } from '@/components/revisions/revision-list';
import { space } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { Button } from '@/components/ui/button';
import { errorMessage } from '@/components/ui/format';
import { EmptyState, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { isApiError } from '@/shared/client/api-client';
import { getApiClient, useLinkComparison, useLinkReview, useLinkRevisions } from '@/shared/client/queries';
import { useGuestSignIn, useViewLink } from '@/shared/client/pin-queries';

export default function LinkRevisionsScreen() {
  const params = useLocalSearchParams<{ token: string; number?: string }>();
  const token = String(params.token ?? '');
  const router = useRouter();
  const { color } = useTheme();
  const view = useViewLink(token);
  const revisions = useLinkRevisions(token);
  const guestName = useGuestSignIn(token);
  const [chosen, setChosen] = useState<number | null>(params.number ? Number(params.number) || null : null);
  const [compareAsked, setCompareAsked] = useState<number | null>(null);
  const [needName, setNeedName] = useState(false);
  const list = revisions.data ?? [];
  const selected = list.find((r) => r.number === chosen) ?? null;
  const number = selected?.number ?? null;
  const review = useLinkReview(token, number ?? 0);
  const comparison = useLinkComparison(token, number, compareAsked === number && number !== null);
  const you = view.data?.you ?? null;

  const head = <Stack.Screen options={{ title: `${view.data ? `Revisions of ${view.data.sheet.name}` : 'Revisions'} · Phasewright` }} />;
  const failure = view.error ?? revisions.error;
  if (failure) {
    const gone = isApiError(failure) && failure.status === 410;
    return (
      <View style={[styles.centre, { backgroundColor: color.ground }]} testID="link-revisions-screen">
        {head}
        <EmptyState icon="slash" title={gone ? 'This link no longer works' : 'Link not found'} message={gone ? 'It was revoked or it expired. Ask the sheet’s owner for a new one.' : errorMessage(failure)} testID="link-revisions-gone" />
      </View>
    );
  }
  if (!view.data || !revisions.data) return <LoadingState label="Opening the revisions…" testID="link-revisions-loading" />;

  return (
    <View style={{ flex: 1, backgroundColor: color.ground }} testID="link-revisions-screen">
      {head}
      <ScrollView contentContainerStyle={styles.pane}>
        <Button label="Back to the sheet" icon="arrow-left" variant="quiet" compact style={styles.start} onPress={() => router.push(`/view/${token}`)} testID="link-revisions-back" />
        <Text variant="label" tone="muted">
          {view.data.project.name} · viewer link
        </Text>
        <Text variant="title">Revisions of {view.data.sheet.name}</Text>
        {you ? (
          <Text variant="small" tone="muted" testID="link-you">
            Reviewing as {you.name}
            {you.guest ? ' (guest)' : ''}
          </Text>
        ) : (
          <GuestNameForm busy={guestName.isPending} error={guestName.error ? errorMessage(guestName.error) : null} onSubmit={(name) => guestName.mutate(name)} />
        )}
        {selected ? (
          <>
            <Button label="All revisions" icon="arrow-left" variant="quiet" compact style={styles.start} onPress={() => setChosen(null)} testID="revisions-all" />
            <RevisionDetail
              revision={selected}
              onDownload={(file) => void Linking.openURL(getApiClient().linkRevisionExportUrl(token, selected.number, file))}
              drawingUrl={getApiClient().linkRevisionExportUrl(token, selected.number, 'drawing.svg')}
              comparison={compareAsked === selected.number ? (comparison.data ?? null) : null}
              comparing={comparison.isFetching}
              compareError={comparison.error ? errorMessage(comparison.error) : null}
              onCompare={() => (compareAsked === selected.number ? void comparison.refetch() : setCompareAsked(selected.number))}
              reviewing={review.isPending}
              reviewError={!you && needName ? 'Give your name above to review' : review.error ? errorMessage(review.error) : null}
              onReview={async (verdict, comment) => {
                if (!you) {
                  setNeedName(true);
                  return false;
                }
                try {
                  await review.mutateAsync({ verdict, comment });
                  return true;
                } catch {
                  return false;
                }
              }}
              canRestore={false}
              restoring={false}
              restoreError={null}
              onRestore={async () => false}
            />
          </>
        ) : (
          <RevisionList revisions={list} selected={null} onSelect={setChosen} canIssue={false} issuing={false} issueError={null} onIssue={async () => false} />
        )}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  centre: { flex: 1, justifyContent: 'center' },
  pane: { padding: space.lg, gap: space.md, maxWidth: 760, width: '100%', alignSelf: 'center' },
  start: { alignSelf: 'flex-start' },
});
