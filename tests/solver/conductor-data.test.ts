// Conductor data read back through runs: NEC Chapter 9 Table 9 (and its frequency scaling), IEC 60228 with its
// temperature correction, parallel sets, Carson's equations for the 4 Node Test Feeder pole, the Kron-reduced
// matrix that a neutral grounded at both ends reproduces, and NEC 310.16 ampacity in the run results.
import { describe, expect, it } from 'vitest';
import { complex, multiply, subtract, matrix, type Matrix } from 'mathjs';
import { buildNetwork, solveSheet } from '../../solver';
import { SheetBuilder } from './helpers/sheet-builder';
import { mag, type C } from './helpers/hand';

function runImpedance(run: Record<string, unknown>, settings: Record<string, unknown> = {}) {
  const sheet = new SheetBuilder('one run', settings).run('r', run).sheet();
  const network = buildNetwork(sheet);
  return network.runs[0];
}

const near = (got: { re: number; im: number }, re: number, im: number, tol: number) => {
  expect(Math.abs(got.re - re)).toBeLessThanOrEqual(tol);
  expect(Math.abs(got.im - im)).toBeLessThanOrEqual(tol);
};

describe('NEC Chapter 9 Table 9 through a run', () => {
  it('4/0 copper in PVC: 0.062 + j0.041 Ω per 1000 ft, each conductor, no mutual coupling', () => {
    // source: NEC Chapter 9 Table 9 (REFERENCES.md, seen)
    const r = runImpedance({ lengthFt: 1000, conductors: { A: { size: '4/0' }, N: { size: '4/0' }, PE: { size: '4' } } });
    near(r.impedanceOhms[0][0], 0.062, 0.041, 1e-12);
    near(r.impedanceOhms[1][1], 0.062, 0.041, 1e-12);
    near(r.impedanceOhms[2][2], 0.31, 0.048, 1e-12);
    near(r.impedanceOhms[0][1], 0, 0, 0);
    expect(r.mutualCoupling).toBe(false);
  });

  it('steel conduit raises X; aluminium conductors in aluminium conduit', () => {
    // source: NEC Chapter 9 Table 9 (REFERENCES.md, seen): 4/0 Cu steel 0.063 + j0.051; 500 kcmil Al in Al 0.048 + j0.039
    near(runImpedance({ lengthFt: 1000, raceway: 'steel', conductors: { A: { size: '4/0' } } }).impedanceOhms[0][0], 0.063, 0.051, 1e-12);
    near(runImpedance({ lengthFt: 1000, raceway: 'aluminum', conductors: { A: { size: '500', material: 'aluminum' } } }).impedanceOhms[0][0], 0.048, 0.039, 1e-12);
  });

  it('scales with length, divides by parallel sets, and scales X to 50 Hz', () => {
    // derived: Z = z × L / sets; inductive reactance is proportional to frequency (Table 9 is a 60 Hz table)
    near(runImpedance({ lengthFt: 250, parallelSets: 2, conductors: { A: { size: '500' } } }).impedanceOhms[0][0], (0.027 * 0.25) / 2, (0.039 * 0.25) / 2, 1e-12);
    near(runImpedance({ lengthFt: 1000, conductors: { A: { size: '12' } } }, { frequencyHz: 50 }).impedanceOhms[0][0], 2.0, (0.054 * 50) / 60, 1e-12);
  });

  it('the drop of a balanced three-phase run at 0.85 power factor is close to I × Ze × L', () => {
    // source: NEC Chapter 9 Table 9, effective Z at 0.85 pf for 4/0 copper in PVC, 0.074 Ω per 1000 ft (seen);
    // the approximate drop formula ΔV ≈ I Ze per phase is common practice, no source (good for small drops)
    const four = ['A', 'B', 'C', 'N'];
    const sheet = new SheetBuilder('drop')
      .source('s', { nominalVolts: 480 })
      .run('r', { lengthFt: 400, conductors: Object.fromEntries(four.map((c) => [c, { size: '4/0' }])) })
      .bus('b')
      .load('m', { connection: 'three-phase-wye', ratedVolts: 480, kw: 120, powerFactor: 0.85, loadKind: 'heating' })
      .connect('s', 'out', 'r', 'from', four)
      .connect('r', 'to', 'b', 'bars', four)
      .connect('b', 'bars', 'm', 'supply', four)
      .sheet();
    const outcome = solveSheet(sheet);
    if (!outcome.ok) throw new Error(outcome.error.message);
    const r = outcome.result;
    const amps = r.runs[0].conductors.A!.current.magnitude;
    const drop = 480 / Math.sqrt(3) - r.buses[0].lineToNeutralVolts.A!;
    expect(Math.abs(drop / (amps * 0.074 * 0.4) - 1)).toBeLessThan(0.02);
  });
});

describe('IEC 60228 through a run', () => {
  it('95 mm² copper: 0.193 Ω/km at 20 °C corrected to 70 °C, reactance 5/6 at 50 Hz of the 60 Hz figure', () => {
    // source: IEC 60228 Table 2, class 2 (REFERENCES.md, recalled); α = 0.00393 /K at 20 °C
    const km = 1000 / 0.3048;
    const at50 = runImpedance({ lengthFt: km, impedanceFrom: 'iec-60228', conductors: { A: { sizeMm2: 95 } } }, { frequencyHz: 50 }).impedanceOhms[0][0];
    const at60 = runImpedance({ lengthFt: km, impedanceFrom: 'iec-60228', conductors: { A: { sizeMm2: 95 } } }, { frequencyHz: 60 }).impedanceOhms[0][0];
    expect(Math.abs(at50.re - 0.193 * (1 + 0.00393 * 50))).toBeLessThan(1e-9);
    expect(Math.abs(at50.im / at60.im - 50 / 60)).toBeLessThan(1e-12);
    expect(at50.re).toBe(at60.re);
  });
});

describe("Carson's equations for the 4 Node Test Feeder pole", () => {
  const pole = {
    A: { xFt: 0, yFt: 28, gmrFt: 0.0244, rOhmsPerMile: 0.306 },
    B: { xFt: 2.5, yFt: 28, gmrFt: 0.0244, rOhmsPerMile: 0.306 },
    C: { xFt: 7, yFt: 28, gmrFt: 0.0244, rOhmsPerMile: 0.306 },
    N: { xFt: 4, yFt: 24, gmrFt: 0.00814, rOhmsPerMile: 0.592 },
  };

  it('gives the primitive matrix of Kersting Example 4.1 for one mile', () => {
    // source: Kersting, Distribution System Modeling and Analysis, Example 4.1 (REFERENCES.md: derived; book as recalled)
    // tolerance: the printed four decimals plus the rounding of the constants 0.0953 and 0.12134
    const z = runImpedance({ lengthFt: 5280, impedanceFrom: 'overhead', conductors: pole }).impedanceOhms;
    near(z[0][0], 0.4013, 1.4133, 1e-4);
    near(z[3][3], 0.6873, 1.5465, 1e-4);
    near(z[0][1], 0.0953, 0.8515, 1e-4);
    near(z[1][2], 0.0953, 0.7802, 1e-4);
    near(z[2][0], 0.0953, 0.7266, 1e-4);
    near(z[0][3], 0.0953, 0.7524, 1e-4);
    near(z[1][3], 0.0953, 0.7865, 1e-4);
    near(z[2][3], 0.0953, 0.7674, 1e-4);
  });

  it('with the neutral grounded at both ends the phase drops follow the Kron-reduced matrix', () => {
    // source: Kersting Example 4.1, Kron-reduced phase impedance matrix (REFERENCES.md: derived; book as recalled)
    const four = ['A', 'B', 'C', 'N'];
    const sheet = new SheetBuilder('kron')
      .source('s', { nominalVolts: 12470 })
      .run('line', { lengthFt: 5280, impedanceFrom: 'overhead', conductors: pole })
      .bus('far', { groundBar: false })
      .electrode('g', 0)
      .load('l', { connection: 'three-phase-wye', ratedVolts: 12470, phaseKw: { A: 800, B: 1500, C: 400 }, powerFactor: 0.9, loadKind: 'heating' })
      .connect('s', 'out', 'line', 'from', four)
      .connect('line', 'to', 'far', 'bars', four)
      .connect('far', 'bars', 'g', 'lead', { N: 'PE' })
      .connect('far', 'bars', 'l', 'supply', four)
      .sheet();
    const outcome = solveSheet(sheet);
    if (!outcome.ok) throw new Error(outcome.error.message);
    const r = outcome.result;
    const zabc = matrix([
      [complex(0.4576, 1.078), complex(0.156, 0.5017), complex(0.1535, 0.3849)],
      [complex(0.156, 0.5017), complex(0.4666, 1.0482), complex(0.158, 0.4236)],
      [complex(0.1535, 0.3849), complex(0.158, 0.4236), complex(0.4615, 1.0651)],
    ]);
    const phases = ['A', 'B', 'C'] as const;
    const current = matrix(phases.map((p) => [complex(r.runs[0].conductors[p]!.current.re, r.runs[0].conductors[p]!.current.im)]));
    const predicted = multiply(zabc, current) as Matrix;
    const far = r.buses.find((b) => b.busId === 'far')!;
    const sourceVolts = [0, -120, 120].map((deg) => complex({ r: 12470 / Math.sqrt(3), phi: (deg * Math.PI) / 180 }));
    phases.forEach((p, i) => {
      const drop = subtract(sourceVolts[i], complex(far.conductors[p]!.phasor.re, far.conductors[p]!.phasor.im)) as C;
      const expected = predicted.get([i, 0]) as C;
      // the published matrix has four decimals: agree within 0.1 % of the drop
      expect(mag(subtract(drop, expected) as C)).toBeLessThan(1e-3 * mag(expected));
    });
  });
});

describe('NEC 310.16 ampacity in the run results', () => {
  function ampacityOf(run: Record<string, unknown>, map: string[]) {
    const sheet = new SheetBuilder('amp')
      .source('s', { nominalVolts: 208 })
      .run('r', run)
      .bus('b')
      .load('l', { connection: 'three-phase-wye', ratedVolts: 208, kw: 30, loadKind: 'heating' })
      .connect('s', 'out', 'r', 'from', map)
      .connect('r', 'to', 'b', 'bars', map)
      .connect('b', 'bars', 'l', 'supply', ['A', 'B', 'C', 'N'])
      .sheet();
    const outcome = solveSheet(sheet);
    if (!outcome.ok) throw new Error(outcome.error.message);
    return outcome.result.runs[0].conductors;
  }
  const four = (size: string) => Object.fromEntries(['A', 'B', 'C', 'N'].map((c) => [c, { size }]));

  it('4/0 copper at 75 °C carries 230 A; the neutral of a balanced three-phase wye does not count', () => {
    // source: NEC Table 310.16 (REFERENCES.md, recalled) and 310.15(E)
    const k = ampacityOf({ lengthFt: 50, conductors: four('4/0') }, ['A', 'B', 'C', 'N']);
    expect(k.A!.ampacityAmperes).toBeCloseTo(230, 9);
    expect(k.A!.percentOfAmpacity).toBeCloseTo((100 * k.A!.current.magnitude) / 230, 9);
  });

  it('six conductors in the raceway take 80 %, and 40 °C ambient takes the 310.15(B) factor', () => {
    // source: NEC 310.15(C)(1) 4–6 conductors at 80 % (REFERENCES.md, recalled); ambient factor √((75 − 40)/(75 − 30))
    const k = ampacityOf({ lengthFt: 50, conductorsInRaceway: 6, ambientC: 40, conductors: four('4/0') }, ['A', 'B', 'C', 'N']);
    expect(k.A!.ampacityAmperes).toBeCloseTo(230 * 0.8 * Math.sqrt(35 / 45), 6);
  });

  it('parallel sets multiply the ampacity', () => {
    // source: NEC Table 310.16 (REFERENCES.md, recalled): 500 kcmil copper at 75 °C, 380 A per set
    const k = ampacityOf({ lengthFt: 50, parallelSets: 2, conductors: four('500') }, ['A', 'B', 'C', 'N']);
    expect(k.B!.ampacityAmperes).toBeCloseTo(760, 9);
  });
});
