// The studies beside the drawing: the fault study (run in the study worker with progress and cancel; every bus
// against five fault types, the duty checks, the service markings) and the voltage profile of the base case
// beside the case on show. A phone gets cards; a wide screen a table. It renders and dispatches only.
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { RunSection, StudiesViewModel } from '@/editor/studies/studies-view';
import type { StudyTab } from '@/editor/studies/study-session';
import type { StudiesActions } from '@/editor/studies/use-studies-panel';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { DutyList, FaultStudyTable, ServiceMarkings } from './fault-study-table';
import { LoadingTable } from './loading-table';
import { ReadingsForm } from './readings-form';
import { SweepTable } from './sweep-table';
import { Chip, ChipRow } from './table-parts';
import { VoltageProfilePlot } from './voltage-profile-plot';

export interface StudiesPanelProps {
  layout: 'cards' | 'table';
  view: StudiesViewModel;
  actions: StudiesActions;
  /** The load or bus selected on the drawing (where a reading can be added). */
  selected: { id: string; name: string } | null;
  caution: string;
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
    ['loading', 'Loading'],
    ['sweep', 'Break sweep'],
    ['readings', 'Readings match'],
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

function Progress({ text, fraction, onCancel, testID }: { text: string; fraction: number; onCancel: () => void; testID: string }) {
  const { color } = useTheme();
  return (
    <View style={styles.progressRow} testID={testID}>
      <View style={styles.flex}>
        <Text variant="small">Running: {text}</Text>
        <View style={[styles.bar, { backgroundColor: color.raised }]} accessibilityRole="progressbar" accessibilityValue={{ min: 0, max: 100, now: Math.round(fraction * 100) }}>
          <View style={[styles.barFill, { width: `${Math.round(fraction * 100)}%`, backgroundColor: color.primary }]} />
        </View>
      </View>
      <Button label="Cancel" variant="secondary" compact onPress={onCancel} testID={`${testID}-cancel`} />
    </View>
  );
}

function RunNotes({ run, what }: { run: RunSection; what: string }) {
  const { color } = useTheme();
  return (
    <>
      {run.error ? (
        <View style={[styles.alert, { borderColor: color.danger, backgroundColor: color.dangerSoft }]} role="alert" testID={`${what}-error`}>
          <Text variant="label">The study could not run</Text>
          <Text variant="small">{run.error}</Text>
        </View>
      ) : null}
      {run.stale ? (
        <View style={[styles.note, { borderColor: color.focus }]} testID={`${what}-stale`}>
          <Icon name="refresh-cw" size={14} color={color.focus} />
          <Text variant="small" style={styles.flex}>
            The sheet changed since this study ran: run it again for current figures.
          </Text>
        </View>
      ) : null}
      {run.note ? (
        <Text variant="caption" tone="faint" testID={`${what}-note`}>
          {run.note}
        </Text>
      ) : null}
    </>
  );
}

function ShownCase({ text, onClear, testID }: { text: string; onClear: () => void; testID: string }) {
  const { color } = useTheme();
  return (
    <View style={[styles.note, { borderColor: color.primary }]} testID={testID}>
      <Icon name="map-pin" size={14} color={color.primary} />
      <Text variant="small" style={styles.flex}>
        On the drawing: {text} (a trial, not saved)
      </Text>
      <Button label="Base case" variant="quiet" compact onPress={onClear} testID={`${testID}-clear`} />
    </View>
  );
}

function FaultTab({ view, actions: a, layout }: StudiesPanelProps) {
  const f = view.fault;
  const shown = f.shownKey && f.view ? f.view.cases.find((c) => c.key === f.shownKey) : null;
  return (
    <View style={styles.gap}>
      <View style={styles.controls}>
        {f.running ? null : <Button label={f.view ? 'Run again' : 'Run the fault study'} icon="zap" onPress={a.onRunFaults} testID="fault-run" compact={layout === 'table'} />}
        <Chip label="Transformer impedance −7.5 % (maximum duty)" on={f.tolerance} onPress={() => a.onTolerance(!f.tolerance)} testID="fault-tolerance" />
      </View>
      {f.progress ? <Progress text={f.progress.text} fraction={f.progress.fraction} onCancel={() => a.onCancel('fault')} testID="fault-progress" /> : null}
      <RunNotes run={f} what="fault" />
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
          {shown ? <ShownCase text={`${shown.faultLabel} fault at ${shown.busName}, nameplate impedance`} onClear={a.onClearCase} testID="fault-shown" /> : null}
          <Section title="Interrupting ratings, failures first" testID="duty-section">
            <DutyList duties={f.view.duties} unlocated={f.view.unlocated} onShow={a.onShowDuty} />
          </Section>
          <Section title="Service markings (NEC 110.24)">
            <ServiceMarkings markings={f.view.markings} />
          </Section>
          <Section title="Every case" testID="case-section">
            <FaultStudyTable
              layout={layout}
              rows={f.rows}
              totalRows={f.view.cases.length}
              query={view.queries.fault}
              shownKey={f.shownKey}
              onSort={a.onFaultSort}
              onText={a.onFaultText}
              onToggle={a.onFaultToggle}
              onShow={a.onShowFault}
            />
          </Section>
          <Assumptions list={f.view.assumptions} />
        </>
      ) : null}
    </View>
  );
}

function Assumptions({ list }: { list: string[] }) {
  return (
    <Section title="Assumptions">
      {list.map((a, i) => (
        <Text key={i} variant="caption" tone="muted">
          • {a}
        </Text>
      ))}
    </Section>
  );
}

function SweepTab({ view, actions: a, layout }: StudiesPanelProps) {
  const w = view.sweep;
  const shown = w.shownKey && w.view ? w.view.rows.find((r) => r.key === w.shownKey) : null;
  return (
    <View style={styles.gap}>
      <View style={styles.controls}>
        {w.running ? null : <Button label={w.view ? 'Sweep again' : 'Run the break sweep'} icon="scissors" onPress={a.onRunSweep} testID="sweep-run" compact={layout === 'table'} />}
        <ChipRow label="Which conductors">
          <Chip label="Every conductor" on={w.conductors === 'all'} onPress={() => a.onSweepConductors('all')} testID="sweep-all" />
          <Chip label="Neutrals only" on={w.conductors === 'neutrals'} onPress={() => a.onSweepConductors('neutrals')} testID="sweep-neutrals" />
        </ChipRow>
      </View>
      {w.progress ? <Progress text={w.progress.text} fraction={w.progress.fraction} onCancel={() => a.onCancel('sweep')} testID="sweep-progress" /> : null}
      <RunNotes run={w} what="sweep" />
      {!w.view && !w.running ? (
        <Text variant="small" tone="muted">
          Opens each conductor of every run in turn (or each neutral) and ranks the openings by the worst over- and under-voltage any load sees against
          the standard.
        </Text>
      ) : null}
      {w.view ? (
        <>
          <Text variant="heading" testID="sweep-summary" tone={w.view.rows.some((r) => r.loadsOutside > 0) ? 'danger' : 'ink'}>
            {w.view.summary}
          </Text>
          <Text variant="caption" tone="muted">
            {w.view.base}
          </Text>
          {shown ? <ShownCase text={`${shown.conductor} of ${shown.runName} open`} onClear={a.onClearCase} testID="sweep-shown" /> : null}
          <SweepTable
            layout={layout}
            rows={w.rows}
            totalRows={w.view.rows.length}
            query={view.queries.sweep}
            shownKey={w.shownKey}
            onSort={a.onSweepSort}
            onText={a.onSweepText}
            onToggle={a.onSweepToggle}
            onShow={a.onShowOpening}
          />
          <Assumptions list={w.view.assumptions} />
        </>
      ) : null}
    </View>
  );
}

function ReadingsTab({ view, actions: a, selected, layout }: StudiesPanelProps) {
  const m = view.match;
  return (
    <View style={styles.gap}>
      {m.progress ? <Progress text={m.progress.text} fraction={m.progress.fraction} onCancel={() => a.onCancel('match')} testID="match-progress" /> : null}
      {m.shownDescription ? <ShownCase text={m.shownDescription} onClear={a.onClearCase} testID="match-shown" /> : null}
      <ReadingsForm
        layout={layout}
        readings={view.readings}
        selected={selected}
        match={m}
        onAddAt={a.onAddReadingAt}
        onAcross={a.onReadingAcross}
        onVolts={a.onReadingVolts}
        onRemove={a.onRemoveReading}
        onPaste={a.onPasteReadings}
        onRun={a.onRunMatch}
        onShowCandidate={a.onShowCandidate}
      />
      {m.result ? <Assumptions list={m.result.assumptions} /> : null}
    </View>
  );
}

export function StudiesPanel(p: StudiesPanelProps) {
  const tab = p.view.tab;
  return (
    <View style={styles.panel} testID="studies-panel">
      <View style={styles.top}>
        <Tabs tab={tab} onTab={p.actions.onTab} />
        {p.onClose ? <IconButton icon="x" label="Close the studies" onPress={p.onClose} testID="studies-close" /> : null}
      </View>
      {tab === 'faults' ? <FaultTab {...p} /> : null}
      {tab === 'sweep' ? <SweepTab {...p} /> : null}
      {tab === 'readings' ? <ReadingsTab {...p} /> : null}
      {tab === 'loading' ? (
        <LoadingTable
          layout={p.layout}
          loading={p.view.loading}
          query={p.view.queries.loading}
          onSort={p.actions.onLoadingSort}
          onText={p.actions.onLoadingText}
          onToggle={p.actions.onLoadingToggle}
          onShowRun={p.actions.onShowRun}
        />
      ) : null}
      {tab === 'profile' ? (
        <VoltageProfilePlot loads={p.view.profile.loads} shownLabel={p.view.profile.shownLabel} standard={p.view.profile.standard} order={p.view.profileOrder} onOrder={p.actions.onProfileOrder} />
      ) : null}
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
  tabs: { flexDirection: 'row', flexWrap: 'wrap', borderWidth: 1, borderRadius: radius.md, padding: 2, gap: 2, flexShrink: 1 },
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
