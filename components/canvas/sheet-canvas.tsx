// The drawing surface: a ground with a faint dot grid, and one layer holding the whole drawing that the editor
// moves and scales as a single transform (never through React). Everything drawn comes in as props.
import { memo, useCallback, useMemo, type ComponentProps } from 'react';
import { StyleSheet, View, type LayoutChangeEvent } from 'react-native';
import { GestureDetector } from 'react-native-gesture-handler';
import Svg, { G } from 'react-native-svg';
import type { Rect } from '@/shared/symbols';
import type { Scene } from '@/editor/canvas/scene';
import type { ZoomBand } from '@/editor/canvas/canvas-controller';
import type { DrawnResults } from '@/editor/results/value-tags';
import type { CrewMember } from '@/editor/presence/crew';
import type { ConnectPreview } from '@/editor/session/editor-state';
import { conductorInk, drawingPalette, standingLook, type PhaseConvention } from '../theme/tokens';
import type { CaseMark } from '@/editor/studies/case-marks';
import { CaseMarks } from './case-marks';
import { ConnectionLine } from './connection-line';
import { CrewOverlay } from './crew-overlay';
import { ElementSymbol, terminalRings } from './element-symbol';
import { GestureMarks } from './gesture-marks';
import { ValueTagStack } from './value-tag-stack';

export interface SheetCanvasProps {
  scene: Scene;
  drawn: DrawnResults | null;
  selection: ReadonlySet<string>;
  selectedConnection: string | null;
  errorIds: ReadonlySet<string>;
  others: CrewMember[];
  box: Rect | null;
  connecting: ConnectPreview | null;
  drag: { ids: ReadonlySet<string>; dx: number; dy: number } | null;
  /** Conductors open in the document itself, "runId|conductor", used when no solve is on show. */
  documentOpen: ReadonlySet<string>;
  band: ZoomBand;
  zoom: number;
  /** Only what meets this rectangle (drawing units) is drawn; null draws everything. */
  renderRect: Rect | null;
  scheme: 'light' | 'dark';
  convention: PhaseConvention;
  showTerminals: boolean;
  /** A study's case on show: where the fault is (or the candidate cause). */
  marks?: readonly CaseMark[];
  gesture: ComponentProps<typeof GestureDetector>['gesture'];
  onGroundNode: (node: HTMLElement | null) => void;
  onWorldNode: (node: HTMLElement | null) => void;
  onSize: (width: number, height: number) => void;
}

const MARGIN = 800;
const meets = (a: Rect, b: Rect) => a.x <= b.x + b.width && a.x + a.width >= b.x && a.y <= b.y + b.height && a.y + a.height >= b.y;

function SheetCanvasView(props: SheetCanvasProps) {
  const { scene, drawn, selection, selectedConnection, errorIds, band, renderRect, scheme, convention, drag, zoom } = props;
  const palette = drawingPalette[scheme];
  const conductors = conductorInk[scheme][convention];
  const looks = standingLook[scheme];
  const showLabels = band !== 'far';
  const showTags = band !== 'far';

  const openByRun = useMemo(() => {
    const out = new Map<string, string[]>();
    for (const key of drawn?.openConductors ?? props.documentOpen) {
      const [run, c] = key.split('|');
      out.set(run, [...(out.get(run) ?? []), c]);
    }
    return out;
  }, [drawn, props.documentOpen]);

  const connectedTerminals = useMemo(() => {
    const set = new Set<string>();
    for (const c of scene.connections.values()) {
      set.add(`${c.connection.from.elementId}|${c.connection.from.terminal}`);
      set.add(`${c.connection.to.elementId}|${c.connection.to.terminal}`);
    }
    return set;
  }, [scene]);

  const visible = useMemo(
    () => [...scene.elements.values()].filter((e) => !renderRect || meets(e.bounds, renderRect)),
    [scene, renderRect],
  );
  const visibleConnections = useMemo(
    () => [...scene.connections.values()].filter((c) => !renderRect || c.points.some((p) => p.x >= renderRect.x && p.x <= renderRect.x + renderRect.width && p.y >= renderRect.y && p.y <= renderRect.y + renderRect.height)),
    [scene, renderRect],
  );
  const stacks = useMemo(() => {
    if (!drawn || !showTags) return [];
    const ids = new Set(visible.map((e) => e.element.id));
    return drawn.stacks.filter((s) => ids.has(s.elementId));
  }, [drawn, showTags, visible]);

  const rings = useMemo(
    () => (props.showTerminals && showLabels ? visible.flatMap((e) => terminalRings(e, connectedTerminals)) : []),
    [props.showTerminals, showLabels, visible, connectedTerminals],
  );

  const b = scene.bounds;
  const box = { x: Math.floor(b.x - MARGIN), y: Math.floor(b.y - MARGIN), width: Math.ceil(b.width + 2 * MARGIN), height: Math.ceil(b.height + 2 * MARGIN) };

  const groundRef = useCallback(
    (node: unknown) => {
      const el = node as HTMLElement | null;
      if (el?.style) el.style.backgroundImage = `radial-gradient(circle, ${palette.dot} 1.1px, transparent 1.4px)`;
      props.onGroundNode(el);
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [palette.dot, props.onGroundNode],
  );
  const worldRef = useCallback((node: unknown) => props.onWorldNode(node as HTMLElement | null), [props.onWorldNode]);
  const onLayout = useCallback((e: LayoutChangeEvent) => props.onSize(e.nativeEvent.layout.width, e.nativeEvent.layout.height), [props.onSize]);

  const deadConnection = (from: string, to: string) =>
    drawn?.status.get(from)?.state === 'de-energised' && drawn?.status.get(to)?.state === 'de-energised';

  return (
    <GestureDetector gesture={props.gesture}>
      <View ref={groundRef} style={[styles.ground, { backgroundColor: palette.ground }]} onLayout={onLayout} testID="sheet-canvas" collapsable={false}>
        <View ref={worldRef} style={styles.world} pointerEvents="none" testID="sheet-world">
          <Svg width={box.width} height={box.height} viewBox={`${box.x} ${box.y} ${box.width} ${box.height}`} style={{ position: 'absolute', left: box.x, top: box.y }}>
            <G>
              {visibleConnections.map((c) => (
                <ConnectionLine
                  key={c.connection.id}
                  placed={c}
                  ink={deadConnection(c.connection.from.elementId, c.connection.to.elementId) ? palette.inkDead : palette.ink}
                  selectedInk={selectedConnection === c.connection.id ? palette.selection : undefined}
                />
              ))}
            </G>
            <G>
              {visible.map((e) => (
                <ElementSymbol
                  key={e.element.id}
                  placed={e}
                  palette={palette}
                  conductors={conductors}
                  status={drawn?.status.get(e.element.id)}
                  openConductors={openByRun.get(e.element.id)?.join(',')}
                  error={errorIds.has(e.element.id)}
                  showLabel={showLabels}
                />
              ))}
            </G>
            <G>
              {stacks.map((s) => (
                <ValueTagStack
                  key={s.elementId}
                  stack={s}
                  looks={looks}
                  dx={drag?.ids.has(s.elementId) ? drag.dx : 0}
                  dy={drag?.ids.has(s.elementId) ? drag.dy : 0}
                />
              ))}
            </G>
            {props.marks?.length ? <CaseMarks marks={props.marks} palette={palette} /> : null}
            <GestureMarks
              scene={scene}
              selection={selection}
              box={props.box}
              connecting={props.connecting}
              rings={rings}
              color={palette.selection}
              ringColor={palette.terminal}
              zoom={zoom}
            />
            <CrewOverlay others={props.others} scene={scene} zoom={zoom} />
          </Svg>
        </View>
      </View>
    </GestureDetector>
  );
}

export const SheetCanvas = memo(SheetCanvasView);

const styles = StyleSheet.create({
  ground: { flex: 1, overflow: 'hidden', position: 'relative' },
  world: { position: 'absolute', left: 0, top: 0, width: 1, height: 1, overflow: 'visible' },
});
