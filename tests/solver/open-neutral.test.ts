// Open and degraded neutrals solved by hand: the series circuit across the line-to-line voltage, Millman's theorem
// for a floating wye of three loads, the earth return through a grounding electrode, and a neutral lug of a few ohms.
import { describe, expect, it } from 'vitest';
import { solveSheet, type SolveResult } from '../../solver';
import { SheetBuilder, customRun } from './helpers/sheet-builder';
import { add, cx, divide, loadImpedance, mag, millman, multiply, polarC, subtract, type C } from './helpers/hand';

const LINE: [number, number] = [0.05, 0.04]; // Ω per 1000 ft, our own figures
const LENGTH_FT = 100;
const zLine = cx((LINE[0] * LENGTH_FT) / 1000, (LINE[1] * LENGTH_FT) / 1000);

interface Case {
  system: 'three-phase-wye' | 'split-phase';
  nominalVolts: number;
  /** Load on each phase: kW at rated voltage and power factor, constant impedance. */
  loads: { phase: 'A' | 'B' | 'C'; kw: number; pf?: number }[];
  ratedVolts: number;
  electrodeOhms?: number;
  sourceGroundingOhms?: number;
}

function buildCase(k: Case) {
  const phases = k.system === 'split-phase' ? ['A', 'B'] : ['A', 'B', 'C'];
  const b = new SheetBuilder('open neutral')
    .source('src', { system: k.system, nominalVolts: k.nominalVolts, ...(k.sourceGroundingOhms ? { grounding: 'resistance', groundingOhms: k.sourceGroundingOhms } : {}) })
    .run('drop', customRun(LENGTH_FT, Object.fromEntries([...phases, 'N'].map((c) => [c, LINE]))))
    .bus('panel', { role: 'service', phaseC: k.system !== 'split-phase', neutralGroundBond: k.electrodeOhms !== undefined })
    .connect('src', 'out', 'drop', 'from', [...phases, 'N'])
    .connect('drop', 'to', 'panel', 'bars', [...phases, 'N']);
  if (k.electrodeOhms !== undefined) b.electrode('rod', k.electrodeOhms).connect('panel', 'bars', 'rod', 'lead', ['PE']);
  k.loads.forEach((l, i) => {
    const id = `load-${l.phase}-${i}`;
    b.load(id, { ratedVolts: k.ratedVolts, kw: l.kw, powerFactor: l.pf ?? 1, loadKind: 'heating' });
    b.connect('panel', 'bars', id, 'supply', { [l.phase]: 'A', N: 'N' });
  });
  b.whatIf('open-n', { cut: { kind: 'open-conductor', runId: 'drop', conductor: 'N' } });
  b.whatIf('lug-3-ohm', { lug: { kind: 'degrade-conductor', runId: 'drop', conductor: 'N', addedOhms: 3 } });
  return b.sheet();
}

function emfs(k: Case): Record<string, C> {
  if (k.system === 'split-phase') return { A: polarC(k.nominalVolts / 2, 0), B: polarC(k.nominalVolts / 2, 180) };
  const vln = k.nominalVolts / Math.sqrt(3);
  return { A: polarC(vln, 0), B: polarC(vln, -120), C: polarC(vln, 120) };
}

/** Each load's voltage by hand, with the panel neutral returning through `returns`. */
function handLoadVolts(k: Case, returns: C[]): number[] {
  const e = emfs(k);
  const branches = k.loads.map((l) => ({ e: e[l.phase], z: add(zLine, loadImpedance(k.ratedVolts, l.kw * 1000, l.pf ?? 1)) as C }));
  const vn = millman(branches, returns);
  return k.loads.map((l, i) => {
    const current = divide(subtract(branches[i].e, vn), branches[i].z) as C;
    return mag(multiply(current, loadImpedance(k.ratedVolts, l.kw * 1000, l.pf ?? 1)) as C);
  });
}

function solvedLoadVolts(result: SolveResult, k: Case): number[] {
  return k.loads.map((l, i) => result.loads.find((x) => x.loadId === `load-${l.phase}-${i}`)!.elements[0].volts);
}

function solve(k: Case, whatIfId?: string): SolveResult {
  const outcome = solveSheet(buildCase(k), { whatIfId });
  if (!outcome.ok) throw new Error(outcome.error.message);
  return outcome.result;
}

const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('open neutral, 120/240 V split-phase: a series circuit across 240 V', () => {
  const k: Case = { system: 'split-phase', nominalVolts: 240, ratedVolts: 120, loads: [{ phase: 'A', kw: 1.5 }, { phase: 'B', kw: 0.5 }] };

  it('splits 240 V in proportion to the load impedances', () => {
    // derived: series circuit, I = 240 / (Z1 + Z2 + 2 Z_line), V_k = I Z_k (Ohm's law)
    const solved = solvedLoadVolts(solve(k, 'open-n'), k);
    const hand = handLoadVolts(k, []);
    solved.forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
    // without line impedance this is 240 × 9.6 / 38.4 = 60 V and 180 V; the line takes a little
    expect(hand[0]).toBeGreaterThan(59.5);
    expect(hand[0]).toBeLessThan(60);
  });

  it('puts the higher voltage on the lower-wattage load', () => {
    // common practice, no source: with the neutral lost, the lighter load sees the higher voltage
    const [heavy, light] = solvedLoadVolts(solve(k, 'open-n'), k);
    expect(light).toBeGreaterThan(170);
    expect(heavy).toBeLessThan(70);
  });

  it('keeps both loads near 120 V in the base case', () => {
    // derived: Millman with the neutral present (its line impedance as the return)
    const solved = solvedLoadVolts(solve(k), k);
    const hand = handLoadVolts(k, [zLine]);
    solved.forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
  });

  it('returns part of the neutral current through a 25 Ω electrode and the earth', () => {
    // derived: Millman's theorem with the electrode as a fourth branch to the solidly grounded source neutral
    const kk: Case = { ...k, electrodeOhms: 25 };
    const result = solve(kk, 'open-n');
    const hand = handLoadVolts(kk, [cx(25)]);
    solvedLoadVolts(result, kk).forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
    const rod = result.electrodes.find((e) => e.electrodeId === 'rod')!;
    expect(rod.amperes).toBeGreaterThan(0.5);
    // Ohm's law on the electrode: its rise above remote earth is I × 25 Ω
    expect(relative(rod.volts, rod.amperes * 25)).toBeLessThan(1e-9);
  });

  it('adds the source grounding resistance to the earth path', () => {
    // derived: the earth return is the electrode and the source grounding resistor in series
    const kk: Case = { ...k, electrodeOhms: 25, sourceGroundingOhms: 5 };
    const hand = handLoadVolts(kk, [cx(30)]);
    solvedLoadVolts(solve(kk, 'open-n'), kk).forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
  });

  it('solves a neutral degraded by 3 Ω', () => {
    // derived: Millman with the neutral branch Z_line + 3 Ω
    const hand = handLoadVolts(k, [add(zLine, cx(3)) as C]);
    const result = solve(k, 'lug-3-ohm');
    solvedLoadVolts(result, k).forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
    expect(result.openNeutral).toBe(true);
  });
});

describe('open neutral, 208Y/120 V: two loads on A and B across 208 V', () => {
  const k: Case = { system: 'three-phase-wye', nominalVolts: 208, ratedVolts: 120, loads: [{ phase: 'A', kw: 1.2, pf: 0.9 }, { phase: 'B', kw: 0.4, pf: 0.9 }] };

  it('is the series circuit across V_AB', () => {
    // derived: series circuit across the line-to-line voltage, V_k = V_AB Z_k / (Z_A + Z_B + 2 Z_line)
    const e = emfs(k);
    const zA = loadImpedance(120, 1200, 0.9);
    const zB = loadImpedance(120, 400, 0.9);
    const current = divide(subtract(e.A, e.B), add(add(zA, zB), multiply(zLine, cx(2)))) as C;
    const solved = solvedLoadVolts(solve(k, 'open-n'), k);
    expect(relative(solved[0], mag(multiply(current, zA) as C))).toBeLessThan(1e-9);
    expect(relative(solved[1], mag(multiply(current, zB) as C))).toBeLessThan(1e-9);
    // 208 V shared 3 : 1 by impedance: the light load sees about 156 V
    expect(solved[1]).toBeGreaterThan(150);
  });
});

describe('open neutral, 480Y/277 V: a floating wye of three loads (Millman)', () => {
  const k: Case = {
    system: 'three-phase-wye',
    nominalVolts: 480,
    ratedVolts: 277,
    loads: [{ phase: 'A', kw: 10, pf: 0.85 }, { phase: 'B', kw: 4 }, { phase: 'C', kw: 7, pf: 0.95 }],
  };

  it('shifts the star point as Millman predicts', () => {
    // derived: Millman's theorem, V_n = Σ Y_k E_k / Σ Y_k, V_k = (E_k − V_n) Z_k / (Z_k + Z_line)
    const result = solve(k, 'open-n');
    const hand = handLoadVolts(k, []);
    solvedLoadVolts(result, k).forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
    const panel = result.buses.find((b) => b.busId === 'panel')!;
    // the neutral bar floats to the star-point voltage, live only through the loads
    expect(panel.conductors.N!.state).toBe('back-fed');
    expect(panel.lineToNeutralVolts.B!).toBeGreaterThan(277);
  });

  it('with a 25 Ω electrode at the service, uses the earth as a fourth branch', () => {
    // derived: Millman's theorem with the electrode branch to the grounded source neutral
    const kk: Case = { ...k, electrodeOhms: 25 };
    const hand = handLoadVolts(kk, [cx(25)]);
    solvedLoadVolts(solve(kk, 'open-n'), kk).forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
  });

  it('a 3 Ω neutral lug keeps the shift small but not zero', () => {
    // derived: Millman with the neutral branch Z_line + 3 Ω
    const hand = handLoadVolts(k, [add(zLine, cx(3)) as C]);
    const solved = solvedLoadVolts(solve(k, 'lug-3-ohm'), k);
    solved.forEach((v, i) => expect(relative(v, hand[i])).toBeLessThan(1e-9));
    const base = solvedLoadVolts(solve(k), k);
    expect(Math.max(...solved.map((v, i) => Math.abs(v - base[i])))).toBeGreaterThan(1);
  });
});
