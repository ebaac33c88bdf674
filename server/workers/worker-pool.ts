// One worker thread for the server's heavy jobs (solves for revisions, report PDFs), started on first use so that
// PGlite's thread never waits on them. Jobs queue in the worker; a crashed worker fails its jobs and is replaced.
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import type { TaskName, TaskReply, Tasks } from './tasks';

const ENTRY = path.join(__dirname, 'worker-entry.cjs');

export class WorkerPool {
  private worker: Worker | null = null;
  private nextId = 1;
  private pending = new Map<number, { resolve: (v: unknown) => void; reject: (e: Error) => void }>();

  constructor(private readonly log: (line: string) => void = () => {}) {}

  run<K extends TaskName>(task: K, input: Tasks[K]['input']): Promise<Tasks[K]['output']> {
    const worker = this.ensure();
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve: resolve as (v: unknown) => void, reject });
      worker.postMessage({ id, task, input });
    });
  }

  async close(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    this.failAll(new Error('the server is shutting down'));
    if (w) await w.terminate();
  }

  private ensure(): Worker {
    if (this.worker) return this.worker;
    const worker = new Worker(ENTRY);
    worker.unref();
    worker.on('message', (reply: TaskReply) => {
      const p = this.pending.get(reply.id);
      if (!p) return;
      this.pending.delete(reply.id);
      if (reply.ok) p.resolve(reply.output);
      else {
        this.log(`worker job failed: ${reply.message}`);
        p.reject(new Error(reply.message.split('\n')[0]));
      }
    });
    const lost = (why: string) => {
      if (this.worker !== worker) return;
      this.worker = null;
      this.log(`worker thread lost: ${why}`);
      this.failAll(new Error('the worker thread stopped'));
    };
    worker.on('error', (err) => lost(String(err)));
    worker.on('exit', (code) => lost(`exit ${code}`));
    this.worker = worker;
    return worker;
  }

  private failAll(error: Error) {
    for (const p of this.pending.values()) p.reject(error);
    this.pending.clear();
  }
}
