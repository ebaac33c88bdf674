// A study row's standing as a small badge: our tint, an icon and the words, so it reads without its colour.
import { StyleSheet, View } from 'react-native';
import { radius, space, standingLook, type TagStandingName } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';

const ICON: Record<TagStandingName, IconName> = { outside: 'x-octagon', tolerable: 'alert-triangle', normal: 'check', plain: 'minus' };

export function StandingBadge({ standing, label, compact, testID }: { standing: TagStandingName; label: string; compact?: boolean; testID?: string }) {
  const { scheme } = useTheme();
  const look = standingLook[scheme][standing];
  return (
    <View style={[styles.badge, { backgroundColor: look.fill, borderColor: look.stroke, borderWidth: standing === 'outside' ? 1.5 : 1 }]} testID={testID}>
      <Icon name={ICON[standing]} size={13} color={look.stroke} />
      {compact ? null : (
        <Text variant="caption" style={{ color: look.text }} numberOfLines={1}>
          {label}
        </Text>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { flexDirection: 'row', alignItems: 'center', gap: space.xs, borderRadius: radius.sm, paddingHorizontal: space.xs, paddingVertical: 1, alignSelf: 'flex-start' },
});
