// An invitation opened from its e-mail. Open to everyone: it says who invited whom to what; signed out, the
// person signs in or makes an account here (the invited address filled in); signed in, they accept and go to
// the project. A used, withdrawn, expired or unknown link says so plainly.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AuthFrame } from '@/components/layout/auth-frame';
import { InviteAuthForm } from '@/components/members/invite-auth-form';
import { space } from '@/components/theme/tokens';
import { Button } from '@/components/ui/button';
import { errorMessage, formatDate } from '@/components/ui/format';
import { RoleBadge } from '@/components/ui/role-badge';
import { FormMessage, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { isApiError } from '@/shared/client/api-client';
import { useAcceptInvitation, useInvitationPreview, useSession, useSignOut } from '@/shared/client/queries';

export default function InvitationScreen() {
  const params = useLocalSearchParams<{ token: string }>();
  const token = String(params.token ?? '');
  const router = useRouter();
  const invitation = useInvitationPreview(token);
  const session = useSession();
  const accept = useAcceptInvitation(token);
  const signOut = useSignOut();
  const [acceptError, setAcceptError] = useState<string | null>(null);

  const head = <Stack.Screen options={{ title: 'Invitation · Phasewright' }} />;

  if (invitation.isPending || session.isPending) {
    return (
      <AuthFrame title="Invitation" testID="invite-screen">
        {head}
        <LoadingState label="Opening the invitation…" />
      </AuthFrame>
    );
  }

  if (invitation.error || !invitation.data) {
    const status = isApiError(invitation.error) ? invitation.error.status : 0;
    const title = status === 410 ? 'This invitation cannot be used' : status === 404 || status === 400 ? 'Invitation not found' : 'Could not open the invitation';
    const message =
      status === 404 || status === 400
        ? 'The link is not right, or a newer invitation replaced it. Ask the project owner to send it again.'
        : errorMessage(invitation.error);
    return (
      <AuthFrame title={title} testID="invite-screen">
        {head}
        <View testID="invite-gone" role="alert" style={styles.gap}>
          <Text>{message}</Text>
          {status === 0 ? <Button label="Try again" variant="secondary" onPress={() => void invitation.refetch()} /> : null}
          <Button label={session.data ? 'Your projects' : 'Sign in'} variant="secondary" onPress={() => router.replace(session.data ? '/' : '/sign-in')} testID="invite-leave" />
        </View>
      </AuthFrame>
    );
  }

  const found = invitation.data;
  const signedInAs = session.data?.user.email ?? null;
  const otherAddress = signedInAs !== null && signedInAs.toLowerCase() !== found.email.toLowerCase();

  const onAccept = async () => {
    setAcceptError(null);
    try {
      const joined = await accept.mutateAsync();
      router.replace(`/projects/${joined.projectId}`);
    } catch (error) {
      setAcceptError(errorMessage(error));
    }
  };

  return (
    <AuthFrame
      title={`Join ${found.projectName}`}
      intro={`${found.inviter ?? 'An owner'} invited you to this project on Phasewright.`}
      testID="invite-screen"
    >
      {head}
      <View style={styles.facts} testID="invite-facts">
        <View style={styles.fact}>
          <Text variant="small" tone="muted">
            For
          </Text>
          <Text variant="bodyStrong" testID="invite-for">
            {found.email}
          </Text>
        </View>
        <View style={styles.fact}>
          <Text variant="small" tone="muted">
            Role
          </Text>
          <RoleBadge role={found.role} testID="invite-role-badge" />
        </View>
        <Text variant="small" tone="faint">
          The link works until {formatDate(found.expiresAt)}.
        </Text>
      </View>

      {signedInAs === null ? (
        <InviteAuthForm email={found.email} />
      ) : (
        <View style={styles.gap}>
          {otherAddress ? (
            <Text tone="muted" testID="invite-other-address">
              You are signed in as {signedInAs}. This invitation is for {found.email}: sign out and sign in with that
              address.
            </Text>
          ) : null}
          <FormMessage message={acceptError} testID="accept-error" />
          <Button label="Accept invitation" icon="check" onPress={() => void onAccept()} loading={accept.isPending} block testID="accept-invitation" />
          {otherAddress ? (
            <TextLink label="Sign out" onPress={() => signOut.mutate()} testID="invite-sign-out" />
          ) : null}
        </View>
      )}
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  gap: { gap: space.md },
  facts: { gap: space.sm },
  fact: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.md },
});
