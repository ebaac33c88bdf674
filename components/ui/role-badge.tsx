// A member's role on a project, as a small outlined tag.
import { StyleSheet, View } from 'react-native';
import type { Role } from '@/shared/roles';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from './text';

const LABEL: Record<Role, string> = { owner: 'Owner', editor: 'Editor', viewer: 'Viewer' };

export function RoleBadge({ role, testID }: { role: Role; testID?: string }) {
  const { color } = useTheme();
  const strong = role === 'owner';
  return (
    <View
      testID={testID}
      style={[
        styles.badge,
        { borderColor: strong ? color.primary : color.lineStrong, backgroundColor: strong ? color.raised : 'transparent' },
      ]}
    >
      <Text variant="caption" tone={strong ? 'primary' : 'muted'}>
        {LABEL[role]}
      </Text>
    </View>
  );
}

export const roleLabel = (role: Role) => LABEL[role];

const styles = StyleSheet.create({
  badge: { borderWidth: 1, borderRadius: radius.pill, paddingHorizontal: space.sm, paddingVertical: 2 },
});
