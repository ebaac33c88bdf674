// Any address that matches no screen.
import { Stack, useRouter } from 'expo-router';
import { Screen } from '@/components/layout/screen';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/states';

export default function NotFoundScreen() {
  const router = useRouter();
  return (
    <Screen padTop centred testID="not-found">
      <Stack.Screen options={{ title: 'Not found · Phasewright' }} />
      <EmptyState
        icon="map"
        title="Nothing at this address"
        message="The page may have moved, or the link has a typo."
        action={<Button label="Go to your projects" onPress={() => router.replace('/')} testID="not-found-home" />}
      />
    </Screen>
  );
}
