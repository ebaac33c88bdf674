// Owners' members table on a wide screen: name and e-mail, role (with the picker), last active, remove.
// The column heads sort the rows.
import { Pressable, StyleSheet, View } from 'react-native';
import type { MemberSummary } from '@/shared/api';
import type { Role } from '@/shared/roles';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';
import { Card } from '../ui/card';
import { formatDateTime } from '../ui/format';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { RolePicker } from './role-picker';
import type { MemberSort, MemberSortKey } from './sort-members';

export interface MemberRowsProps {
  members: MemberSummary[];
  busyUserId: string | null;
  onChangeRole: (member: MemberSummary, role: Role) => void;
  onRemove: (member: MemberSummary) => void;
}

export function MemberTable({ members, busyUserId, onChangeRole, onRemove, sort, onSort }: MemberRowsProps & {
  sort: MemberSort;
  onSort: (key: MemberSortKey) => void;
}) {
  const { color } = useTheme();
  return (
    <Card testID="member-table">
      <View role="row" style={[styles.row, styles.head, { backgroundColor: color.raised }]}>
        <SortHead label="Name" column="name" sort={sort} onSort={onSort} style={styles.name} />
        <SortHead label="Role" column="role" sort={sort} onSort={onSort} style={styles.role} />
        <SortHead label="Last active" column="lastActive" sort={sort} onSort={onSort} style={styles.active} />
        <View style={styles.action} />
      </View>
      {members.map((member) => (
        <View
          key={member.userId}
          role="row"
          style={[styles.row, { borderTopWidth: 1, borderTopColor: color.line }]}
          testID={`member-row-${member.userId}`}
        >
          <View style={styles.name}>
            <Text variant="bodyStrong" numberOfLines={1}>
              {member.name}
            </Text>
            <Text variant="small" tone="muted" numberOfLines={1}>
              {member.email}
            </Text>
          </View>
          <View style={styles.role}>
            <RolePicker
              value={member.role}
              label={`Role for ${member.name}`}
              disabled={busyUserId === member.userId}
              onChange={(role) => onChangeRole(member, role)}
              testID={`member-role-${member.email}`}
            />
          </View>
          <Text variant="number" tone="muted" style={styles.active}>
            {member.lastActiveAt ? formatDateTime(member.lastActiveAt) : 'Never'}
          </Text>
          <View style={styles.action}>
            <IconButton
              icon="user-x"
              tone="danger"
              label={`Remove ${member.name}`}
              onPress={() => onRemove(member)}
              testID={`remove-member-${member.email}`}
            />
          </View>
        </View>
      ))}
    </Card>
  );
}

function SortHead({ label, column, sort, onSort, style }: {
  label: string;
  column: MemberSortKey;
  sort: MemberSort;
  onSort: (key: MemberSortKey) => void;
  style: object;
}) {
  const { color } = useTheme();
  const active = sort.key === column;
  return (
    <Pressable
      role="columnheader"
      aria-sort={active ? (sort.descending ? 'descending' : 'ascending') : 'none'}
      accessibilityLabel={`Sort by ${label.toLowerCase()}`}
      onPress={() => onSort(column)}
      testID={`sort-members-${column}`}
      style={[styles.sortHead, style]}
    >
      <Text variant="caption" tone={active ? 'primary' : 'muted'}>
        {label.toUpperCase()}
      </Text>
      <Icon
        name={active ? (sort.descending ? 'chevron-up' : 'chevron-down') : 'chevrons-down'}
        size={14}
        color={active ? color.primary : color.inkFaint}
      />
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', paddingHorizontal: space.lg, paddingVertical: space.sm, gap: space.md },
  head: { paddingVertical: 0 },
  sortHead: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: 40 },
  name: { flex: 1, minWidth: 0 },
  role: { width: 240 },
  active: { width: 150 },
  action: { width: 44, alignItems: 'flex-end' },
});
