// The IEEE PES 4 Node Test Feeder (REFERENCES.md), built as a sheet and run through the whole path from JSON to
// results: the grounded wye–grounded wye step-down case with the balanced load against the published values,
// then the other connections and the unbalanced load against the invariants they must obey.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { solveDocument, solveSheet, type SolveResult } from '../../solver';
import { symmetricalComponents } from '../../solver/sequence';
import { ieee4Sheet, type Ieee4Options } from './helpers/ieee4';
import { cx, mag, type C } from './helpers/hand';
import { add, arg, complex, divide } from 'mathjs';

const fixture = JSON.parse(readFileSync(join(__dirname, 'fixtures', 'ieee-4-node-gry-gry-step-down-balanced.json'), 'utf8'));

function solvedFixture(): SolveResult {
  const outcome = solveDocument(fixture);
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

function solved(options: Ieee4Options): SolveResult {
  const outcome = solveSheet(ieee4Sheet(options).sheet());
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

/** Line-to-neutral phasor of a bus conductor (against the bus neutral, or remote earth without one). */
function lineToNeutral(result: SolveResult, busId: string, phase: 'A' | 'B' | 'C') {
  const bus = result.buses.find((b) => b.busId === busId)!;
  const p = bus.conductors[phase]!.phasor;
  const n = bus.conductors.N?.phasor ?? { re: 0, im: 0 };
  const re = p.re - n.re;
  const im = p.im - n.im;
  return { magnitude: Math.hypot(re, im), angleDeg: (Math.atan2(im, re) * 180) / Math.PI, c: cx(re, im) };
}

function current(result: SolveResult, runId: string, conductor: 'A' | 'B' | 'C' | 'N') {
  return result.runs.find((r) => r.runId === runId)!.conductors[conductor]!.current;
}

/** Half a unit of the last printed digit. */
const printed = (text: string) => {
  const decimals = text.includes('.') ? text.split('.')[1].length : 0;
  return { value: Number(text), tolerance: 0.5 * 10 ** -decimals + 1e-9 };
};

// source: IEEE PES 4 Node Test Feeder (Kersting, Radial Distribution Test Feeders, 2001), REFERENCES.md, recalled
// (from memory): GrY–GrY step-down, balanced load; magnitude / angle in degrees
const PUBLISHED: { what: string; read: (r: SolveResult, ph: 'A' | 'B' | 'C') => { magnitude: number; angleDeg: number }; values: [string, string][] }[] = [
  { what: 'V2', read: (r, ph) => lineToNeutral(r, 'node-2', ph), values: [['7107', '-0.3'], ['7140', '-120.3'], ['7121', '119.6']] },
  { what: 'V3', read: (r, ph) => lineToNeutral(r, 'node-3', ph), values: [['2247.6', '-3.7'], ['2269', '-123.5'], ['2256', '116.4']] },
  { what: 'V4', read: (r, ph) => lineToNeutral(r, 'node-4', ph), values: [['1918', '-9.1'], ['2061', '-128.3'], ['1981', '110.9']] },
  { what: 'I12', read: (r, ph) => current(r, 'line-12', ph), values: [['347.9', '-34.9'], ['323.7', '-154.2'], ['336.8', '85.0']] },
  { what: 'I34', read: (r, ph) => current(r, 'line-34', ph), values: [['1042.8', '-34.9'], ['970.2', '-154.2'], ['1009.6', '85.0']] },
];

describe('IEEE 4 Node Test Feeder: GrY–GrY step-down, balanced load, against the published values', () => {
  const result = solvedFixture();
  for (const row of PUBLISHED) {
    (['A', 'B', 'C'] as const).forEach((phase, i) => {
      it(`${row.what} phase ${phase.toLowerCase()} = ${row.values[i][0]} ∠ ${row.values[i][1]}°`, () => {
        // source: IEEE PES 4 Node Test Feeder, REFERENCES.md, recalled; tolerance: the printed precision
        const got = row.read(result, phase);
        const m = printed(row.values[i][0]);
        const a = printed(row.values[i][1]);
        expect(Math.abs(got.magnitude - m.value)).toBeLessThanOrEqual(m.tolerance);
        expect(Math.abs(got.angleDeg - a.value)).toBeLessThanOrEqual(a.tolerance);
      });
    });
  }

  it('converges at constant power, with a tiny KCL residual and a closed power balance', () => {
    // derived: Tellegen's theorem (source power = loads + losses) and Kirchhoff's current law
    expect(result.loads[0].model).toBe('constant-power');
    expect(Math.abs(result.loads[0].kw - 5400)).toBeLessThan(1e-3);
    expect(result.kclResidual).toBeLessThan(1e-12);
    expect(result.powerBalance.mismatchPercent).toBeLessThan(1e-9);
    expect(result.powerBalance.lossKw).toBeGreaterThan(0);
  });

  it('carries the current ratio of an ideal transformer, in phase', () => {
    // derived: ampere-turn balance of a GrY–GrY bank, I34 = (12.47 / 4.16) I12 (magnetising branch negligible)
    for (const ph of ['A', 'B', 'C'] as const) {
      const hi = current(result, 'line-12', ph);
      const lo = current(result, 'line-34', ph);
      expect(Math.abs(lo.magnitude / hi.magnitude - 12470 / 4160)).toBeLessThan(1e-5);
      expect(Math.abs(lo.angleDeg - hi.angleDeg)).toBeLessThan(1e-3);
    }
  });
});

describe('IEEE 4 Node Test Feeder: the other connections and the unbalanced load', () => {
  const cases: Ieee4Options[] = [
    { connection: 'delta-gry' },
    { connection: 'delta-delta' },
    { connection: 'gry-gry', stepUp: true },
    { connection: 'gry-gry', unbalanced: true },
    { connection: 'delta-gry', unbalanced: true },
    { connection: 'delta-delta', unbalanced: true },
  ];
  for (const options of cases) {
    const label = `${options.connection}${options.stepUp ? ' step-up' : ''}${options.unbalanced ? ' unbalanced' : ''}`;
    it(`${label}: power balance, KCL and the load served at constant power`, () => {
      // derived: Tellegen's theorem and Kirchhoff's current law; the load is constant kW and pf
      const result = solved(options);
      expect(result.powerBalance.mismatchPercent).toBeLessThan(1e-9);
      expect(result.kclResidual).toBeLessThan(1e-12);
      // source: REFERENCES.md, 5400 kW balanced; 1275 + 1800 + 2375 = 5450 kW unbalanced
      expect(Math.abs(result.loads[0].kw - (options.unbalanced ? 5450 : 5400))).toBeLessThan(1e-3);
      const loss = result.powerBalance.sourceKw - result.powerBalance.loadKw;
      expect(Math.abs(loss - result.powerBalance.lossKw)).toBeLessThan(1e-6 * result.powerBalance.sourceKw);
    });
  }

  it('delta–grounded wye: no zero-sequence current in the delta-side line, even with the unbalanced load', () => {
    // derived: a delta winding offers no zero-sequence path, so Ia + Ib + Ic = 0 on line 1–2
    for (const unbalanced of [false, true]) {
      const result = solved({ connection: 'delta-gry', unbalanced });
      const sum = (['A', 'B', 'C'] as const).reduce<C>((acc, ph) => add(acc, complex(current(result, 'line-12', ph).re, current(result, 'line-12', ph).im)) as C, cx(0));
      expect(mag(sum)).toBeLessThan(1e-9 * current(result, 'line-12', 'A').magnitude);
    }
    // ...while the wye side carries the unbalance in its neutral
    expect(current(solved({ connection: 'delta-gry', unbalanced: true }), 'line-34', 'N').magnitude).toBeGreaterThan(50);
  });

  it('delta–delta: no zero-sequence current on either side', () => {
    // derived: neither delta offers a zero-sequence path
    const result = solved({ connection: 'delta-delta', unbalanced: true });
    for (const line of ['line-12', 'line-34']) {
      const sum = (['A', 'B', 'C'] as const).reduce<C>((acc, ph) => add(acc, complex(current(result, line, ph).re, current(result, line, ph).im)) as C, cx(0));
      expect(mag(sum)).toBeLessThan(1e-9 * current(result, line, 'A').magnitude);
    }
    // the delta secondary has no path to earth: it is shown as ungrounded
    expect(result.buses.find((b) => b.busId === 'node-3')!.ungrounded).toBe(true);
    expect(result.buses.find((b) => b.busId === 'node-3')!.phaseToGroundVolts.A).toBe('ungrounded');
  });

  it('delta–grounded wye (Dyn1): the low side lags by 30° in positive sequence and leads by 30° in negative sequence', () => {
    // derived: the standard 30° shift of the ANSI delta–wye (Fortescue): I1 and V1 turn −30°, I2 and V2 +30°
    const result = solved({ connection: 'delta-gry', unbalanced: true });
    const seq = (line: string) => {
      const [a, b, c] = (['A', 'B', 'C'] as const).map((ph) => current(result, line, ph));
      return symmetricalComponents(a, b, c);
    };
    const hi = seq('line-12');
    const lo = seq('line-34');
    const ratio = 12470 / 4160;
    const turn = (z: { re: number; im: number }) => complex(z.re, z.im);
    const positive = divide(turn(lo.positive), turn(hi.positive)) as C;
    const negative = divide(turn(lo.negative), turn(hi.negative)) as C;
    expect(Math.abs(mag(positive) / Math.sqrt(3) - ratio / Math.sqrt(3))).toBeLessThan(1e-4 * ratio);
    expect(Math.abs((arg(positive) * 180) / Math.PI + 30)).toBeLessThan(1e-3);
    expect(Math.abs(mag(negative) - ratio)).toBeLessThan(1e-4 * ratio);
    expect(Math.abs((arg(negative) * 180) / Math.PI - 30)).toBeLessThan(1e-3);
    // and the secondary bus voltages sit about 30° behind the GrY–GrY case's
    const wye = solved({ connection: 'gry-gry', unbalanced: true });
    const shift = lineToNeutral(result, 'node-3', 'B').angleDeg - lineToNeutral(wye, 'node-3', 'B').angleDeg;
    expect(Math.abs(shift + 30)).toBeLessThan(2);
  });

  it('step-up: the voltage rises by the turns ratio and the line current falls by it', () => {
    // derived: ideal ratio 24.9 / 12.47 on voltage, its inverse on current (GrY–GrY, in phase)
    const result = solved({ connection: 'gry-gry', stepUp: true });
    const v2 = lineToNeutral(result, 'node-2', 'A');
    const v3 = lineToNeutral(result, 'node-3', 'A');
    // a 6 % impedance at 0.9 of rating drops a few per cent
    expect(v3.magnitude / v2.magnitude).toBeGreaterThan(0.95 * (24900 / 12470));
    expect(v3.magnitude / v2.magnitude).toBeLessThan(24900 / 12470);
    expect(Math.abs(current(result, 'line-12', 'A').magnitude / current(result, 'line-34', 'A').magnitude - 24900 / 12470)).toBeLessThan(1e-5);
    // a 24.9 kV secondary carries the 5400 kW with a far smaller drop than the 4.16 kV one
    expect(lineToNeutral(result, 'node-4', 'A').magnitude / (24900 / Math.sqrt(3))).toBeGreaterThan(0.93);
  });
});
