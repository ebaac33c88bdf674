// Choosing which conductor (or pole) to open when they are drawn too close together to tap apart: one full-size
// button each, in the sheet's phase colours, the open ones marked.
import { Pressable, StyleSheet, View } from 'react-native';
import type { CutChooser as Chooser } from '@/editor/session/editor-state';
import { conductorInk, radius, space, touchTargetMin, type ConductorName, type PhaseConvention } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';
import { Text } from '../ui/text';

export interface CutChooserProps {
  chooser: Chooser;
  title: string;
  open: ReadonlySet<string>;
  convention: PhaseConvention;
  onChoose: (which: string) => void;
  onClose: () => void;
}

const WORD: Record<string, string> = { A: 'Phase A', B: 'Phase B', C: 'Phase C', N: 'Neutral', PE: 'Ground' };

export function CutChooser({ chooser, title, open, convention, onChoose, onClose }: CutChooserProps) {
  const theme = useTheme();
  const inks = conductorInk[theme.scheme][convention];
  const items = chooser.kind === 'breaker' ? chooser.poles : chooser.conductors;
  return (
    <View testID="cut-chooser" style={[styles.box, { backgroundColor: theme.color.surface, borderColor: theme.color.line }]}>
      <View style={styles.head}>
        <Text variant="label" style={styles.title} numberOfLines={2}>
          {title}
        </Text>
        <IconButton icon="x" label="Close" onPress={onClose} testID="cut-chooser-close" />
      </View>
      <View style={styles.row}>
        {items.map((c) => {
          const ink = inks[c as ConductorName];
          const isOpen = open.has(c);
          return (
            <Pressable
              key={c}
              onPress={() => onChoose(c)}
              accessibilityRole="button"
              accessibilityLabel={`${isOpen ? 'Close' : 'Open'} ${WORD[c] ?? c}`}
              testID={`cut-${c}`}
              style={({ pressed }) => [styles.choice, { borderColor: theme.color.lineStrong, backgroundColor: pressed ? theme.color.raised : theme.color.surface }]}
            >
              <View style={[styles.swatch, { backgroundColor: ink?.stroke ?? theme.color.ink, borderColor: ink?.casing ?? theme.color.lineStrong }]} />
              <Text variant="label">{c}</Text>
              <Text variant="caption" tone={isOpen ? 'danger' : 'muted'}>
                {isOpen ? 'open' : 'closed'}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.lg, padding: space.sm, gap: space.xs, alignSelf: 'center', maxWidth: 520 },
  head: { flexDirection: 'row', alignItems: 'center', paddingLeft: space.xs },
  title: { flex: 1 },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  choice: { minWidth: 56, minHeight: touchTargetMin + 12, borderWidth: 1, borderRadius: radius.md, alignItems: 'center', justifyContent: 'center', paddingHorizontal: space.sm, gap: 2 },
  swatch: { width: 22, height: 5, borderRadius: 2, borderWidth: 1 },
});
