// Where an import's text comes from: a chosen file (read in the browser, refused when too large before it is read)
// or text pasted into the field. Says which file the text came from; an edit makes it pasted text again.
import { StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { Button } from '../ui/button';
import { canPickFiles, pickTextFile } from '../ui/pick-text-file';
import { TextField } from '../ui/text-field';

export interface TextSourceProps {
  /** "CSV" or "JSON": named on the button and the field. */
  format: string;
  accept: string;
  maxBytes: number;
  lines: number;
  text: string;
  source: string | null;
  /** A new text: from a file (its name) or typed or pasted (null). */
  onText: (text: string, source: string | null) => void;
  onTooLarge: (name: string, sizeBytes: number) => void;
  testIDs: { pick: string; text: string };
}

export function TextSource(p: TextSourceProps) {
  const pick = async () => {
    const picked = await pickTextFile(p.accept, p.maxBytes);
    if (!picked) return;
    if ('tooLarge' in picked) p.onTooLarge(picked.name, picked.sizeBytes);
    else p.onText(picked.text, picked.name);
  };
  return (
    <>
      {canPickFiles() ? (
        <View style={styles.buttons}>
          <Button label={`Choose a ${p.format} file`} icon="file-text" variant="secondary" compact onPress={() => void pick()} testID={p.testIDs.pick} />
        </View>
      ) : null}
      <TextField
        label={p.source ? `Text of ${p.source}` : `Or paste the ${p.format} here`}
        value={p.text}
        onChangeText={(t) => p.onText(t, null)}
        multiline
        numberOfLines={p.lines}
        autoCapitalize="none"
        autoCorrect={false}
        testID={p.testIDs.text}
      />
    </>
  );
}

const styles = StyleSheet.create({
  buttons: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', justifyContent: 'flex-end' },
});
