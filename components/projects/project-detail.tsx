// One project: its sheets (open, new, rename, delete, and for owners share), its members and, for owners, the
// invitations, the membership record, renaming and deleting the project. Viewers see no controls that change
// anything. Everyone gets their own pin e-mail switch at the foot.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { MemberSummary, ProjectCreateBody, ProjectSummary, SheetCreateBody, SheetSummary } from '@/shared/api';
import { can } from '@/shared/roles';
import { ProjectForm } from '../forms/project-form';
import { ShareSheet } from '../links/share-sheet';
import { MembersSection } from '../members/members-section';
import { OwnerMembership } from '../members/owner-membership';
import { PinEmailsSwitch } from '../members/pin-emails-switch';
import { SheetNameForm } from '../forms/sheet-name-form';
import { Screen } from '../layout/screen';
import { useResponsive } from '../layout/use-responsive';
import { space } from '../theme/tokens';
import { Button, IconButton } from '../ui/button';
import { Card, ListRow, Section } from '../ui/card';
import { Count } from '../ui/count';
import { ConfirmDialog } from '../ui/confirm-dialog';
import { errorMessage, formatDateTime, plural } from '../ui/format';
import { FormSheet } from '../ui/form-sheet';
import { Loadable, type LoadableState } from '../ui/loadable';
import { RoleBadge } from '../ui/role-badge';
import { EmptyState } from '../ui/states';
import { Text } from '../ui/text';

export interface ProjectDetailProps {
  project: ProjectSummary;
  sheets: LoadableState<SheetSummary[]>;
  members: LoadableState<MemberSummary[]>;
  onOpenSheet: (sheetId: string) => void;
  onCreateSheet: (values: SheetCreateBody) => Promise<void>;
  onRenameSheet: (sheetId: string, values: SheetCreateBody) => Promise<void>;
  onDeleteSheet: (sheetId: string) => Promise<void>;
  onUpdateProject: (values: ProjectCreateBody) => Promise<void>;
  onDeleteProject: () => Promise<void>;
}

type Dialog =
  | { kind: 'none' }
  | { kind: 'new-sheet' }
  | { kind: 'rename-sheet'; sheet: SheetSummary }
  | { kind: 'delete-sheet'; sheet: SheetSummary }
  | { kind: 'share-sheet'; sheet: SheetSummary }
  | { kind: 'edit-project' }
  | { kind: 'delete-project' };

export function ProjectDetail(props: ProjectDetailProps) {
  const { project, sheets, members } = props;
  const [dialog, setDialog] = useState<Dialog>({ kind: 'none' });
  const [busy, setBusy] = useState(false);
  const [confirmError, setConfirmError] = useState<string | null>(null);
  const close = () => {
    setDialog({ kind: 'none' });
    setConfirmError(null);
  };
  const { isPhone } = useResponsive();
  const mayEditSheets = can.editSheet(project.role);
  const isOwner = can.deleteProject(project.role);

  const confirm = async (action: () => Promise<void>) => {
    setBusy(true);
    setConfirmError(null);
    try {
      await action();
      close();
    } catch (error) {
      setConfirmError(errorMessage(error));
    } finally {
      setBusy(false);
    }
  };

  return (
    <>
      <Screen
        testID="project-detail"
        footer={
          can.createSheet(project.role) ? (
            <Button
              label="New sheet"
              icon="plus"
              onPress={() => setDialog({ kind: 'new-sheet' })}
              style={styles.grow}
              testID="new-sheet"
            />
          ) : undefined
        }
      >
        <View style={styles.head}>
          <Text variant="display" testID="project-name-heading">
            {project.name}
          </Text>
          {project.description ? <Text tone="muted">{project.description}</Text> : null}
          <View style={styles.facts}>
            <RoleBadge role={project.role} testID="project-role" />
            <Count value={project.sheetCount} one="sheet" />
            <Text variant="small" tone="faint">
              Changed {formatDateTime(project.updatedAt)}
            </Text>
          </View>
          {project.role === 'viewer' ? (
            <Text variant="small" tone="muted" testID="viewer-note">
              You can look at this project. Ask an owner if you need to change it.
            </Text>
          ) : null}
        </View>

        <Loadable state={sheets} loadingLabel="Loading sheets…" errorTitle="Could not load the sheets" testID="sheets">
          {(list) => (
            <Section title="Sheets" count={list.length}>
              {list.length === 0 ? (
                <Card>
                  <EmptyState
                    icon="file-plus"
                    title="No sheets yet"
                    message={
                      mayEditSheets
                        ? 'A sheet is one diagram: a service, a panel, a feeder. Add the first one.'
                        : 'Nobody has added a sheet to this project yet.'
                    }
                    testID="sheets-empty"
                  />
                </Card>
              ) : (
                <Card testID="sheet-list">
                  {list.map((sheet, index) => (
                    <ListRow
                      key={sheet.id}
                      first={index === 0}
                      title={sheet.name}
                      subtitle={`Changed ${formatDateTime(sheet.updatedAt)}${sheet.updatedBy ? ` by ${sheet.updatedBy.name}` : ''}`}
                      onPress={() => props.onOpenSheet(sheet.id)}
                      testID={`sheet-row-${sheet.id}`}
                      accessibilityLabel={`Open sheet ${sheet.name}`}
                      actions={
                        mayEditSheets ? (
                          <>
                            {isOwner ? (
                              <IconButton
                                icon="share-2"
                                label={`Share ${sheet.name}`}
                                onPress={() => setDialog({ kind: 'share-sheet', sheet })}
                                testID={`share-sheet-${sheet.id}`}
                              />
                            ) : null}
                            <IconButton
                              icon="edit-2"
                              label={`Rename ${sheet.name}`}
                              onPress={() => setDialog({ kind: 'rename-sheet', sheet })}
                              testID={`rename-sheet-${sheet.id}`}
                            />
                            <IconButton
                              icon="trash-2"
                              tone="danger"
                              label={`Delete ${sheet.name}`}
                              onPress={() => setDialog({ kind: 'delete-sheet', sheet })}
                              testID={`delete-sheet-${sheet.id}`}
                            />
                          </>
                        ) : undefined
                      }
                    />
                  ))}
                </Card>
              )}
            </Section>
          )}
        </Loadable>

        <MembersSection projectId={project.id} members={members} manage={isOwner} />

        {isOwner ? <OwnerMembership projectId={project.id} /> : null}

        {isOwner ? (
          <Section title="Owner">
            <Card style={[styles.ownerCard, !isPhone && styles.ownerCardWide]}>
              <Button
                label="Edit name and description"
                icon="edit-2"
                variant="secondary"
                onPress={() => setDialog({ kind: 'edit-project' })}
                testID="edit-project"
              />
              <Button
                label="Delete project"
                icon="trash-2"
                variant="danger"
                onPress={() => setDialog({ kind: 'delete-project' })}
                testID="delete-project"
              />
            </Card>
          </Section>
        ) : null}

        <Section title="Your settings">
          <PinEmailsSwitch />
        </Section>
      </Screen>

      <ShareSheet sheet={dialog.kind === 'share-sheet' ? dialog.sheet : null} onClose={close} />

      <FormSheet visible={dialog.kind === 'new-sheet'} title="New sheet" onClose={close} testID="new-sheet-sheet">
        <SheetNameForm
          submitLabel="Add sheet"
          onSubmit={async (values) => {
            await props.onCreateSheet(values);
            close();
          }}
        />
      </FormSheet>

      <FormSheet visible={dialog.kind === 'rename-sheet'} title="Rename sheet" onClose={close} testID="rename-sheet-sheet">
        {dialog.kind === 'rename-sheet' ? (
          <SheetNameForm
            key={dialog.sheet.id}
            defaultName={dialog.sheet.name}
            submitLabel="Save name"
            onSubmit={async (values) => {
              await props.onRenameSheet(dialog.sheet.id, values);
              close();
            }}
          />
        ) : null}
      </FormSheet>

      <FormSheet visible={dialog.kind === 'edit-project'} title="Edit project" onClose={close} testID="edit-project-sheet">
        {dialog.kind === 'edit-project' ? (
          <ProjectForm
            defaultValues={{ name: project.name, description: project.description }}
            submitLabel="Save"
            onSubmit={async (values) => {
              await props.onUpdateProject(values);
              close();
            }}
          />
        ) : null}
      </FormSheet>

      <ConfirmDialog
        visible={dialog.kind === 'delete-sheet'}
        title="Delete this sheet?"
        message={
          dialog.kind === 'delete-sheet'
            ? `"${dialog.sheet.name}" and its drawing go for good. This cannot be undone.`
            : ''
        }
        confirmLabel="Delete sheet"
        danger
        busy={busy}
        error={confirmError}
        onCancel={close}
        onConfirm={() => dialog.kind === 'delete-sheet' && confirm(() => props.onDeleteSheet(dialog.sheet.id))}
        testID="delete-sheet-dialog"
      />

      <ConfirmDialog
        visible={dialog.kind === 'delete-project'}
        title="Delete this project?"
        message={`"${project.name}", its ${plural(project.sheetCount, 'sheet')} and its member list go for good. This cannot be undone.`}
        confirmLabel="Delete project"
        danger
        busy={busy}
        error={confirmError}
        onCancel={close}
        onConfirm={() => confirm(props.onDeleteProject)}
        testID="delete-project-dialog"
      />
    </>
  );
}

const styles = StyleSheet.create({
  head: { gap: space.sm },
  facts: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  ownerCard: { padding: space.lg, gap: space.md },
  ownerCardWide: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'flex-start' },
  grow: { flexGrow: 1, maxWidth: 420 },
});
