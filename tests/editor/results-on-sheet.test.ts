// Results on the drawing, through drawnResults (the function the canvas draws from): the demo sheets' tags, their
// places, standings and open-conductor marks; and the small 208Y/120 system against the hand calculation.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { symbolOf, placeText } from '../../shared/symbols';
import { solveSheet, type SolveResult } from '../../solver';
import { drawnResults } from '../../editor/results/value-tags';
import { differences } from '../../editor/results/differences';
import { phasorView } from '../../editor/results/phasor-view';
import { LOAD_A_KW, LOAD_B_KW, smallSystem } from './support/small-system';

function fixture(name: string): Sheet {
  const read = readSheet(JSON.parse(readFileSync(path.join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error(JSON.stringify(read.issues));
  return read.sheet;
}

function solved(sheet: Sheet, whatIfId?: string): SolveResult {
  const out = solveSheet(sheet, { whatIfId });
  if (!out.ok) throw new Error(out.error.message);
  return out.result;
}

const tagValue = (drawn: ReturnType<typeof drawnResults>, key: string) => {
  const t = drawn.tags.get(key);
  if (!t) throw new Error(`no tag ${key}; have ${[...drawn.tags.keys()].slice(0, 20).join(', ')}`);
  return t.value;
};

describe('Larkspur Row on the drawing', () => {
  const sheet = fixture('larkspur-row.json');
  const base = solved(sheet);
  const drawn = drawnResults(sheet, base);

  it('tags every live bus with its line-to-neutral voltages and N–G, and every load with its voltage', () => {
    for (const bus of base.buses.filter((b) => b.state !== 'de-energised')) {
      for (const [phase, volts] of Object.entries(bus.lineToNeutralVolts)) {
        expect(tagValue(drawn, `${bus.busId}:ln-${phase}`)).toBe(volts);
      }
      if (bus.neutralToGroundVolts !== null) expect(tagValue(drawn, `${bus.busId}:ng`)).toBe(bus.neutralToGroundVolts);
    }
    for (const load of base.loads) {
      const keys = [...drawn.tags.keys()].filter((k) => k.startsWith(`${load.loadId}:v`));
      expect(keys.length, load.loadId).toBe(load.elements.length);
    }
  });

  it('tags every conductor of every run with its current, the neutral included', () => {
    for (const run of base.runs) {
      for (const [c, k] of Object.entries(run.conductors)) expect(tagValue(drawn, `${run.runId}:i-${c}`)).toBe(k!.current.magnitude);
    }
    const nKeys = [...drawn.tags.keys()].filter((k) => k.endsWith(':i-N'));
    expect(nKeys.length).toBe(base.runs.filter((r) => r.conductors.N).length);
  });

  it("stacks each element's tags at its symbol's tag anchor", () => {
    const service = drawn.stacks.find((s) => s.elementId === 'service')!;
    const anchor = placeText(sheet.elements.service, symbolOf(sheet.elements.service).tags);
    expect([service.x, service.y]).toEqual([anchor.x, anchor.y]);
    expect(service.x).toBeGreaterThan(sheet.elements.service.x); // beside the bar, not on it
    expect(service.tags.map((t) => t.label)).toEqual(['A–N', 'B–N', 'C–N', 'N–G']);
  });

  it('judges the service voltages against ANSI C84.1 and names the standard', () => {
    // source: ANSI C84.1 Table 1, Range A service voltage 114–126 V on a 120 V base (from memory, REFERENCES.md)
    for (const p of ['A', 'B', 'C']) {
      const t = drawn.tags.get(`service:ln-${p}`)!;
      expect(t.value).toBeGreaterThan(114);
      expect(t.value).toBeLessThan(126);
      expect(t.standing).toBe('normal');
    }
    expect(drawn.standard.label).toMatch(/ANSI C84\.1/);
    expect(drawn.tags.get('service:ln-A')!.text).toMatch(/^\d{3}\.\d$/);
  });

  it('under an open apartment neutral, the two phases share the line-to-line voltage in series and the cut is marked', () => {
    const open = solved(sheet, 'open-apt-4-neutral');
    const cut = drawnResults(sheet, open);
    expect(cut.openConductors.has('apt-4-feeder|N')).toBe(true);
    expect(drawn.openConductors.has('apt-4-feeder|N')).toBe(false);
    // The apartment's loads are in series across its A–B voltage: the loads on A and the load on B add up to it.
    // source: Kirchhoff's voltage law around the series circuit (the loads share one power factor, so their
    // voltages are in phase and their magnitudes add), common practice, no source
    const vAB = open.buses.find((b) => b.busId === 'apt-4')!.lineToLineVolts.AB!;
    const vA = tagValue(cut, 'apt-4-lights:v');
    const vB = tagValue(cut, 'apt-4-kitchen:v');
    expect(vA + vB).toBeCloseTo(vAB, 0);
    expect(tagValue(cut, 'apt-4-electronics:v')).toBeCloseTo(vA, 6); // same phase, same two points
    // the light phase rises above ANSI Range B's 127 V maximum (from memory, REFERENCES.md), the heavy one sags
    expect(vA).toBeGreaterThan(127);
    expect(cut.tags.get('apt-4-lights:v')!.standing).toBe('outside');
    expect(vB).toBeLessThan(104);
    // the opened neutral carries no current
    expect(tagValue(cut, 'apt-4-feeder:i-N')).toBeLessThan(1e-6);
    // and the side-by-side list puts those loads first
    const rows = differences(drawn, cut);
    const top = rows.slice(0, 6).map((r) => r.elementId);
    expect(top).toContain('apt-4-lights');
    expect(top).toContain('apt-4-kitchen');
    const lights = rows.find((r) => r.key === 'apt-4-lights:v')!;
    expect(lights.change).toBeCloseTo(vA - tagValue(drawn, 'apt-4-lights:v'), 9);
  });

  it("draws a bus's phasor diagram with its neutral shift", () => {
    const open = solved(sheet, 'open-apt-4-neutral');
    const bus = open.buses.find((b) => b.busId === 'apt-4')!;
    const view = phasorView(bus);
    expect(view.phases.map((p) => p.name)).toEqual(['A', 'B']);
    // each phase's distance from the neutral point is its line-to-neutral voltage (the definition of the diagram)
    const a = view.phases[0];
    const b = view.phases[1];
    const n = view.neutral!;
    expect(Math.hypot(n.re - b.re, n.im - b.im)).toBeCloseTo(bus.lineToNeutralVolts.B!, 6);
    expect(Math.hypot(n.re - a.re, n.im - a.im)).toBeCloseTo(bus.lineToNeutralVolts.A!, 6);
    expect(view.neutralShiftVolts!).toBeGreaterThan(20);
    const balanced = phasorView(base.buses.find((x) => x.busId === 'apt-4')!);
    expect(balanced.neutralShiftVolts!).toBeLessThan(2);
  });
});

describe('the farm on the drawing', () => {
  const sheet = fixture('farm.json');
  const base = solved(sheet);
  const drawn = drawnResults(sheet, base);

  it('tags the 120/240 service with two line-to-neutral voltages near 120 V', () => {
    const tags = drawn.stacks.find((s) => s.elementId === 'farm-service')!.tags.map((t) => t.label);
    expect(tags).toEqual(['A–N', 'B–N', 'N–G']);
    // source: ANSI C84.1 Table 1 Range B service 110–127 V (from memory, REFERENCES.md)
    for (const p of ['A', 'B']) {
      expect(tagValue(drawn, `farm-service:ln-${p}`)).toBeGreaterThan(110);
      expect(tagValue(drawn, `farm-service:ln-${p}`)).toBeLessThan(127);
    }
  });

  it('with the service neutral open, the two halves of the 120/240 service split apart and the cut is marked', () => {
    const result = solved(sheet, 'open-service-neutral');
    const open = drawnResults(sheet, result);
    const spread = (d: typeof drawn) => Math.abs(tagValue(d, 'farm-service:ln-A') - tagValue(d, 'farm-service:ln-B'));
    expect(spread(open)).toBeGreaterThan(spread(drawn) + 5);
    // The bond at the service keeps N–G at zero there: the bus's N–G is measured against its own ground bar.
    expect(tagValue(open, 'farm-service:ng')).toBeLessThan(1e-6);
    expect(open.openConductors.has('service-drop|N')).toBe(true);
  });
});

describe('the small 208Y/120 system against the hand calculation', () => {
  const read = (open: boolean) => {
    const r = readSheet(smallSystem(open));
    if (!r.ok) throw new Error('bad sheet');
    return r.sheet;
  };

  it('each resistive load sees about 120 V with the neutral closed', () => {
    const drawn = drawnResults(read(false), solved(read(false)));
    // source: 208Y/120 nominal system, V_LN = 208/√3 (common practice, no source); a 50 ft 4/0 feeder drops well under 1 %
    expect(tagValue(drawn, 'la:v')).toBeCloseTo(120.09, 0);
    expect(tagValue(drawn, 'lb:v')).toBeCloseTo(120.09, 0);
    expect(drawn.tags.get('la:v')!.standing).toBe('normal');
    // each tag names the bus phase the load is on (Load B's own A terminal lands on the panel's B)
    expect(drawn.tags.get('la:v')!.label).toBe('A–N');
    expect(drawn.tags.get('lb:v')!.label).toBe('B–N');
  });

  it('with the neutral open, the loads divide the line-to-line voltage as a series circuit', () => {
    const sheet = read(true);
    const result = solved(sheet);
    const drawn = drawnResults(sheet, result);
    // Resistances at rated voltage: R = V²/P (Ohm's law, common practice, no source)
    const rA = 120 ** 2 / (LOAD_A_KW * 1000);
    const rB = 120 ** 2 / (LOAD_B_KW * 1000);
    const vLL = result.buses.find((b) => b.busId === 'panel')!.lineToLineVolts.AB!;
    // source: series circuit across the line-to-line voltage, V_a = V_LL · Z_a / (Z_a + Z_b) (Ohm's law, no source)
    expect(tagValue(drawn, 'la:v')).toBeCloseTo((vLL * rA) / (rA + rB), 2);
    expect(tagValue(drawn, 'lb:v')).toBeCloseTo((vLL * rB) / (rA + rB), 2);
    // and with 208 V from an ideal source through 50 ft of 4/0, within half a volt of 208 · 12/18 = 138.7 V
    expect(Math.abs(tagValue(drawn, 'la:v') - (208 * 2) / 3)).toBeLessThan(0.5);
    expect(drawn.openConductors.has('feeder|N')).toBe(true);
    expect(drawn.tags.get('la:v')!.standing).toBe('outside');
  });

  it("marks the panel back-fed on its neutral when the neutral is open, and not when it is closed", () => {
    // An open neutral leaves the panel's neutral bar live only through the loads from the phases (a shock
    // hazard: common practice, no source); the phases themselves stay energised.
    const open = drawnResults(read(true), solved(read(true)));
    expect(open.status.get('panel')).toMatchObject({ state: 'back-fed', backFed: 'N' });
    const closed = drawnResults(read(false), solved(read(false)));
    expect(closed.status.get('panel')).toMatchObject({ state: 'energised' });
    expect(closed.status.get('panel')!.backFed).toBeUndefined();
  });
});
