// The key to the value tags, over the canvas: the standard they are judged against, named, each standing's tag
// shape and tint, and the cautions one tap away.
import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { Path } from 'react-native-svg';
import { radius, space, standingLook, touchTargetMin, type TagStandingName } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { tagOutline, tagStrokeWidth } from '../canvas/tag-shapes';

export interface LegendProps {
  standardLabel: string | null;
  compact: boolean;
  onCautions: () => void;
}

const ORDER: TagStandingName[] = ['normal', 'tolerable', 'outside'];

export function Legend({ standardLabel, compact, onCautions }: LegendProps) {
  const theme = useTheme();
  const looks = standingLook[theme.scheme];
  return (
    <View testID="legend" style={[styles.box, compact && styles.compact, { backgroundColor: theme.color.surface, borderColor: theme.color.line }]}>
      <Text variant="caption" tone="muted" numberOfLines={2} testID="legend-standard" style={styles.standard}>
        {standardLabel ?? 'Voltage standard'}
      </Text>
      <View style={styles.keys}>
        {ORDER.map((s) => (
          <View key={s} style={styles.key}>
            <Svg width={compact ? 24 : 30} height={16}>
              <Path d={tagOutline(s, 1, 1, compact ? 22 : 28, 14)} fill={looks[s].fill} stroke={looks[s].stroke} strokeWidth={tagStrokeWidth(s)} />
            </Svg>
            {/* A phone has room for one word each: a shape with no word means nothing to someone new. */}
            <Text variant="caption" tone="muted">
              {compact ? looks[s].word.split(' ')[0] : looks[s].word}
            </Text>
          </View>
        ))}
        <Pressable onPress={onCautions} accessibilityRole="button" accessibilityLabel="Cautions" testID="open-cautions" style={styles.cautions} hitSlop={6}>
          <Icon name="alert-triangle" size={16} color={theme.color.focus} />
          {/* On a phone the triangle alone (its label is spoken), so the key stays on one row. */}
          {!compact ? (
            <Text variant="caption" tone="primary">
              Cautions
            </Text>
          ) : null}
        </Pressable>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.sm, paddingTop: space.xs, maxWidth: 520 },
  // Clear of the fit button in the canvas's top right corner.
  compact: { marginRight: 56 },
  standard: { letterSpacing: 0 },
  keys: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', columnGap: space.sm },
  key: { flexDirection: 'row', alignItems: 'center', gap: 4 },
  cautions: { flexDirection: 'row', alignItems: 'center', gap: 4, minHeight: touchTargetMin, minWidth: touchTargetMin, paddingHorizontal: space.xs },
});
