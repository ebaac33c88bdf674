// Derived results: sequence components and unbalance, standing against ANSI C84.1 and IEC 60038, tie currents
// (breaker poles, bonds), source strengths, and the checks every solve reports.
import { describe, expect, it } from 'vitest';
import { add, complex } from 'mathjs';
import { solveSheet, type SolveResult } from '../../solver';
import { validateSheet } from '../../shared/sheet';
import { SheetBuilder } from './helpers/sheet-builder';
import { building } from './helpers/building';
import { ieee4Sheet } from './helpers/ieee4';
import { cx, loadImpedance, mag, multiply, divide, subtract, type C } from './helpers/hand';

function ok(outcome: ReturnType<typeof solveSheet>): SolveResult {
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

function service(perUnit: number, standard = 'ansi-c84.1', nominalVolts = 208) {
  const four = ['A', 'B', 'C', 'N'];
  return new SheetBuilder('standing', { voltageStandard: standard })
    .source('s', { nominalVolts, voltsPerUnit: perUnit })
    .bus('svc', { role: 'service', neutralGroundBond: true })
    .load('lamp', { ratedVolts: nominalVolts / Math.sqrt(3), kw: 0.1, loadKind: 'lighting' })
    .load('fan', { ratedVolts: nominalVolts / Math.sqrt(3), kw: 0.1, loadKind: 'motor' })
    .connect('s', 'out', 'svc', 'bars', four)
    .connect('svc', 'bars', 'lamp', 'supply', ['A', 'N'])
    .connect('svc', 'bars', 'fan', 'supply', ['A', 'N'])
    .sheet();
}

describe('symmetrical components and unbalance', () => {
  it('a balanced bus has only positive sequence; an unbalanced one reconstructs from its sequences', () => {
    // source: Fortescue; Va = V0 + V1 + V2 (derived)
    const balanced = ok(solveSheet(service(1)));
    const svc = balanced.buses[0];
    expect(Math.abs(svc.sequence!.positive.magnitude - 208 / Math.sqrt(3))).toBeLessThan(1e-6);
    expect(svc.sequence!.negative.magnitude).toBeLessThan(1e-9);
    expect(svc.unbalance!.nemaPercent).toBeLessThan(1e-9);

    const r = ok(solveSheet(ieee4Sheet({ connection: 'gry-gry', unbalanced: true }).sheet()));
    const node4 = r.buses.find((b) => b.busId === 'node-4')!;
    const s = node4.sequence!;
    const va = add(add(complex(s.zero.re, s.zero.im), complex(s.positive.re, s.positive.im)), complex(s.negative.re, s.negative.im)) as C;
    const a = node4.conductors.A!.phasor;
    const n = node4.conductors.N!.phasor;
    expect(mag(subtract(va, cx(a.re - n.re, a.im - n.im)) as C)).toBeLessThan(1e-9 * 2400);
    // NEMA MG-1 from the line-to-line magnitudes (source: REFERENCES.md, seen: 100 × max deviation / average)
    const ll = [node4.lineToLineVolts.AB!, node4.lineToLineVolts.BC!, node4.lineToLineVolts.CA!];
    const avg = (ll[0] + ll[1] + ll[2]) / 3;
    expect(node4.unbalance!.nemaPercent).toBeCloseTo((100 * Math.max(...ll.map((v) => Math.abs(v - avg)))) / avg, 9);
    expect(node4.unbalance!.negativeSequencePercent).toBeCloseTo((100 * s.negative.magnitude) / s.positive.magnitude, 9);
    expect(node4.unbalance!.nemaPercent).toBeGreaterThan(1);
  });
});

describe('standing against the chosen standard', () => {
  it('ANSI C84.1 at the service: 120 V normal, 112.8 V tolerable (Range B), 106.8 V outside', () => {
    // source: ANSI C84.1 Table 1 (REFERENCES.md, recalled): service Range A 114–126 V, Range B 110–127 V
    const standing = (pu: number) => ok(solveSheet(service(pu))).buses[0].standing.lineToNeutral.A!.standing;
    expect(standing(1)).toBe('normal');
    expect(standing(0.94)).toBe('tolerable');
    expect(standing(0.89)).toBe('outside');
    const svc = ok(solveSheet(service(1))).buses[0];
    expect(svc.standing.lineToLine.AB!.nominalVolts).toBe(208);
    expect(svc.standing.lineToNeutral.A!.normalRange).toEqual([114, 126]);
  });

  it('ANSI utilization at the equipment: a lighting load and a motor differ at 109 V', () => {
    // source: ANSI C84.1 Table 1 notes (REFERENCES.md, recalled): utilization minimum 108 V, 110 V without lighting
    const r = ok(solveSheet(service(109 / 120)));
    const lamp = r.loads.find((l) => l.loadId === 'lamp')!.elements[0].standing!;
    const fan = r.loads.find((l) => l.loadId === 'fan')!.elements[0].standing!;
    expect(lamp.standing).toBe('normal');
    expect(fan.standing).toBe('tolerable');
  });

  it('IEC 60038: 230/400 V within ±10 %', () => {
    // source: IEC 60038 (REFERENCES.md, recalled): 230/400 V ± 10 % at the supply terminals
    const standing = (pu: number) => ok(solveSheet(service(pu, 'iec-60038', 400))).buses[0].standing.lineToNeutral.A!;
    expect(standing(0.95).standing).toBe('normal');
    expect(standing(0.95).nominalVolts).toBe(230);
    expect(standing(0.88).standing).toBe('outside');
    expect(ok(solveSheet(service(1, 'iec-60038', 400))).standard.label).toMatch(/IEC 60038/);
  });
});

describe('tie currents, bonds and checks', () => {
  it('breaker pole currents equal the feeder phase currents they pass', () => {
    // derived: Kirchhoff's current law through a closed pole
    const r = ok(solveSheet(building().sheet()));
    const cb = r.breakers.find((b) => b.breakerId === 'cb-panel')!;
    const feeder = r.runs.find((x) => x.runId === 'feeder')!;
    for (const p of ['A', 'B', 'C'] as const) expect(Math.abs(cb.poles[p]!.amperes - feeder.conductors[p]!.current.magnitude)).toBeLessThan(1e-9);
    expect(cb.percentOfRating).toBeCloseTo((100 * Math.max(...(['A', 'B', 'C'] as const).map((p) => cb.poles[p]!.amperes))) / 200, 9);
    // the apartment breaker's C pole carries the apartment's B bar
    const apt = r.breakers.find((b) => b.breakerId === 'cb-apt')!;
    expect(Math.abs(apt.poles.C!.amperes - r.runs.find((x) => x.runId === 'apt-feeder')!.conductors.B!.current.magnitude)).toBeLessThan(1e-9);
  });

  it('flags a neutral-to-ground bond at a sub-panel, with the neutral current it puts on the ground path', () => {
    // source: NEC 250.24(A)(5) and 250.142(B): no bond on the load side of the service (common practice)
    const json = building().json() as { elements: Record<string, Record<string, unknown>> };
    json.elements.panel.neutralGroundBond = true;
    const v = validateSheet(json);
    if (!v.ok) throw new Error('invalid');
    const r = ok(solveSheet(v.sheet));
    const bond = r.bonds.find((b) => b.busId === 'panel')!;
    expect(bond.permitted).toBe(false);
    expect(bond.amperes).toBeGreaterThan(1);
    // the ground path now carries part of the neutral current (derived: two parallel return paths)
    expect(r.runs.find((x) => x.runId === 'feeder')!.conductors.PE!.current.magnitude).toBeGreaterThan(1);
    expect(r.warnings.some((w) => w.elementId === 'panel' && /bond .* puts .* A of neutral current on the ground path/.test(w.message))).toBe(true);
    expect(r.bonds.find((b) => b.busId === 'service')!.permitted).toBe(true);
  });

  it('reports iterations, mismatch, the KCL residual, the power balance, the assumptions and the caution', () => {
    const r = ok(solveSheet(building().sheet()));
    expect(r.convergence.iterations).toBeGreaterThan(1);
    expect(r.convergence.mismatch).toBeLessThanOrEqual(r.convergence.tolerance);
    expect(r.kclResidual).toBeLessThan(1e-12);
    // derived: source power = load power + losses
    const pb = r.powerBalance;
    expect(Math.abs(pb.sourceKw - pb.loadKw - pb.lossKw)).toBeLessThan(1e-9 * pb.sourceKw);
    expect(pb.mismatchPercent).toBeLessThan(1e-9);
    expect(r.assumptions.join(' ')).toMatch(/no mutual coupling/);
    expect(r.caution).toMatch(/engineering estimate/);
  });
});

describe('source strength', () => {
  function strongSource(strength: Record<string, unknown>, load: Record<string, unknown>) {
    const four = ['A', 'B', 'C', 'N'];
    return new SheetBuilder('src')
      .source('s', { nominalVolts: 480, ...strength })
      .bus('b')
      .load('l', { ratedVolts: 277, kw: 50, powerFactor: 0.8, loadKind: 'heating', ...load })
      .connect('s', 'out', 'b', 'bars', four)
      .connect('b', 'bars', 'l', 'supply', (load.connection as string) === 'three-phase-wye' ? four : ['A', 'N'])
      .sheet();
  }
  const z1FromKa = (ka: number, xr: number) => {
    const z = 480 / (Math.sqrt(3) * ka * 1000);
    const r = z / Math.sqrt(1 + xr * xr);
    return cx(r, r * xr);
  };

  it('25 kA at X/R 8: a balanced load sees E Z_L / (Z_L + Z1)', () => {
    // derived: |Z1| = V_LL / (√3 I_sc), R = |Z| / √(1 + (X/R)²) (common practice); balanced: positive sequence only
    const r = ok(solveSheet(strongSource({ strength: 'fault-current', faultCurrentKa: 25, xOverR: 8 }, { connection: 'three-phase-wye', ratedVolts: 480, kw: 300 })));
    const zl = loadImpedance(277.128, 100000, 0.8);
    const zLoad = multiply(zl, (480 / Math.sqrt(3)) ** 2 / 277.128 ** 2) as C;
    const expected = mag(divide(multiply(cx(480 / Math.sqrt(3)), zLoad), add(zLoad, z1FromKa(25, 8))) as C);
    expect(Math.abs(r.loads[0].elements[0].volts - expected)).toBeLessThan(1e-9 * expected);
  });

  it('one line-to-neutral load sees the self impedance (Z0 + 2 Z1) / 3', () => {
    // derived: symmetrical components, one phase loaded with its return at the source star
    const r = ok(solveSheet(strongSource({ strength: 'fault-current', faultCurrentKa: 10, xOverR: 5, zeroToPositiveRatio: 2 }, { kw: 80 })));
    const z1 = z1FromKa(10, 5);
    const z0 = multiply(z1, 2) as C;
    const self = multiply(add(z0, multiply(z1, 2)), 1 / 3) as C;
    const zl = loadImpedance(277, 80000, 0.8);
    const expected = mag(divide(multiply(cx(480 / Math.sqrt(3)), zl), add(zl, self)) as C);
    expect(Math.abs(r.loads[0].elements[0].volts - expected)).toBeLessThan(1e-9 * expected);
  });

  it('short-circuit MVA gives |Z1| = V² / S', () => {
    // derived: |Z1| = V_LL² / S_sc (common practice)
    const r = ok(solveSheet(strongSource({ strength: 'short-circuit-mva', shortCircuitMva: 15, xOverR: 4 }, { connection: 'three-phase-wye', ratedVolts: 480, kw: 300 })));
    const z = (480 * 480) / 15e6;
    const rr = z / Math.sqrt(17);
    const zl = multiply(loadImpedance(277.128, 100000, 0.8), (480 / Math.sqrt(3)) ** 2 / 277.128 ** 2) as C;
    const expected = mag(divide(multiply(cx(480 / Math.sqrt(3)), zl), add(zl, cx(rr, 4 * rr))) as C);
    expect(Math.abs(r.loads[0].elements[0].volts - expected)).toBeLessThan(1e-9 * expected);
  });
});
