// Picks a role: three side-by-side choices, each a full touch target. Reads as a radio group.
import { Pressable, StyleSheet, View } from 'react-native';
import { ROLES, type Role } from '@/shared/roles';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { roleLabel } from '../ui/role-badge';
import { Text } from '../ui/text';

export interface RolePickerProps {
  value: Role;
  onChange: (role: Role) => void;
  disabled?: boolean;
  /** Names the group for screen readers ("Role for Dev Patel"). */
  label: string;
  testID?: string;
}

export function RolePicker({ value, onChange, disabled, label, testID }: RolePickerProps) {
  const { color } = useTheme();
  return (
    <View
      role="radiogroup"
      aria-label={label}
      testID={testID}
      style={[styles.group, { borderColor: color.lineStrong }, disabled && styles.disabled]}
    >
      {ROLES.map((role, index) => {
        const chosen = role === value;
        return (
          <Pressable
            key={role}
            role="radio"
            aria-checked={chosen}
            accessibilityLabel={roleLabel(role)}
            disabled={disabled}
            onPress={() => !chosen && onChange(role)}
            testID={testID ? `${testID}-${role}` : undefined}
            style={({ pressed }) => [
              styles.choice,
              index > 0 && { borderLeftWidth: 1, borderLeftColor: color.lineStrong },
              { backgroundColor: chosen ? color.primary : pressed ? color.raised : color.surface },
            ]}
          >
            <Text variant="label" tone={chosen ? 'onPrimary' : 'ink'}>
              {roleLabel(role)}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  group: { flexDirection: 'row', borderWidth: 1, borderRadius: radius.md, overflow: 'hidden', alignSelf: 'flex-start' },
  choice: { minHeight: touchTargetMin, minWidth: 64, paddingHorizontal: space.md, alignItems: 'center', justifyContent: 'center' },
  disabled: { opacity: 0.55 },
});
