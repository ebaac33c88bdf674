// The pins over the canvas, in screen positions that follow the view, each a finger-sized button that opens its
// thread. While a pin is being placed, the layer takes the next tap on the canvas and says so.
import { Pressable, StyleSheet, View, type GestureResponderEvent } from 'react-native';
import type { Point } from '@/shared/symbols';
import { radius, space, touchTargetMin } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { FLAG_FOOT, PinFlag } from './pin-flag';

export interface PinMark {
  id: string;
  number: number;
  resolved: boolean;
  /** The point the flag stands on, in drawing units. */
  at: Point;
  label: string;
}

export interface PinLayerProps {
  pins: PinMark[];
  viewport: { x: number; y: number; zoom: number };
  size: { width: number; height: number };
  openId: string | null;
  placing: boolean;
  onOpen: (pinId: string) => void;
  /** A tap while placing, in the layer's own pixels. */
  onPlace: (screen: Point) => void;
  onCancelPlacing: () => void;
}

/** The flag's foot sits on the point; the button around it is a touch target. */
const PAD = (touchTargetMin - 36) / 2 + 4;

export function PinLayer(p: PinLayerProps) {
  const { color } = useTheme();
  const place = (e: GestureResponderEvent) => {
    const n = e.nativeEvent as unknown as { locationX?: number; locationY?: number; offsetX?: number; offsetY?: number };
    const x = n.locationX ?? n.offsetX ?? 0;
    const y = n.locationY ?? n.offsetY ?? 0;
    p.onPlace({ x, y });
  };
  const { x: vx, y: vy, zoom } = p.viewport;
  return (
    <View style={StyleSheet.absoluteFill} pointerEvents="box-none" testID="pin-layer">
      {p.placing ? (
        <Pressable
          style={[StyleSheet.absoluteFill, styles.catcher]}
          onPress={place}
          accessibilityRole="button"
          accessibilityLabel="Place the pin here"
          testID="pin-target-layer"
        />
      ) : null}
      {p.pins.map((pin) => {
        const sx = pin.at.x * zoom + vx;
        const sy = pin.at.y * zoom + vy;
        if (sx < -60 || sy < -60 || sx > p.size.width + 60 || sy > p.size.height + 60) return null;
        return (
          <Pressable
            key={pin.id}
            onPress={() => p.onOpen(pin.id)}
            accessibilityRole="button"
            accessibilityLabel={`Pin ${pin.number}${pin.resolved ? ', resolved' : ''}: ${pin.label}`}
            testID={`pin-flag-${pin.number}`}
            pointerEvents={p.placing ? 'none' : 'auto'}
            style={[styles.flag, { left: sx - FLAG_FOOT.x - PAD, top: sy - FLAG_FOOT.y - PAD, padding: PAD }]}
          >
            <PinFlag number={pin.number} resolved={pin.resolved} open={pin.id === p.openId} />
          </Pressable>
        );
      })}
      {p.placing ? (
        <View style={[styles.hint, { backgroundColor: color.surface, borderColor: color.lineStrong }]} pointerEvents="box-none" testID="pin-placing-hint">
          <Text variant="small" style={styles.hintText}>
            Tap an element or a point on the sheet for the pin.
          </Text>
          <Button label="Cancel" variant="quiet" compact onPress={p.onCancelPlacing} testID="pin-placing-cancel" />
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  catcher: { cursor: 'crosshair' } as object,
  flag: { position: 'absolute' },
  hint: {
    position: 'absolute',
    left: space.sm,
    right: space.sm,
    bottom: space.sm,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    paddingLeft: space.md,
    borderWidth: 1,
    borderRadius: radius.md,
  },
  hintText: { flex: 1 },
});
