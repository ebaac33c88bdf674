// The others on the sheet: each one's cursor with their name, the outline of what they have selected and the
// preview of what they are dragging, all in their own colour. Sizes are divided by the zoom to stay readable.
import { memo } from 'react';
import { G, Path, Rect, Text } from 'react-native-svg';
import type { CrewMember } from '@/editor/presence/crew';
import type { Scene } from '@/editor/canvas/scene';
import { fontFamily } from '../theme/tokens';

export interface CrewOverlayProps {
  others: CrewMember[];
  scene: Scene;
  zoom: number;
}

function CrewOverlayView({ others, scene, zoom }: CrewOverlayProps) {
  const k = 1 / Math.max(zoom, 0.2);
  return (
    <G>
      {others.map((m) => (
        <G key={m.clientId} testID={`crew-marks-${m.userId}`}>
          {m.selection.map((id) => {
            const e = scene.elements.get(id);
            if (!e) return null;
            const b = e.bounds;
            return <Rect key={id} x={b.x - 6} y={b.y - 6} width={b.width + 12} height={b.height + 12} rx={4} stroke={m.color} strokeWidth={2 * k} strokeDasharray={`${6 * k} ${4 * k}`} fill="none" />;
          })}
          {m.drag
            ? m.drag.ids.map((id) => {
                const e = scene.elements.get(id);
                if (!e) return null;
                const b = e.bounds;
                return <Rect key={`drag-${id}`} x={b.x + m.drag!.dx} y={b.y + m.drag!.dy} width={b.width} height={b.height} rx={4} fill={m.color} fillOpacity={0.12} stroke={m.color} strokeWidth={1.5 * k} />;
              })
            : null}
          {m.cursor ? (
            <G testID={`crew-cursor-${m.userId}`} transform={`translate(${m.cursor.x} ${m.cursor.y}) scale(${k})`}>
              <Path d="M 0 0 L 0 16 L 4.5 12 L 8 19 L 10.5 18 L 7 11 L 13 11 Z" fill={m.color} stroke="#FFFFFF" strokeWidth={1} />
              <Rect x={12} y={14} width={m.name.length * 6.6 + 10} height={16} rx={3} fill={m.color} />
              <Text x={17} y={26} fontSize={11} fontFamily={fontFamily.medium} fill="#FFFFFF">
                {m.name}
              </Text>
            </G>
          ) : null}
        </G>
      ))}
    </G>
  );
}

export const CrewOverlay = memo(CrewOverlayView);
