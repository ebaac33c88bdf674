// One worker thread of the sync benchmark: runs a share of the clients, makes their edits on the common schedule,
// and times every remote edit it applies. Time is read from process.hrtime (CLOCK_MONOTONIC), one clock for every
// thread of the process, and the send time travels inside the edit (in its element id), so a latency is always
// "this thread's now minus the sender's now" on that one clock, whichever worker sent it.
import { readFileSync } from 'node:fs';
import { parentPort, workerData } from 'node:worker_threads';
import * as Y from 'yjs';
import { SheetCommands } from '../../editor/document/commands';
import { connectSheet, type SyncClient } from '../support/sync-client';

export interface WorkerSetup {
  baseUrl: string;
  cookie: string;
  updatesPerClient: number;
  roundMs: number;
  /** How long to wait after the last edit for everything to arrive before counting the rest as lost. */
  waitMs: number;
  /** The kernel's clock ticks per second (getconf CLK_TCK), the unit of /proc CPU times. */
  ticksPerSecond: number;
  /** The clients this worker runs: the sheet, the client's number across the scenario, how many share its sheet. */
  clients: { sheetId: string; index: number; sheetClients: number }[];
}

export type ToWorker = { type: 'go'; startMs: number };
export type FromWorker =
  | { type: 'synced' }
  | {
      type: 'report';
      latenciesMs: Float64Array;
      received: number;
      expected: number;
      cpuMs: number;
      /** Clients that did not see every edit of their sheet, and how many edits their documents still lack. */
      shortClients: number;
      absentFromDocs: number;
    };

export const monotonicMs = () => Number(process.hrtime.bigint()) / 1e6;

/** CPU time (utime + stime) from a /proc stat file: /proc/thread-self/stat for this thread, /proc/<pid>/stat for a process. */
export function procCpuMs(statFile: string, ticksPerSecond: number): number {
  const stat = readFileSync(statFile, 'utf8');
  const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
  return ((Number(fields[11]) + Number(fields[12])) * 1000) / ticksPerSecond;
}

// An edit's id carries its send time: u-<round>-<client>-<send ms>.
const editId = (round: number, index: number, sentMs: number) => `u-${round}-${index}-${sentMs.toFixed(3)}`;
const sentMsOf = (id: string) => (id.startsWith('u-') ? Number(id.slice(id.lastIndexOf('-') + 1)) : NaN);

const pause = (ms: number) => new Promise((r) => setTimeout(r, Math.max(0, ms)));

async function run(setup: WorkerSetup) {
  const port = parentPort!;
  const http = { baseUrl: setup.baseUrl, cookieHeader: () => setup.cookie };
  const clients: { client: SyncClient; cmd: SheetCommands; index: number }[] = setup.clients.map((c) => {
    const client = connectSheet(http, c.sheetId, new Y.Doc());
    return { client, cmd: new SheetCommands(client.doc, {}), index: c.index };
  });
  await Promise.all(clients.map((c) => c.client.synced()));

  const latencies: number[] = [];
  let received = 0;
  const receivedBy = new Map<SyncClient, number>();
  const expected = setup.clients.reduce((n, c) => n + (c.sheetClients - 1) * setup.updatesPerClient, 0);
  for (const { client } of clients) {
    receivedBy.set(client, 0);
    client.doc.getMap('elements').observe((event) => {
      if (event.transaction.local) return;
      const now = monotonicMs();
      for (const key of event.keysChanged) {
        const sent = sentMsOf(key);
        if (Number.isNaN(sent)) continue;
        latencies.push(now - sent);
        received++;
        receivedBy.set(client, receivedBy.get(client)! + 1);
      }
    });
  }

  const go = await new Promise<ToWorker>((resolve) => {
    port.once('message', resolve);
    port.postMessage({ type: 'synced' } satisfies FromWorker);
  });
  const threadCpuMs = () => procCpuMs('/proc/thread-self/stat', setup.ticksPerSecond);
  const cpu0 = threadCpuMs();
  // Every client edits once a round (about 10 a second), all at the round's start, on a schedule shared by all
  // workers so that the server sees the same bursts as when one process ran every client.
  for (let round = 0; round < setup.updatesPerClient; round++) {
    await pause(go.startMs + round * setup.roundMs - monotonicMs());
    for (const { cmd, index } of clients) {
      const sentMs = monotonicMs();
      const id = editId(round, index, sentMs);
      cmd.addElement({ kind: 'bus', id, name: id, x: round, y: index });
    }
  }
  const deadline = monotonicMs() + setup.waitMs;
  while (received < expected && monotonicMs() < deadline) await pause(20);
  const cpuMs = threadCpuMs() - cpu0;
  // Told apart when something is missing: an edit absent from the document was not delivered (late or lost); one
  // present but not counted would be a fault of this measurement.
  let shortClients = 0;
  let absentFromDocs = 0;
  for (const [i, { client }] of clients.entries()) {
    const whole = setup.clients[i].sheetClients * setup.updatesPerClient;
    if (receivedBy.get(client)! < (setup.clients[i].sheetClients - 1) * setup.updatesPerClient) shortClients++;
    absentFromDocs += whole - [...client.doc.getMap('elements').keys()].filter((k) => k.startsWith('u-')).length;
  }
  const latenciesMs = Float64Array.from(latencies);
  port.postMessage({ type: 'report', latenciesMs, received, expected, cpuMs, shortClients, absentFromDocs } satisfies FromWorker, [latenciesMs.buffer]);
  for (const { client } of clients) client.destroy();
}

if (parentPort) void run(workerData as WorkerSetup);
