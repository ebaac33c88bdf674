// The voltage profile: each load's voltage, in percent of its nominal, against the chosen standard's bands, the
// base case beside the case on show (a what-if, a trial or a study's case). The plot's geometry (scales, ticks,
// bands, marks) is worked out here with d3-scale so that the component only draws it.
import { scaleBand, scaleLinear } from 'd3-scale';
import type { SolveResult, Standing } from '../../solver';

export type ProfileStanding = Standing['standing'] | 'dead' | 'none';

export interface ProfileSample {
  volts: number;
  percent: number;
  standing: ProfileStanding;
}

export interface ProfileLoad {
  /** `${loadId}:${element index}`: a load across two pairs of conductors has two. */
  key: string;
  loadId: string;
  name: string;
  label: string;
  nominalVolts: number;
  /** The standard's bands for this load, percent of nominal (IEC 60038 has one: both are the same). */
  normalPercent: [number, number] | null;
  tolerablePercent: [number, number] | null;
  base: ProfileSample | null;
  shown: ProfileSample | null;
}

export type ProfileOrder = 'name' | 'base-voltage' | 'shown-voltage';

function sampleOf(volts: number, nominal: number, live: boolean, standing: Standing | undefined): ProfileSample {
  return { volts, percent: (100 * volts) / nominal, standing: !live ? 'dead' : standing ? standing.standing : 'none' };
}

/** One entry per load element, in the order asked for (voltage orders put the lowest first). */
export function profileLoads(base: SolveResult, shown: SolveResult | null, order: ProfileOrder = 'name'): ProfileLoad[] {
  const byKey = new Map<string, ProfileLoad>();
  const add = (result: SolveResult, side: 'base' | 'shown') => {
    for (const load of result.loads) {
      load.elements.forEach((e, i) => {
        const key = `${load.loadId}:${i}`;
        const nominal = e.nominalVolts > 0 ? e.nominalVolts : e.ratedVolts;
        if (!(nominal > 0)) return;
        let entry = byKey.get(key);
        if (!entry) {
          const s = e.standing;
          entry = {
            key,
            loadId: load.loadId,
            name: load.name || load.loadId,
            label: e.label,
            nominalVolts: nominal,
            normalPercent: s ? [(100 * s.normalRange[0]) / nominal, (100 * s.normalRange[1]) / nominal] : null,
            tolerablePercent: s ? [(100 * s.tolerableRange[0]) / nominal, (100 * s.tolerableRange[1]) / nominal] : null,
            base: null,
            shown: null,
          };
          byKey.set(key, entry);
        }
        entry[side] = sampleOf(e.volts, nominal, load.state !== 'de-energised', e.standing);
      });
    }
  };
  add(base, 'base');
  if (shown) add(shown, 'shown');
  const loads = [...byKey.values()];
  const byName = (a: ProfileLoad, b: ProfileLoad) => a.name.localeCompare(b.name, undefined, { numeric: true }) || a.key.localeCompare(b.key);
  const pct = (s: ProfileSample | null) => (s ? s.percent : Infinity);
  if (order === 'name') return loads.sort(byName);
  const side = order === 'base-voltage' ? 'base' : 'shown';
  return loads.sort((a, b) => pct(a[side]) - pct(b[side]) || byName(a, b));
}

export interface PlotBox {
  width: number;
  height: number;
  margin: { top: number; right: number; bottom: number; left: number };
}

export interface ProfilePlot {
  /** Where each load's column sits and how wide it is. */
  columns: { key: string; x: number; width: number; centre: number }[];
  /** Per column, the bands as rectangles (tolerable under normal). */
  bands: { key: string; kind: 'tolerable' | 'normal'; x: number; width: number; y: number; height: number }[];
  marks: { key: string; side: 'base' | 'shown'; x: number; y: number; standing: ProfileStanding; clipped: 'low' | 'high' | null }[];
  /** A line from the base mark to the case's mark, where both exist. */
  links: { key: string; x: number; y1: number; y2: number }[];
  ticks: { value: number; y: number; text: string }[];
  /** 100 % of nominal. */
  nominalY: number;
  plot: { x: number; y: number; width: number; height: number };
  domain: [number, number];
}

/**
 * Scales for the profile: the voltage axis covers every band and every voltage with a little room, at least
 * 80–110 % of nominal, at most 0–200 % (a faulted or open-neutral case can go far; marks beyond are clipped at
 * the edge and say so).
 */
export function profilePlot(loads: readonly ProfileLoad[], box: PlotBox): ProfilePlot {
  const values: number[] = [80, 110];
  for (const l of loads) {
    for (const s of [l.base, l.shown]) if (s && s.standing !== 'dead') values.push(s.percent);
    if (l.tolerablePercent) values.push(...l.tolerablePercent);
  }
  const lo = Math.max(0, Math.min(...values) - 2);
  const hi = Math.min(200, Math.max(...values) + 2);
  const plot = { x: box.margin.left, y: box.margin.top, width: Math.max(1, box.width - box.margin.left - box.margin.right), height: Math.max(1, box.height - box.margin.top - box.margin.bottom) };
  const y = scaleLinear().domain([lo, hi]).range([plot.y + plot.height, plot.y]).nice(6);
  const [d0, d1] = y.domain() as [number, number];
  const x = scaleBand<string>()
    .domain(loads.map((l) => l.key))
    .range([plot.x, plot.x + plot.width])
    .paddingInner(loads.length > 40 ? 0.1 : 0.25)
    .paddingOuter(0.15);
  const width = x.bandwidth();
  const clampY = (percent: number) => {
    if (percent < d0) return { y: y(d0), clipped: 'low' as const };
    if (percent > d1) return { y: y(d1), clipped: 'high' as const };
    return { y: y(percent), clipped: null };
  };
  const columns = loads.map((l) => ({ key: l.key, x: x(l.key)!, width, centre: x(l.key)! + width / 2 }));
  const bands: ProfilePlot['bands'] = [];
  const marks: ProfilePlot['marks'] = [];
  const links: ProfilePlot['links'] = [];
  loads.forEach((l, i) => {
    const col = columns[i];
    const band = (kind: 'tolerable' | 'normal', r: [number, number] | null) => {
      if (!r) return;
      const top = y(Math.min(r[1], d1));
      const bottom = y(Math.max(r[0], d0));
      bands.push({ key: l.key, kind, x: col.x, width: col.width, y: top, height: Math.max(0, bottom - top) });
    };
    band('tolerable', l.tolerablePercent);
    band('normal', l.normalPercent);
    // Two marks side by side in the column when both cases are shown; the base case alone sits in the middle.
    const both = l.base && l.shown;
    const at = (side: 'base' | 'shown') => (both ? col.x + col.width * (side === 'base' ? 0.3 : 0.7) : col.centre);
    for (const side of ['base', 'shown'] as const) {
      const s = l[side];
      if (!s) continue;
      const c = clampY(s.standing === 'dead' ? d0 : s.percent);
      marks.push({ key: l.key, side, x: at(side), y: c.y, standing: s.standing, clipped: s.standing === 'dead' ? null : c.clipped });
    }
    if (l.base && l.shown) links.push({ key: l.key, x: col.centre, y1: clampY(l.base.percent).y, y2: clampY(l.shown.standing === 'dead' ? d0 : l.shown.percent).y });
  });
  const ticks = y.ticks(6).map((value) => ({ value, y: y(value), text: `${value} %` }));
  return { columns, bands, marks, links, ticks, nominalY: y(100), plot, domain: [d0, d1] };
}
