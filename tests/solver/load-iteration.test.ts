// Load behaviour with voltage: constant impedance exactly, constant current and constant power by iteration,
// the low-voltage switch, and non-convergence reported with the loads named.
import { describe, expect, it } from 'vitest';
import { solveSheet, type SolveResult } from '../../solver';
import { SheetBuilder } from './helpers/sheet-builder';

const R = 0.3;
const X = 0.4;

/** A 240 V single-phase source of impedance R + jX feeding one load at the bus. */
function oneLoad(load: Record<string, unknown>, settings: Record<string, unknown> = {}) {
  return new SheetBuilder('one load', settings)
    .source('src', { system: 'single-phase', nominalVolts: 240, strength: 'impedance', r1Ohms: R, x1Ohms: X })
    .bus('b', { phaseB: false, phaseC: false })
    .load('l', { ratedVolts: 240, ...load })
    .connect('src', 'out', 'b', 'bars', ['A', 'N'])
    .connect('b', 'bars', 'l', 'supply', ['A', 'N'])
    .sheet();
}

function solved(sheet: ReturnType<typeof oneLoad>): SolveResult {
  const outcome = solveSheet(sheet);
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

describe('load iteration', () => {
  it('constant impedance is exact in one pass', () => {
    // derived: Ohm's law, V = E Z_L / (Z_L + Z_s) with Z_L = V² / P
    const result = solved(oneLoad({ kw: 10, loadKind: 'heating' }));
    const zl = (240 * 240) / 10000;
    const expected = (240 * zl) / Math.hypot(zl + R, X);
    const load = result.loads[0];
    expect(load.model).toBe('constant-impedance');
    expect(result.convergence.iterations).toBe(1);
    expect(Math.abs(load.elements[0].volts - expected)).toBeLessThan(1e-9 * expected);
  });

  it('constant power matches the closed-form two-bus voltage', () => {
    // derived: |V|⁴ − (E² − 2(RP + XQ))|V|² + |Z|²|S|² = 0, the larger root (two-bus power flow)
    const p = 15000;
    const q = p * Math.tan(Math.acos(0.9));
    const result = solved(oneLoad({ kw: 15, powerFactor: 0.9, loadKind: 'motor' }));
    const b = 240 * 240 - 2 * (R * p + X * q);
    const v2 = (b + Math.sqrt(b * b - 4 * (R * R + X * X) * (p * p + q * q))) / 2;
    const load = result.loads[0];
    expect(load.model).toBe('constant-power');
    expect(Math.abs(load.elements[0].volts - Math.sqrt(v2))).toBeLessThan(1e-6);
    expect(Math.abs(load.kw - 15)).toBeLessThan(1e-6);
    expect(result.convergence.iterations).toBeGreaterThan(2);
    expect(result.convergence.mismatch).toBeLessThanOrEqual(result.convergence.tolerance);
  });

  it('constant current draws its rated current at its power-factor angle behind its own voltage', () => {
    // common practice, no source: a constant-current load keeps |I| = S / V_rated and its angle to V
    const result = solved(oneLoad({ kw: 24, powerFactor: 0.8, loadKind: 'lighting' }));
    const e = result.loads[0].elements[0];
    expect(e.model).toBe('constant-current');
    expect(Math.abs(e.amperes - 24000 / 0.8 / 240)).toBeLessThan(1e-6);
    // P / |S| at the terminal is still the power factor
    expect(Math.abs(e.kw / Math.hypot(e.kw, e.kvar) - 0.8)).toBeLessThan(1e-9);
    expect(e.volts).toBeLessThan(240);
  });

  it('a mix of shares lands between its pure models', () => {
    // derived: at a voltage below rating a constant-power share draws more current than a constant-impedance one
    const volts = (kind: Record<string, unknown>) => solved(oneLoad({ kw: 15, powerFactor: 0.9, ...kind })).loads[0].elements[0].volts;
    const z = volts({ constantImpedanceFraction: 1 });
    const pwr = volts({ constantPowerFraction: 1 });
    const mix = volts({ constantImpedanceFraction: 0.5, constantPowerFraction: 0.5 });
    expect(mix).toBeLessThan(z);
    expect(mix).toBeGreaterThan(pwr);
    expect(solved(oneLoad({ kw: 30, constantImpedanceFraction: 0.5, constantPowerFraction: 0.5 })).loads[0].model).toBe('mix');
  });

  it('turns a load to constant impedance below the low-voltage switch', () => {
    // source: the sheet setting (default 0.7 of rating); a 240 V load on a weak source sinks below 168 V
    const result = solved(oneLoad({ kw: 250, powerFactor: 0.9, loadKind: 'motor' }));
    const e = result.loads[0].elements[0];
    expect(e.volts).toBeLessThan(0.7 * 240);
    expect(e.switchedToImpedance).toBe(true);
    expect(e.model).toBe('constant-impedance');
    // derived: switched, it is the impedance that draws its rated power at the switch voltage, (0.7 V)² / conj(S)
    const p = 250000;
    const q = p * Math.tan(Math.acos(0.9));
    const vs2 = (0.7 * 240) ** 2;
    const zl = { re: (vs2 * p) / (p * p + q * q), im: (vs2 * q) / (p * p + q * q) };
    const expected = (240 * Math.hypot(zl.re, zl.im)) / Math.hypot(zl.re + R, zl.im + X);
    expect(Math.abs(e.volts - expected)).toBeLessThan(1e-9 * expected);
  });

  it('switches continuously: just above the switch the load draws what it draws just below', () => {
    // derived: the switched impedance matches the constant-power current at the switch voltage
    const below = solved(oneLoad({ kw: 250, powerFactor: 0.9, loadKind: 'motor' }, { lowVoltageSwitchFraction: 0.7 })).loads[0].elements[0];
    expect(Math.abs(below.kw / (250 * (below.volts / (0.7 * 240)) ** 2) - 1)).toBeLessThan(1e-9);
  });

  it('reports non-convergence as an error that names the load', () => {
    // derived: 250 kW at constant power is beyond the largest power the source impedance can deliver
    // (E² / (2(|Z| + R)) ≈ 36 kW at unity power factor), so no solution exists without the switch
    const outcome = solveSheet(oneLoad({ kw: 250, powerFactor: 0.9, loadKind: 'motor' }, { lowVoltageSwitchFraction: 0, maxLoadIterations: 100 }));
    expect(outcome.ok).toBe(false);
    if (outcome.ok) return;
    expect(outcome.error.code).toBe('not-converged');
    expect(outcome.error.elementIds).toEqual(['l']);
    expect(outcome.error.message).toMatch(/did not converge .* at loads l/);
  });
});
