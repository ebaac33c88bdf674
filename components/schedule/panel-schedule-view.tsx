// A panel's schedule: the phase totals, their imbalance and the neutral current at the top, then the circuits as a
// table (wide) or as cards (phone), each with its breaker's loading; a row opens its form when the sheet is
// editable. Renders the schedule it is given and calls back; it computes nothing of its own.
import { useState, type ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import type { CircuitEdit } from '@/editor/schedule/circuit-edit';
import type { PanelSchedule, ScheduleRow } from '@/editor/schedule/panel-schedule';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text, type TextTone } from '../ui/text';
import { ChoiceField } from '../editor/choice-field';
import { CircuitForm } from './circuit-form';

export interface PanelScheduleViewProps {
  schedule: PanelSchedule | null;
  panels: { id: string; name: string }[];
  caseLabel: string;
  editable: boolean;
  isPhone: boolean;
  onChoosePanel: (busId: string) => void;
  onEditCircuit: (loadId: string, edit: CircuitEdit) => string | null;
  onImportCsv: () => void;
}

const fixed = (n: number, digits = 1) => (Number.isFinite(n) ? n.toFixed(digits) : '—');

/** The amount as entered: kW or A. */
const amountText = (r: ScheduleRow) => (r.givenAs === 'kw' ? `${fixed(r.kw, 2)} kW` : `${fixed(r.amperesGiven, 1)} A`);
const phasesText = (r: ScheduleRow) => (r.phases.length ? r.phases.join('–') : '—');

/**
 * Breaker loading's standing, with a mark as well as a tint: ▲ over its rating, △ at 80 % or more (the limit for a
 * continuous load in common practice, no source), none below.
 */
function loading(r: ScheduleRow): { text: string; short: string; rating: string; tone: TextTone; mark: string } {
  const b = r.breaker;
  if (!b) return { text: 'no breaker drawn', short: '—', rating: '—', tone: 'faint', mark: '' };
  const rating = b.ratingAmperes ? `${b.ratingAmperes} A` : 'no rating';
  if (b.percentOfRating === undefined) return { text: rating, short: '—', rating, tone: 'muted', mark: '' };
  const pct = b.percentOfRating;
  const text = `${fixed(b.amperes ?? 0)} A, ${fixed(pct, 0)} % of ${b.ratingAmperes} A`;
  const short = `${fixed(pct, 0)} %`;
  if (pct > 100) return { text, short, rating, tone: 'danger', mark: '▲ ' };
  if (pct >= 80) return { text, short, rating, tone: 'danger', mark: '△ ' };
  return { text, short, rating, tone: 'ink', mark: '' };
}

function Summary({ s }: { s: PanelSchedule }) {
  const { color } = useTheme();
  return (
    <View style={[styles.summary, { borderColor: color.line, backgroundColor: color.ground }]} testID="schedule-summary">
      <View style={styles.totals}>
        {s.phases.map((p) => (
          <View key={p} style={styles.total} testID={`schedule-total-${p}`}>
            <Text variant="caption" tone="muted">
              PHASE {p}
            </Text>
            <Text variant="numberLarge">{fixed(s.totals[p]!.kva, 2)} kVA</Text>
            <Text variant="number" tone="muted">
              {s.totals[p]!.amperes === null ? '— A' : `${fixed(s.totals[p]!.amperes!)} A`}
            </Text>
          </View>
        ))}
        {s.hasNeutral ? (
          <View style={styles.total} testID="schedule-neutral">
            <Text variant="caption" tone="muted">
              NEUTRAL
            </Text>
            <Text variant="numberLarge">{s.neutralAmperes === null ? '— A' : `${fixed(s.neutralAmperes)} A`}</Text>
            <Text variant="small" tone="muted">
              {s.feederNeutral ? `${fixed(s.feederNeutral.amperes)} A in ${s.feederNeutral.runName}` : 'from the circuits'}
            </Text>
          </View>
        ) : null}
      </View>
      <Text variant="small" testID="schedule-imbalance">
        {s.imbalancePercent === null
          ? 'Imbalance: one phase only'
          : `Imbalance between phases: ${fixed(s.imbalancePercent, 0)} % of the average by connected kVA${
              s.solvedImbalancePercent !== null ? `, ${fixed(s.solvedImbalancePercent, 0)} % by solved current` : ''
            }`}
      </Text>
      <Text variant="small" tone="muted">
        {`${s.rows.length} circuit${s.rows.length === 1 ? '' : 's'}, ${fixed(s.totalKva, 2)} kVA connected${s.ratingAmperes ? `; bus rated ${s.ratingAmperes} A` : ''}`}
      </Text>
      {s.notes.map((n) => (
        <Text key={n} variant="small" tone="danger">
          {n}
        </Text>
      ))}
    </View>
  );
}

const COLUMNS: { key: string; label: string; width: number; align?: 'right' }[] = [
  { key: 'circuit', label: 'Circuit', width: 60 },
  { key: 'description', label: 'Description · behaviour', width: 220 },
  { key: 'phases', label: 'Phases', width: 60 },
  { key: 'load', label: 'Load', width: 84, align: 'right' },
  { key: 'pf', label: 'PF', width: 48, align: 'right' },
  { key: 'solved', label: 'Drawn', width: 70, align: 'right' },
  { key: 'breaker', label: 'Breaker', width: 64, align: 'right' },
  { key: 'loading', label: 'Loading', width: 76, align: 'right' },
  { key: 'edit', label: '', width: 60 },
];
const W = Object.fromEntries(COLUMNS.map((c) => [c.key, c.width])) as Record<string, number>;

function Cell({ width, align, children }: { width: number; align?: 'right'; children: ReactNode }) {
  return <View style={[styles.cell, { width, alignItems: align === 'right' ? 'flex-end' : 'flex-start' }]}>{children}</View>;
}

function Table({ s, editable, editing, setEditing, onEditCircuit }: { s: PanelSchedule; editable: boolean; editing: string | null; setEditing: (id: string | null) => void; onEditCircuit: PanelScheduleViewProps['onEditCircuit'] }) {
  const { color } = useTheme();
  return (
    <ScrollView horizontal contentContainerStyle={styles.tableScroll}>
      <View role="table" testID="schedule-table">
        <View role="row" style={[styles.row, { borderBottomColor: color.lineStrong }]}>
          {COLUMNS.map((c) => (
            <Cell key={c.key} width={c.width} align={c.align}>
              <Text variant="caption" tone="muted" role="columnheader">
                {c.label.toUpperCase()}
              </Text>
            </Cell>
          ))}
        </View>
        {s.rows.map((r) => {
          const l = loading(r);
          return (
            <View key={r.loadId}>
              <View role="row" style={[styles.row, { borderBottomColor: color.line }]} testID={`schedule-row-${r.loadId}`}>
                <Cell width={W.circuit}>
                  <Text variant="number" tone={r.circuitGiven ? 'ink' : 'muted'}>
                    {r.circuit}
                  </Text>
                </Cell>
                <Cell width={W.description}>
                  <Text>{r.description}</Text>
                  <Text variant="small" tone="muted">
                    {r.behaviourLabel}
                  </Text>
                </Cell>
                <Cell width={W.phases}>
                  <Text variant="number">{phasesText(r)}</Text>
                </Cell>
                <Cell width={W.load} align="right">
                  <Text variant="number">{amountText(r)}</Text>
                </Cell>
                <Cell width={W.pf} align="right">
                  <Text variant="number">{fixed(r.powerFactor, 2)}</Text>
                </Cell>
                <Cell width={W.solved} align="right">
                  <Text variant="number">{r.solved ? `${fixed(r.solved.amperes)} A` : '—'}</Text>
                </Cell>
                <Cell width={W.breaker} align="right">
                  <Text variant="number" tone={r.breaker ? 'ink' : 'faint'}>
                    {l.rating}
                  </Text>
                </Cell>
                <Cell width={W.loading} align="right">
                  <Text variant="number" tone={l.tone} testID={`schedule-loading-${r.loadId}`} accessibilityLabel={l.text}>
                    {l.mark + l.short}
                  </Text>
                </Cell>
                <Cell width={W.edit}>
                  {editable ? <Button label="Edit" variant="quiet" compact onPress={() => setEditing(editing === r.loadId ? null : r.loadId)} testID={`schedule-edit-${r.loadId}`} /> : null}
                </Cell>
              </View>
              {editing === r.loadId ? (
                <View style={[styles.inlineForm, { borderColor: color.line }]}>
                  <CircuitForm row={r} phaseOptions={r.phaseOptions} onCancel={() => setEditing(null)} onSave={(e) => done(onEditCircuit(r.loadId, e), setEditing)} />
                </View>
              ) : null}
            </View>
          );
        })}
      </View>
    </ScrollView>
  );
}

function done(problem: string | null, setEditing: (id: string | null) => void): string | null {
  if (problem === null) setEditing(null);
  return problem;
}

function Cards({ s, editable, editing, setEditing, onEditCircuit }: { s: PanelSchedule; editable: boolean; editing: string | null; setEditing: (id: string | null) => void; onEditCircuit: PanelScheduleViewProps['onEditCircuit'] }) {
  const { color } = useTheme();
  return (
    <View style={styles.cards} testID="schedule-cards">
      {s.rows.map((r) => {
        const l = loading(r);
        return (
          <View key={r.loadId} style={[styles.card, { borderColor: color.line, backgroundColor: color.surface }]} testID={`schedule-row-${r.loadId}`}>
            <View style={styles.cardHead}>
              <Text variant="bodyStrong" style={styles.flex}>
                {r.circuit} · {r.description}
              </Text>
              {editable ? <Button label="Edit" variant="quiet" compact onPress={() => setEditing(editing === r.loadId ? null : r.loadId)} testID={`schedule-edit-${r.loadId}`} /> : null}
            </View>
            <Text variant="number">
              {phasesText(r)} · {amountText(r)} · pf {fixed(r.powerFactor, 2)}
              {r.solved ? ` · ${fixed(r.solved.amperes)} A` : ''}
            </Text>
            <Text variant="small" tone="muted">
              {r.behaviourLabel}
            </Text>
            <Text variant="number" tone={l.tone} testID={`schedule-loading-${r.loadId}`}>
              {r.breaker ? `Breaker: ${l.mark}${l.text}` : l.text}
            </Text>
            {editing === r.loadId ? <CircuitForm row={r} phaseOptions={r.phaseOptions} onCancel={() => setEditing(null)} onSave={(e) => done(onEditCircuit(r.loadId, e), setEditing)} /> : null}
          </View>
        );
      })}
    </View>
  );
}

export function PanelScheduleView(p: PanelScheduleViewProps) {
  const [editing, setEditing] = useState<string | null>(null);
  const s = p.schedule;
  return (
    <View style={styles.root} testID="panel-schedule">
      {p.panels.length > 1 ? (
        <ChoiceField label="Panel" value={s?.busId ?? ''} options={p.panels.map((b) => ({ value: b.id, label: b.name }))} onChange={p.onChoosePanel} testID="schedule-panel" />
      ) : null}
      {!s ? (
        <Text tone="muted">Choose a panel to see its schedule.</Text>
      ) : (
        <>
          <View style={styles.headLine}>
            <Text variant="heading" style={styles.flex} testID="schedule-title">
              {s.name}
            </Text>
            {p.editable ? <Button label="Import CSV" icon="upload" variant="secondary" compact onPress={p.onImportCsv} testID="schedule-import-csv" /> : null}
          </View>
          <Text variant="small" tone="muted">
            Currents for: {p.caseLabel}. Load as entered; “Drawn” is the solved current of the circuit.
          </Text>
          <Summary s={s} />
          {s.rows.length === 0 ? (
            <Text tone="muted" testID="schedule-empty">
              No circuits on this panel yet: connect loads to its bars, or import a schedule from CSV.
            </Text>
          ) : p.isPhone ? (
            <Cards s={s} editable={p.editable} editing={editing} setEditing={setEditing} onEditCircuit={p.onEditCircuit} />
          ) : (
            <Table s={s} editable={p.editable} editing={editing} setEditing={setEditing} onEditCircuit={p.onEditCircuit} />
          )}
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { gap: space.md },
  flex: { flex: 1 },
  headLine: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  summary: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.sm },
  totals: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  total: { minWidth: 96, gap: space.xxs },
  tableScroll: { flexGrow: 1 },
  row: { flexDirection: 'row', alignItems: 'center', borderBottomWidth: 1, minHeight: 40 },
  cell: { paddingHorizontal: space.xs, paddingVertical: space.xs, justifyContent: 'center' },
  inlineForm: { borderBottomWidth: 1, paddingHorizontal: space.sm, maxWidth: 720 },
  cards: { gap: space.sm },
  card: { borderWidth: 1, borderRadius: radius.md, padding: space.md, gap: space.xs },
  cardHead: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
