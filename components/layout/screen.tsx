// A screen's frame: the ground colour, a scrolling column that stops growing on wide screens, and an optional
// bottom bar for the primary actions (within reach of the thumb on a phone).
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { layout, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';

export interface ScreenProps {
  children: ReactNode;
  /** Buttons for the bottom bar. */
  footer?: ReactNode;
  /** Leave room for the status bar when no header sits above (sign-in screens). */
  padTop?: boolean;
  scroll?: boolean;
  maxWidth?: number;
  /** Centre the column vertically (short forms). */
  centred?: boolean;
  testID?: string;
}

export function Screen({ children, footer, padTop, scroll = true, maxWidth = layout.contentMaxWidth, centred, testID }: ScreenProps) {
  const { color } = useTheme();
  const insets = useSafeAreaInsets();
  const column = <View style={[styles.column, { maxWidth }]}>{children}</View>;
  return (
    <View testID={testID} style={[styles.root, { backgroundColor: color.ground, paddingTop: padTop ? insets.top : 0 }]}>
      {scroll ? (
        <ScrollView
          style={styles.fill}
          contentContainerStyle={[styles.content, centred && styles.centred]}
          keyboardShouldPersistTaps="handled"
        >
          {column}
        </ScrollView>
      ) : (
        <View style={[styles.fill, styles.content, centred && styles.centred]}>{column}</View>
      )}
      {footer ? <ActionBar>{footer}</ActionBar> : null}
    </View>
  );
}

/** The bottom bar; also used on its own at the foot of a pane. */
export function ActionBar({ children }: { children: ReactNode }) {
  const { color } = useTheme();
  const insets = useSafeAreaInsets();
  return (
    <View
      style={[
        styles.bar,
        { backgroundColor: color.surface, borderTopColor: color.line, paddingBottom: Math.max(insets.bottom, space.md) },
      ]}
    >
      <View style={[styles.barRow, { maxWidth: layout.contentMaxWidth }]}>{children}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  fill: { flex: 1 },
  content: { flexGrow: 1, alignItems: 'center', paddingHorizontal: space.lg, paddingVertical: space.xl },
  centred: { justifyContent: 'center' },
  column: { width: '100%', gap: space.lg },
  bar: { borderTopWidth: 1, paddingTop: space.md, paddingHorizontal: space.lg, alignItems: 'center' },
  barRow: { width: '100%', flexDirection: 'row', gap: space.md, justifyContent: 'flex-end' },
});
