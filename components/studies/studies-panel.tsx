// The studies beside the drawing: the fault study (run in the study worker with progress and cancel; every bus
// against five fault types, the duty checks, the service markings) and the voltage profile of the base case
// beside the case on show. A phone gets cards; a wide screen a table. It renders and dispatches only.
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { FaultCaseColumn, FaultCaseRow, DutyRow } from '@/editor/studies/fault-study-rows';
import type { FaultSection, ProfileSection } from '@/editor/studies/studies-view';
import type { StudyTab } from '@/editor/studies/study-session';
import type { TableQuery } from '@/editor/studies/table-query';
import type { ProfileOrder } from '@/editor/studies/voltage-profile';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { DutyList, FaultStudyTable, ServiceMarkings } from './fault-study-table';
import { Chip } from './table-parts';
import { VoltageProfilePlot } from './voltage-profile-plot';

export interface StudiesPanelProps {
  layout: 'cards' | 'table';
  tab: StudyTab;
  fault: FaultSection;
  query: TableQuery<FaultCaseColumn>;
  profile: ProfileSection;
  profileOrder: ProfileOrder;
  caution: string;
  onTab: (tab: StudyTab) => void;
  onRun: () => void;
  onCancel: () => void;
  onTolerance: (on: boolean) => void;
  onSort: (column: FaultCaseColumn) => void;
  onText: (text: string) => void;
  onToggle: (column: 'faultType' | 'status', value: string) => void;
  onShowCase: (row: FaultCaseRow) => void;
  onShowDuty: (duty: DutyRow) => void;
  onClearCase: () => void;
  onProfileOrder: (order: ProfileOrder) => void;
  /** Wide screens: the pane's close button (a phone's sliding panel has its own). */
  onClose?: () => void;
}

function Section({ title, children, testID }: { title: string; children: ReactNode; testID?: string }) {
  return (
    <View style={styles.section} testID={testID}>
      <Text variant="caption" tone="muted" style={styles.sectionTitle}>
        {title.toUpperCase()}
      </Text>
      {children}
    </View>
  );
}

function Tabs({ tab, onTab }: { tab: StudyTab; onTab: (t: StudyTab) => void }) {
  const { color } = useTheme();
  const tabs: [StudyTab, string][] = [
    ['faults', 'Fault currents'],
    ['profile', 'Voltage profile'],
  ];
  return (
    <View style={[styles.tabs, { borderColor: color.line }]} accessibilityRole="tablist">
      {tabs.map(([t, label]) => {
        const on = t === tab;
        return (
          <Pressable
            key={t}
            onPress={() => onTab(t)}
            accessibilityRole="tab"
            accessibilityState={{ selected: on }}
            testID={`study-tab-${t}`}
            style={({ pressed }) => [styles.tab, { backgroundColor: on ? color.primary : pressed ? color.raised : 'transparent' }]}
          >
            <Text variant="label" tone={on ? 'onPrimary' : 'ink'}>
              {label}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

function Progress({ text, fraction, onCancel }: { text: string; fraction: number; onCancel: () => void }) {
  const { color } = useTheme();
  return (
    <View style={styles.progressRow} testID="fault-progress">
      <View style={styles.flex}>
        <Text variant="small">Running the fault study: {text}</Text>
        <View style={[styles.bar, { backgroundColor: color.raised }]} accessibilityRole="progressbar" accessibilityValue={{ min: 0, max: 100, now: Math.round(fraction * 100) }}>
          <View style={[styles.barFill, { width: `${Math.round(fraction * 100)}%`, backgroundColor: color.primary }]} />
        </View>
      </View>
      <Button label="Cancel" variant="secondary" compact onPress={onCancel} testID="fault-cancel" />
    </View>
  );
}

function FaultTab(p: StudiesPanelProps) {
  const { color } = useTheme();
  const f = p.fault;
  const shown = f.shownKey && f.view ? f.view.cases.find((c) => c.key === f.shownKey) : null;
  return (
    <View style={styles.gap}>
      <View style={styles.controls}>
        {f.running ? null : <Button label={f.view ? 'Run again' : 'Run the fault study'} icon="zap" onPress={p.onRun} testID="fault-run" compact={p.layout === 'table'} />}
        <Chip label="Transformer impedance −7.5 % (maximum duty)" on={f.tolerance} onPress={() => p.onTolerance(!f.tolerance)} testID="fault-tolerance" />
      </View>
      {f.progress ? <Progress text={f.progress.text} fraction={f.progress.fraction} onCancel={p.onCancel} /> : null}
      {f.error ? (
        <View style={[styles.alert, { borderColor: color.danger, backgroundColor: color.dangerSoft }]} role="alert" testID="fault-error">
          <Text variant="label">The fault study could not run</Text>
          <Text variant="small">{f.error}</Text>
        </View>
      ) : null}
      {f.stale && f.view ? (
        <View style={[styles.note, { borderColor: color.focus }]} testID="fault-stale">
          <Icon name="refresh-cw" size={14} color={color.focus} />
          <Text variant="small" style={styles.flex}>
            The sheet changed since this study ran: run it again for current figures.
          </Text>
        </View>
      ) : null}
      {f.note ? (
        <Text variant="caption" tone="faint" testID="fault-note">
          {f.note}
        </Text>
      ) : null}
      {!f.view && !f.running ? (
        <Text variant="small" tone="muted">
          Every bus against five fault types (three-phase, line to ground, line to line, double line to ground, line to neutral), each breaker's and
          bus's interrupting rating checked against the fault at its location, and the available fault current of each service.
        </Text>
      ) : null}
      {f.view ? (
        <>
          <Text variant="heading" testID="fault-summary" tone={f.view.duties.some((d) => d.status === 'fails') ? 'danger' : 'ink'}>
            {f.view.summary}
          </Text>
          {shown ? (
            <View style={[styles.note, { borderColor: color.primary }]} testID="fault-shown">
              <Icon name="map-pin" size={14} color={color.primary} />
              <Text variant="small" style={styles.flex}>
                On the drawing: {shown.faultLabel} fault at {shown.busName} (a trial at nameplate impedance, not saved)
              </Text>
              <Button label="Base case" variant="quiet" compact onPress={p.onClearCase} testID="fault-clear-case" />
            </View>
          ) : null}
          <Section title="Interrupting ratings, failures first" testID="duty-section">
            <DutyList duties={f.view.duties} unlocated={f.view.unlocated} onShow={p.onShowDuty} />
          </Section>
          <Section title="Service markings (NEC 110.24)">
            <ServiceMarkings markings={f.view.markings} />
          </Section>
          <Section title="Every case" testID="case-section">
            <FaultStudyTable
              layout={p.layout}
              rows={f.rows}
              totalRows={f.view.cases.length}
              query={p.query}
              shownKey={f.shownKey}
              onSort={p.onSort}
              onText={p.onText}
              onToggle={p.onToggle}
              onShow={p.onShowCase}
            />
          </Section>
          <Section title="Assumptions">
            {f.view.assumptions.map((a, i) => (
              <Text key={i} variant="caption" tone="muted">
                • {a}
              </Text>
            ))}
          </Section>
        </>
      ) : null}
    </View>
  );
}

export function StudiesPanel(p: StudiesPanelProps) {
  return (
    <View style={styles.panel} testID="studies-panel">
      <View style={styles.top}>
        <Tabs tab={p.tab} onTab={p.onTab} />
        {p.onClose ? <IconButton icon="x" label="Close the studies" onPress={p.onClose} testID="studies-close" /> : null}
      </View>
      {p.tab === 'faults' ? (
        <FaultTab {...p} />
      ) : (
        <VoltageProfilePlot loads={p.profile.loads} shownLabel={p.profile.shownLabel} standard={p.profile.standard} order={p.profileOrder} onOrder={p.onProfileOrder} />
      )}
      <Text variant="caption" tone="muted" testID="studies-caution">
        {p.caution}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.md },
  top: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  gap: { gap: space.md },
  flex: { flex: 1 },
  tabs: { flexDirection: 'row', borderWidth: 1, borderRadius: radius.md, padding: 2, gap: 2, alignSelf: 'flex-start' },
  tab: { minHeight: 36, paddingHorizontal: space.md, borderRadius: radius.sm, justifyContent: 'center' },
  controls: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  progressRow: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: touchTargetMin },
  bar: { height: 6, borderRadius: 3, overflow: 'hidden', marginTop: space.xs },
  barFill: { height: 6 },
  alert: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xs },
  note: { flexDirection: 'row', alignItems: 'center', gap: space.sm, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.sm, paddingVertical: space.xs },
  section: { gap: space.sm },
  sectionTitle: { letterSpacing: 0.8 },
});
