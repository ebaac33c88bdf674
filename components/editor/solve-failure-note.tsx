// Over the canvas when the sheet could not be solved: what went wrong, in the solver's words, and a button that
// selects the elements it names (they glow red on the drawing), so a failure is never a drawing without answers
// and no word why.
import { StyleSheet, View } from 'react-native';
import { radius, space } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text } from '../ui/text';

export interface SolveFailureNoteProps {
  message: string;
  elementIds: string[];
  onShowWhere: (ids: string[]) => void;
  /** One line (a wide screen, whose side pane has the message): the drawing under it stays in sight. */
  compact?: boolean;
}

export function SolveFailureNote({ message, elementIds, onShowWhere, compact }: SolveFailureNoteProps) {
  const { color } = useTheme();
  return (
    <View role="alert" testID="canvas-failure" style={[styles.box, compact && styles.row, { backgroundColor: color.dangerSoft, borderColor: color.danger }]}>
      <Text variant="label">{compact ? 'No results: the sheet could not be solved (see Results)' : 'No results: the sheet could not be solved'}</Text>
      {!compact ? (
        <Text variant="small" numberOfLines={3}>
          {message}
        </Text>
      ) : null}
      {elementIds.length ? <Button label="Show where" variant="secondary" compact onPress={() => onShowWhere(elementIds)} testID="canvas-show-failure" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.md, padding: space.sm, gap: space.xs, maxWidth: 520, alignSelf: 'stretch', alignItems: 'flex-start' },
  row: { flexDirection: 'row', alignItems: 'center', alignSelf: 'flex-start', gap: space.md, paddingVertical: space.xs },
});
