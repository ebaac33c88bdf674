// One revision: who issued it and when, the solver's version and the input hash, its cases in a few figures, the
// reviews, a review form, downloads, the comparison with the live sheet, and restore for owners.
import { useEffect, useState, type ReactNode } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import type { ReviewVerdict, RevisionComparison as Comparison, RevisionSummary } from '@/shared/revisions';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card, Section } from '../ui/card';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { formatDateTime } from '../ui/format';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { RevisionComparison } from './revision-comparison';
import { RevisionStatus } from './revision-status';

export const DOWNLOADS = [
  { file: 'report.pdf', label: 'Report (PDF)', icon: 'file-text' },
  { file: 'drawing.svg', label: 'Drawing (SVG)', icon: 'image' },
  { file: 'drawing.png', label: 'Drawing (PNG)', icon: 'image' },
  { file: 'results.csv', label: 'Results (CSV)', icon: 'grid' },
  { file: 'document.json', label: 'Sheet (JSON)', icon: 'code' },
] as const;

export interface RevisionDetailProps {
  revision: RevisionSummary;
  onDownload: (file: string) => void;
  /** The drawing as issued (the revision's SVG export), shown read-only. */
  drawingUrl: string;
  comparison: Comparison | null;
  comparing: boolean;
  compareError: string | null;
  onCompare: () => void;
  reviewing: boolean;
  reviewError: string | null;
  onReview: (verdict: ReviewVerdict, comment: string) => Promise<boolean>;
  canRestore: boolean;
  restoring: boolean;
  restoreError: string | null;
  onRestore: () => Promise<boolean>;
}

function Fact({ label, children }: { label: string; children: ReactNode }) {
  return (
    <View style={styles.fact}>
      <Text variant="label" tone="muted" style={styles.factLabel}>
        {label}
      </Text>
      <View style={styles.factValue}>{children}</View>
    </View>
  );
}

const pct = (v: number) => `${v.toFixed(1)} %`;

export function RevisionDetail(p: RevisionDetailProps) {
  const r = p.revision;
  const [comment, setComment] = useState('');
  const [confirming, setConfirming] = useState(false);
  // The drawing keeps its own proportions, so a wide sheet on a phone is not a strip in a tall empty box.
  const [drawingAspect, setDrawingAspect] = useState<number | null>(null);
  useEffect(() => {
    let live = true;
    Image.getSize(
      p.drawingUrl,
      (w, h) => live && w > 0 && h > 0 && setDrawingAspect(w / h),
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, [p.drawingUrl]);
  const review = async (verdict: ReviewVerdict) => {
    if (await p.onReview(verdict, comment)) setComment('');
  };
  return (
    <View style={styles.column} testID={`revision-detail-${r.number}`}>
      <View style={styles.head}>
        <Text variant="title">Revision {r.number}</Text>
        <RevisionStatus status={r.status} />
      </View>
      {r.note ? <Text variant="body">{r.note}</Text> : null}
      <Card style={styles.card}>
        <Fact label="Issued">
          <Text variant="body">{`${formatDateTime(r.issuedAt)} by ${r.issuedBy.name || 'unknown'}`}</Text>
        </Fact>
        <Fact label="Solver version">
          <Text variant="number" testID="revision-solver-version">{r.solverVersion}</Text>
        </Fact>
        <Fact label="Input hash (SHA-256)">
          <Text variant="number" selectable testID="revision-hash" style={styles.hash}>
            {r.inputHash}
          </Text>
        </Fact>
      </Card>

      <Section title="Drawing as issued">
        <Card style={styles.drawing}>
          <Image source={{ uri: p.drawingUrl }} style={[styles.drawingImage, { aspectRatio: drawingAspect ?? 1.6 }]} resizeMode="contain" accessibilityLabel={`The drawing of revision ${r.number}`} testID="revision-drawing" />
        </Card>
      </Section>

      <Section title="Cases">
        <Card style={styles.card}>
          {r.cases.map((c) => (
            <View key={c.whatIfId ?? 'base'} style={styles.case}>
              <Text variant="bodyStrong">{c.name}</Text>
              {c.ok ? (
                <Text variant="small" tone="muted">
                  {c.highestLoad ? `Load voltage: highest ${pct(c.highestLoad.percentOfRating)} of rating (${c.highestLoad.name})` : ''}
                  {c.lowestLoad ? ` · lowest ${pct(c.lowestLoad.percentOfRating)} (${c.lowestLoad.name})` : ''}
                  {c.faultKa !== undefined ? ` · fault ${c.faultKa.toFixed(2)} kA` : ''}
                </Text>
              ) : (
                <Text variant="small" tone="danger">Not solved: {c.error}</Text>
              )}
            </View>
          ))}
        </Card>
      </Section>

      <Section title="Downloads">
        <View style={styles.buttons}>
          {DOWNLOADS.map((d) => (
            <Button key={d.file} label={d.label} icon={d.icon} variant="secondary" compact onPress={() => p.onDownload(d.file)} testID={`download-${d.file}`} />
          ))}
        </View>
      </Section>

      <Section title="Reviews" count={r.reviews.length}>
        <View style={styles.column}>
          {r.reviews.map((rv) => (
            <Card key={rv.id} style={styles.card}>
              <Text variant="bodyStrong">
                {rv.verdict === 'approved' ? 'Approved' : 'Reviewed'} by {rv.reviewer.name}
                {rv.reviewer.viaLink ? ' (viewer link)' : ''}
              </Text>
              <Text variant="small" tone="muted">{formatDateTime(rv.createdAt)}</Text>
              {rv.comment ? <Text variant="body">{rv.comment}</Text> : null}
            </Card>
          ))}
          <TextField label="Comment" value={comment} onChangeText={setComment} multiline maxLength={4000} placeholder="What you checked" testID="review-comment" />
          <FormMessage message={p.reviewError} testID="review-error" />
          <View style={styles.buttons}>
            <Button label="Mark reviewed" icon="eye" variant="secondary" loading={p.reviewing} onPress={() => void review('reviewed')} testID="review-reviewed" />
            <Button label="Approve" icon="check-circle" loading={p.reviewing} onPress={() => void review('approved')} testID="review-approved" />
          </View>
        </View>
      </Section>

      <Section title="Compared with the live sheet">
        <View style={styles.column}>
          <Button label={p.comparison ? 'Compare again' : 'Compare with the live sheet'} icon="columns" variant="secondary" loading={p.comparing} onPress={p.onCompare} testID="compare-revision" />
          <FormMessage message={p.compareError} testID="compare-error" />
          {p.comparison ? <RevisionComparison comparison={p.comparison} /> : null}
        </View>
      </Section>

      {p.canRestore ? (
        <Section title="Restore">
          <View style={styles.column}>
            <Text variant="small" tone="muted">
              Makes the live sheet what it was in this revision, as a new edit everyone on the sheet sees. Later revisions stay as issued.
            </Text>
            <Button label={`Restore revision ${r.number}`} icon="rotate-ccw" variant="danger" onPress={() => setConfirming(true)} testID="restore-revision" />
          </View>
        </Section>
      ) : null}
      <ConfirmDialog
        visible={confirming}
        title={`Restore revision ${r.number}?`}
        message="The live sheet is replaced by this revision's drawing. You can undo it by restoring a later revision."
        confirmLabel="Restore"
        danger
        busy={p.restoring}
        error={p.restoreError}
        onConfirm={async () => {
          if (await p.onRestore()) setConfirming(false);
        }}
        onCancel={() => setConfirming(false)}
        testID="restore-confirm"
      />
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: space.md },
  head: { flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' },
  card: { padding: space.md, gap: space.sm },
  fact: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  factLabel: { flexBasis: 150 },
  factValue: { flexGrow: 1, flexBasis: 200, minWidth: 0 },
  hash: { fontSize: 12 },
  drawing: { padding: space.sm },
  drawingImage: { width: '100%', maxHeight: 480 },
  case: { gap: 2 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
