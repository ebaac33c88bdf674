// A project's members. Everyone sees who is on it; owners get roles to change and people to remove (as a
// table on a wide screen, cards on a phone). The server's refusals (the last owner) are shown as it words them.
import { useMemo, useState } from 'react';
import type { MemberSummary } from '@/shared/api';
import { useChangeMemberRole, useRemoveMember } from '@/shared/client/queries';
import type { Role } from '@/shared/roles';
import { useResponsive } from '../layout/use-responsive';
import { Card, ListRow, Section } from '../ui/card';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { errorMessage } from '../ui/format';
import { Loadable, type LoadableState } from '../ui/loadable';
import { RoleBadge, roleLabel } from '../ui/role-badge';
import { FormMessage } from '../ui/states';
import { MemberCards } from './member-cards';
import { MemberTable } from './member-table';
import { nextSort, sortMembers, type MemberSort } from './sort-members';

export interface MembersSectionProps {
  projectId: string;
  members: LoadableState<MemberSummary[]>;
  /** Owners manage; everyone else reads. */
  manage: boolean;
}

export function MembersSection({ projectId, members, manage }: MembersSectionProps) {
  return (
    <Loadable state={members} loadingLabel="Loading members…" errorTitle="Could not load the members" testID="members">
      {(list) => (
        <Section title="Members" count={list.length} testID="member-section">
          {manage ? <ManagedMembers projectId={projectId} members={list} /> : <ReadOnlyMembers members={list} />}
        </Section>
      )}
    </Loadable>
  );
}

function ReadOnlyMembers({ members }: { members: MemberSummary[] }) {
  return (
    <Card testID="member-list">
      {members.map((member, index) => (
        <ListRow
          key={member.userId}
          first={index === 0}
          title={member.name}
          subtitle={member.email}
          meta={<RoleBadge role={member.role} />}
          testID={`member-row-${member.userId}`}
        />
      ))}
    </Card>
  );
}

function ManagedMembers({ projectId, members }: { projectId: string; members: MemberSummary[] }) {
  const { isPhone } = useResponsive();
  const changeRole = useChangeMemberRole(projectId);
  const remove = useRemoveMember(projectId);
  const [sort, setSort] = useState<MemberSort>({ key: 'name', descending: false });
  const [problem, setProblem] = useState<string | null>(null);
  const [removing, setRemoving] = useState<MemberSummary | null>(null);
  const [removeError, setRemoveError] = useState<string | null>(null);
  const sorted = useMemo(() => sortMembers(members, sort), [members, sort]);

  const onChangeRole = (member: MemberSummary, role: Role) => {
    setProblem(null);
    changeRole.mutate(
      { userId: member.userId, role },
      { onError: (error) => setProblem(`${member.name} stays ${roleLabel(member.role).toLowerCase()}: ${errorMessage(error)}`) },
    );
  };
  const closeRemove = () => {
    setRemoving(null);
    setRemoveError(null);
  };
  const confirmRemove = async () => {
    if (!removing) return;
    setRemoveError(null);
    try {
      await remove.mutateAsync(removing.userId);
      closeRemove();
    } catch (error) {
      setRemoveError(errorMessage(error));
    }
  };
  const rows = {
    members: sorted,
    busyUserId: changeRole.isPending ? (changeRole.variables?.userId ?? null) : null,
    onChangeRole,
    onRemove: (member: MemberSummary) => setRemoving(member),
  };

  return (
    <>
      <FormMessage message={problem} testID="member-problem" />
      {isPhone ? <MemberCards {...rows} /> : <MemberTable {...rows} sort={sort} onSort={(key) => setSort(nextSort(sort, key))} />}
      <ConfirmDialog
        visible={removing !== null}
        title="Remove this member?"
        message={removing ? `${removing.name} (${removing.email}) loses access to this project and its sheets at once.` : ''}
        confirmLabel="Remove"
        danger
        busy={remove.isPending}
        error={removeError}
        onCancel={closeRemove}
        onConfirm={() => void confirmRemove()}
        testID="remove-member-dialog"
      />
    </>
  );
}
