// The voltage profile: each load's voltage in percent of nominal against the sheet's standard bands, the base case
// beside the worst case of the break sweep and each what-if, drawn as a standalone SVG for the report (plain
// arithmetic for the scale: d3-scale is not a dependency) with the same figures in a table under it.
import type { Sheet } from '../../shared/sheet';
import { SheetSolver, type SolveResult } from '../../solver';
import { SVG_FONTS } from '../exports/drawing-svg';
import { openedName, reportSweep } from './break-sweep-study';
import type { ExtraStudy } from './extra-studies';
import { fixed } from './study-rows';

const LOAD_LIMIT = 40;
const WHAT_IF_LIMIT = 4;
const WORST_CASE_ID = '__worst-break__';

interface Series {
  name: string;
  color: string;
  shape: 'circle' | 'triangle' | 'square' | 'diamond';
  /** Percent of nominal of each load's worst element, by load id. */
  percent: Map<string, number>;
}

interface LoadRow {
  id: string;
  name: string;
  element: string;
  nominalVolts: number;
}

const COLORS = ['#1E2830', '#B3261E', '#2F6DB5', '#7A5A00', '#2E7D4F', '#7B3FA0'];
const SHAPES: Series['shape'][] = ['circle', 'triangle', 'square', 'diamond', 'square', 'diamond'];

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');

/** Each load's element farthest from nominal, in percent of nominal. */
function percents(r: SolveResult): Map<string, number> {
  const out = new Map<string, number>();
  for (const l of r.loads) {
    let worst: number | undefined;
    for (const e of l.elements) {
      if (!(e.nominalVolts > 0)) continue;
      const p = (e.volts / e.nominalVolts) * 100;
      if (worst === undefined || Math.abs(p - 100) > Math.abs(worst - 100)) worst = p;
    }
    if (worst !== undefined) out.set(l.loadId, worst);
  }
  return out;
}

/** The normal and tolerable bands in percent of nominal, from the base case's first judged load. */
function bands(r: SolveResult): { normal: [number, number]; tolerable: [number, number]; label: string } {
  for (const l of r.loads)
    for (const e of l.elements)
      if (e.standing) {
        const n = e.standing.nominalVolts;
        const pct = (v: [number, number]): [number, number] => [(v[0] / n) * 100, (v[1] / n) * 100];
        return { normal: pct(e.standing.normalRange), tolerable: pct(e.standing.tolerableRange), label: e.standing.label };
      }
  return { normal: [95, 105], tolerable: [90, 110], label: r.standard.label };
}

function marker(shape: Series['shape'], x: number, y: number, color: string): string {
  const r = 3.2;
  switch (shape) {
    case 'circle':
      return `<circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${r}" fill="${color}"/>`;
    case 'triangle':
      return `<path d="M ${x.toFixed(1)} ${(y - r).toFixed(1)} L ${(x + r).toFixed(1)} ${(y + r).toFixed(1)} L ${(x - r).toFixed(1)} ${(y + r).toFixed(1)} Z" fill="${color}"/>`;
    case 'square':
      return `<rect x="${(x - r + 0.5).toFixed(1)}" y="${(y - r + 0.5).toFixed(1)}" width="${2 * r - 1}" height="${2 * r - 1}" fill="none" stroke="${color}" stroke-width="1.2"/>`;
    case 'diamond':
      return `<path d="M ${x.toFixed(1)} ${(y - r).toFixed(1)} L ${(x + r).toFixed(1)} ${y.toFixed(1)} L ${x.toFixed(1)} ${(y + r).toFixed(1)} L ${(x - r).toFixed(1)} ${y.toFixed(1)} Z" fill="none" stroke="${color}" stroke-width="1.2"/>`;
  }
}

/** The plot: one line per load, percent of nominal across, the bands shaded behind. */
export function profileSvg(loads: LoadRow[], series: Series[], band: ReturnType<typeof bands>): { svg: string; width: number; height: number } {
  const width = 512;
  const labelW = 178;
  const right = 14;
  const rowH = 12;
  const legendRows = series.length;
  const top = 14 + legendRows * 13 + 16;
  const plotH = loads.length * rowH;
  const height = top + plotH + 30;
  const all = series.flatMap((s) => [...s.percent.values()]);
  // The axis spans the tolerable band and every value, in steps of 10 %, clipped to 0–250 %.
  const lo = Math.max(0, Math.floor(Math.min(band.tolerable[0] - 5, ...all) / 10) * 10);
  const hi = Math.min(250, Math.ceil(Math.max(band.tolerable[1] + 5, ...all) / 10) * 10);
  const x = (p: number) => labelW + ((Math.min(hi, Math.max(lo, p)) - lo) / (hi - lo)) * (width - labelW - right);
  const step = hi - lo > 120 ? 20 : 10;
  const parts: string[] = [];
  parts.push(`<rect x="${x(band.tolerable[0]).toFixed(1)}" y="${top}" width="${(x(band.tolerable[1]) - x(band.tolerable[0])).toFixed(1)}" height="${plotH}" fill="#EFE8D6"/>`);
  parts.push(`<rect x="${x(band.normal[0]).toFixed(1)}" y="${top}" width="${(x(band.normal[1]) - x(band.normal[0])).toFixed(1)}" height="${plotH}" fill="#DCEBDD"/>`);
  for (let t = lo; t <= hi; t += step) {
    parts.push(`<line x1="${x(t).toFixed(1)}" y1="${top}" x2="${x(t).toFixed(1)}" y2="${top + plotH}" stroke="${t === 100 ? '#5B666E' : '#D5CFC2'}" stroke-width="${t === 100 ? 0.8 : 0.4}"/>`);
    parts.push(`<text x="${x(t).toFixed(1)}" y="${top + plotH + 11}" font-family="${SVG_FONTS.text}" font-size="7.5" fill="#5B666E" text-anchor="middle">${t}</text>`);
  }
  parts.push(`<text x="${(labelW + (width - right)) / 2}" y="${top + plotH + 24}" font-family="${SVG_FONTS.text}" font-size="8" fill="#1E2830" text-anchor="middle">Load voltage, % of nominal (green: normal range; tan: tolerable range)</text>`);
  loads.forEach((l, i) => {
    const y = top + i * rowH + rowH / 2;
    if (i % 2 === 1) parts.push(`<rect x="0" y="${(y - rowH / 2).toFixed(1)}" width="${labelW - 4}" height="${rowH}" fill="#F4EFE3"/>`);
    const label = l.name.length > 44 ? `${l.name.slice(0, 43)}…` : l.name;
    parts.push(`<text x="${labelW - 6}" y="${(y + 2.6).toFixed(1)}" font-family="${SVG_FONTS.text}" font-size="7.5" fill="#1E2830" text-anchor="end">${esc(label)}</text>`);
    parts.push(`<line x1="${labelW}" y1="${y.toFixed(1)}" x2="${width - right}" y2="${y.toFixed(1)}" stroke="#E4DED1" stroke-width="0.3"/>`);
    for (const s of series) {
      const p = s.percent.get(l.id);
      if (p !== undefined) parts.push(marker(s.shape, x(p), y, s.color));
    }
  });
  series.forEach((s, i) => {
    const lx = 6;
    const ly = 14 + i * 13;
    const name = s.name.length > 100 ? `${s.name.slice(0, 99)}…` : s.name;
    parts.push(marker(s.shape, lx + 4, ly - 3, s.color));
    parts.push(`<text x="${lx + 12}" y="${ly}" font-family="${SVG_FONTS.text}" font-size="8" fill="#1E2830">${esc(name)}</text>`);
  });
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}">${parts.join('')}</svg>`;
  return { svg, width, height };
}

export const voltageProfileStudy: ExtraStudy = {
  id: 'voltage-profile',
  title: 'Voltage profile',
  run(sheet) {
    const sweep = reportSweep(sheet);
    const worst = sweep.cases.find((c) => !c.problem);
    // The worst break as a what-if of its own, solved with the sheet's load laws like every other case.
    const withWorst: Sheet = worst ? { ...sheet, whatIfs: { ...sheet.whatIfs, [WORST_CASE_ID]: { id: WORST_CASE_ID, name: 'worst break', changes: { open: worst.change } } } } : sheet;
    const solver = new SheetSolver(withWorst);
    const baseOut = solver.solve();
    if (!baseOut.ok) throw new Error(`the base case could not be solved: ${baseOut.error.message}`);
    const base = baseOut.result;
    const series: Series[] = [{ name: 'Base case', color: COLORS[0], shape: SHAPES[0], percent: percents(base) }];
    const skipped: string[] = [];
    if (worst) {
      const o = solver.solve(WORST_CASE_ID);
      if (o.ok) series.push({ name: `Worst break: ${openedName(worst)}`, color: COLORS[1], shape: SHAPES[1], percent: percents(o.result) });
      else skipped.push(`the worst break (${openedName(worst)}): ${o.error.message}`);
    }
    const whatIfs = Object.values(sheet.whatIfs);
    for (const w of whatIfs.slice(0, WHAT_IF_LIMIT)) {
      const o = solver.solve(w.id);
      const k = series.length;
      if (o.ok) series.push({ name: `What-if: ${w.name || w.id}`, color: COLORS[k % COLORS.length], shape: SHAPES[k % SHAPES.length], percent: percents(o.result) });
      else skipped.push(`${w.name || w.id}: ${o.error.message}`);
    }
    const allLoads: LoadRow[] = base.loads.map((l) => {
      const e = l.elements[0];
      return { id: l.loadId, name: l.name, element: l.elements.length > 1 ? `${l.elements.length} elements` : (e?.label ?? '—'), nominalVolts: e?.nominalVolts ?? NaN };
    });
    // Loads farthest from nominal in any case first when they do not all fit.
    const spread = (id: string) => Math.max(0, ...series.map((s) => Math.abs((s.percent.get(id) ?? 100) - 100)));
    const shown = allLoads.length > LOAD_LIMIT ? [...allLoads].sort((a, b) => spread(b.id) - spread(a.id)).slice(0, LOAD_LIMIT) : allLoads;
    const band = bands(base);
    const figure = profileSvg(shown, series, band);
    const rows: (string | number | null)[][] = shown.map((l) => [l.name, fixed(l.nominalVolts, 0), ...series.map((s) => fixed(s.percent.get(l.id)))]);
    if (allLoads.length > shown.length) rows.push([`… and ${allLoads.length - shown.length} more`, '', ...series.map(() => '')]);
    // Short headers keep the columns narrow; the notes name each what-if.
    const firstWhatIf = worst && series[1]?.name.startsWith('Worst') ? 2 : 1;
    const caseCols = series.map((_, i) => (i === 0 ? 'Base' : i < firstWhatIf ? 'Worst break' : `What-if ${i - firstWhatIf + 1}`));
    const whatIfNames = series.slice(firstWhatIf).map((s, i) => `What-if ${i + 1}: ${s.name.replace(/^What-if: /, '')}.`);
    return [
      {
        title: 'Load voltages in percent of nominal',
        columns: ['Load', 'Nominal V', ...caseCols],
        widths: [26, 8, ...series.map(() => 66 / series.length)],
        align: ['left', 'right', ...series.map(() => 'right' as const)],
        rows,
        figure,
        notes: [
          `Each load at its element farthest from nominal. Bands: ${band.label}; normal ${fixed(band.normal[0])}–${fixed(band.normal[1])} %, tolerable ${fixed(band.tolerable[0])}–${fixed(band.tolerable[1])} % of nominal.`,
          ...whatIfNames,
          worst ? `The worst break (${openedName(worst)}) is the top case of the break sweep, solved here with the sheet's load laws.` : 'The break sweep found no case to show.',
          ...(whatIfs.length > WHAT_IF_LIMIT ? [`The first ${WHAT_IF_LIMIT} what-ifs are drawn; ${whatIfs.length - WHAT_IF_LIMIT} more are in the what-if tables.`] : []),
          ...skipped.map((s) => `Not drawn: ${s}.`),
        ],
      },
    ];
  },
};
