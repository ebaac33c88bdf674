// A sheet's viewer links with their state (active, revoked, expired); an active one can be revoked.
import { StyleSheet, View } from 'react-native';
import type { ViewerLinkState, ViewerLinkSummary } from '@/shared/client/api-client';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { formatDate } from '../ui/format';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';

// Each state has its own icon as well as its colour, so it reads without colour.
const STATE_LOOK: Record<ViewerLinkState, { word: string; icon: IconName; tone: 'success' | 'muted' | 'danger' }> = {
  active: { word: 'Active', icon: 'check-circle', tone: 'success' },
  revoked: { word: 'Revoked', icon: 'slash', tone: 'danger' },
  expired: { word: 'Expired', icon: 'clock', tone: 'muted' },
};

function timeNote(link: ViewerLinkSummary): string {
  if (link.state === 'revoked') return `Revoked ${formatDate(link.revokedAt)}`;
  if (link.state === 'expired') return `Expired ${formatDate(link.expiresAt)}`;
  return link.expiresAt ? `Works until ${formatDate(link.expiresAt)}` : 'Works until revoked';
}

export function LinkList({ links, onRevoke }: { links: ViewerLinkSummary[]; onRevoke: (link: ViewerLinkSummary) => void }) {
  const { color } = useTheme();
  if (links.length === 0) {
    return (
      <Text variant="small" tone="faint" testID="links-none">
        No viewer links for this sheet yet.
      </Text>
    );
  }
  return (
    <View style={[styles.list, { borderColor: color.line }]} testID="link-list">
      {links.map((link, index) => {
        const look = STATE_LOOK[link.state];
        const ink = { success: color.success, muted: color.inkMuted, danger: color.danger }[look.tone];
        return (
          <View
            key={link.id}
            style={[styles.row, index > 0 && { borderTopWidth: 1, borderTopColor: color.line }]}
            testID={`link-row-${link.id}`}
          >
            <View style={styles.text}>
              <Text variant="bodyStrong" numberOfLines={1}>
                {link.label || 'Unlabelled link'}
              </Text>
              <Text variant="small" tone="muted">
                Made {formatDate(link.createdAt)} · {timeNote(link)}
              </Text>
            </View>
            <View style={styles.state} testID={`link-state-${link.id}`} accessibilityLabel={`State: ${look.word}`}>
              <Icon name={look.icon} size={16} color={ink} />
              <Text variant="label" tone={look.tone}>
                {look.word}
              </Text>
            </View>
            {link.state === 'active' ? (
              <Button
                label="Revoke"
                variant="quiet"
                compact
                onPress={() => onRevoke(link)}
                testID={`revoke-link-${link.id}`}
              />
            ) : null}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { borderWidth: 1, borderRadius: radius.md, overflow: 'hidden' },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, padding: space.md },
  text: { flexGrow: 1, flexBasis: 180, minWidth: 0 },
  state: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
});
