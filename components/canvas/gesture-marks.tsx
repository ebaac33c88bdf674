// What this user's gestures look like while they last: the selection outlines, a selection box, the connection
// being drawn (snapping to the terminal it would land on), and open rings on terminals with nothing connected.
import { memo } from 'react';
import { Circle, G, Line, Rect } from 'react-native-svg';
import type { Point, Rect as Box } from '@/shared/symbols';
import type { ConnectPreview } from '@/editor/session/editor-state';
import type { Scene } from '@/editor/canvas/scene';

export interface GestureMarksProps {
  scene: Scene;
  selection: ReadonlySet<string>;
  box: Box | null;
  connecting: ConnectPreview | null;
  rings: Point[];
  color: string;
  ringColor: string;
  zoom: number;
}

function GestureMarksView({ scene, selection, box, connecting, rings, color, ringColor, zoom }: GestureMarksProps) {
  const k = 1 / Math.max(zoom, 0.2);
  return (
    <G>
      {rings.map((p, i) => (
        <Circle key={i} cx={p.x} cy={p.y} r={3.5} stroke={ringColor} strokeWidth={1.2} fill="none" />
      ))}
      {[...selection].map((id) => {
        const e = scene.elements.get(id);
        if (!e) return null;
        const b = e.bounds;
        return <Rect key={id} testID={`selected-${id}`} x={b.x - 5} y={b.y - 5} width={b.width + 10} height={b.height + 10} rx={4} stroke={color} strokeWidth={2 * k} fill={color} fillOpacity={0.06} />;
      })}
      {box ? <Rect x={box.x} y={box.y} width={box.width} height={box.height} stroke={color} strokeWidth={1.5 * k} strokeDasharray={`${5 * k} ${3 * k}`} fill={color} fillOpacity={0.08} /> : null}
      {connecting ? (
        <G testID="connect-preview">
          <Line x1={connecting.from.point.x} y1={connecting.from.point.y} x2={connecting.to.x} y2={connecting.to.y} stroke={color} strokeWidth={2 * k} strokeDasharray={connecting.target ? undefined : `${6 * k} ${4 * k}`} />
          <Circle cx={connecting.from.point.x} cy={connecting.from.point.y} r={5 * k} fill={color} />
          {connecting.target ? <Circle cx={connecting.target.point.x} cy={connecting.target.point.y} r={8 * k} stroke={color} strokeWidth={2 * k} fill="none" /> : null}
        </G>
      ) : null}
    </G>
  );
}

export const GestureMarks = memo(GestureMarksView);
