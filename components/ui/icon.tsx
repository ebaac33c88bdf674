// One bundled icon set (Feather, line icons in a single weight that sit well beside drawn ink).
import Feather from '@expo/vector-icons/Feather';
import type { ComponentProps } from 'react';
import { useTheme } from '../theme/use-theme';

export type IconName = ComponentProps<typeof Feather>['name'];

export interface IconProps {
  name: IconName;
  size?: number;
  color?: string;
  testID?: string;
}

export function Icon({ name, size = 20, color, testID }: IconProps) {
  const theme = useTheme();
  return <Feather name={name} size={size} color={color ?? theme.color.ink} testID={testID} aria-hidden />;
}

/** The font the icon set draws with; the root layout loads it with the text fonts. */
export const iconFont = Feather.font;
