// What-ifs as data over the base case: openings, degraded conductors and lugs, open poles, load scaling, and
// shunt faults (one per what-if). An opening reuses the base factors (block update) and agrees with a fresh solve.
import { describe, expect, it } from 'vitest';
import { SheetSolver, solveSheet, type SolveResult } from '../../solver';
import { validateSheet } from '../../shared/sheet';
import { building } from './helpers/building';

function ok(outcome: ReturnType<typeof solveSheet>): SolveResult {
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

const loadVolts = (r: SolveResult, id: string) => r.loads.find((l) => l.loadId === id)!.elements.map((e) => e.volts);

describe('what-ifs', () => {
  it('an open conductor solved through the base factors equals a fresh solve with the conductor open', () => {
    // derived: the block update and a full factorization of the same matrix give the same voltages
    const sheet = building().whatIf('open-apt-n', { cut: { kind: 'open-conductor', runId: 'apt-feeder', conductor: 'N' } }).sheet();
    const solver = new SheetSolver(sheet);
    const viaBase = ok(solver.solve('open-apt-n'));
    expect(['low-rank', 'refactor']).toContain(viaBase.linearSolve.method);
    const json = building().json() as { elements: Record<string, { conductors?: Record<string, { open?: boolean }> }> };
    json.elements['apt-feeder'].conductors!.N.open = true;
    const v = validateSheet(json);
    if (!v.ok) throw new Error('invalid');
    const fresh = ok(solveSheet(v.sheet));
    expect(fresh.linearSolve.method).toBe('factor');
    for (const id of ['apt-kitchen', 'apt-bed', 'heat-a']) {
      loadVolts(viaBase, id).forEach((volts, i) => expect(Math.abs(volts - loadVolts(fresh, id)[i])).toBeLessThan(1e-7 * volts));
    }
    // an open apartment neutral: the 1.8 kW kitchen sags and the 0.4 kW bedroom swells (common practice, no source)
    expect(loadVolts(viaBase, 'apt-bed')[0]).toBeGreaterThan(150);
    expect(loadVolts(viaBase, 'apt-kitchen')[0]).toBeLessThan(100);
    expect(viaBase.openNeutral).toBe(true);
    expect(viaBase.loads.find((l) => l.loadId === 'apt-bed')!.elements[0].constantImpedanceVolts).toBeGreaterThan(0);
  });

  it('a what-if never changes the base case', () => {
    // derived: what-ifs are data over the base case, not copies that overwrite it
    const sheet = building().whatIf('w', { cut: { kind: 'open-conductor', runId: 'feeder', conductor: 'N' } }).sheet();
    const solver = new SheetSolver(sheet);
    const before = ok(solver.solve());
    ok(solver.solve('w'));
    const after = ok(solver.solve());
    expect(loadVolts(after, 'heat-a')).toEqual(loadVolts(before, 'heat-a'));
    expect(sheet.elements.feeder.kind === 'run' && sheet.elements.feeder.conductors.N!.open).toBe(false);
  });

  it('a degraded lug at the panel equals the same resistance added to the feeder neutral', () => {
    // derived: both put 2 Ω in series with the same neutral path
    const sheet = building()
      .whatIf('lug', { l: { kind: 'degrade-connection', connectionId: 'c-panel', conductor: 'N', ohms: 2 } })
      .whatIf('splice', { s: { kind: 'degrade-conductor', runId: 'feeder', conductor: 'N', addedOhms: 2 } })
      .sheet();
    const solver = new SheetSolver(sheet);
    const lug = ok(solver.solve('lug'));
    const splice = ok(solver.solve('splice'));
    for (const id of ['heat-a', 'lights-b', 'apt-bed']) {
      loadVolts(lug, id).forEach((v, i) => expect(Math.abs(v - loadVolts(splice, id)[i])).toBeLessThan(1e-6));
    }
    // the lug changes the merged nodes, so it is refactored; the splice keeps the pattern
    expect(lug.linearSolve.method).toBe('factor');
    expect(['low-rank', 'refactor', 'reused-analysis']).toContain(splice.linearSolve.method);
  });

  it('an open breaker pole de-energises line-to-neutral loads on that phase and back-feeds through a line-to-line load', () => {
    // common practice, no source: a 208 V load across A–B keeps the A bar live from B when pole A opens
    const sheet = building().whatIf('pole', { p: { kind: 'open-pole', breakerId: 'cb-panel', pole: 'A' } }).sheet();
    const r = ok(new SheetSolver(sheet).solve('pole'));
    const panel = r.buses.find((b) => b.busId === 'panel')!;
    expect(panel.conductors.A!.state).toBe('back-fed');
    expect(r.warnings.some((w) => w.elementId === 'panel' && /hazard: .* back-fed/.test(w.message))).toBe(true);
    expect(r.breakers.find((b) => b.breakerId === 'cb-panel')!.poles.A).toEqual({ state: 'open', amperes: 0 });
  });

  it('scales the loads of a panel, or everything downstream of it', () => {
    // derived: constant-power loads draw factor × their power; constant-impedance ones scale with V² as well
    const sheet = building()
      .whatIf('half-downstream', { s: { kind: 'scale-loads', elementId: 'panel', factor: 0.5, scope: 'downstream' } })
      .whatIf('half-panel', { s: { kind: 'scale-loads', elementId: 'panel', factor: 0.5, scope: 'panel' } })
      .sheet();
    const solver = new SheetSolver(sheet);
    const base = ok(solver.solve());
    const down = ok(solver.solve('half-downstream'));
    const panelOnly = ok(solver.solve('half-panel'));
    const kw = (r: SolveResult, id: string) => r.loads.find((l) => l.loadId === id)!.kw;
    expect(Math.abs(kw(down, 'motor') - 0.5 * kw(base, 'motor'))).toBeLessThan(1e-6);
    expect(Math.abs(kw(down, 'apt-bed') - 0.5 * kw(base, 'apt-bed'))).toBeLessThan(1e-6);
    expect(Math.abs(kw(panelOnly, 'motor') - 0.5 * kw(base, 'motor'))).toBeLessThan(1e-6);
    // 'panel' stops at the next bus: the apartment's loads keep their power
    expect(Math.abs(kw(panelOnly, 'apt-bed') - kw(base, 'apt-bed'))).toBeLessThan(1e-3);
  });

  it('solves a shunt-fault what-if and rejects two faults in one what-if, with the change named', () => {
    const sheet = building()
      .whatIf('fault', { f: { kind: 'shunt-fault', busId: 'panel', faultType: 'line-to-ground' } })
      .whatIf('two', { f: { kind: 'shunt-fault', busId: 'panel', faultType: 'line-to-ground' }, g: { kind: 'shunt-fault', busId: 'apt', faultType: 'three-phase' } })
      .sheet();
    const solver = new SheetSolver(sheet);
    const fault = ok(solver.solve('fault'));
    // common practice: a bolted ground fault at a panel draws far more than the panel's 200 A rating
    expect(fault.fault?.symmetricalKa).toBeGreaterThan(1);
    const two = solver.solve('two');
    expect(two.ok).toBe(false);
    if (two.ok) return;
    expect(two.error.code).toBe('not-supported');
    expect(two.error.message).toMatch(/what-if two, change g: one shunt fault per what-if/);
  });

  it('names the what-ifs it has when asked for one it does not', () => {
    const outcome = solveSheet(building().whatIf('real', {}).sheet(), { whatIfId: 'nope' });
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.error.message).toMatch(/no what-if "nope" \(it has real\)/);
  });

  it('ignores a change whose target was deleted, with a warning', () => {
    const sheet = building().whatIf('stale', { x: { kind: 'open-conductor', runId: 'gone', conductor: 'N' } }).sheet();
    const r = ok(solveSheet(sheet, { whatIfId: 'stale' }));
    expect(r.warnings.some((w) => /what-if stale, change x: run gone does not exist .*ignored/.test(w.message))).toBe(true);
  });
});
