// A sheet's revisions: the list (and issuing, for editors and owners) beside the chosen revision's record, its
// reviews, downloads, comparison with the live sheet and, for owners, restore. Reached from the editor's sheet details.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { Linking, ScrollView, StyleSheet, View } from 'react-native';
import { SplitView } from '@/components/layout/split-view';
import { useResponsive } from '@/components/layout/use-responsive';
import { RevisionDetail } from '@/components/revisions/revision-detail';
import { RevisionList } from '@/components/revisions/revision-list';
import { space } from '@/components/theme/tokens';
import { useTheme } from '@/components/theme/use-theme';
import { Button } from '@/components/ui/button';
import { errorMessage } from '@/components/ui/format';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { isApiError } from '@/shared/client/api-client';
import {
  getApiClient,
  useIssueRevision,
  useRestoreRevision,
  useReviewRevision,
  useRevisionComparison,
  useRevisions,
  useSheet,
} from '@/shared/client/queries';

export default function RevisionsScreen() {
  const params = useLocalSearchParams<{ sheetId: string; number?: string }>();
  const sheetId = String(params.sheetId ?? '');
  const router = useRouter();
  const { color } = useTheme();
  const { isWide } = useResponsive();
  const sheet = useSheet(sheetId);
  const revisions = useRevisions(sheetId);
  const [chosen, setChosen] = useState<number | null>(params.number ? Number(params.number) || null : null);
  const [compareAsked, setCompareAsked] = useState<number | null>(null);
  const issue = useIssueRevision(sheetId);
  const restore = useRestoreRevision(sheetId);
  const list = revisions.data ?? [];
  const selected = list.find((r) => r.number === chosen) ?? (isWide ? list[0] : undefined) ?? null;
  const number = selected?.number ?? null;
  const review = useReviewRevision(sheetId, number ?? 0);
  const comparison = useRevisionComparison(sheetId, number, compareAsked === number && number !== null);
  const role = sheet.data?.project.role;
  const missing = isApiError(sheet.error) && [400, 403, 404].includes(sheet.error.status);

  const title = sheet.data ? `Revisions of ${sheet.data.sheet.name}` : 'Revisions';
  const frame = (body: React.ReactNode) => (
    <>
      <Stack.Screen options={{ title: `${title} · Phasewright`, headerTitle: 'Revisions' }} />
      {body}
    </>
  );
  if (missing) {
    return frame(
      <View style={[styles.centre, { backgroundColor: color.ground }]}>
        <EmptyState icon="slash" title="Sheet not found" message="It may have been deleted, or you are not a member of its project." action={<Button label="All projects" variant="secondary" onPress={() => router.replace('/')} />} testID="revisions-missing" />
      </View>,
    );
  }
  if (sheet.error || revisions.error) {
    return frame(
      <View style={[styles.centre, { backgroundColor: color.ground }]}>
        <ErrorState title="Could not load the revisions" message={errorMessage(sheet.error ?? revisions.error)} onRetry={() => void revisions.refetch()} testID="revisions-error" />
      </View>,
    );
  }
  if (!sheet.data || !revisions.data) return frame(<LoadingState label="Loading the revisions…" testID="revisions-loading" />);

  const listPane = (
    <ScrollView contentContainerStyle={styles.pane}>
      <Button label="Back to the sheet" icon="arrow-left" variant="quiet" compact style={styles.start} onPress={() => router.push(`/sheets/${sheetId}`)} testID="revisions-back" />
      <Text variant="heading">{title}</Text>
      <RevisionList
        revisions={list}
        selected={number}
        onSelect={(n) => setChosen(n)}
        canIssue={role === 'owner' || role === 'editor'}
        issuing={issue.isPending}
        issueError={issue.error ? errorMessage(issue.error) : null}
        onIssue={async (note) => {
          try {
            setChosen((await issue.mutateAsync({ note })).number);
            return true;
          } catch {
            return false;
          }
        }}
      />
    </ScrollView>
  );
  const detailPane = selected ? (
    <ScrollView contentContainerStyle={styles.pane}>
      {!isWide ? <Button label="All revisions" icon="arrow-left" variant="quiet" compact style={styles.start} onPress={() => setChosen(null)} testID="revisions-all" /> : null}
      <RevisionDetail
        revision={selected}
        onDownload={(file) => void Linking.openURL(getApiClient().revisionExportUrl(sheetId, selected.number, file))}
        drawingUrl={getApiClient().revisionExportUrl(sheetId, selected.number, 'drawing.svg')}
        comparison={compareAsked === selected.number ? (comparison.data ?? null) : null}
        comparing={comparison.isFetching}
        compareError={comparison.error ? errorMessage(comparison.error) : null}
        onCompare={() => (compareAsked === selected.number ? void comparison.refetch() : setCompareAsked(selected.number))}
        reviewing={review.isPending}
        reviewError={review.error ? errorMessage(review.error) : null}
        onReview={async (verdict, comment) => {
          try {
            await review.mutateAsync({ verdict, comment });
            return true;
          } catch {
            return false;
          }
        }}
        canRestore={role === 'owner'}
        restoring={restore.isPending}
        restoreError={restore.error ? errorMessage(restore.error) : null}
        onRestore={async () => {
          try {
            await restore.mutateAsync(selected.number);
            return true;
          } catch {
            return false;
          }
        }}
      />
    </ScrollView>
  ) : null;

  return frame(
    <View style={{ flex: 1, backgroundColor: color.ground }} testID="revisions-screen">
      {isWide ? <SplitView list={listPane} detail={detailPane ?? <EmptyState icon="file-text" title="No revision chosen" message="Issue one, or choose one from the list." />} /> : (detailPane ?? listPane)}
    </View>,
  );
}

const styles = StyleSheet.create({
  centre: { flex: 1, justifyContent: 'center' },
  pane: { padding: space.lg, gap: space.md, maxWidth: 760 },
  start: { alignSelf: 'flex-start' },
});
