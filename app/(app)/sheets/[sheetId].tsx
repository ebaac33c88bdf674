// A sheet's page: its record for now; the drawing canvas comes with the editor.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { SheetDetail } from '@/components/projects/sheet-detail';
import { useTheme } from '@/components/theme/use-theme';
import { Button } from '@/components/ui/button';
import { Loadable } from '@/components/ui/loadable';
import { EmptyState } from '@/components/ui/states';
import { isApiError } from '@/shared/client/api-client';
import { loadable } from '@/shared/client/loadable';
import { useSheet } from '@/shared/client/queries';

export default function SheetScreen() {
  const params = useLocalSearchParams<{ sheetId: string }>();
  const sheetId = String(params.sheetId ?? '');
  const router = useRouter();
  const { color } = useTheme();
  const sheet = useSheet(sheetId);
  // A malformed id (400) is as missing as an unknown one (404) or someone else's (403).
  const missing = isApiError(sheet.error) && [400, 403, 404].includes(sheet.error.status);

  return (
    <View style={{ flex: 1, backgroundColor: color.ground, justifyContent: sheet.data ? undefined : 'center' }}>
      <Stack.Screen options={{ title: `${sheet.data?.sheet.name ?? 'Sheet'} · Phasewright`, headerTitle: 'Sheet' }} />
      {missing ? (
        <EmptyState
          icon="slash"
          title="Sheet not found"
          message="It may have been deleted, or you are not a member of its project."
          action={<Button label="All projects" variant="secondary" onPress={() => router.replace('/')} />}
          testID="sheet-missing"
        />
      ) : (
        <Loadable state={loadable(sheet)} loadingLabel="Loading the sheet…" errorTitle="Could not load the sheet" testID="sheet">
          {({ sheet: found, project }) => (
            <SheetDetail
              sheet={found}
              project={project}
              onOpenProject={() => router.dismissTo(`/projects/${project.id}`)}
            />
          )}
        </Loadable>
      )}
    </View>
  );
}
