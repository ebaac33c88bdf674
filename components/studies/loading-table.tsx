// The loading of the case on show: each conductor against its ampacity (worst first, sortable, filterable; a tap
// selects the run on the drawing), breakers against their ratings, voltage drop per run and from the source,
// and misplaced neutral-to-ground bonds.
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { LoadingSection } from '@/editor/studies/studies-view';
import type { LoadingColumn } from '@/editor/studies/loading-rows';
import type { TableQuery } from '@/editor/studies/table-query';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { StandingBadge } from './standing-badge';
import { Chip, ChipRow, MoreRows, SortHead } from './table-parts';

const PAGE = 40;
const pct = (v: number | undefined) => (v === undefined ? '—' : `${v.toFixed(0)} %`);
const amps = (v: number | undefined) => (v === undefined ? '—' : v >= 100 ? v.toFixed(0) : v.toFixed(1));

export interface LoadingTableProps {
  layout: 'cards' | 'table';
  loading: LoadingSection;
  query: TableQuery<LoadingColumn>;
  onSort: (column: LoadingColumn) => void;
  onText: (text: string) => void;
  onToggle: (column: 'status' | 'conductor', value: string) => void;
  onShowRun: (runId: string) => void;
}

function Heading({ children }: { children: string }) {
  return (
    <Text variant="caption" tone="muted" style={styles.heading}>
      {children.toUpperCase()}
    </Text>
  );
}

export function LoadingTable(p: LoadingTableProps) {
  const { color } = useTheme();
  const [limit, setLimit] = useState(PAGE);
  const v = p.loading.view;
  if (p.loading.error) {
    return (
      <Text variant="small" tone="danger" testID="loading-error">
        {p.loading.error}
      </Text>
    );
  }
  if (!v) {
    return (
      <Text variant="small" tone="muted">
        Waiting for the solve…
      </Text>
    );
  }
  const statuses = p.query.only.status ?? [];
  const wide = p.layout === 'table';
  return (
    <View style={styles.gap} testID="loading-study">
      <Text variant="label" testID="loading-summary">
        {v.summary}
      </Text>
      <Text variant="caption" tone="muted">
        {v.caseNote}
      </Text>
      <Heading>Conductors against their ampacity</Heading>
      <TextField label="Find a run" value={p.query.text} onChangeText={p.onText} placeholder="Name of a feeder or a size" testID="loading-filter-text" autoCapitalize="none" />
      <ChipRow label="Standing">
        {(
          [
            ['over', 'Over'],
            ['high', 'Above 80 %'],
            ['ok', 'Within'],
          ] as const
        ).map(([s, words]) => (
          <Chip key={s} label={words} on={statuses.includes(s)} onPress={() => p.onToggle('status', s)} testID={`loading-filter-${s}`} />
        ))}
        <Chip label="Neutrals" on={(p.query.only.conductor ?? []).includes('N')} onPress={() => p.onToggle('conductor', 'N')} testID="loading-filter-N" />
      </ChipRow>
      <View style={[styles.tr, { borderBottomColor: color.lineStrong }]}>
        <SortHead label="Run" column="run" sort={p.query.sort} onSort={p.onSort} style={styles.flex} testID="loading-sort-run" />
        <SortHead label="" column="conductor" sort={p.query.sort} onSort={p.onSort} style={styles.c} />
        {wide ? <Text variant="caption" tone="muted" style={styles.size}>Size</Text> : null}
        <SortHead label="A" column="amperes" sort={p.query.sort} onSort={p.onSort} align="right" style={styles.n} testID="loading-sort-amperes" />
        {wide ? <SortHead label="Ampacity" column="ampacity" sort={p.query.sort} onSort={p.onSort} align="right" style={styles.n} /> : null}
        <SortHead label="%" column="percent" sort={p.query.sort} onSort={p.onSort} align="right" style={styles.n} testID="loading-sort-percent" />
        <View style={wide ? styles.badge : styles.badgeSmall} />
      </View>
      {p.loading.rows.slice(0, limit).map((r) => (
        <Pressable
          key={r.key}
          onPress={() => p.onShowRun(r.runId)}
          accessibilityRole="button"
          accessibilityLabel={`${r.conductor} of ${r.runName}: ${amps(r.amperes)} A of ${amps(r.ampacityAmperes)} A, ${r.statusLabel}. ${r.rule ?? ''}`}
          testID={`loading-row-${r.key}`}
          style={({ pressed }) => [styles.tr, { borderBottomColor: color.line, backgroundColor: pressed ? color.raised : 'transparent' }]}
        >
          <Text variant="small" style={styles.flex} numberOfLines={1}>
            {r.runName}
          </Text>
          <Text variant="number" style={styles.c}>
            {r.conductor}
          </Text>
          {wide ? (
            <Text variant="small" style={styles.size} numberOfLines={1}>
              {r.size}
            </Text>
          ) : null}
          <Text variant="number" style={[styles.n, styles.num]}>
            {amps(r.amperes)}
          </Text>
          {wide ? (
            <Text variant="number" style={[styles.n, styles.num]}>
              {amps(r.ampacityAmperes)}
            </Text>
          ) : null}
          <Text variant="number" style={[styles.n, styles.num]} tone={r.standing === 'outside' ? 'danger' : 'ink'}>
            {pct(r.percent)}
          </Text>
          <View style={wide ? styles.badge : styles.badgeSmall}>
            <StandingBadge standing={r.standing} label={r.statusLabel} compact={!wide} />
          </View>
        </Pressable>
      ))}
      <MoreRows shown={Math.min(limit, p.loading.rows.length)} total={p.loading.rows.length} onMore={() => setLimit((n) => n + PAGE)} testID="loading-more" />

      <Heading>Breakers against their ratings</Heading>
      {v.breakers.map((b) => (
        <View key={b.key} style={[styles.tr, { borderBottomColor: color.line }]} testID={`breaker-row-${b.key}`}>
          <Text variant="small" style={styles.flex} numberOfLines={1}>
            {b.name}
          </Text>
          <Text variant="number" style={styles.num}>
            {amps(b.amperes)} / {b.ratingAmperes ?? '—'} A
          </Text>
          <StandingBadge standing={b.standing} label={b.statusLabel} compact={!wide} />
        </View>
      ))}

      <Heading>Voltage drop (3 % per run, 5 % from the source)</Heading>
      {v.drops.map((d) => (
        <View key={d.key} style={[styles.tr, { borderBottomColor: color.line }]} testID={`drop-row-${d.key}`}>
          <Text variant="small" style={styles.flex} numberOfLines={1}>
            {d.name} <Text variant="caption" tone="muted">{d.role}</Text>
          </Text>
          <Text variant="number" style={styles.num}>
            {d.dropPercent === undefined ? '—' : `${d.dropPercent.toFixed(2)} %`} · Σ {d.cumulativePercent === undefined ? '—' : `${d.cumulativePercent.toFixed(2)} %`}
          </Text>
          <StandingBadge standing={d.standing} label={d.statusLabel} compact={!wide} />
        </View>
      ))}

      {v.bonds.length ? <Heading>Neutral-to-ground bonds</Heading> : null}
      {v.bonds.map((b) => (
        <View key={b.key} style={styles.bond} testID={`bond-${b.key}`}>
          <StandingBadge standing={b.standing} label={b.standing === 'outside' ? 'Flagged' : 'Permitted'} />
          <Text variant="small" style={styles.flex}>
            {b.name}: {b.message}
          </Text>
        </View>
      ))}
      {v.notes.map((n, i) => (
        <Text key={i} variant="caption" tone="muted">
          • {n}
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  flex: { flex: 1 },
  gap: { gap: space.sm },
  heading: { letterSpacing: 0.8, marginTop: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 34, borderBottomWidth: 1, paddingHorizontal: space.xs },
  c: { width: 28 },
  size: { width: 110 },
  n: { width: 64 },
  num: { textAlign: 'right' },
  badge: { width: 150, alignItems: 'flex-start' },
  badgeSmall: { width: 28, alignItems: 'flex-start' },
  bond: { flexDirection: 'row', alignItems: 'flex-start', gap: space.sm },
});
