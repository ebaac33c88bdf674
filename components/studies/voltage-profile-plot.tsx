// The voltage profile: one column per load, the standard's tolerable and normal bands behind it, a hollow circle
// for the base case and a filled diamond for the case on show, joined by a line; tap a column for its figures.
import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import { profilePlot, type ProfileLoad, type ProfileOrder, type ProfileStanding } from '@/editor/studies/voltage-profile';
import { formatVolts } from '@/editor/results/value-tags';
import { fontFamily, space, standingLook } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';
import { Chip, ChipRow } from './table-parts';

const HEIGHT = 240;
const MARGIN = { top: 12, right: 8, bottom: 20, left: 46 };

export interface VoltageProfilePlotProps {
  loads: ProfileLoad[];
  /** The case beside the base case, in words; null when only the base case is on show. */
  shownLabel: string | null;
  standard: string | null;
  order: ProfileOrder;
  onOrder: (order: ProfileOrder) => void;
}

const lookOf = (s: ProfileStanding) => (s === 'dead' || s === 'none' ? 'plain' : s);

function diamond(x: number, y: number, r: number) {
  return `M ${x} ${y - r} L ${x + r} ${y} L ${x} ${y + r} L ${x - r} ${y} Z`;
}

function describe(l: ProfileLoad, shownLabel: string | null) {
  const side = (s: ProfileLoad['base']) => (!s ? '—' : s.standing === 'dead' ? 'no voltage' : `${formatVolts(s.volts)} V (${s.percent.toFixed(1)} %)`);
  return `${l.name} ${l.label}: base case ${side(l.base)}${shownLabel ? `; ${shownLabel} ${side(l.shown)}` : ''}`;
}

export function VoltageProfilePlot(p: VoltageProfilePlotProps) {
  const { color, scheme } = useTheme();
  const looks = standingLook[scheme];
  const [width, setWidth] = useState(0);
  const [picked, setPicked] = useState<string | null>(null);
  const plot = useMemo(() => (width > 0 ? profilePlot(p.loads, { width, height: HEIGHT, margin: MARGIN }) : null), [p.loads, width]);
  const onLayout = (e: LayoutChangeEvent) => setWidth(Math.floor(e.nativeEvent.layout.width));
  const chosen = p.loads.find((l) => l.key === picked) ?? null;
  const r = plot ? Math.max(2.5, Math.min(5, (plot.columns[0]?.width ?? 10) / 4)) : 4;
  const outside = p.loads.filter((l) => (p.shownLabel ? l.shown : l.base)?.standing === 'outside').length;

  if (p.loads.length === 0) {
    return (
      <Text variant="small" tone="muted">
        No live loads to plot yet.
      </Text>
    );
  }
  return (
    <View style={styles.box} testID="voltage-profile">
      <ChipRow label="Order">
        {(
          [
            ['name', 'By name'],
            ['base-voltage', 'By base voltage'],
            ...(p.shownLabel ? [['shown-voltage', 'By case voltage']] : []),
          ] as [ProfileOrder, string][]
        ).map(([o, label]) => (
          <Chip key={o} label={label} on={p.order === o} onPress={() => p.onOrder(o)} testID={`profile-order-${o}`} />
        ))}
      </ChipRow>
      <View onLayout={onLayout} style={{ height: HEIGHT }} testID="voltage-profile-plot" accessibilityLabel={`Voltage at ${p.loads.length} loads in percent of nominal; ${outside} outside both ranges`}>
        {plot ? (
          <Svg width={width} height={HEIGHT}>
            <G>
              {plot.bands.map((b) => (
                <Rect key={`${b.key}-${b.kind}`} x={b.x} y={b.y} width={b.width} height={b.height} fill={b.kind === 'normal' ? looks.normal.fill : looks.tolerable.fill} opacity={b.kind === 'normal' ? 1 : 0.9} />
              ))}
            </G>
            <G>
              {plot.ticks.map((t) => (
                <G key={t.value}>
                  <Line x1={plot.plot.x} x2={plot.plot.x + plot.plot.width} y1={t.y} y2={t.y} stroke={color.line} strokeWidth={t.value === 100 ? 0 : 0.6} />
                  <SvgText x={plot.plot.x - 6} y={t.y + 4} fontSize={10} fontFamily={fontFamily.mono} fill={color.inkMuted} textAnchor="end">
                    {t.text}
                  </SvgText>
                </G>
              ))}
              <Line x1={plot.plot.x} x2={plot.plot.x + plot.plot.width} y1={plot.nominalY} y2={plot.nominalY} stroke={color.inkMuted} strokeWidth={1} strokeDasharray="4 3" />
            </G>
            <G>
              {plot.links.map((l) => (
                <Line key={l.key} x1={l.x} x2={l.x} y1={l.y1} y2={l.y2} stroke={color.inkFaint} strokeWidth={1} />
              ))}
              {plot.marks.map((m) => {
                const look = looks[lookOf(m.standing)];
                if (m.side === 'base') return <Circle key={`${m.key}-b`} cx={m.x} cy={m.y} r={r} fill={color.surface} stroke={color.ink} strokeWidth={1.2} />;
                return <Path key={`${m.key}-s`} d={diamond(m.x, m.y, r + 1)} fill={m.standing === 'dead' ? color.inkFaint : look.stroke} stroke={color.ink} strokeWidth={0.8} />;
              })}
              {plot.marks
                .filter((m) => m.clipped)
                .map((m) => (
                  <Path key={`${m.key}-${m.side}-clip`} d={m.clipped === 'high' ? `M ${m.x - 4} ${m.y + 9} L ${m.x} ${m.y + 3} L ${m.x + 4} ${m.y + 9}` : `M ${m.x - 4} ${m.y - 9} L ${m.x} ${m.y - 3} L ${m.x + 4} ${m.y - 9}`} stroke={color.danger} strokeWidth={1.5} fill="none" />
                ))}
            </G>
            {chosen ? (
              <Rect x={plot.columns.find((c) => c.key === chosen.key)!.x} y={plot.plot.y} width={plot.columns[0].width} height={plot.plot.height} fill="none" stroke={color.primary} strokeWidth={1.5} />
            ) : null}
          </Svg>
        ) : null}
        {plot ? (
          <View style={StyleSheet.absoluteFill}>
            {plot.columns.map((c) => (
              <Pressable
                key={c.key}
                onPress={() => setPicked(c.key === picked ? null : c.key)}
                accessibilityRole="button"
                accessibilityLabel={describe(p.loads.find((l) => l.key === c.key)!, p.shownLabel)}
                testID={`profile-column-${c.key}`}
                style={{ position: 'absolute', left: c.x, top: plot.plot.y, width: Math.max(c.width, 6), height: plot.plot.height }}
              />
            ))}
          </View>
        ) : null}
      </View>
      <View style={styles.key}>
        <Svg width={14} height={14}>
          <Circle cx={7} cy={7} r={4} fill={color.surface} stroke={color.ink} strokeWidth={1.2} />
        </Svg>
        <Text variant="caption" tone="muted">
          Base case
        </Text>
        {p.shownLabel ? (
          <>
            <Svg width={14} height={14}>
              <Path d={diamond(7, 7, 5)} fill={looks.tolerable.stroke} stroke={color.ink} strokeWidth={0.8} />
            </Svg>
            <Text variant="caption" tone="muted" numberOfLines={1} style={styles.flex}>
              {p.shownLabel}
            </Text>
          </>
        ) : (
          <Text variant="caption" tone="faint" style={styles.flex}>
            Show a what-if, a trial or a study's case to see it beside the base case
          </Text>
        )}
      </View>
      <View style={styles.key}>
        <View style={[styles.swatch, { backgroundColor: looks.normal.fill, borderColor: looks.normal.stroke }]} />
        <Text variant="caption" tone="muted">
          Normal range
        </Text>
        <View style={[styles.swatch, { backgroundColor: looks.tolerable.fill, borderColor: looks.tolerable.stroke }]} />
        <Text variant="caption" tone="muted" style={styles.flex} numberOfLines={2}>
          Tolerable range{p.standard ? ` · ${p.standard}` : ''}
        </Text>
      </View>
      <Text variant="small" testID="profile-picked" tone={chosen ? 'ink' : 'faint'}>
        {chosen ? describe(chosen, p.shownLabel) : 'Tap a column for its load and figures.'}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  key: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  swatch: { width: 14, height: 10, borderWidth: 1, borderRadius: 2 },
  flex: { flex: 1 },
});
