// The voltage profile of the demo building: every load's voltage in percent of nominal against the ANSI C84.1
// bands, base case beside a what-if, and the plot's geometry (higher voltage higher up, bands where the standard
// puts them, marks beyond the axis clipped to its edge and flagged).
import { describe, expect, it } from 'vitest';
import { solveSheet, type SolveResult } from '../../../solver';
import { profileLoads, profilePlot, type ProfileLoad } from '../../../editor/studies/voltage-profile';
import { demoSheet } from '../support/fixtures';

const sheet = demoSheet('larkspur-row.json');
const solved = (whatIfId?: string): SolveResult => {
  const out = solveSheet(sheet, { whatIfId });
  if (!out.ok) throw new Error(out.error.message);
  return out.result;
};
const base = solved();
const openNeutral = solved('open-apt-4-neutral');
const box = { width: 600, height: 300, margin: { top: 10, right: 10, bottom: 30, left: 44 } };

describe('voltage profile', () => {
  it('has every load element, each in percent of its own nominal, from both cases', () => {
    const loads = profileLoads(base, openNeutral);
    expect(loads).toHaveLength(base.loads.reduce((n, l) => n + l.elements.length, 0));
    for (const l of loads) {
      const [loadId, i] = l.key.split(':');
      const b = base.loads.find((x) => x.loadId === loadId)!.elements[Number(i)];
      const w = openNeutral.loads.find((x) => x.loadId === loadId)!.elements[Number(i)];
      expect(l.base!.percent).toBeCloseTo((100 * b.volts) / b.nominalVolts, 9);
      expect(l.shown!.percent).toBeCloseTo((100 * w.volts) / w.nominalVolts, 9);
      expect(l.shown!.standing).toBe(w.standing?.standing ?? 'none');
    }
  });

  it('takes the bands from ANSI C84.1 utilization limits: a 120 V lighting load 108–125 V normal, 104–127 V tolerable', () => {
    // Source: ANSI C84.1 Table 1 utilization voltages on 120 V (from memory, as solver/standards records them).
    const light = profileLoads(base, null).find((l) => l.loadId === 'corridor-lights')!;
    expect(light.normalPercent![0]).toBeCloseTo(90, 9);
    expect(light.normalPercent![1]).toBeCloseTo((100 * 125) / 120, 9);
    expect(light.tolerablePercent![0]).toBeCloseTo((100 * 104) / 120, 9);
    expect(light.tolerablePercent![1]).toBeCloseTo((100 * 127) / 120, 9);
  });

  it('shows the open neutral of apartment 4 pushing one of its loads up and one down', () => {
    // An open neutral on a two-phase feeder puts the two legs' loads in series across 208 V: the lighter side rises
    // (common practice, no source).
    const apt4 = profileLoads(base, openNeutral).filter((l) => l.loadId.startsWith('apt-4'));
    expect(apt4.some((l) => l.shown!.percent > l.base!.percent + 1)).toBe(true);
    expect(apt4.some((l) => l.shown!.percent < l.base!.percent - 1)).toBe(true);
  });

  it('orders by the case on show lowest first when asked', () => {
    const loads = profileLoads(base, openNeutral, 'shown-voltage');
    const p = loads.map((l) => l.shown!.percent);
    expect([...p].sort((a, b) => a - b)).toEqual(p);
  });

  it('places marks in the plot, higher voltage higher up, each within its column, bands where the standard puts them', () => {
    const loads = profileLoads(base, openNeutral);
    const plot = profilePlot(loads, box);
    expect(plot.columns).toHaveLength(loads.length);
    const inPlot = (y: number) => y >= plot.plot.y - 1e-9 && y <= plot.plot.y + plot.plot.height + 1e-9;
    for (const m of plot.marks) expect(inPlot(m.y), m.key).toBe(true);
    const byKey = new Map(loads.map((l) => [l.key, l]));
    const marks = plot.marks.filter((m) => !m.clipped && m.standing !== 'dead');
    for (const a of marks.slice(0, 20)) {
      for (const b of marks.slice(0, 20)) {
        const pa = byKey.get(a.key)![a.side]!.percent;
        const pb = byKey.get(b.key)![b.side]!.percent;
        if (pa > pb + 1e-9) expect(a.y).toBeLessThan(b.y);
      }
    }
    for (const m of plot.marks) {
      const col = plot.columns.find((c) => c.key === m.key)!;
      expect(m.x).toBeGreaterThanOrEqual(col.x);
      expect(m.x).toBeLessThanOrEqual(col.x + col.width);
    }
    // The normal band of a lighting load spans 90 % to 104.2 %: its rectangle's edges sit at those heights.
    const key = loads.find((l) => l.loadId === 'corridor-lights')!.key;
    const normal = plot.bands.find((b) => b.key === key && b.kind === 'normal')!;
    const yOf = (percent: number) => plot.plot.y + plot.plot.height - ((percent - plot.domain[0]) / (plot.domain[1] - plot.domain[0])) * plot.plot.height;
    expect(normal.y).toBeCloseTo(yOf((100 * 125) / 120), 6);
    expect(normal.y + normal.height).toBeCloseTo(yOf(90), 6);
    expect(plot.ticks.some((t) => t.value === 100)).toBe(true);
  });

  it('clips a voltage beyond 200 % to the top edge and flags it', () => {
    const load: ProfileLoad = {
      key: 'x:0', loadId: 'x', name: 'X', label: 'A–N', nominalVolts: 120, normalPercent: [90, 104], tolerablePercent: [87, 106],
      base: { volts: 120, percent: 100, standing: 'normal' }, shown: { volts: 300, percent: 250, standing: 'outside' },
    };
    const plot = profilePlot([load], box);
    expect(plot.domain[1]).toBeLessThanOrEqual(200);
    const shown = plot.marks.find((m) => m.side === 'shown')!;
    expect(shown.clipped).toBe('high');
    expect(shown.y).toBeCloseTo(plot.plot.y, 9);
  });
});
