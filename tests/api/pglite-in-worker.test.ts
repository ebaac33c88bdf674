// The database in its worker thread behaves as PGlite did on the main thread: transactions commit or roll back as
// a whole and hold other statements off while open, PostgreSQL's error fields (the code the API relies on) come
// through, bytes and timestamps round-trip, and a closed database refuses further work.
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { PGliteInWorker } from '../../db/pglite-in-worker';

let dir: string;
let db: PGliteInWorker;
beforeAll(async () => {
  dir = mkdtempSync(path.join(os.tmpdir(), 'pw-pgw-'));
  db = await PGliteInWorker.open(path.join(dir, 'pglite'));
  await db.query('create table item (id int primary key, data bytea, at timestamptz)');
});
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
});

const ids = async () => (await db.query('select id from item order by id', [], { rowMode: 'array' })).rows.map((r) => (r as number[])[0]);

it('commits a transaction as a whole, and rolls one back as a whole when its callback throws', async () => {
  await db.transaction(async (tx) => {
    await tx.query('insert into item (id) values ($1)', [1]);
    await tx.query('insert into item (id) values ($1)', [2]);
  });
  await expect(
    db.transaction(async (tx) => {
      await tx.query('insert into item (id) values ($1)', [3]);
      throw new Error('changed my mind');
    }),
  ).rejects.toThrow('changed my mind');
  expect(await ids()).toEqual([1, 2]);
});

it('keeps other statements waiting while a transaction is open', async () => {
  let inside!: () => void;
  const held = new Promise<void>((r) => (inside = r));
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  const tx = db.transaction(async (t) => {
    await t.query('insert into item (id) values (10)');
    inside();
    await gate;
  });
  await held;
  let outsideDone = false;
  const outside = db.query('select count(*)::int as n from item').then((r) => ((outsideDone = true), r));
  await new Promise((r) => setTimeout(r, 100));
  expect(outsideDone).toBe(false);
  release();
  await tx;
  // The waiting statement ran after the commit, so it sees the row.
  expect(((await outside).rows[0] as { n: number }).n).toBe(3);
});

it("passes PostgreSQL's error code and detail through", async () => {
  const err = await db.query('insert into item (id) values (1)').catch((e) => e);
  expect(err).toBeInstanceOf(Error);
  expect(err.code).toBe('23505'); // unique_violation (PostgreSQL manual, Appendix A: error codes)
  expect(String(err.detail)).toContain('(id)=(1)');
});

it('round-trips bytes, and leaves timestamps as the text PostgreSQL sends when asked to', async () => {
  const bytes = Uint8Array.from([0, 1, 2, 250, 255]);
  await db.query('insert into item (id, data, at) values (20, $1, $2)', [bytes, '2026-01-02T03:04:05Z']);
  const row = (await db.query('select data, at from item where id = 20', [], { rowMode: 'object', parsers: { 1184: (v: string) => v } })).rows[0] as {
    data: Uint8Array;
    at: string;
  };
  expect([...row.data]).toEqual([...bytes]);
  expect(row.at).toBe('2026-01-02 03:04:05+00');
});

it('refuses parsers that would have to run in the worker', async () => {
  await expect(db.query('select 1', [], { parsers: { 1184: (v: string) => new Date(v) } })).rejects.toThrow(/pass-through parsers/);
});

it('refuses work once closed', async () => {
  await db.close();
  await expect(db.query('select 1')).rejects.toThrow(/stopped|closed/);
});
