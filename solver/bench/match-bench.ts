// Benchmark of the readings match on the demo building (solver/fixtures/larkspur-row.json): readings made by the
// full solver (solveSheet on a what-if) at 2 to 8 load elements, matched with and without the refit of the best
// candidates with the sheet's load laws. Prints figures and ratios; asserts nothing. `npm run bench:match`
// (optionally `-- --runs 5`).
import { readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { readSheet, type Sheet, type WhatIfChange } from '../../shared/sheet';
import { readingsMatchSync, solveSheet, type Reading } from '../index';
import type { ReadingsMatchResult } from '../studies/study-types';

const cpuMs = (): number => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
};
const load = (): string => loadavg().map((v) => v.toFixed(2)).join(' / ');
const ms = (v: number): string => (v < 10 ? v.toFixed(2) : v < 100 ? v.toFixed(1) : v.toFixed(0));
const median = (values: number[]): number => [...values].sort((a, b) => a - b)[values.length >> 1];

function demoSheet(): Sheet {
  const read = readSheet(JSON.parse(readFileSync(join(__dirname, '..', 'fixtures', 'larkspur-row.json'), 'utf8')));
  if (!read.ok) throw new Error(read.issues.map((i) => `${i.path}: ${i.message}`).join('; '));
  return read.sheet;
}

interface Case {
  name: string;
  /** The what-if whose full solve gives the readings. */
  changes: Record<string, WhatIfChange>;
  /** Load ids read (the first element of each). */
  loads: string[];
  /** What the match should put in its top group, as `kind runId conductor`. */
  truth: string;
}

const OPEN_APT_4: WhatIfChange = { kind: 'open-conductor', runId: 'apt-4-feeder', conductor: 'N' };
const CASES: Case[] = [
  { name: 'open apt 4 neutral, 2 readings', changes: { o: OPEN_APT_4 }, loads: ['apt-4-lights', 'apt-4-kitchen'], truth: 'open-conductor apt-4-feeder N' },
  {
    name: 'open apt 4 neutral, 4 readings',
    changes: { o: OPEN_APT_4 },
    loads: ['apt-4-lights', 'apt-4-kitchen', 'apt-4-electronics', 'apt-3-lights'],
    truth: 'open-conductor apt-4-feeder N',
  },
  {
    name: 'open apt 4 neutral, 6 readings',
    changes: { o: OPEN_APT_4 },
    loads: ['apt-4-lights', 'apt-4-kitchen', 'apt-4-electronics', 'apt-3-lights', 'apt-5-kitchen', 'corridor-lights'],
    truth: 'open-conductor apt-4-feeder N',
  },
  {
    name: 'open apt 4 neutral at 130 % load, 8 readings',
    changes: { o: OPEN_APT_4, s: { kind: 'scale-loads', elementId: 'apt-4-feeder', factor: 1.3, scope: 'downstream' } },
    loads: ['apt-4-lights', 'apt-4-kitchen', 'apt-4-electronics', 'apt-3-lights', 'apt-5-kitchen', 'corridor-lights', 'apt-1-electronics', 'cafe-lights'],
    truth: 'open-conductor apt-4-feeder N',
  },
  {
    name: 'failing apt 2 lug (3 Ω), 6 readings',
    changes: { l: { kind: 'degrade-connection', connectionId: 'c-apt-2-feeder-to', conductor: 'N', ohms: 3 } },
    loads: ['apt-2-lights', 'apt-2-kitchen', 'apt-2-electronics', 'apt-1-lights', 'apt-3-kitchen', 'corridor-lights'],
    truth: 'degrade-conductor apt-2-feeder N',
  },
];

function readingsOf(sheet: Sheet, c: Case): Reading[] {
  const withCase: Sheet = { ...sheet, whatIfs: { ...sheet.whatIfs, bench: { id: 'bench', name: c.name, changes: c.changes } } };
  const solved = solveSheet(withCase, { whatIfId: 'bench' });
  if (!solved.ok) throw new Error(`${c.name}: ${solved.error.message}`);
  return c.loads.map((loadId) => {
    const load = solved.result.loads.find((l) => l.loadId === loadId);
    if (!load) throw new Error(`${c.name}: no load ${loadId}`);
    const element = load.elements[0];
    return { at: { kind: 'load', loadId, element: element.label }, volts: element.volts };
  });
}

const key = (c: { cause: { kind: string; runId?: string; conductor?: string; connectionId?: string } }) =>
  `${c.cause.kind} ${c.cause.runId ?? c.cause.connectionId ?? ''} ${c.cause.conductor ?? ''}`.trim();

function run(sheet: Sheet, readings: Reading[], refineBest: number, runs: number): { wall: number; cpu: number; result: ReadingsMatchResult } {
  const wall: number[] = [];
  const cpu: number[] = [];
  let result: ReadingsMatchResult | undefined;
  for (let i = 0; i < runs; i++) {
    const c0 = cpuMs();
    const t0 = performance.now();
    const r = readingsMatchSync(sheet, readings, { refineBest });
    wall.push(performance.now() - t0);
    cpu.push(cpuMs() - c0);
    if (!r.ok) throw new Error(r.error.message);
    result = r.value;
  }
  return { wall: median(wall), cpu: median(cpu), result: result! };
}

function main(): void {
  const runsArg = process.argv.indexOf('--runs');
  const runs = runsArg > 0 ? Math.max(1, Number(process.argv[runsArg + 1]) || 3) : 3;
  const sheet = demoSheet();
  console.log(`Readings match on the demo building (larkspur-row.json) — Node ${process.version}, ${cpus().length} cores, median of ${runs} runs`);
  console.log(`load average (1 / 5 / 15 min) at start: ${load()}; the machine is shared, so CPU time is printed beside wall time.`);
  // Warm the JIT: one match of each kind on the first case.
  const warm = readingsOf(sheet, CASES[0]);
  readingsMatchSync(sheet, warm, { refineBest: 0 });
  readingsMatchSync(sheet, warm);

  const totals = { ciCpu: 0, fullCpu: 0, fullWall: 0 };
  for (const c of CASES) {
    const readings = readingsOf(sheet, c);
    const ci = run(sheet, readings, 0, runs);
    const full = run(sheet, readings, 10, runs);
    totals.ciCpu += ci.cpu;
    totals.fullCpu += full.cpu;
    totals.fullWall += full.wall;
    const r = full.result;
    const top = r.groups[0]?.candidates ?? [];
    const hit = top.find((x) => key(x) === c.truth);
    console.log(`\n${c.name}`);
    console.log(
      `  constant-impedance only: ${ms(ci.wall)} ms wall, ${ms(ci.cpu)} ms CPU (${ci.result.candidatesTried} candidates); ` +
        `with the refit of the best 10: ${ms(full.wall)} ms wall, ${ms(full.cpu)} ms CPU (target < 1000 ms: ${full.wall < 1000 ? 'met' : full.cpu < 1000 ? 'NOT met in wall time, met in CPU time' : 'NOT met'})`,
    );
    console.log(
      `  refit ${ms(full.cpu - ci.cpu)} ms CPU for ${r.candidatesRefined} candidates (${ms((full.cpu - ci.cpu) / Math.max(1, r.candidatesRefined))} ms each), ` +
        `${(full.cpu / Math.max(ci.cpu, 1e-3)).toFixed(1)}× the constant-impedance match`,
    );
    console.log(
      `  best: ${r.best?.description} (${r.best?.loadModel}), rms ${r.fit.rmsPercent.toFixed(3)} % / ${r.fit.rmsVolts.toFixed(3)} V, ` +
        `verdict ${r.certainty.verdict}, ratio to the next group ${Number.isFinite(r.certainty.ratio) ? r.certainty.ratio.toFixed(1) : '∞'}; ` +
        `top group ${top.length} candidate(s) at ${r.certainty.locationsInBestGroup} location(s); true cause ${hit ? `in it (level ${hit.loadLevel.factor.toFixed(3)})` : 'NOT in it'}`,
    );
  }
  console.log(
    `\nall ${CASES.length} cases: ${ms(totals.fullWall)} ms wall, ${ms(totals.fullCpu)} ms CPU with the refit; ` +
      `${ms(totals.ciCpu)} ms CPU without it (refit share ${((100 * (totals.fullCpu - totals.ciCpu)) / totals.fullCpu).toFixed(0)} %)`,
  );
  console.log(`load average at the end: ${load()}`);
}

main();
