// A connection between two terminals: one ink line (a feeder drawn as one line), heavier when selected.
import { memo } from 'react';
import { Path } from 'react-native-svg';
import { INK_WIDTH, polylinePath } from '@/shared/symbols';
import type { PlacedConnection } from '@/editor/canvas/scene';

export interface ConnectionLineProps {
  placed: PlacedConnection;
  ink: string;
  selectedInk?: string;
  dead?: boolean;
}

function ConnectionLineView({ placed, ink, selectedInk, dead }: ConnectionLineProps) {
  const d = polylinePath(placed.points);
  return (
    <>
      {selectedInk ? <Path d={d} stroke={selectedInk} strokeWidth={INK_WIDTH + 6} strokeOpacity={0.35} fill="none" strokeLinejoin="round" /> : null}
      <Path d={d} stroke={ink} strokeWidth={INK_WIDTH} fill="none" strokeLinejoin="round" strokeDasharray={dead ? '5 4' : undefined} />
    </>
  );
}

export const ConnectionLine = memo(ConnectionLineView);
