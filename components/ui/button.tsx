// Buttons: primary (one per view), secondary, danger and quiet; at least 44 px tall; a spinner while busy.
import { ActivityIndicator, Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Icon, type IconName } from './icon';
import { Text, type TextTone } from './text';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

export interface ButtonProps {
  label: string;
  onPress?: () => void;
  variant?: ButtonVariant;
  icon?: IconName;
  loading?: boolean;
  disabled?: boolean;
  /** Stretch to the container's width (forms, bottom bars on a phone). */
  block?: boolean;
  compact?: boolean;
  testID?: string;
  accessibilityLabel?: string;
  style?: StyleProp<ViewStyle>;
}

export function Button({
  label,
  onPress,
  variant = 'primary',
  icon,
  loading = false,
  disabled = false,
  block = false,
  compact = false,
  testID,
  accessibilityLabel,
  style,
}: ButtonProps) {
  const { color } = useTheme();
  const inactive = disabled || loading;
  const look = {
    primary: { bg: color.primary, pressed: color.primaryPressed, border: color.primary, tone: 'onPrimary' as TextTone },
    danger: { bg: color.danger, pressed: color.dangerPressed, border: color.danger, tone: 'onDanger' as TextTone },
    secondary: { bg: color.surface, pressed: color.raised, border: color.lineStrong, tone: 'ink' as TextTone },
    quiet: { bg: 'transparent', pressed: color.raised, border: 'transparent', tone: 'primary' as TextTone },
  }[variant];
  const ink = { onPrimary: color.onPrimary, onDanger: color.onDanger, ink: color.ink, primary: color.primary }[
    look.tone as 'onPrimary' | 'onDanger' | 'ink' | 'primary'
  ];

  return (
    <Pressable
      testID={testID}
      accessibilityRole="button"
      accessibilityLabel={accessibilityLabel ?? label}
      accessibilityState={{ disabled: inactive, busy: loading }}
      disabled={inactive}
      onPress={onPress}
      style={({ pressed }) => [
        styles.base,
        compact && styles.compact,
        block && styles.block,
        { backgroundColor: pressed ? look.pressed : look.bg, borderColor: look.border },
        inactive && styles.inactive,
        style,
      ]}
    >
      <View style={styles.content}>
        {loading ? (
          <ActivityIndicator size="small" color={ink} />
        ) : icon ? (
          <Icon name={icon} size={18} color={ink} />
        ) : null}
        <Text variant="label" tone={look.tone} numberOfLines={1} style={styles.label}>
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

export interface IconButtonProps {
  icon: IconName;
  /** Said by screen readers and shown as the tooltip; required because the button has no text. */
  label: string;
  onPress?: () => void;
  tone?: 'ink' | 'danger' | 'primary';
  disabled?: boolean;
  testID?: string;
}

export function IconButton({ icon, label, onPress, tone = 'ink', disabled, testID }: IconButtonProps) {
  const { color } = useTheme();
  const ink = { ink: color.inkMuted, danger: color.danger, primary: color.primary }[tone];
  return (
    <Pressable
      testID={testID}
      accessibilityRole="button"
      accessibilityLabel={label}
      disabled={disabled}
      onPress={onPress}
      hitSlop={4}
      style={({ pressed }) => [styles.iconButton, pressed && { backgroundColor: color.raised }]}
    >
      <Icon name={icon} size={20} color={ink} />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: 48,
    minWidth: touchTargetMin,
    paddingHorizontal: space.lg,
    borderRadius: radius.md,
    borderWidth: 1,
    alignItems: 'center',
    justifyContent: 'center',
  },
  compact: { minHeight: touchTargetMin, paddingHorizontal: space.md },
  block: { alignSelf: 'stretch' },
  inactive: { opacity: 0.55 },
  content: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  label: { fontSize: 15 },
  iconButton: {
    width: touchTargetMin,
    height: touchTargetMin,
    borderRadius: radius.md,
    alignItems: 'center',
    justifyContent: 'center',
  },
});
