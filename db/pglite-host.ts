// The worker-thread side of PGliteInWorker (db/pglite-in-worker.ts): owns the PGlite instance and runs the queries
// and transactions the main thread sends, so that the database's work never stalls the main thread's sockets.
import { parentPort, workerData } from 'node:worker_threads';
import { PGlite, type Transaction } from '@electric-sql/pglite';
import type { HostReply, HostRequest, WireQuery } from './pglite-in-worker';

const port = parentPort!;
const db = new PGlite((workerData as { dataDir: string }).dataDir);
const transactions = new Map<number, { tx: Transaction; end: (commit: boolean) => void }>();
// Each open transaction's settling promise: resolves after COMMIT, rejects after ROLLBACK.
const ends = new Map<number, Promise<void>>();
let nextTx = 1;

const optionsOf = (q: WireQuery) => ({
  rowMode: q.rowMode,
  // Only pass-through parsers cross the thread (the main side checks): these types stay as the text PostgreSQL sends.
  parsers: q.rawTypes ? Object.fromEntries(q.rawTypes.map((oid) => [oid, (value: string) => value])) : undefined,
});

function errorFields(err: unknown): HostReply & { ok: false } {
  const e = err as Record<string, unknown>;
  const fields: Record<string, unknown> = {};
  for (const key of Object.keys(e ?? {})) if (typeof e[key] !== 'function' && typeof e[key] !== 'object') fields[key] = e[key];
  return { ok: false, id: 0, message: err instanceof Error ? err.message : String(err), fields };
}

async function handle(req: HostRequest): Promise<unknown> {
  switch (req.op) {
    case 'ready':
      await db.waitReady;
      return null;
    case 'query': {
      const runner = req.tx ? transactions.get(req.tx)?.tx : db;
      if (!runner) throw new Error(`transaction ${req.tx} is not open`);
      const r = await runner.query(req.query.sql, req.query.params, optionsOf(req.query));
      return { rows: r.rows, fields: r.fields, affectedRows: r.affectedRows };
    }
    case 'begin': {
      const id = nextTx++;
      // The transaction stays open (holding PGlite's lock, so other queries wait) until the main side ends it.
      const opened = new Promise<void>((resolve) => {
        const done = db.transaction(
          (tx) =>
            new Promise<void>((commit, rollback) => {
              transactions.set(id, { tx, end: (ok) => (ok ? commit() : rollback(new Error('rolled back'))) });
              resolve();
            }),
        );
        ends.set(id, done.finally(() => transactions.delete(id)));
      });
      await opened;
      return id;
    }
    case 'end': {
      const open = transactions.get(req.tx);
      if (!open) throw new Error(`transaction ${req.tx} is not open`);
      open.end(req.commit);
      const done = ends.get(req.tx)!;
      ends.delete(req.tx);
      if (req.commit) await done;
      else await done.catch(() => {});
      return null;
    }
    case 'close':
      await db.close();
      return null;
  }
}
port.on('message', (req: HostRequest) => {
  handle(req).then(
    (value) => port.postMessage({ ok: true, id: req.id, value } satisfies HostReply),
    (err) => port.postMessage({ ...errorFields(err), id: req.id } satisfies HostReply),
  );
});
