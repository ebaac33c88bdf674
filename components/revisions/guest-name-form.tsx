// Someone holding a viewer link gives a name before reviewing: the owners' e-mail and the review carry it.
import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { FormMessage } from '../ui/states';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';

export function GuestNameForm({ busy, error, onSubmit }: { busy: boolean; error: string | null; onSubmit: (name: string) => void }) {
  const [name, setName] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const submit = () => {
    const trimmed = name.trim();
    if (!trimmed) return setProblem('Give your name, so the owners know who reviewed');
    if (trimmed.length > 80) return setProblem('At most 80 characters');
    setProblem(null);
    onSubmit(trimmed);
  };
  return (
    <Card style={styles.card} testID="guest-name">
      <Text variant="small" tone="muted">
        You can look without an account. To review or approve, give your name.
      </Text>
      <TextField label="Your name" value={name} onChangeText={setName} error={problem ?? undefined} maxLength={80} onSubmitEditing={submit} testID="guest-name-field" />
      <FormMessage message={error} testID="guest-name-error" />
      <Button label="Continue as this name" variant="secondary" loading={busy} onPress={submit} testID="guest-name-submit" />
    </Card>
  );
}

const styles = StyleSheet.create({ card: { gap: space.sm, padding: space.md } });
