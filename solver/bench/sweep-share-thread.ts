// A worker thread for the benchmark's split sweep: sweeps the share it is sent and answers with its cases,
// reporting progress on the way. It stays up between sweeps (a pool started before the clock, as a server's is).
import { parentPort } from 'node:worker_threads';
import type { Sheet } from '../../shared/sheet';
import { breakSweepSync, type BreakSweepOptions } from '../index';

export type ToShareThread = { sheet: Sheet; options: BreakSweepOptions };
export type FromShareThread = { type: 'progress'; done: number; total: number } | { type: 'done'; outcome: ReturnType<typeof breakSweepSync> };

parentPort?.on('message', ({ sheet, options }: ToShareThread) => {
  const outcome = breakSweepSync(sheet, { ...options, onProgress: (p) => parentPort?.postMessage({ type: 'progress', done: p.done, total: p.total } satisfies FromShareThread) });
  parentPort?.postMessage({ type: 'done', outcome } satisfies FromShareThread);
});
