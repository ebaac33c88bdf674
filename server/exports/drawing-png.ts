// The drawing as PNG: the export's SVG rasterised by resvg with the shipped fonts (no system fonts, so every
// machine draws the same), at a scale that keeps the longer side within a limit.
import { Resvg } from '@resvg/resvg-js';
import { FONT_FILES } from './fonts';

export const PNG_SCALE = 2;
// 4096 px on the longer side keeps a raster within about 64 MB, whatever the drawing's size.
export const PNG_MAX_SIDE = 4096;

/** The scale that the PNG of a drawing of this size is rendered at. */
export function pngScale(width: number, height: number): number {
  return Math.min(PNG_SCALE, PNG_MAX_SIDE / Math.max(width, height, 1));
}

export function drawingPng(svg: string, width: number, height: number): Buffer {
  const scale = pngScale(width, height);
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'width', value: Math.round(width * scale) },
    font: { loadSystemFonts: false, fontFiles: Object.values(FONT_FILES), defaultFontFamily: 'Inter', sansSerifFamily: 'Inter', monospaceFamily: 'JetBrains Mono' },
  });
  return resvg.render().asPng();
}
