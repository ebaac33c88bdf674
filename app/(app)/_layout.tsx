// Signed-in screens. Without a session the user goes to sign in; every screen here gets the header with
// the sign-out button.
import { Redirect, Stack, useRouter } from 'expo-router';
import { View } from 'react-native';
import { AppHeader } from '@/components/layout/app-header';
import { useTheme } from '@/components/theme/use-theme';
import { errorMessage } from '@/components/ui/format';
import { ErrorState, LoadingState } from '@/components/ui/states';
import { useSession, useSignOut } from '@/shared/client/queries';

export default function SignedInLayout() {
  const router = useRouter();
  const { color } = useTheme();
  const session = useSession();
  const signOut = useSignOut();

  if (session.isPending) {
    return (
      <View style={{ flex: 1, backgroundColor: color.ground, justifyContent: 'center' }}>
        <LoadingState label="Checking your session…" />
      </View>
    );
  }
  if (session.error && !session.data) {
    return (
      <View style={{ flex: 1, backgroundColor: color.ground, justifyContent: 'center' }}>
        <ErrorState
          title="Cannot reach Phasewright"
          message={errorMessage(session.error)}
          onRetry={() => void session.refetch()}
          retrying={session.isFetching}
        />
      </View>
    );
  }
  if (!session.data) return <Redirect href="/sign-in" />;

  const user = session.data.user;
  return (
    <Stack
      screenOptions={{
        contentStyle: { backgroundColor: color.ground },
        header: ({ options, back, route }) => (
          <AppHeader
            // A screen may give a short header title beside its full title (which names the browser tab).
            title={typeof options.headerTitle === 'string' ? options.headerTitle : (options.title ?? '')}
            userName={user.name || user.email}
            // Opened straight from a link there is no history: go up to the projects list instead.
            onBack={back ? () => router.back() : route.name === 'index' ? undefined : () => router.replace('/')}
            onSignOut={() => signOut.mutate()}
            signingOut={signOut.isPending}
          />
        ),
      }}
    />
  );
}
