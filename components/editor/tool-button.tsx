// A tool in a bar: an icon over a short word, at least 44 px each way, marked when it is the tool in use.
import { Pressable, StyleSheet } from 'react-native';
import { radius, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon, type IconName } from '../ui/icon';
import { Text } from '../ui/text';

export interface ToolButtonProps {
  icon: IconName;
  label: string;
  onPress: () => void;
  active?: boolean;
  disabled?: boolean;
  testID?: string;
}

export function ToolButton({ icon, label, onPress, active, disabled, testID }: ToolButtonProps) {
  const { color } = useTheme();
  const ink = disabled ? color.inkFaint : active ? color.onPrimary : color.ink;
  return (
    <Pressable
      testID={testID}
      accessibilityRole="button"
      accessibilityLabel={label}
      accessibilityState={{ selected: active, disabled }}
      disabled={disabled}
      onPress={onPress}
      style={({ pressed }) => [styles.button, { backgroundColor: active ? color.primary : pressed ? color.raised : 'transparent' }]}
    >
      <Icon name={icon} size={20} color={ink} />
      <Text variant="caption" style={[styles.label, { color: ink }]} numberOfLines={1}>
        {label}
      </Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  // Small enough that a seven-letter word fits a share of a 390 px bar.
  label: { fontSize: 11, letterSpacing: -0.1 },
  // Up to eight share a phone's width: each takes an equal share, never under a finger's width.
  button: { flex: 1, minWidth: touchTargetMin, maxWidth: 84, minHeight: touchTargetMin + 8, paddingHorizontal: 0, paddingVertical: 4, borderRadius: radius.md, alignItems: 'center', justifyContent: 'center', gap: 2 },
});
