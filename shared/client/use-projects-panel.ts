// The projects list's data and actions, for the phone's projects screen and the wide screen's side pane alike.
import { useRouter } from 'expo-router';
import type { ProjectCreateBody } from '../api';
import { loadable } from './loadable';
import { useCreateProject, useProjects } from './queries';

export function useProjectsPanel(selectedId?: string) {
  const router = useRouter();
  const projects = useProjects();
  const createProject = useCreateProject();
  return {
    projects: loadable(projects),
    selectedId,
    // Beside an open project, picking another replaces it rather than piling up history.
    onSelect: (projectId: string) =>
      selectedId ? router.replace(`/projects/${projectId}`) : router.push(`/projects/${projectId}`),
    onCreate: async (values: ProjectCreateBody) => {
      const project = await createProject.mutateAsync(values);
      if (selectedId) router.replace(`/projects/${project.id}`);
      else router.push(`/projects/${project.id}`);
    },
  };
}
