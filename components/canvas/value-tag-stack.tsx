// A stack of value tags beside what they measure: label, number and unit in tabular figures, tinted and outlined
// by standing. Each tag carries a test id and a spoken description with the same numbers.
import { memo } from 'react';
import { G, Path, Text } from 'react-native-svg';
import { TAG_PITCH } from '@/shared/symbols';
import type { TagStack } from '@/editor/results/value-tags';
import { fontFamily, type StandingLook, type TagStandingName } from '../theme/tokens';
import { TAG_FONT_SIZE, TAG_HEIGHT, tagOutline, tagStrokeWidth, tagWidth } from './tag-shapes';

export interface ValueTagStackProps {
  stack: TagStack;
  looks: Record<TagStandingName, StandingLook>;
  /** Offset of a drag preview, so tags travel with their element. */
  dx?: number;
  dy?: number;
}

function ValueTagStackView({ stack, looks, dx = 0, dy = 0 }: ValueTagStackProps) {
  return (
    <G transform={`translate(${stack.x + dx} ${stack.y + dy})`}>
      {stack.tags.map((tag, i) => {
        const text = `${tag.label} ${tag.text} ${tag.unit}`;
        const w = tagWidth(text, tag.standing);
        const x = stack.align === 'end' ? -w : stack.align === 'middle' ? -w / 2 : 0;
        const y = i * TAG_PITCH - TAG_HEIGHT / 2;
        const look = looks[tag.standing];
        const inset = tag.standing === 'outside' ? 5 : tag.standing === 'normal' ? 2 : 0;
        return (
          <G key={tag.key} testID={`tag-${tag.key}`} aria-label={tag.description} data-value={tag.value} data-standing={tag.standing}>
            <Path d={tagOutline(tag.standing, x, y, w)} fill={look.fill} stroke={look.stroke} strokeWidth={tagStrokeWidth(tag.standing)} />
            <Text x={x + 6 + inset} y={y + TAG_HEIGHT - 4.5} fontSize={TAG_FONT_SIZE} fontFamily={fontFamily.mono} fill={look.text}>
              {text}
            </Text>
          </G>
        );
      })}
    </G>
  );
}

export const ValueTagStack = memo(ValueTagStackView);
