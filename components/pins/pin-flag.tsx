// A pin as drawn on the sheet: a short staff with a swallow-tailed pennant carrying the pin's number. Open pins are
// filled; resolved ones are drawn in outline only (a shape difference as well as a colour one); the pin whose
// thread is open has a heavier edge.
import Svg, { Line, Path, Text as SvgText } from 'react-native-svg';
import { fontFamily } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';

export interface PinFlagProps {
  number: number;
  resolved: boolean;
  open: boolean;
}

/** Where the staff's foot is inside the drawing, so that callers can stand it on a point. */
export const FLAG_FOOT = { x: 3, y: 33 };
export const FLAG_HEIGHT = 35;

export function flagWidth(number: number): number {
  return 24 + 7 * (String(number).length - 1);
}

export function PinFlag({ number, resolved, open }: PinFlagProps) {
  const { color, scheme } = useTheme();
  const w = flagWidth(number);
  const fill = resolved ? color.surface : color.focus;
  const edge = open ? color.primary : resolved ? color.inkMuted : scheme === 'dark' ? '#F1D9A8' : '#7A5210';
  // The dark theme's amber is light: dark figures on it, white on the light theme's deeper one.
  const ink = resolved ? color.inkMuted : scheme === 'dark' ? '#1E1608' : '#FFFFFF';
  // The pennant: from the staff's top out to a notched tail and back.
  const d = `M 3 2 L ${w} 2 L ${w - 5} 10 L ${w} 18 L 3 18 Z`;
  return (
    <Svg width={w + 2} height={FLAG_HEIGHT} viewBox={`0 0 ${w + 2} ${FLAG_HEIGHT}`}>
      <Line x1={3} y1={2} x2={3} y2={FLAG_FOOT.y} stroke={edge} strokeWidth={2} strokeLinecap="round" />
      <Path d={d} fill={fill} stroke={edge} strokeWidth={open ? 2.5 : 1.25} strokeLinejoin="round" />
      <SvgText x={(3 + w - 5) / 2 + 1} y={14.5} fontSize={11} fontFamily={fontFamily.monoMedium} fill={ink} textAnchor="middle">
        {String(number)}
      </SvgText>
    </Svg>
  );
}
