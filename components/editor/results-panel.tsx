// Results beside the drawing: the case on show (base case, each what-if, a trial), how the solve went or where it
// failed, hazards, each load's voltage, a bus's phasor diagram, and a what-if's differences from the base case
// side by side.
import { memo, type ReactNode } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { PhasorView } from '@/editor/results/phasor-view';
import { formatAmperes, formatVolts, type TagStanding } from '@/editor/results/value-tags';
import { radius, space, standingLook, touchTargetMin, type PhaseConvention } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button, IconButton } from '../ui/button';
import { Icon } from '../ui/icon';
import { Text } from '../ui/text';
import { PhasorDiagram } from './phasor-diagram';

export interface CaseItem {
  id: string | null;
  name: string;
  changes: number;
}

export interface DifferenceItem {
  key: string;
  name: string;
  label: string;
  unit: 'V' | 'A';
  base: number | null;
  whatIf: number | null;
  change: number | null;
}

export interface LoadItem {
  key: string;
  name: string;
  label: string;
  volts: number;
  standing: TagStanding;
  note?: string;
}

export interface ResultsPanelProps {
  editable: boolean;
  cases: CaseItem[];
  shownCase: string | null;
  shownChanges: { id: string; text: string }[];
  trial: string[];
  solve: { ms: number | null; where: string | null; place: string };
  failure: { message: string; elementIds: string[] } | null;
  invalid: string[];
  warnings: string[];
  loads: LoadItem[];
  /** Loads not listed (the list shows the worst first). */
  moreLoads: number;
  differences: DifferenceItem[] | null;
  phasor: { busName: string; view: PhasorView } | null;
  convention: PhaseConvention;
  onShowCase: (id: string | null) => void;
  onAddWhatIf: () => void;
  onRemoveWhatIf: (id: string) => void;
  onRemoveChange: (changeId: string) => void;
  onRemoveTrial: (index: number) => void;
  onClearTrial: () => void;
  onKeepTrial: () => void;
  onShowFailure: (ids: string[]) => void;
  onClosePhasor: () => void;
}

function Block({ title, children, testID, action }: { title: string; children: ReactNode; testID?: string; action?: ReactNode }) {
  return (
    <View style={styles.block} testID={testID}>
      <View style={styles.blockHead}>
        <Text variant="caption" tone="muted" style={styles.blockTitle}>
          {title.toUpperCase()}
        </Text>
        {action}
      </View>
      {children}
    </View>
  );
}

const sign = (v: number, unit: 'V' | 'A') => `${v > 0 ? '+' : v < 0 ? '−' : ''}${unit === 'V' ? formatVolts(Math.abs(v)) : formatAmperes(Math.abs(v))}`;
const figure = (v: number | null, unit: 'V' | 'A') => (v === null ? 'dead' : unit === 'V' ? formatVolts(v) : formatAmperes(v));

// One row per load, redrawn only when its own figures change (an edit re-renders the panel, not every row).
const LoadRow = memo(function LoadRow({ rowKey, name, label, volts, standing, looks }: { rowKey: string; name: string; label: string; volts: number; standing: TagStanding; looks: (typeof standingLook)['light'] }) {
  return (
    <View style={styles.tableRow} testID={`load-row-${rowKey}`}>
      <Text variant="small" style={styles.colName} numberOfLines={2}>
        {name} {label}
      </Text>
      <View style={[styles.pill, { backgroundColor: looks[standing].fill, borderColor: looks[standing].stroke }]}>
        <Text variant="number" style={{ color: looks[standing].text }}>
          {formatVolts(volts)} V
        </Text>
      </View>
    </View>
  );
});

export function ResultsPanel(p: ResultsPanelProps) {
  const theme = useTheme();
  const looks = standingLook[theme.scheme];
  return (
    <View style={styles.panel} testID="results-panel">
      {/* First: it is what a tap on a bus asked for. */}
      {p.phasor ? (
        <Block title="Phasor diagram" testID="phasor-block" action={<IconButton icon="x" label="Close the phasor diagram" onPress={p.onClosePhasor} />}>
          {/* Small enough to show whole, figures included, in a phone's sliding panel. */}
          <PhasorDiagram busName={p.phasor.busName} view={p.phasor.view} convention={p.convention} size={180} />
        </Block>
      ) : null}
      <Block
        title="Case on show"
        testID="case-list"
        action={p.editable ? <Button label="New what-if" icon="plus" variant="quiet" compact onPress={p.onAddWhatIf} testID="add-what-if" /> : null}
      >
        <View style={styles.cases}>
          {p.cases.map((c) => {
            const on = c.id === p.shownCase;
            return (
              <View key={c.id ?? 'base'} style={styles.caseRow}>
                <Pressable
                  onPress={() => p.onShowCase(c.id)}
                  accessibilityRole="radio"
                  accessibilityState={{ checked: on }}
                  testID={c.id ? `case-${c.id}` : 'case-base'}
                  style={({ pressed }) => [styles.case, { borderColor: on ? theme.color.primary : theme.color.line, backgroundColor: on ? theme.color.raised : pressed ? theme.color.raised : theme.color.surface }]}
                >
                  <Icon name={on ? 'check-circle' : 'circle'} size={16} color={on ? theme.color.primary : theme.color.inkFaint} />
                  <Text variant="small" style={styles.caseName} numberOfLines={2}>
                    {c.name}
                  </Text>
                  {c.id ? (
                    <Text variant="caption" tone="muted">
                      {c.changes} {c.changes === 1 ? 'change' : 'changes'}
                    </Text>
                  ) : null}
                </Pressable>
                {c.id && p.editable ? <IconButton icon="trash-2" label={`Remove ${c.name}`} onPress={() => p.onRemoveWhatIf(c.id!)} testID={`remove-case-${c.id}`} /> : null}
              </View>
            );
          })}
        </View>
        {p.shownChanges.map((c) => (
          <View key={c.id} style={styles.changeRow}>
            <Text variant="small" style={styles.flex}>
              {c.text}
            </Text>
            {p.editable ? <IconButton icon="x" label={`Remove: ${c.text}`} onPress={() => p.onRemoveChange(c.id)} /> : null}
          </View>
        ))}
        {p.trial.length ? (
          <View style={[styles.trial, { borderColor: theme.color.focus }]} testID="trial-layer">
            <Text variant="label">Trial here only, not saved</Text>
            {p.trial.map((t, i) => (
              <View key={i} style={styles.changeRow}>
                <Text variant="small" style={styles.flex}>
                  {t}
                </Text>
                <IconButton icon="x" label={`Remove: ${t}`} onPress={() => p.onRemoveTrial(i)} />
              </View>
            ))}
            <View style={styles.actions}>
              <Button label="Clear the trial" variant="secondary" compact onPress={p.onClearTrial} testID="clear-trial" />
              {p.editable ? <Button label="Keep as a what-if" variant="secondary" compact onPress={p.onKeepTrial} testID="keep-trial" /> : null}
            </View>
          </View>
        ) : null}
      </Block>

      <Text variant="caption" tone="faint" testID="solve-status">
        {p.solve.ms === null ? 'Solving…' : `Solved in ${p.solve.ms.toFixed(0)} ms on the ${p.solve.where === 'worker' ? 'worker' : 'page'}`} · large sheets solve on the worker (now: {p.solve.place})
      </Text>

      {p.failure ? (
        <View style={[styles.alert, { borderColor: theme.color.danger, backgroundColor: theme.color.dangerSoft }]} role="alert" testID="solve-failure">
          <Text variant="label">The sheet could not be solved</Text>
          <Text variant="small">{p.failure.message}</Text>
          {p.failure.elementIds.length ? <Button label="Show where" variant="secondary" compact onPress={() => p.onShowFailure(p.failure!.elementIds)} testID="show-failure" /> : null}
        </View>
      ) : null}
      {p.invalid.length ? (
        <Block title="Left out until fixed" testID="invalid-list">
          {p.invalid.map((m, i) => (
            <Text key={i} variant="small" tone="danger">
              {m}
            </Text>
          ))}
        </Block>
      ) : null}
      {p.warnings.length ? (
        <Block title="Hazards and notes" testID="warning-list">
          {p.warnings.map((w, i) => (
            <View key={i} style={styles.changeRow}>
              <Icon name="alert-triangle" size={16} color={theme.color.focus} />
              <Text variant="small" style={styles.flex}>
                {w}
              </Text>
            </View>
          ))}
        </Block>
      ) : null}

      {p.differences ? (
        <Block title="Against the base case" testID="differences">
          <View style={[styles.tableRow, styles.tableHead, { borderBottomColor: theme.color.line }]}>
            <Text variant="caption" tone="muted" style={styles.colName}>
              Where
            </Text>
            <Text variant="caption" tone="muted" style={styles.colNum}>
              Base
            </Text>
            <Text variant="caption" tone="muted" style={styles.colNum}>
              What-if
            </Text>
            <Text variant="caption" tone="muted" style={styles.colNum}>
              Change
            </Text>
          </View>
          {p.differences.slice(0, 40).map((d) => (
            <View key={d.key} style={styles.tableRow} testID={`diff-${d.key}`}>
              <Text variant="small" style={styles.colName} numberOfLines={2}>
                {d.name} {d.label}
              </Text>
              <Text variant="number" style={styles.colNum}>
                {figure(d.base, d.unit)}
              </Text>
              <Text variant="number" style={styles.colNum}>
                {figure(d.whatIf, d.unit)}
              </Text>
              <Text variant="number" style={styles.colNum}>
                {d.change === null ? '—' : `${sign(d.change, d.unit)} ${d.unit}`}
              </Text>
            </View>
          ))}
        </Block>
      ) : null}

      <Block title="Voltage at the loads, worst first" testID="load-list">
        {p.loads.length === 0 ? (
          <Text variant="small" tone="muted">
            No live loads yet.
          </Text>
        ) : (
          p.loads.map((l) => <LoadRow key={l.key} rowKey={l.key} name={l.name} label={l.label} volts={l.volts} standing={l.standing} looks={looks} />)
        )}
        {p.moreLoads > 0 ? (
          <Text variant="small" tone="muted">
            and {p.moreLoads} more, all shown on the drawing
          </Text>
        ) : null}
      </Block>
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { gap: space.lg },
  block: { gap: space.sm },
  blockHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', minHeight: 28 },
  blockTitle: { letterSpacing: 0.8 },
  cases: { gap: space.xs },
  caseRow: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  case: { flex: 1, minHeight: touchTargetMin, flexDirection: 'row', alignItems: 'center', gap: space.sm, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.md },
  caseName: { flex: 1 },
  changeRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 32 },
  flex: { flex: 1 },
  trial: { borderWidth: 1, borderStyle: 'dashed', borderRadius: radius.md, padding: space.sm, gap: space.xs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  alert: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xs },
  tableRow: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 30 },
  tableHead: { borderBottomWidth: 1 },
  colName: { flex: 1 },
  colNum: { width: 72, textAlign: 'right' },
  pill: { borderWidth: 1, borderRadius: radius.pill, paddingHorizontal: space.sm },
});
