// The new link's address, shown this once (the server keeps only its hash), with a copy button.
import { useState } from 'react';
import { Platform, StyleSheet, TextInput, View, type TextStyle } from 'react-native';
import { fontFamily, radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

async function copyText(text: string): Promise<boolean> {
  if (Platform.OS !== 'web' || typeof navigator === 'undefined' || !navigator.clipboard) return false;
  try {
    await navigator.clipboard.writeText(text);
    return true;
  } catch {
    return false;
  }
}

export function NewLinkNotice({ url, onDone }: { url: string; onDone: () => void }) {
  const { color } = useTheme();
  const [copied, setCopied] = useState<'yes' | 'failed' | null>(null);
  return (
    <View style={[styles.box, { borderColor: color.success, backgroundColor: color.raised }]} testID="new-link" role="status">
      <Text variant="bodyStrong">Link made. Copy it now: it will not be shown again.</Text>
      <TextInput
        value={url}
        editable={false}
        selectTextOnFocus
        accessibilityLabel="The new link"
        testID="new-link-url"
        style={[styles.url, noRing, { color: color.ink, backgroundColor: color.surface, borderColor: color.lineStrong }]}
      />
      <View style={styles.buttons}>
        <Button
          label={copied === 'yes' ? 'Copied' : 'Copy link'}
          icon={copied === 'yes' ? 'check' : 'copy'}
          onPress={async () => setCopied((await copyText(url)) ? 'yes' : 'failed')}
          testID="copy-link"
        />
        <Button label="Done" variant="secondary" onPress={onDone} testID="new-link-done" />
      </View>
      {copied === 'failed' ? (
        <Text variant="small" tone="danger">
          Could not copy here: select the address above and copy it by hand.
        </Text>
      ) : null}
    </View>
  );
}

const noRing = (Platform.OS === 'web' ? { outlineStyle: 'none' } : {}) as TextStyle;

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.md, padding: space.lg, gap: space.md },
  url: { minHeight: 44, borderWidth: 1, borderRadius: radius.sm, paddingHorizontal: space.sm, fontFamily: fontFamily.mono, fontSize: 13 },
  buttons: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
