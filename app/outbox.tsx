// The local mail sink's messages, newest first, with the links in them clickable. Only there while the server
// catches mail locally (on a developer's machine); otherwise the server answers 404 and this page says so.
import { Stack, useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { AppHeader } from '@/components/layout/app-header';
import { Screen } from '@/components/layout/screen';
import { space } from '@/components/theme/tokens';
import { Card, Section } from '@/components/ui/card';
import { errorMessage, formatDateTime } from '@/components/ui/format';
import { MessageText } from '@/components/ui/message-text';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Text } from '@/components/ui/text';
import { isApiError } from '@/shared/client/api-client';
import { useOutbox, useSession, useSignOut } from '@/shared/client/queries';

export default function OutboxScreen() {
  const router = useRouter();
  const outbox = useOutbox();
  const session = useSession();
  const signOut = useSignOut();
  const unavailable = isApiError(outbox.error) && outbox.error.status === 404;
  const messages = [...(outbox.data ?? [])].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));

  return (
    <>
      <Stack.Screen options={{ title: 'Outbox · Phasewright' }} />
      <AppHeader
        title="Mail outbox"
        onBack={() => (router.canGoBack() ? router.back() : router.replace('/'))}
        userName={session.data?.user.name}
        onSignOut={session.data ? () => signOut.mutate() : undefined}
        signingOut={signOut.isPending}
      />
      <Screen testID="outbox-screen">
        <Text tone="muted">
          On a developer's machine Phasewright keeps outgoing mail here instead of sending it. Newest first.
        </Text>
        {unavailable ? (
          <EmptyState
            icon="inbox"
            title="No outbox here"
            message="This server sends real e-mail, so there is no local outbox to show. Check your own inbox."
            testID="outbox-unavailable"
          />
        ) : outbox.error ? (
          <ErrorState
            title="Could not load the outbox"
            message={errorMessage(outbox.error)}
            onRetry={() => void outbox.refetch()}
            retrying={outbox.isFetching}
          />
        ) : outbox.isPending ? (
          <LoadingState label="Loading mail…" />
        ) : messages.length === 0 ? (
          <EmptyState icon="inbox" title="No mail yet" message="Mail the server sends shows up here within a few seconds." testID="outbox-empty" />
        ) : (
          <Section title="Messages" count={messages.length}>
            {messages.map((message) => (
              <Card key={message.id} style={styles.message} testID="outbox-message">
                <Text variant="heading">{message.subject || '(no subject)'}</Text>
                <View style={styles.meta}>
                  <Text variant="small" tone="muted">
                    To {message.to.join(', ')} · from {message.from}
                  </Text>
                  <Text variant="number" tone="faint">
                    {formatDateTime(message.receivedAt)}
                  </Text>
                </View>
                <MessageText text={message.text} variant="small" style={styles.body} />
              </Card>
            ))}
          </Section>
        )}
      </Screen>
    </>
  );
}

const styles = StyleSheet.create({
  message: { padding: space.lg, gap: space.sm },
  meta: { gap: space.xxs },
  body: { marginTop: space.xs },
});
