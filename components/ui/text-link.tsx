// A link in running text, with a full-size touch target.
import { Pressable, StyleSheet } from 'react-native';
import { touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from './text';

export function TextLink({ label, onPress, testID }: { label: string; onPress: () => void; testID?: string }) {
  const { color } = useTheme();
  return (
    <Pressable onPress={onPress} accessibilityRole="link" testID={testID} style={styles.target} hitSlop={4}>
      {({ pressed }) => (
        <Text variant="label" style={{ color: color.link, textDecorationLine: pressed ? 'underline' : 'none' }}>
          {label}
        </Text>
      )}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  target: { minHeight: touchTargetMin, justifyContent: 'center' },
});
