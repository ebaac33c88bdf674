// The studies part of `npm run bench:solver`: a break sweep over every conductor of a generated building sheet, and
// a fault study of every bus by the five fault types, with the base solve, a fresh what-if solve and a single fault
// as yardsticks. Prints figures and ratios; asserts nothing.
import { cpus, loadavg } from 'node:os';
import { performance } from 'node:perf_hooks';
import { SHUNT_FAULT_TYPES } from '../../shared/sheet';
import { breakSweepInShares, breakSweepSync, faultStudy, solveFault, solveSheet } from '../index';
import { ShareThreads } from './share-threads';
import { buildingSheet } from './building-sheet';
import { BreakSweeper } from '../studies/break-sweep';
import { OpeningSolver } from '../studies/opening-solver';

const cpuMs = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};

function timed<T>(fn: () => T): { ms: number; cpu: number; value: T } {
  const c0 = cpuMs();
  const t0 = performance.now();
  const value = fn();
  return { ms: performance.now() - t0, cpu: cpuMs() - c0, value };
}

const load = (): string => loadavg().map((v) => v.toFixed(1)).join(' / ');
const ms = (v: number): string => (v < 10 ? v.toFixed(2) : v < 100 ? v.toFixed(1) : v.toFixed(0));

export async function studyBench(buses = 1_000): Promise<void> {
  console.log(`\nStudies on a generated 208Y/120 building sheet of ${buses} buses (solver/bench/building-sheet.ts) — ${cpus().length} cores`);
  console.log(`load average (1 / 5 / 15 min) at start: ${load()}; the machine is shared, so CPU time is printed beside wall time.`);
  const sheet = buildingSheet(buses);
  // Warm the JIT on a small sheet.
  const warm = buildingSheet(40, 2);
  breakSweepSync(warm, { refineWorst: 2 });
  faultStudy(warm);

  const base = timed(() => solveSheet(sheet));
  if (!base.value.ok) throw new Error(base.value.error.message);
  const b = base.value.result;
  console.log(
    `base solve (build, solve, results): ${ms(base.ms)} ms wall, ${ms(base.cpu)} ms CPU; ${b.linearSolve.unknowns} unknowns, ` +
      `${b.loads.length} loads, ${b.convergence.iterations} load iterations`,
  );

  // Yardsticks that do not depend on how busy the machine is: one dense solve with the sweep's factors, and one
  // product with its matrix; a case is about one of each plus a pass over the loads.
  const prepared = timed(() => BreakSweeper.prepare(sheet, { refineWorst: 0 }));
  if (!prepared.value.ok) throw new Error(prepared.value.error.message);
  const sweeper = prepared.value.value;
  const opening = (sweeper as unknown as { solver: OpeningSolver }).solver;
  const rhs = { re: new Float64Array(opening.n).fill(1), im: new Float64Array(opening.n) };
  const solves = timed(() => {
    for (let i = 0; i < 200; i++) opening.solveBase(rhs.re, rhs.im);
  });
  const solveMs = solves.ms / 200;
  const solveCpu = solves.cpu / 200;
  console.log(
    `break sweep set-up (build, base solve with the load laws, the sweep's own factors): ${ms(prepared.ms)} ms wall, ${ms(prepared.cpu)} ms CPU; ` +
      `one dense solve with those factors ${ms(solveMs)} ms wall, ${ms(solveCpu)} ms CPU (nnz(A) without explicit zeros ${opening.matrix.colPtr[opening.n]})`,
  );

  for (const refineWorst of [0, 10]) {
    const sweep = timed(() => breakSweepSync(sheet, { refineWorst }));
    if (!sweep.value.ok) throw new Error(sweep.value.error.message);
    const s = sweep.value.value;
    const full = s.cases.filter((c) => c.method === 'full-solve').length;
    const worst = s.cases[0];
    console.log(
      `break sweep, every conductor, constant-impedance cases${refineWorst ? `, worst ${refineWorst} again with the load laws` : ''}: ` +
        `${s.total} cases in ${ms(sweep.ms)} ms wall, ${ms(sweep.cpu)} ms CPU (target < 2000 ms: ${sweep.ms < 2000 ? 'met' : sweep.cpu < 2000 ? 'NOT met in wall time, met in CPU time' : 'NOT met'}); ` +
        `${ms(sweep.ms / s.total)} ms per case with the set-up (${((sweep.cpu - prepared.cpu) / s.total / solveCpu).toFixed(1)} dense solves' CPU per case without it); ` +
        `${full} fresh solves; worst ${worst.runId} ${worst.conductor} ` +
        `(${worst.severityPercent.toFixed(1)} % beyond Range A)`,
    );
    if (refineWorst === 0) {
      // One what-if solved the ordinary way, for the ratio.
      const one = { ...sheet, whatIfs: { w: { id: 'w', name: 'w', changes: { o: worst.change } } } };
      const fresh = timed(() => solveSheet(one, { whatIfId: 'w' }));
      console.log(
        `  one opening solved as a fresh what-if: ${ms(fresh.ms)} ms; the sweep did ${s.total} for ${(sweep.ms / fresh.ms).toFixed(1)} of those ` +
          `(${((fresh.ms * s.total) / sweep.ms).toFixed(0)}× faster than solving each afresh)`,
      );
    }
  }

  // The same sweep split over the machine's cores: share 0 here, the others on worker threads started and warmed
  // before the clock (as a server's pool would be); each share builds and factors the base case itself.
  const shares = Math.min(4, cpus().length);
  if (shares >= 2) {
    const pool = new ShareThreads(shares - 1);
    try {
      const warmed = await breakSweepInShares(warm, { refineWorst: 2 }, shares, pool.runner(warm));
      if (!warmed.ok) throw new Error(warmed.error.message);
      for (const refineWorst of [0, 10]) {
        const runs: { ms: number; cpu: number }[] = [];
        let total = 0;
        let worst = '';
        for (let run = 0; run < 3; run++) {
          const c0 = cpuMs();
          const t0 = performance.now();
          const out = await breakSweepInShares(sheet, { refineWorst }, shares, pool.runner(sheet));
          runs.push({ ms: performance.now() - t0, cpu: cpuMs() - c0 });
          if (!out.ok) throw new Error(out.error.message);
          total = out.value.total;
          worst = `${out.value.cases[0].runId} ${out.value.cases[0].conductor}`;
        }
        const best = Math.min(...runs.map((r) => r.ms));
        console.log(
          `break sweep in ${shares} shares (${shares - 1} worker thread${shares > 2 ? 's' : ''} + this one)${refineWorst ? `, worst ${refineWorst} again with the load laws` : ', constant-impedance cases'}: ` +
            `${total} cases in ${runs.map((r) => ms(r.ms)).join(', ')} ms wall over 3 runs, best ${ms(best)} (target < 2000 ms: ${best < 2000 ? 'met' : 'NOT met'}); ` +
            `this thread's CPU ${runs.map((r) => ms(r.cpu)).join(', ')} ms; worst ${worst}`,
        );
      }
    } finally {
      await pool.close();
    }
  }

  const busIds = Object.values(sheet.elements).filter((e) => e.kind === 'bus').map((e) => e.id);
  const study = timed(() => faultStudy(sheet));
  if (!study.value.ok) throw new Error(study.value.error.message);
  const f = study.value.study;
  const problems = f.cases.filter((c) => c.problem).length;
  console.log(
    `fault study, ${busIds.length} buses × ${SHUNT_FAULT_TYPES.length} fault types: ${f.cases.length} cases in ${ms(study.ms)} ms wall, ${ms(study.cpu)} ms CPU ` +
      `(target < 2000 ms: ${study.ms < 2000 ? 'met' : study.cpu < 2000 ? 'NOT met in wall time, met in CPU time' : 'NOT met'}); ${ms(study.ms / f.cases.length)} ms per fault; ` +
      `${problems} cases without figures; ${f.duties.length} duty checks`,
  );
  const single = timed(() => solveFault(sheet, { busId: busIds[busIds.length - 1], faultType: 'line-to-ground' }));
  console.log(
    `  one fault solved alone (factorization and network-wide results): ${ms(single.ms)} ms; ` +
      `the study did ${f.cases.length} for ${(study.ms / single.ms).toFixed(1)} of those`,
  );
  console.log(`load average at end: ${load()}`);
}
