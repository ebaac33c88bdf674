// Before a visitor without an account comments: the name the sheet's people will see beside their pins.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';

export function GuestNameForm({ busy, onGiveName }: { busy: boolean; onGiveName: (name: string) => Promise<unknown> }) {
  const [name, setName] = useState('');
  const [error, setError] = useState<string | null>(null);
  const submit = async () => {
    const given = name.trim();
    if (!given) return setError('Give the name to show beside your comments.');
    if (given.length > 80) return setError('At most 80 characters.');
    setError(null);
    try {
      await onGiveName(given);
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not start commenting. Try again.');
    }
  };
  return (
    <View style={styles.form} testID="guest-name-form">
      <Text variant="small" tone="muted">
        To comment, give your name. No account is needed; the sheet’s people see it beside your pins.
      </Text>
      <TextField label="Your name" value={name} onChangeText={setName} autoComplete="name" maxLength={80} testID="guest-name" onSubmitEditing={() => void submit()} />
      <FormMessage message={error} testID="guest-name-error" />
      <Button label="Comment under this name" compact loading={busy} onPress={() => void submit()} testID="guest-name-submit" />
    </View>
  );
}

const styles = StyleSheet.create({ form: { gap: space.sm } });
