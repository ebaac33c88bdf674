// A panel over the screen for a short form: it slides up from the bottom on a phone and sits in the middle on a
// wide screen. The scrim and Escape close it.
import type { ReactNode } from 'react';
import { KeyboardAvoidingView, Modal, Platform, Pressable, ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { useResponsive } from '../layout/use-responsive';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from './button';
import { Text } from './text';

export interface FormSheetProps {
  visible: boolean;
  title: string;
  onClose: () => void;
  children: ReactNode;
  testID?: string;
}

export function FormSheet({ visible, title, onClose, children, testID }: FormSheetProps) {
  const { color } = useTheme();
  const { isPhone } = useResponsive();
  const insets = useSafeAreaInsets();
  return (
    <Modal visible={visible} transparent animationType={isPhone ? 'slide' : 'fade'} onRequestClose={onClose}>
      <KeyboardAvoidingView
        behavior={Platform.OS === 'ios' ? 'padding' : undefined}
        style={[styles.fill, isPhone ? styles.bottom : styles.centre]}
      >
        <Pressable style={[StyleSheet.absoluteFill, { backgroundColor: color.scrim }]} onPress={onClose} accessibilityLabel="Close" />
        <View
          testID={testID}
          role="dialog"
          aria-modal
          aria-label={title}
          style={[
            styles.panel,
            { backgroundColor: color.surface, borderColor: color.line },
            isPhone ? [styles.phonePanel, { paddingBottom: Math.max(insets.bottom, space.lg) }] : styles.widePanel,
          ]}
        >
          {isPhone ? <View style={[styles.grip, { backgroundColor: color.lineStrong }]} /> : null}
          <View style={styles.head}>
            <Text variant="title" style={styles.title} role="heading">
              {title}
            </Text>
            <IconButton icon="x" label="Close" onPress={onClose} testID={testID ? `${testID}-close` : undefined} />
          </View>
          <ScrollView contentContainerStyle={styles.body} keyboardShouldPersistTaps="handled">
            {children}
          </ScrollView>
        </View>
      </KeyboardAvoidingView>
    </Modal>
  );
}

const styles = StyleSheet.create({
  fill: { flex: 1 },
  bottom: { justifyContent: 'flex-end' },
  centre: { justifyContent: 'center', alignItems: 'center', padding: space.xl },
  panel: { borderWidth: 1, maxHeight: '90%' },
  phonePanel: { borderTopLeftRadius: radius.lg, borderTopRightRadius: radius.lg, paddingTop: space.sm },
  widePanel: { width: '100%', maxWidth: 480, borderRadius: radius.lg, paddingBottom: space.lg },
  grip: { alignSelf: 'center', width: 40, height: 4, borderRadius: 2, marginBottom: space.xs },
  head: { flexDirection: 'row', alignItems: 'center', paddingLeft: space.xl, paddingRight: space.sm, paddingTop: space.sm },
  title: { flex: 1 },
  body: { paddingHorizontal: space.xl, paddingTop: space.sm, gap: space.lg },
});
