// The projects list. On a wide screen the list sits at the left with room for a project's detail beside it.
import { Stack } from 'expo-router';
import { View } from 'react-native';
import { SplitView } from '@/components/layout/split-view';
import { useResponsive } from '@/components/layout/use-responsive';
import { ProjectsPanel } from '@/components/projects/projects-panel';
import { useTheme } from '@/components/theme/use-theme';
import { EmptyState } from '@/components/ui/states';
import { useProjectsPanel } from '@/shared/client/use-projects-panel';

export default function ProjectsScreen() {
  const { isWide } = useResponsive();
  const { color } = useTheme();
  const panel = useProjectsPanel();
  return (
    <>
      <Stack.Screen options={{ title: 'Projects · Phasewright', headerTitle: 'Phasewright' }} />
      {isWide ? (
        <SplitView
          list={<ProjectsPanel {...panel} asPane />}
          detail={
            <View style={{ flex: 1, justifyContent: 'center', backgroundColor: color.ground }}>
              <EmptyState
                icon="folder"
                title="Pick a project"
                message="Choose a project on the left to see its sheets and members, or start a new one."
                testID="pick-project"
              />
            </View>
          }
        />
      ) : (
        <ProjectsPanel {...panel} />
      )}
    </>
  );
}
