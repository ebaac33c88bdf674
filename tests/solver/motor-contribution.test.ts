// Motors feeding a fault through their subtransient reactance.
import { describe, expect, it } from 'vitest';
import { SheetBuilder } from './helpers/sheet-builder';
import { faultStudy, solveFault, type FaultSolveResult, type FaultSpec } from '../../solver';
import type { Sheet } from '../../shared/sheet';

function fault(sheet: Sheet, spec: FaultSpec): FaultSolveResult {
  const r = solveFault(sheet, spec);
  if (!r.ok) throw new Error(r.error.message);
  return r.result;
}

const KVA = 100;
const PF = 0.85;
const RATED_AMPS = (KVA * 1000) / (Math.sqrt(3) * 480);

// A 480 V source (Z1 = Z0 = 0.005 + j0.03 Ω) feeding a motor control bus with one 100 kVA motor (85 kW at 0.85).
function plant(motor: Record<string, unknown>): SheetBuilder {
  return new SheetBuilder('plant', {})
    .source('src', { nominalVolts: 480, strength: 'impedance', r1Ohms: 0.005, x1Ohms: 0.03, r0Ohms: 0.005, x0Ohms: 0.03 })
    .bus('mcc', { role: 'service', neutralGroundBond: true })
    .connect('src', 'out', 'mcc', 'bars', ['A', 'B', 'C', 'N'])
    .load('pump', { connection: 'three-phase-delta', loadKind: 'motor', kw: KVA * PF, powerFactor: PF, ratedVolts: 480, ...motor })
    .connect('mcc', 'bars', 'pump', 'supply', ['A', 'B', 'C']);
}

const diff = (a: { re: number; im: number }, b: { re: number; im: number }) => Math.hypot(a.re - b.re, a.im - b.im);

describe('motor contribution during faults', () => {
  it('a motor at the faulted bus adds |E"| / X"d, about 5–6 times its rated current', () => {
    const without = fault(plant({}).sheet(), { busId: 'mcc', faultType: 'three-phase' });
    const withMotor = fault(plant({ contributesToFaults: true }).sheet(), { busId: 'mcc', faultType: 'three-phase' });
    const added = diff(withMotor.fault.currents.A!, without.fault.currents.A!);
    // The model (a source behind X"d carrying its pre-fault current): E" = V (1 − Y_load · jX"), so on the motor's
    // base |E"| = |1 − j 0.17 (pf − j sin φ)| pu of the pre-fault voltage, and a bolted fault at its terminals draws
    // |E"| / X" times rated current (X"d = 0.17 pu: common practice, IEEE Std 141 from memory).
    const sin = Math.sqrt(1 - PF * PF);
    const ePu = Math.hypot(1 - 0.17 * sin, 0.17 * PF);
    const vPre = withMotor.fault.prefaultVolts.A!.magnitude / (480 / Math.sqrt(3));
    expect(added / RATED_AMPS).toBeCloseTo((vPre * ePu) / 0.17, 6);
    // common practice, no source: a motor feeds about 4–6 times its rated current into a fault at its terminals
    expect(added / RATED_AMPS).toBeGreaterThan(4);
    expect(added / RATED_AMPS).toBeLessThan(6);
    // the motor's own current during the fault is that contribution
    const pump = withMotor.loads.find((l) => l.loadId === 'pump')!;
    expect(pump.elements[0].amperes * Math.sqrt(3)).toBeCloseTo(added, 3); // delta element current × √3 = line current
    expect(withMotor.kclResidual).toBeLessThan(1e-9);
    expect(withMotor.assumptions.some((a) => /pump.*subtransient reactance/.test(a))).toBe(true);
  });

  it('a motor behind a run feeds E" / (Z_run + jX"d), E" from its pre-fault current (hand Thevenin, per-phase wye)', () => {
    // 100 ft of 4 AWG Cu in PVC: NEC Chapter 9 Table 9 (seen) R 0.31, XL 0.048 Ω/1000 ft per conductor.
    const zs = { re: 0.005, im: 0.03 };
    const zr = { re: 0.031, im: 0.0048 };
    const build = (contributes: boolean) =>
      new SheetBuilder('motor behind a run', {})
        .source('src', { nominalVolts: 480, strength: 'impedance', r1Ohms: zs.re, x1Ohms: zs.im, r0Ohms: zs.re, x0Ohms: zs.im })
        .bus('mcc', { role: 'service', neutralGroundBond: true })
        .run('cable', { lengthFt: 100, conductors: { A: { size: '4' }, B: { size: '4' }, C: { size: '4' } } })
        .load('pump', { connection: 'three-phase-delta', loadKind: 'motor', kw: KVA * PF, powerFactor: PF, ratedVolts: 480, contributesToFaults: contributes })
        .connect('src', 'out', 'mcc', 'bars', ['A', 'B', 'C', 'N'])
        .connect('mcc', 'bars', 'cable', 'from', ['A', 'B', 'C'])
        .connect('cable', 'to', 'pump', 'supply', ['A', 'B', 'C'])
        .sheet();
    const spec: FaultSpec = { busId: 'mcc', faultType: 'three-phase' };
    const added = diff(fault(build(true), spec).fault.currents.A!, fault(build(false), spec).fault.currents.A!);
    // Per-phase wye equivalent (complex arithmetic by hand): Y_load = conj(S) / V_LL², X" = 0.17 V_LL² / |S|.
    type C = { re: number; im: number };
    const add = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im });
    const mul = (a: C, b: C): C => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
    const div = (a: C, b: C): C => {
      const d = b.re * b.re + b.im * b.im;
      return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d };
    };
    const s = { re: KVA * PF * 1000, im: KVA * Math.sqrt(1 - PF * PF) * 1000 };
    const zLoad = div({ re: 480 * 480, im: 0 }, { re: s.re, im: -s.im });
    const xd = { re: 0, im: (0.17 * 480 * 480) / Math.hypot(s.re, s.im) };
    const e = { re: 480 / Math.sqrt(3), im: 0 };
    const iPre = div(e, add(add(zs, zr), zLoad));
    const ePrime = add(e, mul({ re: -1, im: 0 }, mul(add(add(zs, zr), xd), iPre)));
    const hand = div(ePrime, add(zr, xd));
    expect(added).toBeCloseTo(Math.hypot(hand.re, hand.im), 6);
  });

  it('a given X"d is used: 0.25 pu feeds less than 0.17 pu, in the ratio of the reactances', () => {
    const base = fault(plant({}).sheet(), { busId: 'mcc', faultType: 'three-phase' });
    const at17 = fault(plant({ contributesToFaults: true }).sheet(), { busId: 'mcc', faultType: 'three-phase' });
    const at25 = fault(plant({ contributesToFaults: true, subtransientReactancePu: 0.25 }).sheet(), { busId: 'mcc', faultType: 'three-phase' });
    const sin = Math.sqrt(1 - PF * PF);
    const e = (x: number) => Math.hypot(1 - x * sin, x * PF) / x; // |E"| / X" on the motor's base, as above
    const ratio = diff(at25.fault.currents.A!, base.fault.currents.A!) / diff(at17.fault.currents.A!, base.fault.currents.A!);
    expect(ratio).toBeCloseTo(e(0.25) / e(0.17), 6);
  });

  it('without the flag nothing changes, and the pre-fault state is the same either way', () => {
    const spec: FaultSpec = { busId: 'mcc', faultType: 'line-to-line' };
    const plain = fault(plant({}).sheet(), spec);
    const off = fault(plant({ contributesToFaults: false, subtransientReactancePu: 0.2 }).sheet(), spec);
    expect(off.fault.currents).toEqual(plain.fault.currents);
    expect(off.fault.symmetricalKa).toBe(plain.fault.symmetricalKa);
    const on = fault(plant({ contributesToFaults: true }).sheet(), spec);
    expect(on.fault.prefaultVolts.B!.magnitude).toBeCloseTo(plain.fault.prefaultVolts.B!.magnitude, 9);
    expect(on.fault.symmetricalKa).toBeGreaterThan(plain.fault.symmetricalKa);
  });

  it('the fault study counts the motor at every bus', () => {
    const sheet = plant({ contributesToFaults: true }).sheet();
    const on = faultStudy(sheet, { faultTypes: ['three-phase'] });
    const off = faultStudy(plant({}).sheet(), { faultTypes: ['three-phase'] });
    if (!on.ok || !off.ok) throw new Error('fault study failed');
    const ka = (s: typeof on) => (s.ok ? s.study.cases.find((c) => c.busId === 'mcc')!.symmetricalKa ?? NaN : NaN);
    expect(ka(on)).toBeGreaterThan(ka(off) + (4 * RATED_AMPS) / 1000);
    if (on.ok) expect(on.study.assumptions.some((a) => /pump/.test(a))).toBe(true);
  });

  it('the flag is ignored on a load that is not a motor (a kind changed later keeps its data)', () => {
    const sheet = (contributes: boolean) =>
      plant({}).load('heater', { connection: 'three-phase-delta', loadKind: 'heating', kw: 85, ratedVolts: 480, contributesToFaults: contributes }).connect('mcc', 'bars', 'heater', 'supply', ['A', 'B', 'C']).sheet();
    const spec: FaultSpec = { busId: 'mcc', faultType: 'three-phase' };
    expect(fault(sheet(true), spec).fault.currents).toEqual(fault(sheet(false), spec).fault.currents);
    expect(fault(sheet(true), spec).assumptions.some((a) => /heater/.test(a))).toBe(false);
  });
});
