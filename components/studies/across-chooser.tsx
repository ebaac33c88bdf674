// Which two bars (or which load element) a reading was taken across: the groups the element offers, each a row of
// finger-sized chips, the chosen one filled. Renders and dispatches only.
import { Pressable, StyleSheet, View } from 'react-native';
import type { AcrossGroup } from '@/editor/studies/reading-across';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

export interface AcrossChooserProps {
  groups: AcrossGroup[];
  chosen: string;
  /** Where the reading is, for the chips' spoken labels ("Apartment 4"). */
  at: string;
  onChoose: (key: string) => void;
  testID: string;
}

export function AcrossChooser({ groups, chosen, at, onChoose, testID }: AcrossChooserProps) {
  const { color } = useTheme();
  return (
    <View style={styles.groups} testID={testID} role="radiogroup" aria-label={`What the meter was across at ${at}`}>
      {groups.map((g) => (
        <View key={g.kind} style={styles.group}>
          <Text variant="caption" tone="muted">
            {g.title}
          </Text>
          <View style={styles.chips}>
            {g.choices.map((c) => {
              const on = c.key === chosen;
              return (
                <Pressable
                  key={c.key}
                  onPress={() => (on ? undefined : onChoose(c.key))}
                  role="radio"
                  aria-checked={on}
                  aria-label={`${at} ${c.label}`}
                  testID={`${testID}-${c.key}`}
                  style={({ pressed }) => [styles.chip, { borderColor: on ? color.primary : color.lineStrong, backgroundColor: on ? color.primary : pressed ? color.raised : color.surface }]}
                >
                  <Text variant="small" style={{ color: on ? color.onPrimary : color.ink }}>
                    {c.label}
                  </Text>
                </Pressable>
              );
            })}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  groups: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.sm },
  group: { gap: space.xs },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: { minHeight: touchTargetMin, minWidth: touchTargetMin, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.sm, alignItems: 'center', justifyContent: 'center' },
});
