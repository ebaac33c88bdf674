// What a viewer link's page says about the link itself: that it no longer works (revoked, expired or never
// right), and, in its details panel, what it opens, until when, under which name comments go, and the way to the
// sheet's revisions.
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { formatDate } from '../ui/format';
import { EmptyState } from '../ui/states';
import { Text } from '../ui/text';

export function ViewLinkGone({ notFound, sheetName }: { notFound: boolean; sheetName: string | null }) {
  return (
    <View role="alert" testID="view-gone">
      <EmptyState
        icon="slash"
        title={notFound ? 'Link not found' : 'This link no longer works'}
        message={
          notFound
            ? 'The address is not right. Check it against the one you were sent.'
            : `The owner revoked it or it expired${sheetName ? `, so “${sheetName}” is no longer shown here` : ''}. Ask the sheet’s owner for a new link.`
        }
      />
    </View>
  );
}

export interface ViewLinkAboutProps {
  sheetName: string;
  projectName: string;
  expiresAt: string | null;
  you: { name: string; guest: boolean } | null;
  /** Opens the sheet's issued revisions, to read, download or review. */
  onOpenRevisions: () => void;
}

export function ViewLinkAbout(p: ViewLinkAboutProps) {
  return (
    <View style={styles.about} testID="view-about">
      <Text>
        “{p.sheetName}” in {p.projectName}, shared for viewing. It follows the editors’ changes as they happen; what-ifs
        and trial cuts you try stay in this browser and are never saved.
      </Text>
      <Text variant="small" tone="muted">
        {p.expiresAt ? `The link works until ${formatDate(p.expiresAt)}, unless the owner revokes it sooner.` : 'The link works until the owner revokes it.'}
      </Text>
      <Text variant="small" tone="muted" testID="view-you">
        {p.you ? `Your comments go under the name ${p.you.name}${p.you.guest ? ' (guest)' : ''}.` : 'To comment, give your name when you add a pin.'}
      </Text>
      <Button label="Revisions and reports" icon="layers" variant="secondary" compact style={styles.start} onPress={p.onOpenRevisions} testID="view-open-revisions" />
    </View>
  );
}

const styles = StyleSheet.create({ about: { gap: space.sm }, start: { alignSelf: 'flex-start' } });
