// Benchmark (prints figures, asserts nothing): a synthetic 208Y/120 building of N panels, solved as a base case,
// as a what-if opening one feeder neutral through the base factors, and as a fresh solve of the same opening; and
// the loading study over the base result.
// Run: npx tsx tests/solver/bench/solve-bench.ts [panels...]
import { performance } from 'node:perf_hooks';
import { validateSheet, type Sheet } from '../../../shared/sheet';
import { SheetSolver, loadingStudyOf, solveSheet } from '../../../solver';
import { SheetBuilder, customRun } from '../helpers/sheet-builder';

function building(panels: number, openFirstNeutral = false): Sheet {
  const five = ['A', 'B', 'C', 'N', 'PE'];
  const b = new SheetBuilder(`${panels} panels`)
    .source('src', { nominalVolts: 208, strength: 'fault-current', faultCurrentKa: 65, xOverR: 8 })
    .bus('svc', { role: 'service', neutralGroundBond: true })
    .electrode('rod', 25)
    .connect('src', 'out', 'svc', 'bars', ['A', 'B', 'C', 'N'])
    .connect('svc', 'bars', 'rod', 'lead', ['PE']);
  const kinds = ['lighting', 'receptacles', 'electronics', 'heating', 'motor'];
  for (let i = 0; i < panels; i++) {
    const feeder = customRun(40 + (i % 17) * 10, { A: [0.19, 0.045], B: [0.19, 0.045], C: [0.19, 0.045], N: [0.19, 0.045], PE: [0.78, 0.052] });
    if (openFirstNeutral && i === 0) (feeder.conductors as Record<string, Record<string, unknown>>).N.open = true;
    b.run(`f${i}`, feeder).bus(`p${i}`).connect('svc', 'bars', `f${i}`, 'from', five).connect(`f${i}`, 'to', `p${i}`, 'bars', five);
    for (let k = 0; k < 6; k++) {
      const phase = 'ABC'[(i + k) % 3];
      b.load(`l${i}-${k}`, { ratedVolts: 120, kw: 0.3 + ((i * 7 + k * 3) % 10) * 0.15, powerFactor: 0.95, loadKind: kinds[(i + k) % kinds.length] });
      b.connect(`p${i}`, 'bars', `l${i}-${k}`, 'supply', { [phase]: 'A', N: 'N' });
    }
    b.load(`m${i}`, { connection: 'three-phase-delta', ratedVolts: 208, kw: 2, powerFactor: 0.85, loadKind: 'motor' });
    b.connect(`p${i}`, 'bars', `m${i}`, 'supply', ['A', 'B', 'C']);
  }
  b.whatIf('open-n', { o: { kind: 'open-conductor', runId: 'f0', conductor: 'N' } });
  const v = validateSheet(b.json());
  if (!v.ok) throw new Error('invalid benchmark sheet');
  return v.sheet;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

function time<T>(repeat: number, f: () => T): { ms: number; last: T } {
  const times: number[] = [];
  let last!: T;
  for (let i = 0; i < repeat; i++) {
    const t0 = performance.now();
    last = f();
    times.push(performance.now() - t0);
  }
  return { ms: median(times), last };
}

const sizes = process.argv.slice(2).map(Number).filter((n) => n > 0);
for (const panels of sizes.length ? sizes : [20, 100, 400]) {
  const sheet = building(panels);
  const opened = building(panels, true);
  const repeat = panels > 200 ? 3 : 7;
  const base = time(repeat, () => solveSheet(sheet));
  if (!base.last.ok) throw new Error(base.last.error.message);
  const viaBase = time(repeat, () => {
    const solver = new SheetSolver(sheet);
    solver.solve();
    const t0 = performance.now();
    const r = solver.solve('open-n');
    return { r, ms: performance.now() - t0 };
  });
  const fresh = time(repeat, () => solveSheet(opened));
  if (!viaBase.last.r.ok || !fresh.last.ok) throw new Error('what-if failed');
  const whatIfMs = viaBase.last.ms;
  const b = base.last.result;
  const study = time(repeat, () => loadingStudyOf(sheet, b));
  console.log(
    `${panels} panels: ${b.linearSolve.unknowns} unknowns, ${b.linearSolve.nonzeros} nonzeros, ${b.loads.length} loads; ` +
      `base ${base.ms.toFixed(1)} ms (${b.convergence.iterations} iterations, ${b.convergence.method}); ` +
      `what-if through base factors ${whatIfMs.toFixed(1)} ms (${viaBase.last.r.result.linearSolve.method}, ${viaBase.last.r.result.convergence.iterations} iterations); ` +
      `fresh solve of the same opening ${fresh.ms.toFixed(1)} ms; ratio ${(fresh.ms / whatIfMs).toFixed(2)}; ` +
      `loading study over the base result ${study.ms.toFixed(1)} ms (${study.last.conductors.length} conductors)`,
  );
}
