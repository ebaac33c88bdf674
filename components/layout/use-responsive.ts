// Phone first: under 768 px wide is a phone (one column, bottom bar); 1024 px and wider puts panes side by side.
import { useWindowDimensions } from 'react-native';
import { layout } from '../theme/tokens';

export interface Responsive {
  width: number;
  height: number;
  isPhone: boolean;
  /** Wide enough for the list and the detail side by side. */
  isWide: boolean;
}

export function useResponsive(): Responsive {
  const { width, height } = useWindowDimensions();
  return { width, height, isPhone: width < layout.phoneMax, isWide: width >= layout.wideMin };
}
