// A panel that slides up from the bottom over the canvas on a phone (the canvas stays usable above it), with a
// title and a close button; on a wide screen the same content sits in the side pane.
import { useEffect, useRef, type ReactNode } from 'react';
import { Animated, ScrollView, StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';
import { Text } from '../ui/text';

export interface SlidingPanelProps {
  title: string;
  onClose: () => void;
  children: ReactNode;
  testID?: string;
  /** Share of the screen's height it may take. */
  maxHeightPercent?: number;
}

export function SlidingPanel({ title, onClose, children, testID, maxHeightPercent = 58 }: SlidingPanelProps) {
  const { color } = useTheme();
  const rise = useRef(new Animated.Value(40)).current;
  useEffect(() => {
    Animated.timing(rise, { toValue: 0, duration: 160, useNativeDriver: false }).start();
  }, [rise]);
  return (
    <Animated.View
      testID={testID}
      role="dialog"
      aria-label={title}
      style={[styles.panel, { backgroundColor: color.surface, borderColor: color.line, maxHeight: `${maxHeightPercent}%`, transform: [{ translateY: rise }] }]}
    >
      <View style={[styles.grip, { backgroundColor: color.lineStrong }]} />
      <View style={styles.head}>
        <Text variant="heading" style={styles.title} role="heading">
          {title}
        </Text>
        <IconButton icon="x" label={`Close ${title.toLowerCase()}`} onPress={onClose} testID={testID ? `${testID}-close` : undefined} />
      </View>
      <ScrollView contentContainerStyle={styles.body} keyboardShouldPersistTaps="handled">
        {children}
      </ScrollView>
    </Animated.View>
  );
}

/** The same content as a section of the wide screen's side pane. */
export function PaneSection({ title, children, testID, action }: { title: string; children: ReactNode; testID?: string; action?: ReactNode }) {
  const { color } = useTheme();
  return (
    <View testID={testID} style={[styles.section, { borderBottomColor: color.line }]}>
      <View style={styles.sectionHead}>
        <Text variant="caption" tone="muted" style={styles.sectionTitle}>
          {title.toUpperCase()}
        </Text>
        {action}
      </View>
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  panel: { position: 'absolute', left: 0, right: 0, bottom: 0, borderTopWidth: 1, borderTopLeftRadius: radius.lg, borderTopRightRadius: radius.lg, paddingTop: space.xs },
  grip: { alignSelf: 'center', width: 40, height: 4, borderRadius: 2 },
  head: { flexDirection: 'row', alignItems: 'center', paddingLeft: space.lg, paddingRight: space.xs },
  title: { flex: 1 },
  body: { paddingHorizontal: space.lg, paddingBottom: space.xl, gap: space.md },
  section: { borderBottomWidth: 1, paddingHorizontal: space.lg, paddingVertical: space.md, gap: space.sm },
  sectionHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', minHeight: 24 },
  sectionTitle: { letterSpacing: 0.8 },
});
