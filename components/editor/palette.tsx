// The elements a sheet is drawn with, each shown by its own symbol: choose one, then tap the sheet to place it.
import { memo } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import Svg, { G, Path } from 'react-native-svg';
import type { ElementKind } from '@/shared/sheet';
import { symbolOf } from '@/shared/symbols';
import { ELEMENT_KINDS, KIND_LABEL } from '@/editor/document/element-defaults';
import { drawingPalette, radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

export interface PaletteProps {
  chosen: ElementKind | null;
  onChoose: (kind: ElementKind) => void;
  columns: 1 | 2;
}

function SymbolPreview({ kind, ink }: { kind: ElementKind; ink: string }) {
  const sample = kind === 'run' ? { kind, conductors: { A: {}, B: {}, C: {}, N: {} } } : { kind };
  const s = symbolOf(sample);
  const lanes = s.lanes.map((l) => `M ${l.fanIn.x} ${l.fanIn.y} L ${l.from.x} ${l.from.y} L ${l.to.x} ${l.to.y} L ${l.fanOut.x} ${l.fanOut.y}`).join(' ');
  const scale = kind === 'bus' ? 0.16 : 0.36;
  return (
    <Svg width={40} height={40} viewBox="-20 -20 40 40">
      <G transform={`scale(${scale})`}>
        <Path d={`${s.ink} ${lanes}`} stroke={ink} strokeWidth={2 / scale} fill="none" strokeLinejoin="round" />
      </G>
    </Svg>
  );
}

function PaletteView({ chosen, onChoose, columns }: PaletteProps) {
  const theme = useTheme();
  const ink = drawingPalette[theme.scheme].ink;
  return (
    <View testID="palette" style={[styles.grid, columns === 2 && styles.two]}>
      {ELEMENT_KINDS.map((kind) => (
        <Pressable
          key={kind}
          onPress={() => onChoose(kind)}
          accessibilityRole="button"
          accessibilityLabel={`Add ${KIND_LABEL[kind].toLowerCase()}`}
          accessibilityState={{ selected: chosen === kind }}
          testID={`palette-${kind}`}
          style={({ pressed }) => [
            styles.item,
            columns === 2 && styles.half,
            { borderColor: chosen === kind ? theme.color.primary : theme.color.line, backgroundColor: pressed || chosen === kind ? theme.color.raised : theme.color.surface },
          ]}
        >
          <SymbolPreview kind={kind} ink={ink} />
          <Text variant="label" style={styles.label} numberOfLines={2}>
            {KIND_LABEL[kind]}
          </Text>
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { gap: space.sm },
  two: { flexDirection: 'row', flexWrap: 'wrap' },
  item: { minHeight: touchTargetMin + 8, flexDirection: 'row', alignItems: 'center', gap: space.sm, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.sm },
  half: { width: '48%' },
  label: { flex: 1 },
});

/** Unchanged on an edit of the sheet, so not redrawn by one. */
export const Palette = memo(PaletteView);
