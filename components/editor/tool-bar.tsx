// The one bar of tools at the bottom, within the thumb's reach on a phone. A viewer's bar has no editing tools:
// look, try a cut (in a trial that is never saved) and results.
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import type { ToolName } from '@/editor/session/editor-state';
import { space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { ToolButton } from './tool-button';

export interface ToolBarProps {
  tool: ToolName;
  editable: boolean;
  canUndo: boolean;
  canRedo: boolean;
  resultsOpen: boolean;
  /** On a wide screen the palette is always beside the canvas: no Add button. */
  showAdd: boolean;
  showResults: boolean;
  onTool: (tool: ToolName) => void;
  onAdd: () => void;
  onUndo: () => void;
  onRedo: () => void;
  onResults: () => void;
  /** The studies panel (fault currents, voltage profile); absent hides the button. */
  studiesOpen?: boolean;
  onStudies?: () => void;
  /** More buttons at the bar's end (the pin tool). */
  extra?: ReactNode;
}

export function ToolBar(p: ToolBarProps) {
  const { color } = useTheme();
  const insets = useSafeAreaInsets();
  return (
    <View
      testID="tool-bar"
      style={[styles.bar, { backgroundColor: color.surface, borderTopColor: color.line, paddingBottom: Math.max(insets.bottom, space.xs) }]}
    >
      <ToolButton icon="mouse-pointer" label={p.editable ? 'Select' : 'Look'} active={p.tool === 'select'} onPress={() => p.onTool('select')} testID="tool-select" />
      {p.editable && p.showAdd ? <ToolButton icon="plus-square" label="Add" active={p.tool === 'place'} onPress={p.onAdd} testID="tool-add" /> : null}
      <ToolButton icon="scissors" label={p.editable ? 'Cut' : 'Try a cut'} active={p.tool === 'cut'} onPress={() => p.onTool(p.tool === 'cut' ? 'select' : 'cut')} testID="tool-cut" />
      {p.editable ? <ToolButton icon="corner-up-left" label="Undo" disabled={!p.canUndo} onPress={p.onUndo} testID="tool-undo" /> : null}
      {p.editable ? <ToolButton icon="corner-up-right" label="Redo" disabled={!p.canRedo} onPress={p.onRedo} testID="tool-redo" /> : null}
      {p.showResults ? <ToolButton icon="activity" label="Results" active={p.resultsOpen} onPress={p.onResults} testID="tool-results" /> : null}
      {p.onStudies ? <ToolButton icon="bar-chart-2" label="Studies" active={p.studiesOpen} onPress={p.onStudies} testID="tool-studies" /> : null}
      {p.extra}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: { flexDirection: 'row', justifyContent: 'space-around', alignItems: 'center', borderTopWidth: 1, paddingTop: space.xs, paddingHorizontal: space.xs },
});
