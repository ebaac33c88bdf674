// Invitations still waiting for an answer (and expired ones, which can be sent again), with Resend and Withdraw.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { InvitationSummary } from '@/shared/client/api-client';
import { useResendInvitation, useWithdrawInvitation } from '@/shared/client/queries';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { errorMessage, formatDate } from '../ui/format';
import { Loadable, type LoadableState } from '../ui/loadable';
import { roleLabel } from '../ui/role-badge';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';

export function InvitationList({ projectId, invitations }: { projectId: string; invitations: LoadableState<InvitationSummary[]> }) {
  const { color } = useTheme();
  const resend = useResendInvitation(projectId);
  const withdraw = useWithdrawInvitation(projectId);
  const [note, setNote] = useState<{ tone: 'danger' | 'success'; text: string } | null>(null);
  const [withdrawing, setWithdrawing] = useState<InvitationSummary | null>(null);
  const [withdrawError, setWithdrawError] = useState<string | null>(null);

  const onResend = (invitation: InvitationSummary) => {
    setNote(null);
    resend.mutate(invitation.id, {
      onSuccess: () => setNote({ tone: 'success', text: `Sent again to ${invitation.email}, with a new link.` }),
      onError: (error) => setNote({ tone: 'danger', text: errorMessage(error) }),
    });
  };
  const closeWithdraw = () => {
    setWithdrawing(null);
    setWithdrawError(null);
  };

  return (
    <Loadable state={invitations} loadingLabel="Loading invitations…" errorTitle="Could not load the invitations" testID="invitations">
      {(all) => {
        const open = all.filter((i) => i.state === 'pending' || i.state === 'expired');
        return (
          <View style={styles.list}>
            <FormMessage message={note?.text} tone={note?.tone} testID="invitation-note" />
            {open.length === 0 ? (
              <Text variant="small" tone="faint" testID="invitations-none">
                No invitations waiting.
              </Text>
            ) : (
              <Card testID="invitation-list">
                {open.map((invitation, index) => (
                  <View
                    key={invitation.id}
                    style={[styles.row, index > 0 && { borderTopWidth: 1, borderTopColor: color.line }]}
                    testID={`invitation-${invitation.email}`}
                  >
                    <View style={styles.text}>
                      <Text variant="bodyStrong" numberOfLines={1}>
                        {invitation.email}
                      </Text>
                      <Text variant="small" tone={invitation.state === 'expired' ? 'danger' : 'muted'}>
                        {roleLabel(invitation.role)} ·{' '}
                        {invitation.state === 'expired'
                          ? `expired ${formatDate(invitation.expiresAt)}`
                          : `sent ${formatDate(invitation.sentAt)}, open until ${formatDate(invitation.expiresAt)}`}
                      </Text>
                    </View>
                    <View style={styles.buttons}>
                      <Button
                        label="Resend"
                        icon="refresh-cw"
                        variant="secondary"
                        compact
                        loading={resend.isPending && resend.variables === invitation.id}
                        onPress={() => onResend(invitation)}
                        testID={`resend-${invitation.email}`}
                      />
                      <Button
                        label="Withdraw"
                        icon="x-circle"
                        variant="quiet"
                        compact
                        onPress={() => setWithdrawing(invitation)}
                        testID={`withdraw-${invitation.email}`}
                      />
                    </View>
                  </View>
                ))}
              </Card>
            )}
            <ConfirmDialog
              visible={withdrawing !== null}
              title="Withdraw this invitation?"
              message={withdrawing ? `The link sent to ${withdrawing.email} stops working.` : ''}
              confirmLabel="Withdraw"
              danger
              busy={withdraw.isPending}
              error={withdrawError}
              onCancel={closeWithdraw}
              onConfirm={() =>
                withdrawing &&
                withdraw.mutate(withdrawing.id, { onSuccess: closeWithdraw, onError: (error) => setWithdrawError(errorMessage(error)) })
              }
              testID="withdraw-dialog"
            />
          </View>
        );
      }}
    </Loadable>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md, padding: space.lg },
  text: { flexGrow: 1, flexBasis: 220, minWidth: 0 },
  buttons: { flexDirection: 'row', gap: space.sm },
});
