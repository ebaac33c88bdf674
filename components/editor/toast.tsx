// A short line over the canvas saying what just happened (or why nothing did); it goes after a few seconds and
// never takes a touch meant for the drawing under it.
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Text } from '../ui/text';

export interface ToastProps {
  message: { text: string; tone: 'info' | 'danger'; serial: number } | null;
  onDismiss: () => void;
}

export function Toast({ message, onDismiss }: ToastProps) {
  const { color } = useTheme();
  useEffect(() => {
    if (!message) return;
    const t = setTimeout(onDismiss, message.tone === 'danger' ? 6000 : 3500);
    return () => clearTimeout(t);
  }, [message, onDismiss]);
  if (!message) return null;
  const danger = message.tone === 'danger';
  return (
    <View
      pointerEvents="none"
      role={danger ? 'alert' : 'status'}
      testID="editor-message"
      style={[styles.toast, { backgroundColor: danger ? color.dangerSoft : color.ink, borderColor: danger ? color.danger : color.ink }]}
    >
      <Text variant="small" style={{ color: danger ? color.ink : color.ground }}>
        {message.text}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  toast: { alignSelf: 'center', maxWidth: 520, borderWidth: 1, borderRadius: radius.md, paddingHorizontal: space.md, paddingVertical: space.sm, minHeight: 36, justifyContent: 'center' },
});
