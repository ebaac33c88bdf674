// The owners' part of a project page about people: invite, invitations waiting, and who changed what.
import { loadable } from '@/shared/client/loadable';
import { useActivity, useInvitations } from '@/shared/client/queries';
import { Section } from '../ui/card';
import { ActivityList } from './activity-list';
import { InvitationList } from './invitation-list';
import { InviteForm } from './invite-form';

export function OwnerMembership({ projectId }: { projectId: string }) {
  const invitations = useInvitations(projectId);
  const activity = useActivity(projectId);
  const waiting = invitations.data?.filter((i) => i.state === 'pending' || i.state === 'expired').length;
  return (
    <>
      <Section title="Invite" testID="invite-section">
        <InviteForm projectId={projectId} />
      </Section>
      <Section title="Invitations" count={waiting} testID="invitation-section">
        <InvitationList projectId={projectId} invitations={loadable(invitations)} />
      </Section>
      <Section title="Activity" testID="activity-section">
        <ActivityList activity={loadable(activity)} />
      </Section>
    </>
  );
}
