// Sync benchmark: starts the server (a child process) and N y-websocket clients on loopback; prints the latency
// from an update being made to it being applied at each other client (p50, p95, p99), updates lost, the server's
// memory, and the time to load a 2,000-element sheet. Run: npm run bench:sync
import { readFileSync, rmSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import * as Y from 'yjs';
import { SheetCommands } from '../../editor/document/commands';
import { TestClient } from '../support/http-client';
import { connectSheet, type SyncClient } from '../support/sync-client';
import { spawnServer } from '../support/server-process';
import { freePort } from '../support/test-server';
import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const UPDATES_PER_CLIENT = Number(process.env.BENCH_UPDATES ?? 20);
const pause = (ms: number) => new Promise((r) => setTimeout(r, ms));

function rssMb(pid: number): number {
  const line = readFileSync(`/proc/${pid}/status`, 'utf8').split('\n').find((l) => l.startsWith('VmRSS:'));
  return line ? Number(line.replace(/\D+/g, '')) / 1024 : NaN;
}

const pct = (sorted: number[], p: number) => (sorted.length === 0 ? NaN : sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))]);

async function scenario(http: TestClient, projectId: string, sheets: number, clientsPerSheet: number) {
  const rooms: { sheetId: string; clients: SyncClient[] }[] = [];
  for (let s = 0; s < sheets; s++) {
    const sheetId = (await http.post(`/api/projects/${projectId}/sheets`, { name: `Bench ${sheets}x${clientsPerSheet} #${s}` })).body.sheet.id;
    const clients = Array.from({ length: clientsPerSheet }, () => connectSheet(http, sheetId));
    rooms.push({ sheetId, clients });
  }
  await Promise.all(rooms.flatMap((r) => r.clients.map((c) => c.synced())));
  const sentAt = new Map<string, number>();
  const latencies: number[] = [];
  let received = 0;
  for (const room of rooms) {
    for (const c of room.clients) {
      c.doc.getMap('elements').observe((event) => {
        if (event.transaction.local) return;
        const now = performance.now();
        for (const key of event.keysChanged) {
          const t = sentAt.get(key);
          if (t !== undefined) {
            latencies.push(now - t);
            received++;
          }
        }
      });
    }
  }
  // Every client edits at about 10 updates a second, interleaved.
  const cpu0 = process.cpuUsage();
  const wall0 = performance.now();
  const all = rooms.flatMap((r) => r.clients.map((c) => ({ c, cmd: new SheetCommands(c.doc, {}) })));
  for (let round = 0; round < UPDATES_PER_CLIENT; round++) {
    for (const [i, { cmd }] of all.entries()) {
      const id = `u-${round}-${i}`;
      sentAt.set(id, performance.now());
      cmd.addElement({ kind: 'bus', id, name: id, x: round, y: i });
    }
    await pause(100);
  }
  const expected = all.length * UPDATES_PER_CLIENT * (clientsPerSheet - 1);
  const deadline = Date.now() + 15_000;
  while (received < expected && Date.now() < deadline) await pause(50);
  const cpu = process.cpuUsage(cpu0);
  const clientCpuPercent = ((cpu.user + cpu.system) / 1000 / (performance.now() - wall0)) * 100;
  for (const r of rooms) for (const c of r.clients) c.destroy();
  latencies.sort((a, b) => a - b);
  return { clientCpuPercent, expected, received, lost: expected - received, p50: pct(latencies, 50), p95: pct(latencies, 95), p99: pct(latencies, 99) };
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
    console.log(`Sync benchmark: ${UPDATES_PER_CLIENT} updates per client at ~10/s, server pid ${server.child.pid}, idle RSS ${rssMb(server.child.pid!).toFixed(0)} MB`);
    console.log('scenario                 | deliveries | lost | p50 ms | p95 ms | p99 ms | server RSS MB | client process CPU %');
    const only = process.env.BENCH_ONLY; // e.g. "1x20" to run one scenario while profiling
    for (const [sheets, per] of [[1, 2], [1, 20], [1, 100], [100, 2]] as const) {
      if (only && only !== `${sheets}x${per}`) continue;
      const r = await scenario(http, projectId, sheets, per);
      const label = sheets === 1 ? `${per} clients on one sheet` : `${sheets} sheets x ${per} clients`;
      console.log(
        `${label.padEnd(24)} | ${String(r.received).padStart(10)} | ${String(r.lost).padStart(4)} | ${r.p50.toFixed(1).padStart(6)} | ${r.p95.toFixed(1).padStart(6)} | ${r.p99.toFixed(1).padStart(6)} | ${rssMb(server.child.pid!).toFixed(0).padStart(6)}        | ${r.clientCpuPercent.toFixed(0).padStart(4)}`,
      );
    }
    const large = await loadLargeSheet(http, projectId, 2000);
    console.log(`2,000-element sheet: import ${large.importMs.toFixed(0)} ms; cold load and first sync ${large.loadMs.toFixed(0)} ms (${large.count} elements)`);
    console.log('Targets: p95 < 50 ms at 20 clients, < 200 ms at 100 clients, 0 lost.');
    console.log('All clients run in this one process: near 100 % client CPU means the clients, not the server, set the latency.');
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
