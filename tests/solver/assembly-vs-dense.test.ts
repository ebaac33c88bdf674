// The sheet-to-network path against an independent dense nodal analysis written by hand with mathjs: a meshed
// 208Y/120 network with a coupled source impedance (Z0 ≠ Z1), parallel runs, an electrode and mixed loads.
import { describe, expect, it } from 'vitest';
import { add, complex, inv, lusolve, matrix, multiply, subtract, zeros, type Complex as MComplex, type Matrix } from 'mathjs';
import { solveSheet } from '../../solver';
import { SheetBuilder, customRun } from './helpers/sheet-builder';
import { cx, loadImpedance, mag, polarC, type C } from './helpers/hand';

const ZR1: [number, number] = [0.08, 0.05];
const ZR2: [number, number] = [0.12, 0.06];
const ZR3: [number, number] = [0.2, 0.045];
const ohms = (perKft: [number, number], ft: number) => cx((perKft[0] * ft) / 1000, (perKft[1] * ft) / 1000);

function sheet() {
  const four = ['A', 'B', 'C', 'N'];
  return new SheetBuilder('meshed')
    .source('src', { nominalVolts: 208, strength: 'impedance', r1Ohms: 0.002, x1Ohms: 0.012, r0Ohms: 0.004, x0Ohms: 0.03 })
    .bus('svc')
    .run('r1', customRun(200, Object.fromEntries(four.map((c) => [c, ZR1]))))
    .run('r2', customRun(250, Object.fromEntries(four.map((c) => [c, ZR2]))))
    .bus('p1', { groundBar: false })
    .electrode('rod', 10)
    .run('r3', customRun(120, Object.fromEntries(four.map((c) => [c, ZR3]))))
    .bus('p2', { groundBar: false })
    .load('ln-a', { ratedVolts: 120, kw: 4, powerFactor: 0.9, loadKind: 'heating' })
    .load('ll-bc', { connection: 'line-to-line', ratedVolts: 208, kw: 6, loadKind: 'heating' })
    .load('wye', { connection: 'three-phase-wye', ratedVolts: 208, kw: 9, powerFactor: 0.8, loadKind: 'heating' })
    .load('ln-c', { ratedVolts: 120, kw: 2.5, loadKind: 'heating' })
    .connect('src', 'out', 'svc', 'bars', four)
    .connect('svc', 'bars', 'r1', 'from', four)
    .connect('svc', 'bars', 'r2', 'from', four)
    .connect('r1', 'to', 'p1', 'bars', four)
    .connect('r2', 'to', 'p1', 'bars', four)
    .connect('p1', 'bars', 'rod', 'lead', { N: 'PE' })
    .connect('p1', 'bars', 'r3', 'from', four)
    .connect('r3', 'to', 'p2', 'bars', four)
    .connect('p1', 'bars', 'ln-a', 'supply', { A: 'A', N: 'N' })
    .connect('p2', 'bars', 'll-bc', 'supply', { B: 'A', C: 'B' })
    .connect('p2', 'bars', 'wye', 'supply', four)
    .connect('p2', 'bars', 'ln-c', 'supply', { C: 'A', N: 'N' })
    .sheet();
}

/** Unknowns: svc a b c, p1 a b c n, p2 a b c n (the source neutral is solidly grounded: 0 V). */
function denseReference(): MComplex[] {
  const idx = { sa: 0, sb: 1, sc: 2, p1a: 3, p1b: 4, p1c: 5, p1n: 6, p2a: 7, p2b: 8, p2c: 9, p2n: 10 } as const;
  const n = 11;
  const Y = zeros(n, n) as Matrix;
  const I = zeros(n, 1) as Matrix;
  const addY = (i: number, j: number, y: C) => Y.set([i, j], add(Y.get([i, j]), y));
  const branch = (i: number | null, j: number | null, z: C) => {
    const y = inv(z) as unknown as C;
    if (i !== null) addY(i, i, y);
    if (j !== null) addY(j, j, y);
    if (i !== null && j !== null) {
      addY(i, j, multiply(y, -1) as C);
      addY(j, i, multiply(y, -1) as C);
    }
  };
  // Source: coupled Zs, self (Z0 + 2Z1)/3, mutual (Z0 − Z1)/3, between the EMF (known) and the terminals.
  const z1 = cx(0.002, 0.012);
  const z0 = cx(0.004, 0.03);
  const self = multiply(add(z0, multiply(z1, 2)), 1 / 3) as C;
  const mutual = multiply(subtract(z0, z1), 1 / 3) as C;
  const Zs = matrix([[self, mutual, mutual], [mutual, self, mutual], [mutual, mutual, self]]);
  const Ys = inv(Zs) as Matrix;
  const vln = 208 / Math.sqrt(3);
  const E = matrix([[polarC(vln, 0)], [polarC(vln, -120)], [polarC(vln, 120)]]);
  const inj = multiply(Ys, E) as Matrix;
  for (let i = 0; i < 3; i++) {
    for (let j = 0; j < 3; j++) addY(i, j, Ys.get([i, j]));
    I.set([i, 0], add(I.get([i, 0]), inj.get([i, 0])));
  }
  // Runs r1 and r2 in parallel (svc → p1), r3 (p1 → p2), one conductor at a time (no mutual coupling)
  for (const [z, ft] of [[ZR1, 200], [ZR2, 250]] as const) {
    branch(idx.sa, idx.p1a, ohms(z, ft));
    branch(idx.sb, idx.p1b, ohms(z, ft));
    branch(idx.sc, idx.p1c, ohms(z, ft));
    branch(null, idx.p1n, ohms(z, ft)); // the service neutral is the grounded source neutral
  }
  branch(idx.p1a, idx.p2a, ohms(ZR3, 120));
  branch(idx.p1b, idx.p2b, ohms(ZR3, 120));
  branch(idx.p1c, idx.p2c, ohms(ZR3, 120));
  branch(idx.p1n, idx.p2n, ohms(ZR3, 120));
  branch(idx.p1n, null, cx(10)); // the electrode
  // Loads at constant impedance, V² / conj(S)
  branch(idx.p1a, idx.p1n, loadImpedance(120, 4000, 0.9));
  branch(idx.p2b, idx.p2c, loadImpedance(208, 6000, 1));
  for (const ph of [idx.p2a, idx.p2b, idx.p2c]) branch(ph, idx.p2n, loadImpedance(208 / Math.sqrt(3), 3000, 0.8));
  branch(idx.p2c, idx.p2n, loadImpedance(120, 2500, 1));
  const x = lusolve(Y, I) as Matrix;
  return Array.from({ length: n }, (_, i) => x.get([i, 0]) as MComplex);
}

describe('sheet-to-network assembly against a dense mathjs nodal analysis', () => {
  it('gives the same node voltages', () => {
    // source: mathjs lusolve as the independent dense reference on a hand-written nodal matrix
    const outcome = solveSheet(sheet());
    if (!outcome.ok) throw new Error(outcome.error.message);
    const r = outcome.result;
    const x = denseReference();
    const got = (busId: string, c: 'A' | 'B' | 'C' | 'N') => r.buses.find((b) => b.busId === busId)!.conductors[c]!.phasor;
    const pairs: [string, 'A' | 'B' | 'C' | 'N', number][] = [
      ['svc', 'A', 0], ['svc', 'B', 1], ['svc', 'C', 2],
      ['p1', 'A', 3], ['p1', 'B', 4], ['p1', 'C', 5], ['p1', 'N', 6],
      ['p2', 'A', 7], ['p2', 'B', 8], ['p2', 'C', 9], ['p2', 'N', 10],
    ];
    for (const [bus, c, i] of pairs) {
      const p = got(bus, c);
      const diff = mag(subtract(complex(p.re, p.im), x[i]) as C);
      expect(diff).toBeLessThan(1e-9 * 120);
    }
    expect(r.kclResidual).toBeLessThan(1e-12);
    expect(r.powerBalance.mismatchPercent).toBeLessThan(1e-9);
  });
});
