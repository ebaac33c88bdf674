// The outlines of value tags, one per standing, so a standing reads without its colour: normal is a pill,
// tolerable has clipped corners, outside has pointed ends (and a heavier line), no range is a plain box.
import type { TagStandingName } from './ink';

export const TAG_HEIGHT = 16;
export const TAG_FONT_SIZE = 11;
/** JetBrains Mono's advance is 0.6 em: every figure has the same width, so tags can be sized without measuring. */
export const TAG_CHAR_WIDTH = TAG_FONT_SIZE * 0.6;
const PAD = 6;

export function tagWidth(text: string, standing: TagStandingName): number {
  const extra = standing === 'outside' ? 10 : standing === 'normal' ? 4 : 0;
  return Math.ceil(text.length * TAG_CHAR_WIDTH + 2 * PAD + extra);
}

/** The outline's path, drawn with its top-left corner at (x, y). */
export function tagOutline(standing: TagStandingName, x: number, y: number, width: number, height = TAG_HEIGHT): string {
  const r = height / 2;
  const x1 = x + width;
  const y1 = y + height;
  switch (standing) {
    case 'normal':
      return `M ${x + r} ${y} L ${x1 - r} ${y} A ${r} ${r} 0 0 1 ${x1 - r} ${y1} L ${x + r} ${y1} A ${r} ${r} 0 0 1 ${x + r} ${y} Z`;
    case 'tolerable': {
      const c = 4;
      return `M ${x + c} ${y} L ${x1 - c} ${y} L ${x1} ${y + c} L ${x1} ${y1 - c} L ${x1 - c} ${y1} L ${x + c} ${y1} L ${x} ${y1 - c} L ${x} ${y + c} Z`;
    }
    case 'outside': {
      const p = 6;
      return `M ${x + p} ${y} L ${x1 - p} ${y} L ${x1} ${y + r} L ${x1 - p} ${y1} L ${x + p} ${y1} L ${x} ${y + r} Z`;
    }
    default:
      return `M ${x} ${y} L ${x1} ${y} L ${x1} ${y1} L ${x} ${y1} Z`;
  }
}

export const tagStrokeWidth = (standing: TagStandingName) => (standing === 'outside' ? 1.8 : 1);
