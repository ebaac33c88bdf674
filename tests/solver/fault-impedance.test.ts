// The fault impedance of a shunt-fault what-if in the sheet format: resistance and reactance, ohms.
import { describe, expect, it } from 'vitest';
import { SheetBuilder } from './helpers/sheet-builder';
import { SheetSolver, type SolveResult } from '../../solver';
import { validateSheet } from '../../shared/sheet';

function ok(outcome: { ok: true; result: SolveResult } | { ok: false; error: { message: string } }): SolveResult {
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

// Saadat, Power System Analysis, Example 10.5 (inputs seen): Z1 = Z2 = j0.22, Z0 = j0.35, Zf = j0.1 pu, 1.0 pu
// pre-fault; here on a 480 V, 1 MVA base, written as a sheet whose what-ifs carry the fault impedance.
const Z_BASE = (480 * 480) / 1e6;
const I_BASE = 1e6 / (Math.sqrt(3) * 480);
const E = 480 / Math.sqrt(3);

function sheetWith(changes: Record<string, Record<string, unknown>>, source: Record<string, unknown>) {
  const b = new SheetBuilder('fault impedance', {})
    .source('src', { nominalVolts: 480, strength: 'impedance', ...source })
    .bus('bus', { role: 'service', neutralGroundBond: true })
    .connect('src', 'out', 'bus', 'bars', ['A', 'B', 'C', 'N']);
  for (const [id, change] of Object.entries(changes)) b.whatIf(id, { f: { kind: 'shunt-fault', busId: 'bus', ...change } });
  return b;
}

const saadatSource = { r1Ohms: 0, x1Ohms: 0.22 * Z_BASE, r0Ohms: 0, x0Ohms: 0.35 * Z_BASE };

describe('fault impedance in the sheet format', () => {
  it('Saadat Example 10.5 through a what-if with faultReactanceOhms = j0.1 pu', () => {
    const sheet = sheetWith(
      {
        lg: { faultType: 'line-to-ground', faultReactanceOhms: 0.1 * Z_BASE },
        ll: { faultType: 'line-to-line', faultReactanceOhms: 0.1 * Z_BASE },
        '3ph': { faultType: 'three-phase', faultReactanceOhms: 0.1 * Z_BASE },
        bolted: { faultType: 'three-phase' },
      },
      saadatSource,
    ).sheet();
    const solver = new SheetSolver(sheet);
    const lg = ok(solver.solve('lg')).fault!;
    expect(lg.currents.A!.magnitude / I_BASE).toBeCloseTo(2.7523, 3); // source: Saadat Ex. 10.5 (derived, agrees with the book as recalled)
    expect(lg.faultOhms.im).toBeCloseTo(0.1 * Z_BASE, 12);
    const ll = ok(solver.solve('ll')).fault!;
    expect(ll.currents.B!.magnitude / I_BASE).toBeCloseTo(3.2075, 3); // source: Saadat Ex. 10.5 (derived)
    const three = ok(solver.solve('3ph')).fault!;
    expect(three.currents.A!.magnitude / I_BASE).toBeCloseTo(3.125, 3); // source: Saadat Ex. 10.5 (derived)
    const bolted = ok(solver.solve('bolted')).fault!;
    expect(bolted.currents.A!.magnitude / I_BASE).toBeCloseTo(1 / 0.22, 3); // source: Saadat Ex. 10.5, bolted 4.545 pu
  });

  it('a resistive-plus-reactive fault against a hand Thevenin calculation', () => {
    // Source Z1 = Z0 = 0.004 + j0.020 Ω; fault Zf = 0.010 + j0.015 Ω.
    // Thevenin (Ohm's law per phase, sequence networks for the ground fault, Saadat §10.3–10.5):
    //   three-phase: I = E / |Z1 + Zf|; line-to-ground: I = 3E / |Z0 + Z1 + Z2 + 3Zf|.
    const z1 = { re: 0.004, im: 0.02 };
    const zf = { re: 0.01, im: 0.015 };
    const sheet = sheetWith(
      {
        '3ph': { faultType: 'three-phase', faultOhms: zf.re, faultReactanceOhms: zf.im },
        lg: { faultType: 'line-to-ground', faultOhms: zf.re, faultReactanceOhms: zf.im },
        resistive: { faultType: 'three-phase', faultOhms: Math.hypot(zf.re, zf.im) },
      },
      { r1Ohms: z1.re, x1Ohms: z1.im, r0Ohms: z1.re, x0Ohms: z1.im },
    ).sheet();
    const solver = new SheetSolver(sheet);
    const three = ok(solver.solve('3ph')).fault!;
    const hand3 = E / Math.hypot(z1.re + zf.re, z1.im + zf.im);
    expect(three.currents.A!.magnitude).toBeCloseTo(hand3, 6);
    // the angle of the current follows the loop impedance: E∠0 / (Z1 + Zf)
    expect(three.currents.A!.angleDeg).toBeCloseTo((-Math.atan2(z1.im + zf.im, z1.re + zf.re) * 180) / Math.PI, 6);
    // the loop's X/R is that of Z1 + Zf
    expect(three.xOverR).toBeCloseTo((z1.im + zf.im) / (z1.re + zf.re), 6);
    const lg = ok(solver.solve('lg')).fault!;
    const handLg = (3 * E) / Math.hypot(3 * z1.re + 3 * zf.re, 3 * z1.im + 3 * zf.im);
    expect(lg.currents.A!.magnitude).toBeCloseTo(handLg, 6);
    // a resistive fault of the same |Zf| draws a different current: the reactance is really used
    const resistive = ok(solver.solve('resistive')).fault!;
    const handR = E / Math.hypot(z1.re + Math.hypot(zf.re, zf.im), z1.im);
    expect(resistive.currents.A!.magnitude).toBeCloseTo(handR, 6);
    expect(Math.abs(resistive.currents.A!.magnitude - three.currents.A!.magnitude)).toBeGreaterThan(100);
  });

  it('older documents without faultReactanceOhms still read, as a resistive fault', () => {
    const json = sheetWith({ old: { faultType: 'line-to-ground', faultOhms: 0.05 } }, saadatSource).json();
    const v = validateSheet(json);
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    const change = v.sheet.whatIfs.old.changes.f;
    expect(change.kind === 'shunt-fault' && change.faultReactanceOhms).toBe(0);
    const r = ok(new SheetSolver(v.sheet).solve('old')).fault!;
    expect(r.faultOhms).toEqual({ re: 0.05, im: 0 });
  });

  it('rejects a negative fault reactance, naming where', () => {
    const v = validateSheet(sheetWith({ bad: { faultType: 'three-phase', faultReactanceOhms: -1 } }, saadatSource).json());
    expect(v.ok).toBe(false);
    if (v.ok) return;
    expect(v.issues.some((i) => i.path === 'whatIfs.bad.changes.f.faultReactanceOhms' && /must not be negative/.test(i.message))).toBe(true);
  });
});
