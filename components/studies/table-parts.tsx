// The parts every study table shares: a column head that sorts when tapped (with its direction shown and said),
// a row of filter chips, and a "show more" line for long tables.
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import type { SortSpec } from '@/editor/studies/table-query';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';

export function SortHead<K extends string>({
  label,
  column,
  sort,
  onSort,
  align = 'left',
  style,
  testID,
}: {
  label: string;
  column: K;
  sort: SortSpec<K> | null;
  onSort: (column: K) => void;
  align?: 'left' | 'right';
  style?: StyleProp<ViewStyle>;
  testID?: string;
}) {
  const { color } = useTheme();
  const on = sort?.key === column;
  const words = on ? (sort!.direction === 'ascending' ? 'sorted low to high' : 'sorted high to low') : 'not sorted';
  return (
    <Pressable
      onPress={() => onSort(column)}
      accessibilityRole="button"
      accessibilityLabel={`${label}, ${words}`}
      testID={testID}
      style={({ pressed }) => [styles.head, align === 'right' && styles.right, pressed && { backgroundColor: color.raised }, style]}
    >
      <Text variant="caption" tone={on ? 'primary' : 'muted'} numberOfLines={1}>
        {label}
      </Text>
      {on ? <Icon name={sort!.direction === 'ascending' ? 'arrow-up' : 'arrow-down'} size={12} color={color.primary} /> : null}
    </Pressable>
  );
}

export function Chip({ label, on, onPress, testID, icon }: { label: string; on: boolean; onPress: () => void; testID?: string; icon?: ReactNode }) {
  const { color } = useTheme();
  return (
    <Pressable
      onPress={onPress}
      accessibilityRole="checkbox"
      accessibilityState={{ checked: on }}
      testID={testID}
      style={({ pressed }) => [
        styles.chip,
        { borderColor: on ? color.primary : color.line, backgroundColor: on ? color.raised : pressed ? color.raised : color.surface },
      ]}
    >
      {on ? <Icon name="check" size={12} color={color.primary} /> : icon}
      <Text variant="caption" tone={on ? 'primary' : 'ink'}>
        {label}
      </Text>
    </Pressable>
  );
}

export function ChipRow({ children, label }: { children: ReactNode; label: string }) {
  return (
    <View style={styles.chips} accessibilityLabel={label}>
      {children}
    </View>
  );
}

export function MoreRows({ shown, total, onMore, testID }: { shown: number; total: number; onMore: () => void; testID?: string }) {
  if (shown >= total) return null;
  return (
    <View style={styles.more}>
      <Text variant="small" tone="muted">
        {shown} of {total} shown
      </Text>
      <Button label="Show more" variant="quiet" compact onPress={onMore} testID={testID} />
    </View>
  );
}

const styles = StyleSheet.create({
  head: { flexDirection: 'row', alignItems: 'center', gap: 2, minHeight: 32, paddingHorizontal: 2, borderRadius: radius.sm },
  right: { justifyContent: 'flex-end' },
  chip: { flexDirection: 'row', alignItems: 'center', gap: space.xs, borderWidth: 1, borderRadius: radius.pill, paddingHorizontal: space.sm, minHeight: 32 },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  more: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', minHeight: touchTargetMin },
});
