// Sync benchmark: starts the server (a child process) and N y-websocket clients on loopback; prints the latency
// from an update being made to it being applied at each other client (p50, p95, p99), updates lost, the server's
// memory, the CPU used by the server and by the clients, the machine's load, and the time to load a 2,000-element
// sheet. The clients are spread over worker threads (BENCH_WORKERS, default 4) so that one saturated client thread
// does not pass for server latency; each worker times edits against the one process-wide monotonic clock.
// Run: npm run bench:sync
import { execSync } from 'node:child_process';
import { readFileSync, rmSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { Worker } from 'node:worker_threads';
import * as Y from 'yjs';
import { TestClient } from '../support/http-client';
import { connectSheet } from '../support/sync-client';
import { spawnServer } from '../support/server-process';
import { freePort } from '../support/free-port';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { monotonicMs, procCpuMs, type FromWorker, type ToWorker, type WorkerSetup } from './sync-bench-worker';

const UPDATES_PER_CLIENT = Number(process.env.BENCH_UPDATES ?? 20);
const WORKERS = Number(process.env.BENCH_WORKERS ?? 4);
const REPEAT = Number(process.env.BENCH_REPEAT ?? 1);
const ROUND_MS = 100;
const WAIT_MS = Number(process.env.BENCH_WAIT_MS ?? 15_000);
const TICKS_PER_SECOND = Number(execSync('getconf CLK_TCK').toString().trim()) || 100;
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

function rssMb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'));
  return line ? Number(line.replace(/\D+/g, '')) / 1024 : NaN;
}

const loadAverage = () => readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
const pct = (sorted: Float64Array, p: number) => (sorted.length === 0 ? NaN : sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]);

function startWorker(setup: WorkerSetup) {
  // Workers do not inherit tsx's loader: a CommonJS stub registers it, then loads the TypeScript worker.
  const file = path.join(__dirname, 'sync-bench-worker.ts');
  const worker = new Worker(`require('tsx/cjs/api').register(); require(${JSON.stringify(file)});`, { eval: true, workerData: setup });
  const next = (type: FromWorker['type']) =>
    new Promise<FromWorker>((resolve, reject) => {
      const onMessage = (m: FromWorker) => {
        if (m.type !== type) return;
        worker.off('message', onMessage);
        worker.off('error', reject);
        resolve(m);
      };
      worker.on('message', onMessage);
      worker.once('error', reject);
    });
  return { worker, next };
}

async function scenario(http: TestClient, projectId: string, serverPid: number, sheets: number, clientsPerSheet: number) {
  const all: WorkerSetup['clients'] = [];
  for (let s = 0; s < sheets; s++) {
    const sheetId = (await http.post(`/api/projects/${projectId}/sheets`, { name: `Bench ${sheets}x${clientsPerSheet} #${s}` })).body.sheet.id;
    for (let c = 0; c < clientsPerSheet; c++) all.push({ sheetId, index: all.length, sheetClients: clientsPerSheet });
  }
  // Clients are dealt round-robin, so the clients of one sheet sit in different workers.
  const workerCount = Math.min(WORKERS, all.length);
  const workers = Array.from({ length: workerCount }, (_, w) =>
    startWorker({
      baseUrl: http.baseUrl,
      cookie: http.cookieHeader(),
      updatesPerClient: UPDATES_PER_CLIENT,
      roundMs: ROUND_MS,
      waitMs: WAIT_MS,
      ticksPerSecond: TICKS_PER_SECOND,
      clients: all.filter((_, i) => i % workerCount === w),
    }),
  );
  try {
    await Promise.all(workers.map((w) => w.next('synced')));
    const reports = workers.map((w) => w.next('report'));
    const cpu0 = process.cpuUsage();
    const serverCpu0 = procCpuMs(`/proc/${serverPid}/stat`, TICKS_PER_SECOND);
    const startMs = monotonicMs() + 50;
    for (const w of workers) w.worker.postMessage({ type: 'go', startMs } satisfies ToWorker);
    const results = (await Promise.all(reports)) as Extract<FromWorker, { type: 'report' }>[];
    const wallMs = monotonicMs() - startMs;
    const cpu = process.cpuUsage(cpu0);
    const serverCpuMs = procCpuMs(`/proc/${serverPid}/stat`, TICKS_PER_SECOND) - serverCpu0;
    const latencies = new Float64Array(results.reduce((n, r) => n + r.latenciesMs.length, 0));
    let at = 0;
    for (const r of results) {
      latencies.set(r.latenciesMs, at);
      at += r.latenciesMs.length;
    }
    latencies.sort();
    const received = results.reduce((n, r) => n + r.received, 0);
    const expected = results.reduce((n, r) => n + r.expected, 0);
    const percentOf = (ms: number) => (ms / wallMs) * 100;
    return {
      window: { startMs, endMs: startMs + wallMs },
      workerCount,
      clientCpuPercent: percentOf((cpu.user + cpu.system) / 1000),
      busiestWorkerCpuPercent: Math.max(...results.map((r) => percentOf(r.cpuMs))),
      serverCpuPercent: percentOf(serverCpuMs),
      serverCpuMs,
      clientCpuMs: (cpu.user + cpu.system) / 1000,
      expected,
      received,
      lost: expected - received,
      shortClients: results.reduce((n, r) => n + r.shortClients, 0),
      absentFromDocs: results.reduce((n, r) => n + r.absentFromDocs, 0),
      p50: pct(latencies, 50),
      p95: pct(latencies, 95),
      p99: pct(latencies, 99),
    };
  } finally {
    await Promise.all(workers.map((w) => w.worker.terminate()));
  }
}

async function loadLargeSheet(http: TestClient, projectId: string, elements: number) {
  const sheetId = (await http.post(`/api/projects/${projectId}/sheets`, { name: `Large ${elements}` })).body.sheet.id;
  const sheet = { formatVersion: 1, name: 'Large', elements: {} as Record<string, unknown>, connections: {} as Record<string, unknown>, whatIfs: {} };
  for (let i = 0; i < elements; i++) {
    const id = `e${i}`;
    sheet.elements[id] = i % 2 === 0
      ? { kind: 'bus', id, name: `Panel ${i}`, x: i * 10, y: 0 }
      : { kind: 'load', id, name: `Load ${i}`, x: i * 10, y: 80, kw: 1.5, ratedVolts: 120 };
    if (i % 2 === 1) sheet.connections[`c${i}`] = { id: `c${i}`, from: { elementId: `e${i - 1}`, terminal: 'bars' }, to: { elementId: id, terminal: 'supply' }, conductorMap: { A: 'A', N: 'N' } };
  }
  const t0 = performance.now();
  const put = await http.request('PUT', `/api/sheets/${sheetId}/document`, sheet);
  const importMs = performance.now() - t0;
  if (put.status !== 200) throw new Error(`import failed: ${JSON.stringify(put.body).slice(0, 300)}`);
  await pause(300); // the room unloads once the import is stored; the next join loads it from the database
  const t1 = performance.now();
  const c = connectSheet(http, sheetId, new Y.Doc());
  await c.synced();
  const loadMs = performance.now() - t1;
  const count = c.doc.getMap('elements').size;
  c.destroy();
  return { importMs, loadMs, count };
}

async function main() {
  const dataDir = mkdtempSync(path.join(os.tmpdir(), 'pw-bench-'));
  const port = await freePort();
  // BENCH_SERVER_NODE_ARGS="--cpu-prof --cpu-prof-dir=/tmp/prof" profiles the server.
  const nodeArgs = (process.env.BENCH_SERVER_NODE_ARGS ?? '').split(' ').filter(Boolean);
  const server = await spawnServer({ DATA_DIR: dataDir }, port, nodeArgs);
  try {
    const http = new TestClient(server.url);
    await http.signUp('bench@example.com');
    const projectId = (await http.post('/api/projects', { name: 'Bench' })).body.project.id;
    console.log(
      `Sync benchmark: ${UPDATES_PER_CLIENT} updates per client at ~10/s, clients in up to ${WORKERS} worker threads, server pid ${server.child.pid}, idle RSS ${rssMb(server.child.pid!).toFixed(0)} MB`,
    );
    console.log(`uptime: ${execSync('uptime').toString().trim()}  (${os.cpus().length} cores)`);
    console.log(
      'scenario                 | deliveries | lost | p50 ms | p95 ms | p99 ms | server RSS MB | server CPU s (%) | clients CPU s (%, workers, busiest %) | load 1/5/15 min',
    );
    const only = process.env.BENCH_ONLY; // e.g. "1x20" to run one scenario while profiling
    for (const [sheets, per] of [[1, 2], [1, 20], [1, 100], [100, 2]] as const) {
      if (only && only !== `${sheets}x${per}`) continue;
      for (let run = 0; run < REPEAT; run++) {
        const r = await scenario(http, projectId, server.child.pid!, sheets, per);
        const label = sheets === 1 ? `${per} clients on one sheet` : `${sheets} sheets x ${per} clients`;
        console.log(
          `${label.padEnd(24)} | ${String(r.received).padStart(10)} | ${String(r.lost).padStart(4)} | ${r.p50.toFixed(1).padStart(6)} | ${r.p95.toFixed(1).padStart(6)} | ${r.p99.toFixed(1).padStart(6)} | ${rssMb(server.child.pid!).toFixed(0).padStart(13)} | ${`${(r.serverCpuMs / 1000).toFixed(2)} (${r.serverCpuPercent.toFixed(0)})`.padStart(16)} | ${`${(r.clientCpuMs / 1000).toFixed(2)} (${r.clientCpuPercent.toFixed(0)}, ${r.workerCount}, ${r.busiestWorkerCpuPercent.toFixed(0)})`.padStart(37)} | ${loadAverage()}`,
        );
        if (r.lost > 0) {
          console.log(`  ${r.lost} not seen within ${WAIT_MS / 1000} s of the last edit, at ${r.shortClients} client(s); ${r.absentFromDocs} absent from their documents (not delivered by then)`);
        }
        // With a server profile, this window (CLOCK_MONOTONIC ms, the clock of V8's profile timestamps) picks the scenario out of it.
        if (nodeArgs.length > 0) console.log(`  window ${r.window.startMs.toFixed(0)}..${r.window.endMs.toFixed(0)} ms`);
      }
    }
    const large = await loadLargeSheet(http, projectId, 2000);
    console.log(`2,000-element sheet: import ${large.importMs.toFixed(0)} ms; cold load and first sync ${large.loadMs.toFixed(0)} ms (${large.count} elements)`);
    console.log('Targets: p95 < 50 ms at 20 clients, < 200 ms at 100 clients, 0 lost.');
    console.log('CPU s is CPU time used during the scenario (from the start of the edits until every worker has everything or gives up); % is of one core over that time.');
    console.log('A busiest worker near 100 % means the clients, not the server, set the latency; load far above the core count means the scheduler does.');
    console.log(`uptime: ${execSync('uptime').toString().trim()}`);
  } finally {
    await server.kill('SIGTERM');
    rmSync(dataDir, { recursive: true, force: true });
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
