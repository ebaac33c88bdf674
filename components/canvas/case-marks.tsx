// Marks for a case shown from a study, over the drawing: a fault is a jagged stroke into the bus with a label of
// its type and current, in the error ink with a heavier outline so that it reads without colour; a candidate
// cause at a lug is a ring with its label in the hazard ink.
import { memo } from 'react';
import { G, Path, Rect, Text as SvgText } from 'react-native-svg';
import type { CaseMark } from '@/editor/studies/case-marks';
import { fontFamily, type DrawingPalette } from '../theme/tokens';
import { TAG_CHAR_WIDTH, TAG_FONT_SIZE, TAG_HEIGHT } from './tag-shapes';

function FaultMark({ mark, palette }: { mark: CaseMark; palette: DrawingPalette }) {
  const { x, y } = mark;
  // A zigzag from up-left into the bus's left end, ending in an arrowhead.
  const bolt = `M ${x - 46} ${y - 30} L ${x - 24} ${y - 14} L ${x - 32} ${y - 8} L ${x - 6} ${y}`;
  const head = `M ${x - 6} ${y} L ${x - 16} ${y - 1} M ${x - 6} ${y} L ${x - 11} ${y - 9}`;
  const width = Math.ceil(mark.label.length * TAG_CHAR_WIDTH + 12);
  const lx = x - 46 - width + 10;
  const ly = y - 30 - TAG_HEIGHT - 2;
  return (
    <G testID={`case-mark-${mark.key}`}>
      <Path d={bolt} stroke={palette.ground} strokeWidth={6} fill="none" strokeLinejoin="round" />
      <Path d={bolt} stroke={palette.error} strokeWidth={2.6} fill="none" strokeLinejoin="round" />
      <Path d={head} stroke={palette.error} strokeWidth={2.6} fill="none" strokeLinecap="round" />
      <Rect x={lx} y={ly} width={width} height={TAG_HEIGHT} rx={2} fill={palette.ground} stroke={palette.error} strokeWidth={1.8} />
      <SvgText x={lx + 6} y={ly + TAG_HEIGHT - 4} fontSize={TAG_FONT_SIZE} fontFamily={fontFamily.monoMedium} fill={palette.error}>
        {mark.label}
      </SvgText>
    </G>
  );
}

/** A candidate cause at a lug: a ring around the landing with a dashed leader to its label. */
function CandidateMark({ mark, palette }: { mark: CaseMark; palette: DrawingPalette }) {
  const { x, y } = mark;
  const width = Math.ceil(mark.label.length * TAG_CHAR_WIDTH + 12);
  const lx = x - 30 - width;
  const ly = y - 34;
  return (
    <G testID={`case-mark-${mark.key}`}>
      <Path d={`M ${x - 9} ${y} A 9 9 0 1 1 ${x + 9} ${y} A 9 9 0 1 1 ${x - 9} ${y} Z`} stroke={palette.hazard} strokeWidth={2.4} fill="none" />
      <Path d={`M ${x - 8} ${y - 5} L ${lx + width} ${ly + TAG_HEIGHT / 2}`} stroke={palette.hazard} strokeWidth={1.4} strokeDasharray="3 2" fill="none" />
      <Rect x={lx} y={ly} width={width} height={TAG_HEIGHT} rx={TAG_HEIGHT / 2} fill={palette.ground} stroke={palette.hazard} strokeWidth={1.6} />
      <SvgText x={lx + 6} y={ly + TAG_HEIGHT - 4} fontSize={TAG_FONT_SIZE} fontFamily={fontFamily.monoMedium} fill={palette.hazard}>
        {mark.label}
      </SvgText>
    </G>
  );
}

function CaseMarksView({ marks, palette }: { marks: readonly CaseMark[]; palette: DrawingPalette }) {
  return (
    <G>
      {marks.map((m) => (m.kind === 'fault' ? <FaultMark key={m.key} mark={m} palette={palette} /> : <CandidateMark key={m.key} mark={m} palette={palette} />))}
    </G>
  );
}

export const CaseMarks = memo(CaseMarksView);
