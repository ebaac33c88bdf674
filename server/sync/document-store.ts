// Durable storage of sheet documents: a snapshot plus the updates after it. Writes are grouped per call
// (one transaction for a batch) and compaction replaces the snapshot and drops folded updates in one transaction.
import { and, asc, eq, gt, lte } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { sheet, sheetSnapshot, sheetUpdate } from '../../db/schema';

export interface StoredDocument {
  snapshot: Uint8Array | null;
  updates: Uint8Array[];
  lastSeq: number;
}

export interface DocumentStore {
  load(sheetId: string): Promise<StoredDocument>;
  /** Appends updates in order in one transaction and touches the sheet's updated-at and updated-by. */
  append(sheetId: string, entries: { update: Uint8Array; userId: string | null }[]): Promise<number>;
  /** Replaces the snapshot with `state`, which includes every update up to `throughSeq`, and deletes those updates. */
  compact(sheetId: string, state: Uint8Array, throughSeq: number): Promise<void>;
}

export function createDocumentStore(db: Database): DocumentStore {
  return {
    async load(sheetId) {
      const [snap] = await db.select().from(sheetSnapshot).where(eq(sheetSnapshot.sheetId, sheetId)).limit(1);
      const after = snap?.throughSeq ?? 0;
      const rows = await db
        .select({ seq: sheetUpdate.seq, update: sheetUpdate.update })
        .from(sheetUpdate)
        .where(and(eq(sheetUpdate.sheetId, sheetId), gt(sheetUpdate.seq, after)))
        .orderBy(asc(sheetUpdate.seq));
      return {
        snapshot: snap?.state ?? null,
        updates: rows.map((r) => r.update),
        lastSeq: rows.length > 0 ? rows[rows.length - 1].seq : after,
      };
    },

    async append(sheetId, entries) {
      if (entries.length === 0) return 0;
      return db.transaction(async (tx) => {
        const rows = await tx
          .insert(sheetUpdate)
          .values(entries.map((e) => ({ sheetId, update: e.update, userId: e.userId })))
          .returning({ seq: sheetUpdate.seq });
        const lastAuthor = entries.findLast((e) => e.userId)?.userId;
        const touch: { updatedAt: Date; updatedBy?: string } = { updatedAt: new Date() };
        if (lastAuthor) touch.updatedBy = lastAuthor;
        await tx.update(sheet).set(touch).where(eq(sheet.id, sheetId));
        return Math.max(...rows.map((r) => r.seq));
      });
    },

    async compact(sheetId, state, throughSeq) {
      await db.transaction(async (tx) => {
        await tx
          .insert(sheetSnapshot)
          .values({ sheetId, state, throughSeq })
          .onConflictDoUpdate({ target: sheetSnapshot.sheetId, set: { state, throughSeq, updatedAt: new Date() } });
        await tx.delete(sheetUpdate).where(and(eq(sheetUpdate.sheetId, sheetId), lte(sheetUpdate.seq, throughSeq)));
      });
    },
  };
}
