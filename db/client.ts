// Opens the database: embedded PGlite under DATA_DIR by default, a PostgreSQL server when DATABASE_URL is given.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import type { PGlite } from '@electric-sql/pglite';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema';

export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

export interface DatabaseHandle {
  db: Database;
  kind: 'pglite' | 'postgres';
  migrate(): Promise<void>;
  close(): Promise<void>;
}

const migrationsFolder = path.join(__dirname, 'migrations');

export async function openDatabase(options: { dataDir: string; databaseUrl?: string }): Promise<DatabaseHandle> {
  if (options.databaseUrl) {
    const { Pool } = await import('pg');
    const { drizzle } = await import('drizzle-orm/node-postgres');
    const { migrate } = await import('drizzle-orm/node-postgres/migrator');
    const pool = new Pool({ connectionString: options.databaseUrl });
    const db = drizzle(pool, { schema });
    return {
      db: db as unknown as Database,
      kind: 'postgres',
      migrate: () => migrate(db, { migrationsFolder }),
      close: () => pool.end(),
    };
  }
  const { drizzle } = await import('drizzle-orm/pglite');
  const { migrate } = await import('drizzle-orm/pglite/migrator');
  const dir = path.resolve(options.dataDir, 'pglite');
  // PGlite creates only the last folder of its path.
  mkdirSync(path.dirname(dir), { recursive: true });
  // PGlite runs in a worker thread so that its statements never hold up the websockets: with 100 sheets of 2 editors
  // each, p95 latency fell from 0.45–0.57 s to 0.07–0.12 s (server/sync/README.md). PGLITE_WORKER=0 keeps it in-process.
  let client: { close(): Promise<void> };
  let db: ReturnType<typeof drizzle<typeof schema>>;
  if (process.env.PGLITE_WORKER !== '0') {
    const { PGliteInWorker } = await import('./pglite-in-worker');
    const inWorker = await PGliteInWorker.open(dir);
    // Drizzle's driver calls only `query` and `transaction`, which PGliteInWorker provides with PGlite's signatures.
    db = drizzle(inWorker as unknown as PGlite, { schema });
    client = inWorker;
  } else {
    const { PGlite: InProcess } = await import('@electric-sql/pglite');
    const local = new InProcess(dir);
    await local.waitReady;
    db = drizzle(local, { schema });
    client = local;
  }
  return {
    db: db as unknown as Database,
    kind: 'pglite',
    migrate: () => migrate(db, { migrationsFolder }),
    close: () => client.close(),
  };
}
