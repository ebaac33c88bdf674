// A box to write a comment in, with its send button and any error from the server under it. Keeps the text when
// sending fails, and empties once it went through.
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { FormMessage } from '../ui/states';
import { TextField } from '../ui/text-field';

export interface NoteBoxProps {
  label: string;
  sendLabel: string;
  busy: boolean;
  onSend: (text: string) => Promise<unknown>;
  onCancel?: () => void;
  testID: string;
  autoFocus?: boolean;
}

export function NoteBox(p: NoteBoxProps) {
  const [text, setText] = useState('');
  const [error, setError] = useState<string | null>(null);
  const send = async () => {
    const body = text.trim();
    if (!body) return setError('Write something first.');
    setError(null);
    try {
      await p.onSend(body);
      setText('');
    } catch (e) {
      setError(e instanceof Error ? e.message : 'Could not send it. Try again.');
    }
  };
  return (
    <View style={styles.box}>
      <TextField label={p.label} value={text} onChangeText={setText} multiline maxLength={4000} testID={`${p.testID}-text`} autoFocus={p.autoFocus} />
      <FormMessage message={error} testID={`${p.testID}-error`} />
      <View style={styles.row}>
        <Button label={p.sendLabel} compact loading={p.busy} onPress={() => void send()} testID={`${p.testID}-send`} />
        {p.onCancel ? <Button label="Cancel" variant="quiet" compact onPress={p.onCancel} testID={`${p.testID}-cancel`} /> : null}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  row: { flexDirection: 'row', gap: space.sm, alignItems: 'center' },
});
