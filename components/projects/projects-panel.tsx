// The list of the user's projects (name, role, sheet count) and the "New project" form in a bottom sheet.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { ProjectCreateBody, ProjectSummary } from '@/shared/api';
import { ProjectForm } from '../forms/project-form';
import { Screen } from '../layout/screen';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card, ListRow, Section } from '../ui/card';
import { Count } from '../ui/count';
import { plural } from '../ui/format';
import { FormSheet } from '../ui/form-sheet';
import { Loadable, type LoadableState } from '../ui/loadable';
import { RoleBadge } from '../ui/role-badge';
import { EmptyState } from '../ui/states';
import { Text } from '../ui/text';

export interface ProjectsPanelProps {
  projects: LoadableState<ProjectSummary[]>;
  selectedId?: string;
  onSelect: (projectId: string) => void;
  /** Resolves once the project exists; a rejection's field issues are shown in the form. */
  onCreate: (values: ProjectCreateBody) => Promise<void>;
  /** Narrow pane beside a project's detail. */
  asPane?: boolean;
}

export function ProjectsPanel({ projects, selectedId, onSelect, onCreate, asPane }: ProjectsPanelProps) {
  const [creating, setCreating] = useState(false);
  const openForm = () => setCreating(true);
  return (
    <>
      <Screen
        testID="projects-panel"
        footer={<Button label="New project" icon="plus" onPress={openForm} block={!asPane} style={styles.grow} testID="new-project" />}
      >
        {!asPane ? (
          <View style={styles.intro}>
            <Text variant="display">Projects</Text>
            <Text tone="muted">Each project holds the sheets for one site or job.</Text>
          </View>
        ) : null}
        <Loadable state={projects} loadingLabel="Loading projects…" errorTitle="Could not load your projects" testID="projects">
          {(list) =>
            list.length === 0 ? (
              <EmptyState
                icon="folder-plus"
                title="No projects yet"
                message="Start one for a building, a service or a job. You can add sheets to it next."
                testID="projects-empty"
              />
            ) : (
              <Section title="Your projects" count={list.length}>
                <Card testID="project-list">
                  {list.map((project, index) => (
                    <ListRow
                      key={project.id}
                      first={index === 0}
                      title={project.name}
                      subtitle={project.description || undefined}
                      selected={project.id === selectedId}
                      onPress={() => onSelect(project.id)}
                      testID={`project-row-${project.id}`}
                      accessibilityLabel={`${project.name}, ${project.role}, ${plural(project.sheetCount, 'sheet')}`}
                      meta={
                        <View style={styles.meta}>
                          <RoleBadge role={project.role} />
                          <Count value={project.sheetCount} one="sheet" testID={`project-sheet-count-${project.id}`} />
                        </View>
                      }
                    />
                  ))}
                </Card>
              </Section>
            )
          }
        </Loadable>
      </Screen>
      <FormSheet visible={creating} title="New project" onClose={() => setCreating(false)} testID="new-project-sheet">
        <ProjectForm
          submitLabel="Create project"
          onSubmit={async (values) => {
            await onCreate(values);
            setCreating(false);
          }}
        />
      </FormSheet>
    </>
  );
}

const styles = StyleSheet.create({
  intro: { gap: space.xs, marginBottom: space.xs },
  meta: { alignItems: 'flex-end', gap: space.xs },
  grow: { flexGrow: 1, maxWidth: 420 },
});
