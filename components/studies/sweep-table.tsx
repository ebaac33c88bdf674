// The break sweep's cases: one per opened conductor, worst first, as cards on a phone or a table on a wide
// screen; sortable and filterable; a tap opens that conductor on the drawing (a trial).
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { SweepColumn, SweepRow } from '@/editor/studies/break-sweep-rows';
import type { TableQuery } from '@/editor/studies/table-query';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { StandingBadge } from './standing-badge';
import { Chip, ChipRow, MoreRows, SortHead } from './table-parts';

const PAGE = 60;
const STANDING_WORDS = { outside: 'Loads outside', tolerable: 'Loads tolerable', normal: 'All within', plain: 'No figures' } as const;

export interface SweepTableProps {
  layout: 'cards' | 'table';
  rows: SweepRow[];
  totalRows: number;
  query: TableQuery<SweepColumn>;
  shownKey: string | null;
  onSort: (column: SweepColumn) => void;
  onText: (text: string) => void;
  onToggle: (conductor: string) => void;
  onShow: (row: SweepRow) => void;
}

const label = (r: SweepRow) =>
  `${r.conductor} of ${r.runName} open: ${r.over ? `highest ${r.over.text} at ${r.over.load}` : 'no over-voltage'}, ${r.under ? `lowest ${r.under.text} at ${r.under.load}` : 'no under-voltage'}, ${r.loadsOutside} loads outside. Show on the drawing`;

const COLUMNS: { key: SweepColumn; label: string; width?: number; align?: 'right' }[] = [
  { key: 'run', label: 'Run' },
  { key: 'conductor', label: 'Open', width: 44 },
  { key: 'over', label: 'Highest', width: 150, align: 'right' },
  { key: 'under', label: 'Lowest', width: 150, align: 'right' },
  { key: 'severity', label: 'Beyond', width: 64, align: 'right' },
  { key: 'outside', label: 'Outside', width: 60, align: 'right' },
  { key: 'dead', label: 'No volts', width: 64, align: 'right' },
];

export function SweepTable(p: SweepTableProps) {
  const { color } = useTheme();
  const [limit, setLimit] = useState(PAGE);
  const rows = p.rows.slice(0, limit);
  const only = p.query.only.conductor ?? [];
  const col = (c: (typeof COLUMNS)[number]) => (c.width ? { width: c.width } : styles.flex);
  return (
    <View style={styles.gap}>
      <TextField label="Find a run or load" value={p.query.text} onChangeText={p.onText} placeholder="Name of a feeder, a drop or a load" testID="sweep-filter-text" autoCapitalize="none" />
      <ChipRow label="Conductor opened">
        {['A', 'B', 'C', 'N'].map((c) => (
          <Chip key={c} label={c === 'N' ? 'Neutral' : `Phase ${c}`} on={only.includes(c)} onPress={() => p.onToggle(c)} testID={`sweep-filter-${c}`} />
        ))}
      </ChipRow>
      <Text variant="caption" tone="muted">
        {p.rows.length === p.totalRows ? `${p.totalRows} openings` : `${p.rows.length} of ${p.totalRows} openings`} · tap one to see it on the drawing
      </Text>
      {p.layout === 'table' ? (
        <View testID="sweep-table">
          <View style={[styles.tr, { borderBottomColor: color.lineStrong }]}>
            {COLUMNS.map((c) => (
              <SortHead key={c.key} label={c.label} column={c.key} sort={p.query.sort} onSort={p.onSort} align={c.align} style={col(c)} testID={`sweep-sort-${c.key}`} />
            ))}
          </View>
          {rows.map((r) => {
            const on = r.key === p.shownKey;
            return (
              <Pressable
                key={r.key}
                onPress={() => p.onShow(r)}
                accessibilityRole="button"
                accessibilityState={{ selected: on }}
                accessibilityLabel={label(r)}
                testID={`sweep-case-${r.key}`}
                style={({ pressed }) => [styles.tr, { borderBottomColor: color.line, backgroundColor: on || pressed ? color.raised : 'transparent' }, on && { borderLeftColor: color.primary, borderLeftWidth: 3 }]}
              >
                <View style={[styles.flex, styles.runCell]}>
                  <StandingBadge standing={r.standing} label={STANDING_WORDS[r.standing]} compact />
                  <Text variant="small" numberOfLines={1} style={styles.flex}>
                    {r.runName}
                    {r.refined ? ' ·' : ''}
                  </Text>
                </View>
                <Text variant="number" style={col(COLUMNS[1])}>
                  {r.conductor}
                </Text>
                <Text variant="number" style={[col(COLUMNS[2]), styles.num]} numberOfLines={1}>
                  {r.over?.text ?? '—'}
                </Text>
                <Text variant="number" style={[col(COLUMNS[3]), styles.num]} numberOfLines={1}>
                  {r.under?.text ?? '—'}
                </Text>
                <Text variant="number" style={[col(COLUMNS[4]), styles.num]} tone={r.severityPercent > 0 ? 'danger' : 'ink'}>
                  {r.problem ? '—' : `${r.severityPercent.toFixed(1)} %`}
                </Text>
                <Text variant="number" style={[col(COLUMNS[5]), styles.num]}>
                  {r.loadsOutside}
                </Text>
                <Text variant="number" style={[col(COLUMNS[6]), styles.num]}>
                  {r.loadsWithoutVoltage}
                </Text>
              </Pressable>
            );
          })}
        </View>
      ) : (
        <>
          <ChipRow label="Sort by">
            {(['severity', 'over', 'under', 'run'] as const).map((k) => {
              const on = p.query.sort?.key === k;
              const words = { severity: 'Worst', over: 'Highest', under: 'Lowest', run: 'Run' }[k];
              return <Chip key={k} label={on ? `${words} ${p.query.sort!.direction === 'ascending' ? '↑' : '↓'}` : words} on={on} onPress={() => p.onSort(k)} testID={`sweep-sort-${k}`} />;
            })}
          </ChipRow>
          <View style={styles.gapSm} testID="sweep-cards">
            {rows.map((r) => {
              const on = r.key === p.shownKey;
              return (
                <Pressable
                  key={r.key}
                  onPress={() => p.onShow(r)}
                  accessibilityRole="button"
                  accessibilityState={{ selected: on }}
                  accessibilityLabel={label(r)}
                  testID={`sweep-case-${r.key}`}
                  style={({ pressed }) => [styles.card, { borderColor: on ? color.primary : color.line, borderWidth: on ? 2 : 1, backgroundColor: on || pressed ? color.raised : color.surface }]}
                >
                  <View style={styles.cardTop}>
                    <Text variant="label" style={styles.flex} numberOfLines={1}>
                      {r.conductor} of {r.runName}
                    </Text>
                    <StandingBadge standing={r.standing} label={`${r.loadsOutside} outside`} />
                  </View>
                  <Text variant="number">
                    ↑ {r.over?.text ?? '—'}  ↓ {r.under?.text ?? '—'}
                  </Text>
                  <Text variant="caption" tone="muted" numberOfLines={1}>
                    {r.problem ?? `${r.over ? `highest at ${r.over.load}` : ''}${r.loadsWithoutVoltage ? ` · ${r.loadsWithoutVoltage} without voltage` : ''}`}
                  </Text>
                </Pressable>
              );
            })}
          </View>
        </>
      )}
      <MoreRows shown={rows.length} total={p.rows.length} onMore={() => setLimit((n) => n + PAGE)} testID="sweep-more" />
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  gap: { gap: space.md },
  gapSm: { gap: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 36, borderBottomWidth: 1, paddingHorizontal: space.xs },
  runCell: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  num: { textAlign: 'right' },
  card: { borderRadius: radius.md, padding: space.md, gap: space.xs, minHeight: touchTargetMin },
  cardTop: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
});
