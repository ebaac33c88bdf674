// Owners' member list on a phone: one card per person with the role picker and a remove button under the name.
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { formatDateTime } from '../ui/format';
import { Text } from '../ui/text';
import type { MemberRowsProps } from './member-table';
import { RolePicker } from './role-picker';

export function MemberCards({ members, busyUserId, onChangeRole, onRemove }: MemberRowsProps) {
  const { color } = useTheme();
  return (
    <Card testID="member-cards">
      {members.map((member, index) => (
        <View
          key={member.userId}
          style={[styles.card, index > 0 && { borderTopWidth: 1, borderTopColor: color.line }]}
          testID={`member-row-${member.userId}`}
        >
          <View>
            <Text variant="bodyStrong">{member.name}</Text>
            <Text variant="small" tone="muted">
              {member.email}
            </Text>
            <Text variant="small" tone="faint">
              Last active {member.lastActiveAt ? formatDateTime(member.lastActiveAt) : 'never'}
            </Text>
          </View>
          <View style={styles.controls}>
            <RolePicker
              value={member.role}
              label={`Role for ${member.name}`}
              disabled={busyUserId === member.userId}
              onChange={(role) => onChangeRole(member, role)}
              testID={`member-role-${member.email}`}
            />
            <Button
              label="Remove"
              icon="user-x"
              variant="quiet"
              compact
              onPress={() => onRemove(member)}
              testID={`remove-member-${member.email}`}
            />
          </View>
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { padding: space.lg, gap: space.md },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
});
