// A phone's bar for the selection, over the bottom of the canvas: what is selected, and one tap to its details
// (and to a bus's phasor diagram), so drawing several elements in a row is never covered by a panel.
import { StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

export interface SelectionPeekProps {
  title: string;
  subtitle: string;
  isBus: boolean;
  onDetails: () => void;
  onPhasors: () => void;
}

export function SelectionPeek({ title, subtitle, isBus, onDetails, onPhasors }: SelectionPeekProps) {
  const { color } = useTheme();
  return (
    <View testID="selection-peek" style={[styles.bar, { backgroundColor: color.surface, borderColor: color.line }]}>
      <View style={styles.text}>
        <Text variant="label" numberOfLines={1}>
          {title}
        </Text>
        <Text variant="caption" tone="muted" numberOfLines={1}>
          {subtitle}
        </Text>
      </View>
      {isBus ? <Button label="Phasors" variant="secondary" compact onPress={onPhasors} testID="peek-phasors" /> : null}
      <Button label="Details" icon="sliders" compact onPress={onDetails} testID="peek-details" />
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { position: 'absolute', left: space.sm, right: space.sm, bottom: space.sm, flexDirection: 'row', alignItems: 'center', gap: space.sm, borderWidth: 1, borderRadius: radius.lg, padding: space.sm, paddingLeft: space.md },
  text: { flex: 1, minWidth: 0 },
});
