// A sheet's record: its name, its project, who made and last changed it, and when. The editor shows it in its
// sheet-details panel (embedded), beside the drawing.
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { SheetResponse } from '@/shared/api';
import { Screen } from '../layout/screen';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { formatDateTime } from '../ui/format';
import { Icon } from '../ui/icon';
import { RoleBadge } from '../ui/role-badge';
import { Text } from '../ui/text';

export interface SheetDetailProps {
  sheet: SheetResponse['sheet'];
  project: SheetResponse['project'];
  onOpenProject: () => void;
  /** Opens the sheet's revisions (issue, review, compare, restore, reports). */
  onOpenRevisions?: () => void;
  /** Inside another panel: no screen of its own. */
  embedded?: boolean;
}

function Fact({ label, value, mono, testID }: { label: string; value: string; mono?: boolean; testID?: string }) {
  return (
    <View style={styles.fact}>
      <Text variant="label" tone="muted" style={styles.factLabel}>
        {label}
      </Text>
      <Text variant={mono ? 'number' : 'body'} style={styles.factValue} testID={testID}>
        {value}
      </Text>
    </View>
  );
}

export function SheetDetail({ sheet, project, onOpenProject, onOpenRevisions, embedded }: SheetDetailProps) {
  const { color } = useTheme();
  const Frame = embedded ? EmbeddedFrame : Screen;
  return (
    <Frame testID="sheet-detail">
      <View style={styles.head}>
        <Pressable
          onPress={onOpenProject}
          accessibilityRole="link"
          style={styles.projectLink}
          testID="sheet-project-link"
        >
          <Icon name="folder" size={16} color={color.link} />
          <Text variant="label" style={{ color: color.link }}>
            {project.name}
          </Text>
        </Pressable>
        <Text variant="display" testID="sheet-name-heading">
          {sheet.name}
        </Text>
        <View style={styles.row}>
          <Text variant="small" tone="muted">
            Your role
          </Text>
          <RoleBadge role={project.role} />
        </View>
      </View>

      <Card style={styles.card} testID="sheet-facts">
        <Fact label="Made by" value={sheet.createdBy?.name ?? 'Unknown'} testID="sheet-created-by" />
        <Fact label="Made" value={formatDateTime(sheet.createdAt)} mono />
        <Fact label="Last changed by" value={sheet.updatedBy?.name ?? 'Unknown'} testID="sheet-updated-by" />
        <Fact label="Last changed" value={formatDateTime(sheet.updatedAt)} mono />
      </Card>
      {onOpenRevisions ? (
        <Button label="Revisions and reports" icon="layers" variant="secondary" onPress={onOpenRevisions} testID="open-revisions" />
      ) : null}
    </Frame>
  );
}

function EmbeddedFrame({ children, testID }: { children: ReactNode; testID?: string }) {
  return (
    <View testID={testID} style={styles.embedded}>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  head: { gap: space.sm },
  embedded: { gap: space.lg },
  projectLink: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: 44, alignSelf: 'flex-start' },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  card: { padding: space.lg, gap: space.md },
  fact: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, alignItems: 'baseline' },
  factLabel: { width: 140 },
  factValue: { flex: 1, minWidth: 160 },
});
