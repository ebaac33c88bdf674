// Asks before something that cannot be undone. Our own modal: window.confirm cannot be styled or tested well.
import { Modal, Pressable, StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from './button';
import { FormMessage } from './states';
import { Text } from './text';

export interface ConfirmDialogProps {
  visible: boolean;
  title: string;
  message: string;
  confirmLabel: string;
  cancelLabel?: string;
  danger?: boolean;
  busy?: boolean;
  error?: string | null;
  onConfirm: () => void;
  onCancel: () => void;
  testID?: string;
}

export function ConfirmDialog({
  visible,
  title,
  message,
  confirmLabel,
  cancelLabel = 'Cancel',
  danger,
  busy,
  error,
  onConfirm,
  onCancel,
  testID = 'confirm-dialog',
}: ConfirmDialogProps) {
  const { color } = useTheme();
  return (
    <Modal visible={visible} transparent animationType="fade" onRequestClose={onCancel}>
      <View style={styles.centre}>
        <Pressable style={[StyleSheet.absoluteFill, { backgroundColor: color.scrim }]} onPress={busy ? undefined : onCancel} accessibilityLabel={cancelLabel} />
        <View
          testID={testID}
          role="alertdialog"
          aria-modal
          aria-label={title}
          style={[styles.panel, { backgroundColor: color.surface, borderColor: color.line }]}
        >
          <Text variant="title">{title}</Text>
          <Text tone="muted">{message}</Text>
          <FormMessage message={error} />
          <View style={styles.buttons}>
            <Button label={cancelLabel} variant="secondary" onPress={onCancel} disabled={busy} testID={`${testID}-cancel`} style={styles.button} />
            <Button
              label={confirmLabel}
              variant={danger ? 'danger' : 'primary'}
              onPress={onConfirm}
              loading={busy}
              testID={`${testID}-confirm`}
              style={styles.button}
            />
          </View>
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  centre: { flex: 1, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  panel: { width: '100%', maxWidth: 420, borderWidth: 1, borderRadius: radius.lg, padding: space.xl, gap: space.md },
  buttons: { flexDirection: 'row', gap: space.md, marginTop: space.sm },
  button: { flex: 1 },
});
