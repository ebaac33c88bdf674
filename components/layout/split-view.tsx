// Wide screens: a fixed list pane beside the detail. Phones never use it; they show one pane at a time.
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { layout } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';

export function SplitView({ list, detail }: { list: ReactNode; detail: ReactNode }) {
  const { color } = useTheme();
  return (
    <View style={[styles.row, { backgroundColor: color.ground }]}>
      <View style={[styles.list, { borderRightColor: color.line }]}>{list}</View>
      <View style={styles.detail}>{detail}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flex: 1, flexDirection: 'row' },
  list: { width: layout.paneWidth, borderRightWidth: 1 },
  detail: { flex: 1 },
});
