// The break sweep against independent answers: every case of the demo sheets and of a generated building against a
// fresh build and solve of the sheet with that conductor removed (its own factorization, no base reused), a small
// case against mathjs's dense lusolve on the assembled matrix, and the lost-neutral series divider by hand.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { complex, lusolve, matrix, zeros, type Complex as MComplex, type Matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { readSheet, type Sheet } from '../../shared/sheet';
import { breakSweep, breakSweepSync, buildNetwork, solveSheet, type StudyLoadModel } from '../../solver';
import { buildingSheet } from '../../solver/bench/building-sheet';
import { BreakSweeper, openingMods } from '../../solver/studies/break-sweep';
import type { OpeningSolver } from '../../solver/studies/opening-solver';
import { assemble } from '../../solver/solve/assemble';
import { mergeTies } from '../../solver/solve/classes';
import { findParts } from '../../solver/solve/parts';
import { pinVoltages } from '../../solver/solve/load-iteration';
import { solveBuiltNetwork } from '../../solver/solve/solve-network';
import { building } from './helpers/building';
import { SheetBuilder, customRun } from './helpers/sheet-builder';

function fixture(name: string): Sheet {
  const read = readSheet(JSON.parse(readFileSync(join(__dirname, '..', '..', 'solver', 'fixtures', name), 'utf8')));
  if (!read.ok) throw new Error(read.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  return read.sheet;
}

/** Each load element's voltage with the conductor removed, from a fresh build and factorization. */
function freshLoadVolts(sheet: Sheet, runId: string, conductor: Parameters<typeof openingMods>[1], model: StudyLoadModel): number[] {
  const network = buildNetwork(sheet, openingMods(runId, conductor));
  const outcome = solveBuiltNetwork(network, sheet.settings, undefined, { constantImpedanceOnly: model === 'constant-impedance' });
  if (!outcome.ok) throw new Error(`${runId} ${conductor}: ${outcome.error.message}`);
  const v = outcome.solution.volts;
  return network.loads.map((p) => Math.hypot(v.re[p.p] - v.re[p.q], v.im[p.p] - v.im[p.q]));
}

/** Every case of the sweep, each load element's voltage through the base factors against the fresh solve. */
function checkEveryCase(sheet: Sheet, model: StudyLoadModel): { cases: number; lowRank: number; worstRelative: number } {
  const prepared = BreakSweeper.prepare(sheet, { loadModel: model });
  if (!prepared.ok) throw new Error(prepared.error.message);
  const sweeper = prepared.value;
  const network = buildNetwork(sheet, openingMods('', 'N'));
  let cases = 0;
  let lowRank = 0;
  let worstRelative = 0;
  network.runs.forEach((layout, run) =>
    layout.conductors.forEach((k, conductor) => {
      if (k.open) return;
      const c = sweeper.solveCase({ run, conductor }, model);
      expect(c.problem, `${layout.runId} ${k.conductor}`).toBeUndefined();
      const fresh = freshLoadVolts(sheet, layout.runId, k.conductor, model);
      for (const { part, volts } of sweeper.watch.lastVolts()) {
        const relative = Math.abs(volts - fresh[part]) / Math.max(1, fresh[part]);
        worstRelative = Math.max(worstRelative, relative);
      }
      cases++;
      if (c.method === 'low-rank') lowRank++;
    }),
  );
  return { cases, lowRank, worstRelative };
}

describe('break sweep against a full re-solve with the conductor removed', () => {
  // source: the independent check is a fresh build and factorization of the opened sheet (the solver's own full path)
  for (const name of ['larkspur-row.json', 'farm.json']) {
    for (const model of ['constant-impedance', 'sheet'] as const) {
      it(`${name}, every run conductor, ${model} loads`, () => {
        const r = checkEveryCase(fixture(name), model);
        expect(r.cases).toBeGreaterThan(8);
        expect(r.lowRank).toBe(r.cases); // the demo sheets need no fresh solve
        expect(r.worstRelative).toBeLessThan(1e-8);
      });
    }
  }

  it('a generated building of 16 buses, PE openings that cut ground bars off included', () => {
    const sheet = buildingSheet(16, 7);
    const r = checkEveryCase(sheet, 'constant-impedance');
    expect(r.cases).toBe(15 * 5);
    expect(r.lowRank).toBe(r.cases); // the cut-off ground bars are held by a tie that carries nothing
    expect(r.worstRelative).toBeLessThan(1e-8);
    const s = checkEveryCase(sheet, 'sheet');
    expect(s.worstRelative).toBeLessThan(1e-8);
  });
});

describe('break sweep in blocks of openings', () => {
  it('every case of a whole sweep, solved 16 to a block with ties for cut-off parts, matches a fresh solve at its worst loads', () => {
    // source: the independent check is a fresh build and factorization of each opened sheet (no base reused)
    const sheet = buildingSheet(16, 7);
    const r = breakSweepSync(sheet, { refineWorst: 0 });
    if (!r.ok) throw new Error(r.error.message);
    const network = buildNetwork(sheet, openingMods('', 'N'));
    expect(r.value.cases.length).toBe(15 * 5);
    for (const c of r.value.cases) {
      expect(c.method, `${c.runId} ${c.conductor}`).toBe('low-rank');
      expect(c.residual!).toBeLessThan(1e-10);
      const fresh = freshLoadVolts(sheet, c.runId, c.conductor, 'constant-impedance');
      for (const worst of [c.worstOver, c.worstUnder]) {
        if (!worst) continue;
        const part = network.loads.findIndex((p) => p.loadId === worst.loadId && p.label === worst.element);
        expect(Math.abs(worst.volts - fresh[part]) / fresh[part], `${c.runId} ${c.conductor} ${worst.loadId}`).toBeLessThan(1e-8);
      }
    }
    // the same figures as one case at a time
    const prepared = BreakSweeper.prepare(sheet, { refineWorst: 0 });
    if (!prepared.ok) throw new Error(prepared.error.message);
    for (const c of r.value.cases.slice(0, 20)) {
      const run = network.runs.findIndex((k) => k.runId === c.runId);
      const conductor = network.runs[run].conductors.findIndex((k) => k.conductor === c.conductor);
      const one = prepared.value.solveCase({ run, conductor }, 'constant-impedance');
      expect(one.severityPercent).toBeCloseTo(c.severityPercent, 9);
      expect([one.loadsOutside, one.loadsTolerable, one.loadsWithoutVoltage]).toEqual([c.loadsOutside, c.loadsTolerable, c.loadsWithoutVoltage]);
    }
  });
});

describe('break sweep: openings that cut a part off', () => {
  it('the bridges of the matrix graph name exactly the openings whose capacitance matrix is singular', () => {
    // source: the independent check is the Woodbury system itself (K singular when the opened network floats)
    for (const sheet of [buildingSheet(16, 7), fixture('larkspur-row.json'), fixture('farm.json')]) {
      const prepared = BreakSweeper.prepare(sheet, { refineWorst: 0 });
      if (!prepared.ok) throw new Error(prepared.error.message);
      const sweeper = prepared.value as unknown as { solver: OpeningSolver; solution: { system: { rhsRe: Float64Array; rhsIm: Float64Array } }; x0: { re: Float64Array; im: Float64Array } };
      const { solver } = sweeper;
      const network = buildNetwork(sheet, openingMods('', 'N'));
      let predicted = 0;
      let singular = 0;
      network.runs.forEach((layout) =>
        layout.conductors.forEach((k, i) => {
          const u = solver.update(layout, i);
          if (!u) return;
          const block = solver.solveBlock([u], sweeper.solution.system.rhsRe, sweeper.solution.system.rhsIm, sweeper.x0);
          const isSingular = !block.cases[0].tRe;
          const tied = solver.likelyUpdate(u) !== u;
          expect(tied, `${layout.runId} ${k.conductor}: predicted ${tied}, singular ${isSingular}`).toBe(isSingular);
          if (tied) predicted++;
          if (isSingular) singular++;
        }),
      );
      expect(predicted).toBe(singular);
      if (sheet.elements['feeder-1']) expect(singular).toBeGreaterThan(0); // the generated building's PE runs
    }
  });
});

describe('break sweep against mathjs dense lusolve', () => {
  it('the small building, the apartment feeder neutral open: the assembled opened system solved densely', () => {
    // source: mathjs lusolve, an independent dense LU, on the opened network's own assembled matrix
    const sheet = building().sheet();
    const network = buildNetwork(sheet, openingMods('apt-feeder', 'N'));
    const merged = mergeTies(network);
    if (!merged.ok) throw new Error(merged.message);
    const parts = findParts(network, merged.classes);
    const system = assemble(network, merged.classes, parts);
    const n = system.matrix.n;
    const dense = zeros(n, n) as Matrix;
    const a = system.matrix;
    for (let j = 0; j < n; j++) for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) dense.set([a.rowIdx[p], j], complex(a.re[p], a.im[p]));
    const b = matrix([...Array(n).keys()].map((i) => [complex(system.rhsRe[i], system.rhsIm[i])]));
    const x = lusolve(dense, b) as Matrix;
    const xv = { re: new Float64Array(n), im: new Float64Array(n) };
    for (let i = 0; i < n; i++) {
      const v = x.get([i, 0]) as MComplex;
      xv.re[i] = v.re;
      xv.im[i] = v.im;
    }
    const v = pinVoltages(network, merged.classes, system, xv);
    const expected = network.loads.map((p) => Math.hypot(v.re[p.p] - v.re[p.q], v.im[p.p] - v.im[p.q]));

    const prepared = BreakSweeper.prepare(sheet);
    if (!prepared.ok) throw new Error(prepared.error.message);
    const run = network.runs.findIndex((r) => r.runId === 'apt-feeder');
    const conductor = network.runs[run].conductors.findIndex((k) => k.conductor === 'N');
    const c = prepared.value.solveCase({ run, conductor }, 'constant-impedance');
    expect(c.method).toBe('low-rank');
    const got = prepared.value.watch.lastVolts();
    expect(got.length).toBe(network.loads.length);
    for (const { part, volts } of got) expect(volts).toBeCloseTo(expected[part], 7);
    // and the opening mattered: the apartment's loads moved well away from 120 V
    const kitchen = got.find(({ part }) => network.loads[part].loadId === 'apt-kitchen')!;
    expect(Math.abs(kitchen.volts - 120)).toBeGreaterThan(10);
  });
});

describe('break sweep physics: the lost-neutral series divider', () => {
  // source: common practice, no source (REFERENCES.md, facts of the trade): with the neutral lost, two loads on
  // different phases share the line-to-line voltage in proportion to their impedances.
  const LINE: [number, number] = [0.05, 0.04]; // Ω per 1000 ft, our own figures
  const sheet = new SheetBuilder('split phase')
    .source('src', { system: 'split-phase', nominalVolts: 240 })
    .run('drop', customRun(100, { A: LINE, B: LINE, N: LINE }))
    .bus('panel', { role: 'panel', phaseC: false })
    .load('small', { ratedVolts: 120, kw: 1, loadKind: 'heating' })
    .load('large', { ratedVolts: 120, kw: 2, loadKind: 'heating' })
    .connect('src', 'out', 'drop', 'from', ['A', 'B', 'N'])
    .connect('drop', 'to', 'panel', 'bars', ['A', 'B', 'N'])
    .connect('panel', 'bars', 'small', 'supply', { A: 'A', N: 'N' })
    .connect('panel', 'bars', 'large', 'supply', { B: 'A', N: 'N' })
    .sheet();

  it('ranks the open neutral first, the small load high and the large load low, by the divider', () => {
    const r = breakSweepSync(sheet, { conductors: 'neutrals' });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.cases.map((c) => `${c.runId} ${c.conductor}`)).toEqual(['drop N']);
    const c = r.value.cases[0];
    // Hand: R = V²/P: 14.4 Ω and 7.2 Ω in series with the two phase conductors (0.005 + j0.004 Ω each) across 240 V.
    const zRe = 14.4 + 7.2 + 2 * 0.005;
    const zIm = 2 * 0.004;
    const amps = 240 / Math.hypot(zRe, zIm);
    expect(c.worstOver!.loadId).toBe('small');
    expect(c.worstOver!.volts).toBeCloseTo(amps * 14.4, 6);
    expect(c.worstUnder!.loadId).toBe('large');
    expect(c.worstUnder!.volts).toBeCloseTo(amps * 7.2, 6);
    // about 160 V and 80 V: beyond ANSI C84.1 Range B (127 V top, 104 V bottom for lighting circuits; recalled)
    expect(c.worstOver!.standing).toBe('outside');
    expect(c.worstOver!.beyondVolts).toBeCloseTo(amps * 14.4 - 125, 6); // Range A utilization top 125 V (recalled)
    expect(c.severityPercent).toBeCloseTo((100 * Math.max(amps * 14.4 - 125, 110 - amps * 7.2)) / 120, 6);
    expect(r.value.base.severityPercent).toBe(0);
  });

  it('every conductor: a lost phase leaves its load without voltage rather than under-voltage', () => {
    const r = breakSweepSync(sheet);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.total).toBe(3);
    const lostA = r.value.cases.find((c) => c.conductor === 'A')!;
    // The small load's phase is gone; its far end sits on the neutral: no voltage (common practice, no source).
    expect(lostA.loadsWithoutVoltage).toBe(1);
    expect(lostA.worstUnder!.loadId).toBe('large');
  });
});

describe('break sweep: ranking, progress and cancellation', () => {
  const larkspur = fixture('larkspur-row.json');

  it('neutrals only, by over-voltage: an apartment neutral first, agreeing with the sheet\'s own what-if', () => {
    const r = breakSweepSync(larkspur, { conductors: 'neutrals', rankBy: 'over' });
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.cases.every((c) => c.conductor === 'N')).toBe(true);
    // An apartment fed by two phases and a neutral: its light half takes most of 208 V (the series divider).
    const top = r.value.cases[0];
    expect(top.runId).toBe('apt-4-feeder');
    expect(top.loadModel).toBe('sheet');
    // source: the solver's full what-if path (SheetSolver on the sheet's open-apt-4-neutral what-if)
    const whatIf = solveSheet(larkspur, { whatIfId: 'open-apt-4-neutral' });
    if (!whatIf.ok) throw new Error(whatIf.error.message);
    const same = whatIf.result.loads.find((l) => l.loadId === top.worstOver!.loadId)!.elements.find((e) => e.label === top.worstOver!.element)!;
    expect(top.worstOver!.volts).toBeCloseTo(same.volts, 6);
    expect(top.worstOver!.volts).toBeGreaterThan(180); // most of 208 V on the light half
    expect(r.value.cases.find((c) => c.runId === 'service-lateral')!.worstOver!.percentOfNominal).toBeGreaterThan(115);
    for (let i = 1; i < r.value.cases.length; i++) {
      expect(r.value.cases[i - 1].worstOver!.beyondPercent).toBeGreaterThanOrEqual(r.value.cases[i].worstOver!.beyondPercent);
    }
  });

  it('reports progress, and an abort stops it between cases with the cases done so far', async () => {
    const sheet = buildingSheet(30, 3);
    const controller = new AbortController();
    const seen: number[] = [];
    let ticks = 0;
    let doneAtAbort = -1;
    const timer = setInterval(() => ticks++, 0);
    const r = await breakSweep(sheet, {
      sliceMs: 0,
      signal: controller.signal,
      onProgress: ({ done, total }) => {
        seen.push(done);
        expect(total).toBe(29 * 5 + 10);
        if (done >= 20 && doneAtAbort < 0) {
          doneAtAbort = done;
          controller.abort();
        }
      },
    });
    clearInterval(timer);
    if (!r.ok) throw new Error(r.error.message);
    expect(r.value.cancelled).toBe(true);
    // A slice is at least one step, a block of 16 cases: progress after each, and nothing after the abort.
    expect(seen.slice(0, 2)).toEqual([16, 32]);
    expect(r.value.cases.length).toBe(doneAtAbort);
    expect(doneAtAbort).toBeLessThan(29 * 5);
    expect(ticks).toBeGreaterThan(0); // the event loop ran between slices
  });

  it('the refined worst cases agree with a sweep that uses the load laws throughout', () => {
    const screened = breakSweepSync(larkspur, { refineWorst: 5 });
    const laws = breakSweepSync(larkspur, { loadModel: 'sheet' });
    if (!screened.ok || !laws.ok) throw new Error('sweep failed');
    const refined = screened.value.cases.filter((c) => c.loadModel === 'sheet');
    expect(refined.length).toBe(5);
    expect(laws.value.cases.every((c) => c.loadModel === 'sheet')).toBe(true);
    for (const c of refined) {
      const same = laws.value.cases.find((d) => d.runId === c.runId && d.conductor === c.conductor)!;
      expect(c.severityPercent).toBeCloseTo(same.severityPercent, 9);
      expect(c.worstOver?.volts).toBeCloseTo(same.worstOver!.volts, 9);
    }
  });

  it('the async and the sync forms give the same ranking', async () => {
    const sheet = buildingSheet(20, 5);
    const a = breakSweepSync(sheet);
    const b = await breakSweep(sheet, { sliceMs: 1 });
    if (!a.ok || !b.ok) throw new Error('sweep failed');
    expect(b.value.cancelled).toBe(false);
    expect(b.value.cases.map((c) => `${c.runId}|${c.conductor}|${c.severityPercent}`)).toEqual(a.value.cases.map((c) => `${c.runId}|${c.conductor}|${c.severityPercent}`));
  });
});
