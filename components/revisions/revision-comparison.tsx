// A revision against the live sheet: what was added, removed or changed, and the base-case voltages that moved.
import { StyleSheet, View } from 'react-native';
import type { ElementChange, RevisionComparison as Comparison } from '@/shared/revisions';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

const volts = (v: number | null) => (v === null ? '—' : `${v.toFixed(1)} V`);
const signed = (v: number | null) => (v === null ? 'on/off' : `${v > 0 ? '+' : ''}${v.toFixed(1)} V`);

function Changes({ title, items }: { title: string; items: ElementChange[] }) {
  if (items.length === 0) return null;
  return (
    <View style={styles.group}>
      <Text variant="label">{title}</Text>
      {items.map((e) => (
        <Text key={e.id} variant="small" tone="muted">
          {e.name}
          {e.kind ? ` (${e.kind})` : ''}
          {e.fields ? `: ${e.fields.join(', ')}` : ''}
        </Text>
      ))}
    </View>
  );
}

export function RevisionComparison({ comparison }: { comparison: Comparison }) {
  const { color } = useTheme();
  const c = comparison;
  if (c.identical) {
    return (
      <Text variant="small" tone="success" testID="comparison-identical">
        The live sheet is the same as revision {c.revision}.
      </Text>
    );
  }
  const moved = c.voltages.slice(0, 30);
  return (
    <View style={styles.column} testID="comparison">
      {c.renamed ? (
        <Text variant="small" tone="muted" testID="comparison-renamed">
          Sheet renamed since: “{c.renamed.from || 'unnamed'}” → “{c.renamed.to}”
        </Text>
      ) : null}
      <Changes title="Elements added since" items={c.elements.added} />
      <Changes title="Elements removed since" items={c.elements.removed} />
      <Changes title="Elements changed" items={c.elements.changed} />
      <Changes title="What-ifs added" items={c.whatIfs.added} />
      <Changes title="What-ifs removed" items={c.whatIfs.removed} />
      <Changes title="What-ifs changed" items={c.whatIfs.changed} />
      {c.connections.added.length + c.connections.removed.length + c.connections.changed.length > 0 ? (
        <Text variant="small" tone="muted">
          Connections: {c.connections.added.length} added, {c.connections.removed.length} removed, {c.connections.changed.length} changed
        </Text>
      ) : null}
      {c.settings.length > 0 ? <Text variant="small" tone="muted">Settings changed: {c.settings.join(', ')}</Text> : null}
      <View style={styles.group}>
        <Text variant="label">Base-case voltages that moved (by {c.voltageThresholdVolts} V or more)</Text>
        {moved.length === 0 ? (
          <Text variant="small" tone="faint">None.</Text>
        ) : (
          moved.map((v) => (
            <View key={v.key} style={[styles.row, { borderTopColor: color.line }]} testID={`moved-${v.key}`}>
              <Text variant="small" style={styles.name} numberOfLines={1}>
                {v.name} {v.label}
              </Text>
              <Text variant="number" tone="muted">
                {volts(v.revisionVolts)} → {volts(v.liveVolts)}
              </Text>
              <Text variant="number">{signed(v.changeVolts)}</Text>
            </View>
          ))
        )}
        {c.voltages.length > moved.length ? <Text variant="small" tone="faint">and {c.voltages.length - moved.length} more</Text> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: space.md },
  group: { gap: space.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, borderTopWidth: 1, paddingTop: space.xs },
  name: { flexGrow: 1, flexBasis: 160, minWidth: 0 },
});
