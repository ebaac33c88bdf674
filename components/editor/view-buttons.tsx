// The view's buttons over the canvas: fit the whole sheet in view, zoom in and out (the same as pinching, for
// those without two fingers free or without a trackpad).
import { StyleSheet, View } from 'react-native';
import { radius } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { IconButton } from '../ui/button';

export function ViewButtons({ onFit, onZoomIn, onZoomOut, compact }: { onFit: () => void; onZoomIn: () => void; onZoomOut: () => void; compact: boolean }) {
  const { color } = useTheme();
  return (
    <View style={[styles.box, { backgroundColor: color.surface, borderColor: color.line }]} testID="view-buttons">
      <IconButton icon="maximize" label="Fit the sheet in view" onPress={onFit} testID="view-fit" />
      {!compact ? <IconButton icon="zoom-in" label="Zoom in" onPress={onZoomIn} testID="view-zoom-in" /> : null}
      {!compact ? <IconButton icon="zoom-out" label="Zoom out" onPress={onZoomOut} testID="view-zoom-out" /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.md },
});
