// The signed-in person's own choice: an e-mail when someone adds a pin to a sheet they own, or not.
import { StyleSheet, Switch, View } from 'react-native';
import { usePreferences, useUpdatePreferences } from '@/shared/client/queries';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Card } from '../ui/card';
import { errorMessage } from '../ui/format';
import { Text } from '../ui/text';

export function PinEmailsSwitch() {
  const { color } = useTheme();
  const preferences = usePreferences();
  const update = useUpdatePreferences();
  const on = preferences.data?.pinEmails ?? true;
  const problem = preferences.error ?? update.error;
  return (
    <Card style={styles.card} testID="pin-emails">
      <View style={styles.row}>
        <View style={styles.words}>
          <Text variant="bodyStrong" nativeID="pin-emails-label">
            E-mail me about new pins
          </Text>
          <Text variant="small" tone="muted">
            On sheets you own, in any project.
          </Text>
        </View>
        <Switch
          value={on}
          disabled={preferences.isPending || update.isPending}
          onValueChange={(pinEmails) => update.mutate({ pinEmails })}
          accessibilityLabel="E-mail me about new pins"
          trackColor={{ false: color.lineStrong, true: color.primary }}
          thumbColor={color.surface}
          // react-native-web draws the "on" thumb in its own teal unless told otherwise.
          {...({ activeThumbColor: color.surface } as object)}
          testID="pin-emails-switch"
        />
      </View>
      {problem ? (
        <Text variant="small" tone="danger" role="alert">
          {errorMessage(problem)}
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { padding: space.lg, gap: space.sm },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  words: { flex: 1 },
});
