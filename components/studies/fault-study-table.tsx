// The fault study's cases: a card per case on a phone, a table on a wide screen; both sort and filter the same
// way and a tap shows that fault on the drawing. Then the duty checks (failures first) and the service markings.
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { SHUNT_FAULT_TYPES } from '@/shared/sheet';
import { FAULT_TYPE_LABEL, FAULT_TYPE_SHORT } from '@/editor/studies/fault-labels';
import {
  CASE_STATUS_LABEL,
  CASE_STATUS_STANDING,
  DUTY_STATUS_LABEL,
  DUTY_STATUS_STANDING,
  formatKa,
  formatMargin,
  type CaseStatus,
  type DutyRow,
  type FaultCaseColumn,
  type FaultCaseRow,
  type FaultStudyView,
  type MarkingRow,
} from '@/editor/studies/fault-study-rows';
import type { TableQuery } from '@/editor/studies/table-query';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { StandingBadge } from './standing-badge';
import { Chip, ChipRow, MoreRows, SortHead } from './table-parts';

const PAGE = 60;
const STATUSES: CaseStatus[] = ['fails', 'x-over-r-above-test', 'passes', 'no-rating'];

export interface FaultStudyTableProps {
  layout: 'cards' | 'table';
  rows: FaultCaseRow[];
  totalRows: number;
  query: TableQuery<FaultCaseColumn>;
  shownKey: string | null;
  onSort: (column: FaultCaseColumn) => void;
  onText: (text: string) => void;
  onToggle: (column: 'faultType' | 'status', value: string) => void;
  onShow: (row: FaultCaseRow) => void;
}

export function FaultCaseFilters(p: Pick<FaultStudyTableProps, 'query' | 'onText' | 'onToggle'>) {
  const types = p.query.only.faultType ?? [];
  const statuses = p.query.only.status ?? [];
  return (
    <View style={styles.filters}>
      <TextField label="Find a bus" value={p.query.text} onChangeText={p.onText} placeholder="Name of a bus or panel" testID="fault-filter-text" autoCapitalize="none" />
      <ChipRow label="Fault types">
        {SHUNT_FAULT_TYPES.map((t) => (
          <Chip key={t} label={FAULT_TYPE_SHORT[t]} on={types.includes(t)} onPress={() => p.onToggle('faultType', t)} testID={`fault-filter-${t}`} />
        ))}
      </ChipRow>
      <ChipRow label="Standing">
        {STATUSES.map((s) => (
          <Chip key={s} label={CASE_STATUS_LABEL[s]} on={statuses.includes(s)} onPress={() => p.onToggle('status', s)} testID={`fault-filter-${s}`} />
        ))}
      </ChipRow>
    </View>
  );
}

function CaseCard({ row, on, onPress }: { row: FaultCaseRow; on: boolean; onPress: () => void }) {
  const { color } = useTheme();
  return (
    <Pressable
      onPress={onPress}
      accessibilityRole="button"
      accessibilityState={{ selected: on }}
      accessibilityLabel={`${row.faultLabel} fault at ${row.busName}: ${formatKa(row.symmetricalKa)} kA, ${CASE_STATUS_LABEL[row.status]}. Show on the drawing`}
      testID={`fault-case-${row.key}`}
      style={({ pressed }) => [styles.card, { borderColor: on ? color.primary : color.line, backgroundColor: on || pressed ? color.raised : color.surface, borderWidth: on ? 2 : 1 }]}
    >
      <View style={styles.cardTop}>
        <Text variant="label" style={styles.flex} numberOfLines={1}>
          {row.busName}
        </Text>
        <Text variant="caption" tone="muted">
          {FAULT_TYPE_LABEL[row.faultType]}
        </Text>
      </View>
      <View style={styles.cardTop}>
        <Text variant="numberLarge">{formatKa(row.symmetricalKa)} kA</Text>
        <Text variant="caption" tone="muted" style={styles.flex}>
          {row.problem ? row.problem : `peak ${formatKa(row.peakKa)} kA · X/R ${row.xOverR?.toFixed(1) ?? '—'}`}
        </Text>
        <StandingBadge standing={CASE_STATUS_STANDING[row.status]} label={CASE_STATUS_LABEL[row.status]} />
      </View>
      {row.exceeds.length ? (
        <Text variant="caption" tone="danger" numberOfLines={2}>
          Exceeds {row.exceeds.join(', ')}
        </Text>
      ) : null}
    </Pressable>
  );
}

const COLUMNS: { key: FaultCaseColumn; label: string; width?: number; align?: 'right' }[] = [
  { key: 'bus', label: 'Bus' },
  { key: 'faultType', label: 'Fault', width: 150 },
  { key: 'symmetricalKa', label: 'Sym. kA', width: 72, align: 'right' },
  { key: 'peakKa', label: 'Peak kA', width: 72, align: 'right' },
  { key: 'xOverR', label: 'X/R', width: 52, align: 'right' },
  { key: 'marginPercent', label: 'Margin', width: 68, align: 'right' },
  { key: 'status', label: 'Against the ratings', width: 200 },
];

function CaseTable({ rows, shownKey, query, onSort, onShow }: Pick<FaultStudyTableProps, 'rows' | 'shownKey' | 'query' | 'onSort' | 'onShow'>) {
  const { color } = useTheme();
  const col = (c: (typeof COLUMNS)[number]) => (c.width ? { width: c.width } : styles.flex);
  return (
    <View accessibilityRole="list" testID="fault-table">
      <View style={[styles.tr, { borderBottomColor: color.lineStrong }]}>
        {COLUMNS.map((c) => (
          <SortHead key={c.key} label={c.label} column={c.key} sort={query.sort} onSort={onSort} align={c.align} style={col(c)} testID={`fault-sort-${c.key}`} />
        ))}
      </View>
      {rows.map((r) => {
        const on = r.key === shownKey;
        return (
          <Pressable
            key={r.key}
            onPress={() => onShow(r)}
            accessibilityRole="button"
            accessibilityState={{ selected: on }}
            accessibilityLabel={`${r.faultLabel} fault at ${r.busName}: ${formatKa(r.symmetricalKa)} kA. Show on the drawing`}
            testID={`fault-case-${r.key}`}
            style={({ pressed }) => [styles.tr, { borderBottomColor: color.line, backgroundColor: on ? color.raised : pressed ? color.raised : 'transparent' }, on && { borderLeftColor: color.primary, borderLeftWidth: 3 }]}
          >
            <Text variant="small" style={styles.flex} numberOfLines={1}>
              {r.busName}
            </Text>
            <Text variant="small" style={col(COLUMNS[1])} numberOfLines={1}>
              {r.faultLabel}
            </Text>
            <Text variant="number" style={[col(COLUMNS[2]), styles.num]}>
              {formatKa(r.symmetricalKa)}
            </Text>
            <Text variant="number" style={[col(COLUMNS[3]), styles.num]}>
              {formatKa(r.peakKa)}
            </Text>
            <Text variant="number" style={[col(COLUMNS[4]), styles.num]}>
              {r.xOverR?.toFixed(1) ?? '—'}
            </Text>
            <Text variant="number" style={[col(COLUMNS[5]), styles.num]} tone={r.marginPercent !== undefined && r.marginPercent < 0 ? 'danger' : 'ink'}>
              {formatMargin(r.marginPercent)}
            </Text>
            <View style={[col(COLUMNS[6]), styles.cell]}>
              <StandingBadge standing={CASE_STATUS_STANDING[r.status]} label={r.problem ? 'No figures' : CASE_STATUS_LABEL[r.status]} />
            </View>
          </Pressable>
        );
      })}
    </View>
  );
}

export function FaultStudyTable(p: FaultStudyTableProps) {
  const [limit, setLimit] = useState(PAGE);
  const rows = p.rows.slice(0, limit);
  return (
    <View style={styles.gap}>
      <FaultCaseFilters query={p.query} onText={p.onText} onToggle={p.onToggle} />
      <Text variant="caption" tone="muted" testID="fault-row-count">
        {p.rows.length === p.totalRows ? `${p.totalRows} cases` : `${p.rows.length} of ${p.totalRows} cases`} · tap one to see it on the drawing
      </Text>
      {p.layout === 'table' ? (
        <CaseTable rows={rows} shownKey={p.shownKey} query={p.query} onSort={p.onSort} onShow={p.onShow} />
      ) : (
        <>
          <ChipRow label="Sort by">
            {(['status', 'symmetricalKa', 'bus', 'faultType'] as const).map((k) => {
              const on = p.query.sort?.key === k;
              const label = { status: 'Standing', symmetricalKa: 'Current', bus: 'Bus', faultType: 'Fault' }[k];
              return <Chip key={k} label={on ? `${label} ${p.query.sort!.direction === 'ascending' ? '↑' : '↓'}` : label} on={on} onPress={() => p.onSort(k)} testID={`fault-sort-${k}`} />;
            })}
          </ChipRow>
          <View style={styles.gapSm} testID="fault-cards">
            {rows.map((r) => (
              <CaseCard key={r.key} row={r} on={r.key === p.shownKey} onPress={() => p.onShow(r)} />
            ))}
          </View>
        </>
      )}
      <MoreRows shown={rows.length} total={p.rows.length} onMore={() => setLimit((n) => n + PAGE)} testID="fault-more" />
    </View>
  );
}

export function DutyList({ duties, unlocated, onShow }: { duties: DutyRow[]; unlocated: string[]; onShow: (d: DutyRow) => void }) {
  const { color } = useTheme();
  if (duties.length === 0 && unlocated.length === 0) {
    return (
      <Text variant="small" tone="muted">
        No breaker, panel or bus on this sheet has an interrupting rating to check.
      </Text>
    );
  }
  return (
    <View style={styles.gapSm} testID="duty-list">
      {duties.map((d) => (
        <Pressable
          key={d.key}
          onPress={() => onShow(d)}
          accessibilityRole="button"
          accessibilityLabel={`${d.name}: rated ${d.interruptingKa} kA, duty ${formatKa(d.adjustedDutyKa)} kA, ${DUTY_STATUS_LABEL[d.status]}. Show its worst fault on the drawing`}
          testID={`duty-${d.key}`}
          style={({ pressed }) => [styles.duty, { borderBottomColor: color.line, backgroundColor: pressed ? color.raised : 'transparent' }]}
        >
          <View style={styles.flex}>
            <Text variant="small" numberOfLines={1}>
              {d.name}
            </Text>
            <Text variant="caption" tone="muted" numberOfLines={1}>
              {d.kindLabel} at {d.locationName} · {d.faultLabel}, X/R {d.xOverR.toFixed(1)} (test {d.testXOverR.toFixed(1)})
            </Text>
          </View>
          <View style={styles.dutyFigures}>
            <Text variant="number" align="right">
              {formatKa(d.adjustedDutyKa)} / {d.interruptingKa} kA
            </Text>
            <StandingBadge standing={DUTY_STATUS_STANDING[d.status]} label={`${DUTY_STATUS_LABEL[d.status]} ${formatMargin(d.marginPercent)}`} />
          </View>
        </Pressable>
      ))}
      {unlocated.length ? (
        <Text variant="caption" tone="muted">
          Not checked (the line side lands on no bus): {unlocated.join(', ')}
        </Text>
      ) : null}
    </View>
  );
}

export function ServiceMarkings({ markings }: { markings: MarkingRow[] }) {
  const { color } = useTheme();
  if (markings.length === 0) {
    return (
      <Text variant="small" tone="muted">
        No bus has the service role, so there is no field marking to give.
      </Text>
    );
  }
  return (
    <View style={styles.gapSm} testID="service-markings">
      {markings.map((m) => (
        <View key={m.busId} style={[styles.marking, { borderColor: color.lineStrong }]} testID={`marking-${m.busId}`}>
          <Text variant="label">{m.busName}</Text>
          <Text variant="small">{m.marking}</Text>
          <Text variant="caption" tone="muted">
            NEC 110.24 field marking · largest of the five fault types: {m.faultLabel}, X/R {m.xOverR.toFixed(1)}
          </Text>
        </View>
      ))}
    </View>
  );
}

export type { FaultStudyView };

const styles = StyleSheet.create({
  flex: { flex: 1 },
  gap: { gap: space.md },
  gapSm: { gap: space.sm },
  filters: { gap: space.sm },
  card: { borderRadius: radius.md, padding: space.md, gap: space.xs, minHeight: touchTargetMin },
  cardTop: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 36, borderBottomWidth: 1, paddingHorizontal: space.xs },
  num: { textAlign: 'right' },
  cell: { alignItems: 'flex-start' },
  duty: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: touchTargetMin, borderBottomWidth: 1, paddingVertical: space.xs },
  dutyFigures: { alignItems: 'flex-end', gap: 2 },
  marking: { borderWidth: 1, borderStyle: 'dashed', borderRadius: radius.sm, padding: space.md, gap: space.xs },
});
