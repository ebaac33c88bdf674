// Where the editor's parts go. Phone: the canvas fills the screen, one bar of tools at the bottom, details and
// results slide up over the canvas. Wide: the palette on the left, the canvas in the middle, the inspector and
// results on the right; the same parts, nothing hidden that the phone shows.
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';

export interface EditorLayoutProps {
  isPhone: boolean;
  topBar: ReactNode;
  canvas: ReactNode;
  /** Over the canvas, filling it, under everything else: the pins. */
  canvasLayer?: ReactNode;
  /** Over the canvas, at its top: the legend and the cut chooser. */
  overlay: ReactNode;
  /** Over the canvas, in its top right corner: the view's own buttons. */
  corner: ReactNode;
  /** Over the canvas, under the legend: what just happened. */
  footnote: ReactNode;
  toolBar: ReactNode;
  /** Wide only: the left pane. */
  leftPane: ReactNode;
  /** Wide only: the right pane. */
  rightPane: ReactNode;
  /** Phone only: the panel sliding up, if one is open. */
  panel: ReactNode;
  /** Phone only: the selection's bar, when nothing slides over it. */
  peek: ReactNode;
  /** Wide only: a view too wide for the side pane, over the canvas. */
  cover?: ReactNode;
  /** Wide only: a pane under the canvas (the studies), the drawing still in sight above it. */
  bottomPane?: ReactNode;
}

export function EditorLayout(p: EditorLayoutProps) {
  const { color } = useTheme();
  const stage = (
    <View style={styles.stage}>
      {p.canvas}
      {p.canvasLayer}
      <View style={styles.overlay} pointerEvents="box-none">
        {p.overlay}
        <View style={styles.footnote} pointerEvents="none">
          {p.footnote}
        </View>
      </View>
      <View style={styles.corner}>{p.corner}</View>
      {p.isPhone ? (p.panel ?? p.peek) : (p.cover ?? null)}
    </View>
  );
  if (p.isPhone) {
    return (
      <View style={[styles.root, { backgroundColor: color.ground }]} testID="editor-phone">
        {p.topBar}
        {stage}
        {p.toolBar}
      </View>
    );
  }
  return (
    <View style={[styles.root, { backgroundColor: color.ground }]} testID="editor-wide">
      {p.topBar}
      <View style={styles.row}>
        {p.leftPane ? (
          <ScrollView style={[styles.left, { backgroundColor: color.surface, borderRightColor: color.line }]} contentContainerStyle={styles.leftBody}>
            {p.leftPane}
          </ScrollView>
        ) : null}
        <View style={styles.centre}>
          {stage}
          {p.bottomPane ? (
            <ScrollView style={[styles.bottom, { backgroundColor: color.surface, borderTopColor: color.line }]} contentContainerStyle={styles.bottomBody} testID="bottom-pane">
              {p.bottomPane}
            </ScrollView>
          ) : null}
          {p.toolBar}
        </View>
        <ScrollView style={[styles.right, { backgroundColor: color.surface, borderLeftColor: color.line }]} testID="side-pane">
          {p.rightPane}
        </ScrollView>
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  stage: { flex: 1, position: 'relative', overflow: 'hidden' },
  overlay: { position: 'absolute', top: space.sm, left: space.sm, right: space.sm, gap: space.sm, alignItems: 'flex-start' },
  footnote: { alignSelf: 'stretch', alignItems: 'center' },
  corner: { position: 'absolute', top: space.sm, right: space.sm, gap: space.xs },
  row: { flex: 1, flexDirection: 'row' },
  left: { width: 232, flexGrow: 0, borderRightWidth: 1 },
  leftBody: { padding: space.md, gap: space.md },
  centre: { flex: 1 },
  right: { width: 380, flexGrow: 0, borderLeftWidth: 1 },
  bottom: { flexGrow: 0, flexShrink: 0, height: '48%', borderTopWidth: 1 },
  bottomBody: { padding: space.lg, gap: space.md },
});
