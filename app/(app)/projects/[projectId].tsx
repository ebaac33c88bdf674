// One project's page: its sheets and members. On a wide screen the projects list stays beside it.
import { Stack, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { SplitView } from '@/components/layout/split-view';
import { useResponsive } from '@/components/layout/use-responsive';
import { ProjectDetail } from '@/components/projects/project-detail';
import { ProjectsPanel } from '@/components/projects/projects-panel';
import { useTheme } from '@/components/theme/use-theme';
import { Button } from '@/components/ui/button';
import { Loadable } from '@/components/ui/loadable';
import { EmptyState } from '@/components/ui/states';
import { isApiError } from '@/shared/client/api-client';
import { loadable } from '@/shared/client/loadable';
import {
  useCreateSheet,
  useDeleteProject,
  useDeleteSheet,
  useMembers,
  useProject,
  useRenameSheet,
  useSheets,
  useUpdateProject,
} from '@/shared/client/queries';
import { useProjectsPanel } from '@/shared/client/use-projects-panel';

export default function ProjectScreen() {
  const params = useLocalSearchParams<{ projectId: string }>();
  const projectId = String(params.projectId ?? '');
  const router = useRouter();
  const { isWide } = useResponsive();
  const { color } = useTheme();
  const panel = useProjectsPanel(projectId);

  const project = useProject(projectId);
  const sheets = useSheets(projectId);
  const members = useMembers(projectId);
  const createSheet = useCreateSheet(projectId);
  const renameSheet = useRenameSheet(projectId);
  const deleteSheet = useDeleteSheet(projectId);
  const updateProject = useUpdateProject(projectId);
  const deleteProject = useDeleteProject();

  // A malformed id (400) is as missing as an unknown one (404) or someone else's (403).
  const missing = isApiError(project.error) && [400, 403, 404].includes(project.error.status);

  const detail = missing ? (
    <View style={{ flex: 1, justifyContent: 'center', backgroundColor: color.ground }}>
      <EmptyState
        icon="slash"
        title="Project not found"
        message="It may have been deleted, or you are not a member of it."
        action={<Button label="All projects" variant="secondary" onPress={() => router.replace('/')} />}
        testID="project-missing"
      />
    </View>
  ) : (
    <View style={{ flex: 1, backgroundColor: color.ground }}>
      <Loadable state={loadable(project)} loadingLabel="Loading the project…" errorTitle="Could not load the project" testID="project">
        {(found) => (
          <ProjectDetail
            project={found}
            sheets={loadable(sheets)}
            members={loadable(members)}
            onOpenSheet={(sheetId) => router.push(`/sheets/${sheetId}`)}
            onCreateSheet={async (values) => {
              await createSheet.mutateAsync(values);
            }}
            onRenameSheet={async (sheetId, values) => {
              await renameSheet.mutateAsync({ sheetId, ...values });
            }}
            onDeleteSheet={async (sheetId) => {
              await deleteSheet.mutateAsync(sheetId);
            }}
            onUpdateProject={async (values) => {
              await updateProject.mutateAsync(values);
            }}
            onDeleteProject={async () => {
              await deleteProject.mutateAsync(projectId);
              router.replace('/');
            }}
          />
        )}
      </Loadable>
    </View>
  );

  return (
    <>
      <Stack.Screen options={{ title: `${project.data?.name ?? 'Project'} · Phasewright`, headerTitle: 'Project' }} />
      {isWide ? <SplitView list={<ProjectsPanel {...panel} asPane />} detail={detail} /> : detail}
    </>
  );
}
