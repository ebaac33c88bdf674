// Parts of the network: de-energised, back-fed (a hazard), ungrounded; none of them may reach the caller as NaN
// or a singular-matrix exception.
import { describe, expect, it } from 'vitest';
import { solveSheet, type SolveResult } from '../../solver';
import { validateSheet } from '../../shared/sheet';
import { SheetBuilder, customRun } from './helpers/sheet-builder';
import { building } from './helpers/building';
import { nonFiniteNumbers } from './helpers/finite';

function ok(outcome: ReturnType<typeof solveSheet>): SolveResult {
  if (!outcome.ok) throw new Error(outcome.error.message);
  expect(nonFiniteNumbers(outcome.result)).toEqual([]);
  return outcome.result;
}

describe('parts of the network', () => {
  it('a panel behind an open breaker is de-energised: zeros, no NaN', () => {
    // common practice, no source: no path to a source, no voltage
    const json = building().json() as { elements: Record<string, Record<string, unknown>> };
    Object.assign(json.elements['cb-panel'], { poleA: 'open', poleB: 'open', poleC: 'open' });
    const v = validateSheet(json);
    if (!v.ok) throw new Error('invalid sheet');
    const r = ok(solveSheet(v.sheet));
    const panel = r.buses.find((x) => x.busId === 'panel')!;
    expect(panel.state).toBe('de-energised');
    expect(panel.conductors.A!.phasor.magnitude).toBe(0);
    const heat = r.loads.find((l) => l.loadId === 'heat-a')!;
    expect(heat.state).toBe('de-energised');
    expect(heat.kw).toBe(0);
    expect(heat.elements[0].standing).toBeUndefined();
    // the neutral and PE pass the breaker unswitched, so the apartment's neutral bar is still bonded to the service
    expect(r.buses.find((x) => x.busId === 'apt')!.conductors.N!.state).toBe('energised');
  });

  it('an isolated bus and a sheet with no source are de-energised, with a warning', () => {
    const r = ok(solveSheet(new SheetBuilder().bus('alone').load('l', { ratedVolts: 120, kw: 1, loadKind: 'motor' }).connect('alone', 'bars', 'l', 'supply', ['A', 'N']).sheet()));
    expect(r.buses[0].state).toBe('de-energised');
    expect(r.loads[0].elements[0].volts).toBe(0);
    expect(r.warnings.map((w) => w.message)).toContain('the sheet has no source: everything is de-energised');
  });

  it('an ungrounded delta source: phase-to-ground is shown as ungrounded, line-to-line is solved', () => {
    // common practice, no source: an ungrounded system has no defined phase-to-ground voltage
    const sheet = new SheetBuilder()
      .source('src', { system: 'three-phase-delta', nominalVolts: 480, grounding: 'ungrounded', strength: 'short-circuit-mva', shortCircuitMva: 20 })
      .run('r', customRun(200, { A: [0.05, 0.04], B: [0.05, 0.04], C: [0.05, 0.04] }))
      .bus('mcc', { neutralBar: false, groundBar: false })
      .load('m', { connection: 'three-phase-delta', ratedVolts: 480, kw: 50, powerFactor: 0.85, loadKind: 'motor' })
      .connect('src', 'out', 'r', 'from', ['A', 'B', 'C'])
      .connect('r', 'to', 'mcc', 'bars', ['A', 'B', 'C'])
      .connect('mcc', 'bars', 'm', 'supply', ['A', 'B', 'C'])
      .sheet();
    const r = ok(solveSheet(sheet));
    const mcc = r.buses[0];
    expect(mcc.ungrounded).toBe(true);
    expect(mcc.phaseToGroundVolts).toEqual({ A: 'ungrounded', B: 'ungrounded', C: 'ungrounded' });
    expect(mcc.lineToLineVolts.AB!).toBeGreaterThan(470);
    expect(mcc.lineToLineVolts.AB!).toBeLessThan(480);
    expect(Math.abs(r.loads[0].kw - 50)).toBeLessThan(1e-6);
    expect(r.warnings.some((w) => /no path to earth/.test(w.message))).toBe(true);
  });

  it('an open phase back-feeds the dead bar through a line-to-line load: live, and named a hazard', () => {
    // common practice, no source: a 240 V load across an open phase makes the dead leg live through itself
    const sheet = new SheetBuilder()
      .source('src', { system: 'split-phase', nominalVolts: 240 })
      .run('drop', customRun(100, { A: [0.1, 0.03], B: [0.1, 0.03], N: [0.1, 0.03] }))
      .bus('house', { phaseC: false })
      .load('dryer', { connection: 'line-to-line', ratedVolts: 240, kw: 5, loadKind: 'heating' })
      .load('lamp', { ratedVolts: 120, kw: 0.1, loadKind: 'heating' })
      .connect('src', 'out', 'drop', 'from', ['A', 'B', 'N'])
      .connect('drop', 'to', 'house', 'bars', ['A', 'B', 'N'])
      .connect('house', 'bars', 'dryer', 'supply', ['A', 'B'])
      .connect('house', 'bars', 'lamp', 'supply', { B: 'A', N: 'N' })
      .whatIf('open-b', { o: { kind: 'open-conductor', runId: 'drop', conductor: 'B' } })
      .sheet();
    const r = ok(solveSheet(sheet, { whatIfId: 'open-b' }));
    const house = r.buses[0];
    expect(house.conductors.B!.state).toBe('back-fed');
    expect(house.state).toBe('back-fed');
    // derived: the lamp (144 Ω) and the dryer (11.52 Ω) in series across A–N: the lamp sees most of 120 V
    expect(house.lineToNeutralVolts.B!).toBeGreaterThan(100);
    expect(r.warnings.some((w) => w.elementId === 'house' && /hazard/.test(w.message))).toBe(true);
  });

  it('a bolted tie across two phases of an ideal source is reported as a conflict', () => {
    const sheet = new SheetBuilder()
      .source('src', { nominalVolts: 208 })
      .bus('b')
      .connect('src', 'out', 'b', 'bars', ['A', 'B', 'C', 'N'])
      .connect('src', 'out', 'b', 'bars', { A: 'B' })
      .sheet();
    const outcome = solveSheet(sheet);
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.error.code).toBe('source-conflict');
    expect(outcome.error.message).toMatch(/ideal sources are shorted/);
    expect(outcome.error.elementIds).toContain('src');
  });
});
