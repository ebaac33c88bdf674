// Cards group related content; ListRow is one pressable line in a list, at least 56 px tall.
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon } from './icon';
import { Text } from './text';

export function Card({ children, style, testID }: { children: ReactNode; style?: StyleProp<ViewStyle>; testID?: string }) {
  const { color } = useTheme();
  return (
    <View testID={testID} style={[styles.card, { backgroundColor: color.surface, borderColor: color.line }, style]}>
      {children}
    </View>
  );
}

/** A titled section with an optional count beside the title. */
export function Section({ title, count, action, children, testID }: {
  title: string;
  count?: number;
  action?: ReactNode;
  children: ReactNode;
  testID?: string;
}) {
  return (
    <View style={styles.section} testID={testID}>
      <View style={styles.sectionHead}>
        <Text variant="caption" tone="muted" style={styles.sectionTitle}>
          {title.toUpperCase()}
        </Text>
        {count !== undefined ? (
          <Text variant="number" tone="faint">
            {count}
          </Text>
        ) : null}
        <View style={styles.fill} />
        {action}
      </View>
      {children}
    </View>
  );
}

export interface ListRowProps {
  title: string;
  subtitle?: string;
  /** Shown on the right before the chevron: a badge, a count. */
  meta?: ReactNode;
  /** Extra buttons after the row's text (rename, delete); each is its own touch target. */
  actions?: ReactNode;
  onPress?: () => void;
  selected?: boolean;
  first?: boolean;
  testID?: string;
  accessibilityLabel?: string;
}

export function ListRow({ title, subtitle, meta, actions, onPress, selected, first, testID, accessibilityLabel }: ListRowProps) {
  const { color } = useTheme();
  return (
    <View
      style={[
        styles.row,
        !first && { borderTopWidth: 1, borderTopColor: color.line },
        selected && { backgroundColor: color.raised },
      ]}
    >
      <Pressable
        testID={testID}
        onPress={onPress}
        disabled={!onPress}
        accessibilityRole={onPress ? 'link' : undefined}
        accessibilityLabel={accessibilityLabel}
        accessibilityState={{ selected }}
        style={({ pressed }) => [styles.rowMain, pressed && { backgroundColor: color.raised }]}
      >
        {selected ? <View style={[styles.selectedMark, { backgroundColor: color.primary }]} /> : null}
        <View style={styles.rowText}>
          <Text variant="bodyStrong" numberOfLines={2}>
            {title}
          </Text>
          {subtitle ? (
            <Text variant="small" tone="muted" numberOfLines={2}>
              {subtitle}
            </Text>
          ) : null}
        </View>
        {meta}
        {onPress ? <Icon name="chevron-right" size={18} color={color.inkFaint} /> : null}
      </Pressable>
      {actions ? <View style={styles.actions}>{actions}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { borderWidth: 1, borderRadius: radius.lg, overflow: 'hidden' },
  section: { gap: space.sm },
  sectionHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 28, paddingHorizontal: space.xs },
  sectionTitle: { letterSpacing: 0.8 },
  fill: { flex: 1 },
  row: { flexDirection: 'row', alignItems: 'stretch' },
  rowMain: {
    flex: 1,
    minHeight: 60,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.md,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
  },
  selectedMark: { position: 'absolute', left: 0, top: space.sm, bottom: space.sm, width: 3, borderRadius: 2 },
  rowText: { flex: 1, minWidth: 0, gap: space.xxs },
  actions: { flexDirection: 'row', alignItems: 'center', paddingRight: space.sm },
});
