// A sheet's revisions, newest first, with a note box to issue the next one (editors and owners).
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { RevisionSummary } from '@/shared/revisions';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card, ListRow } from '../ui/card';
import { formatDateTime } from '../ui/format';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { RevisionStatus } from './revision-status';

export interface RevisionListProps {
  revisions: RevisionSummary[];
  selected: number | null;
  onSelect: (number: number) => void;
  canIssue: boolean;
  issuing: boolean;
  issueError: string | null;
  /** Issues the next revision; true once issued, so the note box empties for the one after. */
  onIssue: (note: string) => Promise<boolean>;
}

export function RevisionList({ revisions, selected, onSelect, canIssue, issuing, issueError, onIssue }: RevisionListProps) {
  const [note, setNote] = useState('');
  return (
    <View style={styles.column} testID="revision-list">
      {canIssue ? (
        <Card style={styles.issue} testID="issue-revision">
          <TextField label="Note for the next revision" value={note} onChangeText={setNote} placeholder="What this revision is for" maxLength={2000} testID="revision-note" />
          <FormMessage message={issueError} testID="issue-error" />
          <Button label="Issue a revision" icon="lock" loading={issuing} onPress={() => void onIssue(note).then((issued) => issued && setNote(''))} testID="issue-revision-button" />
          <Text variant="small" tone="faint">
            Freezes the sheet as it is now, with its results. Later edits never change it.
          </Text>
        </Card>
      ) : null}
      {revisions.length === 0 ? (
        <Text variant="small" tone="faint" testID="revisions-none">
          No revision has been issued for this sheet yet.
        </Text>
      ) : (
        <Card>
          {revisions.map((r, i) => (
            <ListRow
              key={r.id}
              first={i === 0}
              title={`Revision ${r.number}${r.note ? ` — ${r.note}` : ''}`}
              subtitle={`${formatDateTime(r.issuedAt)} · ${r.issuedBy.name || 'unknown'}`}
              meta={<RevisionStatus status={r.status} testID={`revision-status-${r.number}`} />}
              selected={selected === r.number}
              onPress={() => onSelect(r.number)}
              testID={`revision-row-${r.number}`}
            />
          ))}
        </Card>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: space.md },
  issue: { gap: space.sm, padding: space.md },
});
