// A revision's standing as a small badge: its own icon beside the word, so it reads without colour.
import { StyleSheet, View } from 'react-native';
import type { RevisionSummary } from '@/shared/revisions';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';

const LOOK: Record<RevisionSummary['status'], { word: string; icon: IconName; tone: 'success' | 'muted' | 'primary' }> = {
  issued: { word: 'Issued', icon: 'file-text', tone: 'muted' },
  reviewed: { word: 'Reviewed', icon: 'eye', tone: 'primary' },
  approved: { word: 'Approved', icon: 'check-circle', tone: 'success' },
};

export function RevisionStatus({ status, testID }: { status: RevisionSummary['status']; testID?: string }) {
  const { color } = useTheme();
  const look = LOOK[status];
  const ink = { success: color.success, muted: color.inkMuted, primary: color.primary }[look.tone];
  return (
    <View style={styles.row} testID={testID} accessibilityLabel={`Status: ${look.word}`}>
      <Icon name={look.icon} size={15} color={ink} />
      <Text variant="label" style={{ color: ink }}>
        {look.word}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row', alignItems: 'center', gap: space.xs } });
