// Text in the type scale: Inter for words, JetBrains Mono for numbers (tabular figures).
import { Text as RNText, type TextProps as RNTextProps } from 'react-native';
import type { TypeVariant } from '../theme/tokens';
import { useTheme } from '../theme/use-theme';

export type TextTone = 'ink' | 'muted' | 'faint' | 'primary' | 'danger' | 'success' | 'onPrimary' | 'onDanger';

export interface TextProps extends RNTextProps {
  variant?: TypeVariant;
  tone?: TextTone;
  align?: 'left' | 'center' | 'right';
}

export function Text({ variant = 'body', tone = 'ink', align, style, ...rest }: TextProps) {
  const { type, color } = useTheme();
  const toneColor: Record<TextTone, string> = {
    ink: color.ink,
    muted: color.inkMuted,
    faint: color.inkFaint,
    primary: color.primary,
    danger: color.danger,
    success: color.success,
    onPrimary: color.onPrimary,
    onDanger: color.onDanger,
  };
  const isNumber = variant === 'number' || variant === 'numberLarge';
  return (
    <RNText
      {...rest}
      style={[
        type[variant],
        { color: toneColor[tone], textAlign: align },
        isNumber && { fontVariant: ['tabular-nums'] },
        style,
      ]}
    />
  );
}
