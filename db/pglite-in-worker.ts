// PGlite in a worker thread, behind the part of PGlite's interface that Drizzle's pglite driver uses (`query` and
// `transaction`). PGlite runs each statement synchronously in WebAssembly; on the main thread every write held up
// the websockets. Here the main thread only posts the statement and waits for the answer, so a caller that awaits
// a write (the sync room, before relaying) still knows it is stored when the promise resolves.
import path from 'node:path';
import { Worker } from 'node:worker_threads';

export interface WireQuery {
  sql: string;
  params?: unknown[];
  rowMode?: 'array' | 'object';
  /** Type OIDs whose values stay text (Drizzle's parsers for dates and intervals, which return their input). */
  rawTypes?: number[];
}

export type HostRequest =
  | { id: number; op: 'ready' }
  | { id: number; op: 'query'; query: WireQuery; tx?: number }
  | { id: number; op: 'begin' }
  | { id: number; op: 'end'; tx: number; commit: boolean }
  | { id: number; op: 'close' };

export type HostReply =
  | { ok: true; id: number; value: unknown }
  | { ok: false; id: number; message: string; fields: Record<string, unknown> };

type Distribute<T> = T extends unknown ? Omit<T, 'id'> : never;

interface QueryOptions {
  rowMode?: 'array' | 'object';
  parsers?: Record<number, (value: string, typeId: number) => unknown>;
}

export interface Results {
  rows: unknown[];
  fields: { name: string; dataTypeID: number }[];
  affectedRows?: number;
}

export interface TransactionClient {
  query(sql: string, params?: unknown[], options?: QueryOptions): Promise<Results>;
}

function wireQuery(sql: string, params: unknown[] | undefined, options: QueryOptions | undefined): WireQuery {
  const rawTypes = options?.parsers ? Object.keys(options.parsers).map(Number) : undefined;
  for (const oid of rawTypes ?? []) {
    const probe = '2000-01-01 00:00:00+00';
    if (options!.parsers![oid](probe, oid) !== probe) throw new Error(`PGliteInWorker: only pass-through parsers are supported (type ${oid})`);
  }
  return { sql, params, rowMode: options?.rowMode, rawTypes };
}

export class PGliteInWorker {
  private readonly pending = new Map<number, { resolve: (v: unknown) => void; reject: (e: Error) => void }>();
  private nextId = 1;
  private openTransactions = 0;
  private failed: Error | null = null;

  private constructor(private readonly worker: Worker) {
    worker.on('message', (reply: HostReply) => {
      const waiting = this.pending.get(reply.id);
      if (!waiting) return;
      this.pending.delete(reply.id);
      this.refWhileBusy();
      if (reply.ok) waiting.resolve(reply.value);
      else waiting.reject(Object.assign(new Error(reply.message), reply.fields));
    });
    const fail = (err: Error) => {
      this.failed = err;
      for (const w of this.pending.values()) w.reject(err);
      this.pending.clear();
    };
    worker.on('error', fail);
    worker.on('exit', (code) => fail(this.failed ?? new Error(`the database worker stopped (exit code ${code})`)));
    worker.unref();
  }

  static async open(dataDir: string): Promise<PGliteInWorker> {
    // The server runs TypeScript through tsx; a worker does not inherit its loader, so a CommonJS stub registers it.
    const host = path.join(__dirname, 'pglite-host.ts');
    const worker = new Worker(`require('tsx/cjs/api').register(); require(${JSON.stringify(host)});`, { eval: true, workerData: { dataDir } });
    const client = new PGliteInWorker(worker);
    await client.call({ op: 'ready' });
    return client;
  }

  async query(sql: string, params?: unknown[], options?: QueryOptions): Promise<Results> {
    return this.call({ op: 'query', query: wireQuery(sql, params, options) }) as Promise<Results>;
  }

  /** Runs `callback` in one transaction: committed when it resolves, rolled back when it throws. */
  async transaction<T>(callback: (tx: TransactionClient) => Promise<T>): Promise<T> {
    const txId = (await this.call({ op: 'begin' })) as number;
    this.openTransactions++;
    const tx: TransactionClient = {
      query: async (sql, params, options) => this.call({ op: 'query', query: wireQuery(sql, params, options), tx: txId }) as Promise<Results>,
    };
    try {
      const result = await callback(tx);
      await this.call({ op: 'end', tx: txId, commit: true });
      return result;
    } catch (err) {
      await this.call({ op: 'end', tx: txId, commit: false }).catch(() => {});
      throw err;
    } finally {
      this.openTransactions--;
      this.refWhileBusy();
    }
  }

  async close(): Promise<void> {
    await this.call({ op: 'close' });
    this.failed = new Error('the database is closed');
    await this.worker.terminate();
  }

  private call(request: Distribute<HostRequest>): Promise<unknown> {
    if (this.failed) return Promise.reject(this.failed);
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      this.refWhileBusy();
      this.worker.postMessage({ ...request, id } as HostRequest);
    });
  }

  // The worker keeps the process alive only while something waits on it, like a socket with a request in flight.
  private refWhileBusy(): void {
    if (this.pending.size > 0 || this.openTransactions > 0) this.worker.ref();
    else this.worker.unref();
  }
}
