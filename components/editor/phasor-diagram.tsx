// A bus's phasor diagram: each phase's voltage from the ground reference (dashed) and from the neutral point
// (solid, the line-to-neutral voltages), the neutral point itself, and how far it has shifted.
import { StyleSheet, View } from 'react-native';
import Svg, { Circle, G, Line, Text as SvgText } from 'react-native-svg';
import type { PhasorView } from '@/editor/results/phasor-view';
import { formatVolts } from '@/editor/results/value-tags';
import { conductorInk, drawingPalette, fontFamily, space, type PhaseConvention } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

export interface PhasorDiagramProps {
  busName: string;
  view: PhasorView;
  convention: PhaseConvention;
  size?: number;
}

export function PhasorDiagram({ busName, view, convention, size = 240 }: PhasorDiagramProps) {
  const theme = useTheme();
  const ink = drawingPalette[theme.scheme];
  const colours = conductorInk[theme.scheme][convention];
  const r = size / 2 - 26;
  const k = r / view.extentVolts;
  const at = (p: { re: number; im: number }) => ({ x: size / 2 + p.re * k, y: size / 2 - p.im * k });
  const o = at({ re: 0, im: 0 });
  const n = view.neutral ? at(view.neutral) : o;
  return (
    <View style={styles.box} testID="phasor-diagram" accessibilityLabel={`Phasor diagram of ${busName}`}>
      <Text variant="label">{busName}</Text>
      <Svg width={size} height={size}>
        <Circle cx={o.x} cy={o.y} r={r} stroke={theme.color.line} strokeWidth={1} fill="none" />
        <Line x1={o.x - r} y1={o.y} x2={o.x + r} y2={o.y} stroke={theme.color.line} strokeWidth={1} />
        <Line x1={o.x} y1={o.y - r} x2={o.x} y2={o.y + r} stroke={theme.color.line} strokeWidth={1} />
        {view.phases.map((p) => {
          const tip = at(p);
          const c = colours[p.name as 'A' | 'B' | 'C'];
          const stroke = c.stroke === '#FFFFFF' || (theme.scheme === 'dark' && c.stroke === '#1A1A1A') ? ink.ink : c.stroke;
          return (
            <G key={p.name}>
              <Line x1={o.x} y1={o.y} x2={tip.x} y2={tip.y} stroke={stroke} strokeWidth={1} strokeDasharray="4 3" />
              <Line x1={n.x} y1={n.y} x2={tip.x} y2={tip.y} stroke={stroke} strokeWidth={2.5} />
              <Circle cx={tip.x} cy={tip.y} r={3.5} fill={stroke} />
              <SvgText x={tip.x + (tip.x >= o.x ? 6 : -6)} y={tip.y - 6} fontSize={12} fontFamily={fontFamily.semibold} fill={ink.ink} textAnchor={tip.x >= o.x ? 'start' : 'end'}>
                {p.name}
              </SvgText>
            </G>
          );
        })}
        {view.neutral ? (
          <G>
            <Circle cx={n.x} cy={n.y} r={5} fill={theme.color.surface} stroke={ink.ink} strokeWidth={2} />
            <SvgText x={n.x + 8} y={n.y + 14} fontSize={12} fontFamily={fontFamily.semibold} fill={ink.ink}>
              N
            </SvgText>
          </G>
        ) : null}
        <Circle cx={o.x} cy={o.y} r={2.5} fill={ink.label} />
      </Svg>
      <View style={styles.figures}>
        {view.phases.map((p) =>
          view.lineToNeutralVolts[p.name as 'A'] !== undefined ? (
            <Text key={p.name} variant="number" testID={`phasor-${p.name}`}>
              {p.name}–N {formatVolts(view.lineToNeutralVolts[p.name as 'A']!)} V
            </Text>
          ) : null,
        )}
        {view.neutralShiftVolts !== null ? (
          <Text variant="number" testID="phasor-shift">
            Neutral shift {formatVolts(view.neutralShiftVolts)} V
          </Text>
        ) : (
          <Text variant="small" tone="muted">
            No neutral shift to show (no neutral, or ungrounded)
          </Text>
        )}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, alignItems: 'flex-start' },
  figures: { gap: 2 },
});
