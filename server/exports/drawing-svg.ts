// The drawing as a standalone SVG, drawn on the server from the same symbol geometry, colours and tag shapes as the
// canvas (shared/symbols): elements, connections, names and sizes, and the base case's value tags when given.
import { readSheet, type Sheet } from '../../shared/sheet';
import {
  conductorInk,
  drawingPalette,
  elementDetail,
  INK_WIDTH,
  placeText,
  polylinePath,
  quarterTurns,
  standingLook,
  TAG_FONT_SIZE,
  TAG_HEIGHT,
  TAG_PITCH,
  tagOutline,
  tagStrokeWidth,
  tagWidth,
  type ConductorInk,
  type ConductorLane,
  type Rect,
} from '../../shared/symbols';
import { buildScene } from '../../editor/canvas/scene';
import { connectionView, elementView, type ConnectionView, type ElementView } from '../../editor/document/sheet-mirror';
import { drawnResults, type DrawnResults } from '../../editor/results/value-tags';
import type { Plain } from '../../editor/document/y-values';
import type { SolveResult } from '../../solver';

/**
 * Font families named in the SVG; the PNG and PDF renderers map them to the font files in assets/fonts, and a
 * browser showing the SVG on its own falls back to its generic families.
 */
export const SVG_FONTS = { text: 'Inter, sans-serif', textBold: "'Inter SemiBold', Inter, sans-serif", mono: "'JetBrains Mono', monospace" } as const;

export interface DrawingSvg {
  svg: string;
  /** The drawing's size in drawing units (1 unit = 1 CSS px at scale 1). */
  width: number;
  height: number;
}

const MARGIN = 40;
const LABEL_CHAR = 6.6; // rough advance of 12 px Inter, for the extent only

const esc = (s: string) => s.replace(/[&<>"']/g, (ch) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[ch]!);
const anchorOf = (align: string) => (align === 'end' ? 'end' : align === 'middle' ? 'middle' : 'start');
const n = (v: number) => String(Math.round(v * 100) / 100);

type Json = Record<string, unknown>;
const group = (doc: Json, name: string): Record<string, Plain> =>
  doc[name] && typeof doc[name] === 'object' && !Array.isArray(doc[name]) ? (doc[name] as Record<string, Plain>) : {};

function lanePaths(lane: ConductorLane, ink: ConductorInk, baseInk: string, open: boolean, cut: string): string {
  const { from, to } = lane;
  const midY = (from.y + to.y) / 2;
  const fans = `M ${n(lane.fanIn.x)} ${n(lane.fanIn.y)} L ${n(from.x)} ${n(from.y)} M ${n(to.x)} ${n(to.y)} L ${n(lane.fanOut.x)} ${n(lane.fanOut.y)}`;
  const body = open ? `M ${n(from.x)} ${n(from.y)} L ${n(from.x)} ${n(midY - 5)} M ${n(to.x)} ${n(midY + 5)} L ${n(to.x)} ${n(to.y)}` : `M ${n(from.x)} ${n(from.y)} L ${n(to.x)} ${n(to.y)}`;
  const parts = [`<path d="${fans}" stroke="${baseInk}" stroke-width="1" fill="none"/>`];
  if (ink.casing) parts.push(`<path d="${body}" stroke="${ink.casing}" stroke-width="${INK_WIDTH + 1.6}" fill="none"/>`);
  parts.push(`<path d="${body}" stroke="${ink.stroke}" stroke-width="${INK_WIDTH}" fill="none"/>`);
  if (ink.stripe) parts.push(`<path d="${body}" stroke="${ink.stripe}" stroke-width="${INK_WIDTH}" stroke-dasharray="3 3" fill="none"/>`);
  if (open) parts.push(`<path d="M ${n(from.x - 4)} ${n(midY - 4)} L ${n(from.x + 4)} ${n(midY + 4)} M ${n(from.x + 4)} ${n(midY - 4)} L ${n(from.x - 4)} ${n(midY + 4)}" stroke="${cut}" stroke-width="${INK_WIDTH}" fill="none"/>`);
  return parts.join('');
}

/** Draws a sheet document (the JSON format, possibly unvalidated); `base` adds the value tags of that solve. */
export function drawingSvg(document: Json, options: { base?: SolveResult | null; title?: string } = {}): DrawingSvg {
  const elements = new Map<string, ElementView>(Object.entries(group(document, 'elements')).map(([id, raw]) => [id, elementView(id, raw)]));
  const connections = new Map<string, ConnectionView>(Object.entries(group(document, 'connections')).map(([id, raw]) => [id, connectionView(id, raw)]));
  const scene = buildScene({ elements, connections });
  const settings = group(document, 'settings');
  const palette = drawingPalette.light;
  const convention = settings.phaseColors === 'iec-60445' ? 'iec-60445' : 'north-american';
  const inks = conductorInk.light[convention];
  const looks = standingLook.light;

  let drawn: DrawnResults | null = null;
  if (options.base) {
    const read = readSheet(document);
    if (read.ok) drawn = drawnResults(read.sheet as Sheet, options.base);
  }
  const openByRun = new Map<string, Set<string>>();
  for (const key of drawn?.openConductors ?? []) {
    const [run, c] = key.split('|');
    openByRun.set(run, (openByRun.get(run) ?? new Set()).add(c));
  }
  if (!drawn) {
    // No solve on show: mark the conductors the document itself opens.
    for (const e of elements.values()) {
      if (e.kind !== 'run' || !e.conductors || typeof e.conductors !== 'object') continue;
      for (const [c, k] of Object.entries(e.conductors as Record<string, Plain>)) {
        if (k && typeof k === 'object' && !Array.isArray(k) && (k as Record<string, Plain>).open === true) openByRun.set(e.id, (openByRun.get(e.id) ?? new Set()).add(c));
      }
    }
  }

  // Extent: every symbol and text anchor, with room for the text itself.
  let x0 = Infinity;
  let y0 = Infinity;
  let x1 = -Infinity;
  let y1 = -Infinity;
  const grow = (r: Rect) => {
    x0 = Math.min(x0, r.x);
    y0 = Math.min(y0, r.y);
    x1 = Math.max(x1, r.x + r.width);
    y1 = Math.max(y1, r.y + r.height);
  };
  const textBox = (x: number, y: number, align: string, width: number, height: number) =>
    grow({ x: align === 'end' ? x - width : align === 'middle' ? x - width / 2 : x, y: y - height, width, height: height + 4 });

  const out: string[] = [];
  out.push(`<g id="connections">`);
  for (const c of scene.connections.values()) {
    for (const p of c.points) grow({ x: p.x, y: p.y, width: 0, height: 0 });
    out.push(`<path data-connection="${esc(c.connection.id)}" d="${polylinePath(c.points)}" stroke="${palette.ink}" stroke-width="${INK_WIDTH}" fill="none" stroke-linejoin="round"/>`);
  }
  out.push(`</g><g id="elements">`);
  for (const placed of scene.elements.values()) {
    const { element, symbol } = placed;
    grow(placed.bounds);
    const status = drawn?.status.get(element.id);
    const dead = status?.state === 'de-energised';
    const ink = dead ? palette.inkDead : status?.state === 'back-fed' ? palette.hazard : palette.ink;
    const turns = quarterTurns(element.rotationDeg);
    const open = openByRun.get(element.id) ?? new Set<string>();
    out.push(`<g data-element="${esc(element.id)}" data-kind="${esc(element.kind)}">`);
    out.push(`<g transform="translate(${n(element.x)} ${n(element.y)}) rotate(${turns * 90})">`);
    out.push(`<path d="${symbol.ink}" stroke="${ink}" stroke-width="${INK_WIDTH}"${dead ? ' stroke-dasharray="5 4"' : ''} stroke-linejoin="round" stroke-linecap="round" fill="none"/>`);
    for (const lane of symbol.lanes) out.push(lanePaths(lane, inks[lane.conductor], ink, open.has(lane.conductor), palette.error));
    if (symbol.glyph) {
      const rot = turns ? ` transform="rotate(${-turns * 90} ${symbol.glyph.x} ${symbol.glyph.y})"` : '';
      out.push(`<text x="${symbol.glyph.x}" y="${symbol.glyph.y + 5}" font-size="14" font-family="${SVG_FONTS.textBold}" text-anchor="middle" fill="${ink}"${rot}>${esc(symbol.glyph.text)}</text>`);
    }
    out.push(`</g>`);
    const label = placeText(element, symbol.label);
    const name = element.name || element.id;
    const shown = name.length > 32 ? `${name.slice(0, 31)}…` : name;
    const detail = elementDetail(element);
    out.push(`<text x="${n(label.x)}" y="${n(label.y)}" font-size="12" font-family="${SVG_FONTS.text}" text-anchor="${anchorOf(label.align)}" fill="${dead ? palette.inkDead : palette.label}">${esc(shown)}</text>`);
    textBox(label.x, label.y, label.align, shown.length * LABEL_CHAR, 12);
    if (detail) {
      out.push(`<text x="${n(label.x)}" y="${n(label.y + 14)}" font-size="11" font-family="${SVG_FONTS.mono}" text-anchor="${anchorOf(label.align)}" fill="${palette.terminal}">${esc(detail)}</text>`);
      textBox(label.x, label.y + 14, label.align, detail.length * 6.6, 11);
    }
    out.push(`</g>`);
  }
  out.push(`</g>`);
  if (drawn) {
    out.push(`<g id="value-tags">`);
    for (const s of drawn.stacks) {
      s.tags.forEach((tag, i) => {
        const text = `${tag.label} ${tag.text} ${tag.unit}`;
        const w = tagWidth(text, tag.standing);
        const x = s.x + (s.align === 'end' ? -w : s.align === 'middle' ? -w / 2 : 0);
        const y = s.y + i * TAG_PITCH - TAG_HEIGHT / 2;
        const look = looks[tag.standing];
        const inset = tag.standing === 'outside' ? 5 : tag.standing === 'normal' ? 2 : 0;
        grow({ x, y, width: w, height: TAG_HEIGHT });
        out.push(
          `<g data-tag="${esc(tag.key)}"><path d="${tagOutline(tag.standing, x, y, w)}" fill="${look.fill}" stroke="${look.stroke}" stroke-width="${tagStrokeWidth(tag.standing)}"/>` +
            `<text x="${n(x + 6 + inset)}" y="${n(y + TAG_HEIGHT - 4.5)}" font-size="${TAG_FONT_SIZE}" font-family="${SVG_FONTS.mono}" fill="${look.text}">${esc(text)}</text></g>`,
        );
      });
    }
    out.push(`</g>`);
  }
  if (!Number.isFinite(x0)) {
    x0 = 0;
    y0 = 0;
    x1 = 200;
    y1 = 100;
  }
  const vx = Math.floor(x0 - MARGIN);
  const vy = Math.floor(y0 - MARGIN);
  const width = Math.ceil(x1 - x0 + 2 * MARGIN);
  const height = Math.ceil(y1 - y0 + 2 * MARGIN);
  const title = options.title ?? (typeof document.name === 'string' ? document.name : '');
  const svg =
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="${vx} ${vy} ${width} ${height}">` +
    (title ? `<title>${esc(title)}</title>` : '') +
    `<rect x="${vx}" y="${vy}" width="${width}" height="${height}" fill="${palette.ground}"/>` +
    out.join('') +
    `</svg>`;
  return { svg, width, height };
}
