// On a wide screen, a view too wide for the side pane (a panel schedule's table, an import preview) covers the
// canvas, with its title and a close button; the side panes stay as they were.
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';
import { Text } from '../ui/text';

export function CoverPanel({ title, onClose, children, testID }: { title: string; onClose: () => void; children: ReactNode; testID?: string }) {
  const { color } = useTheme();
  return (
    <View style={[styles.cover, { backgroundColor: color.surface, borderColor: color.line }]} role="dialog" aria-label={title} testID={testID}>
      <View style={[styles.head, { borderBottomColor: color.line }]}>
        <Text variant="heading" role="heading" style={styles.title}>
          {title}
        </Text>
        <IconButton icon="x" label={`Close ${title.toLowerCase()}`} onPress={onClose} testID={testID ? `${testID}-close` : undefined} />
      </View>
      <ScrollView contentContainerStyle={styles.body} keyboardShouldPersistTaps="handled">
        {children}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  cover: { position: 'absolute', top: space.sm, left: space.sm, right: space.sm, bottom: space.sm, borderWidth: 1, borderRadius: radius.lg, overflow: 'hidden' },
  head: { flexDirection: 'row', alignItems: 'center', paddingLeft: space.lg, paddingRight: space.xs, paddingVertical: space.xs, borderBottomWidth: 1 },
  title: { flex: 1 },
  body: { padding: space.lg, gap: space.md },
});
