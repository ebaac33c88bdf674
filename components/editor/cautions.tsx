// The cautions that go with every result, and the assumptions the solve made.
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { Text } from '../ui/text';

export function Cautions({ caution, assumptions, standardLabel }: { caution: string; assumptions: string[]; standardLabel: string | null }) {
  return (
    <View style={styles.box} testID="cautions">
      <Text testID="caution-text">{caution}</Text>
      {standardLabel ? (
        <Text variant="small" tone="muted">
          Voltages are judged against {standardLabel}.
        </Text>
      ) : null}
      {assumptions.length ? (
        <View style={styles.list}>
          <Text variant="label">Assumptions</Text>
          {assumptions.map((a, i) => (
            <Text key={i} variant="small" tone="muted">
              • {a}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.md },
  list: { gap: space.xs },
});
