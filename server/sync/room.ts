// One sheet's live room: its Yjs document, the connected peers and their awareness, over the y-websocket protocol.
//
// Message flow (y-protocols): on join the server sends sync step 1 (its state vector) and the awareness states;
// a client's step 1 is answered with step 2 (what it lacks). A writer's step 2 and update messages are stored in
// the database first, then applied to the room's document and relayed to the peers, a stored batch at a time.
// Because the document only ever holds stored updates, everything a peer is sent (relays and step 2 replies alike)
// has already been written: a crash loses nothing anyone saw. A read-only peer's step 2 and updates are dropped
// (and logged, unless they hold nothing the document lacks, as the step 2 every client sends on joining does).
import * as Y from 'yjs';
import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';
import * as syncProtocol from 'y-protocols/sync';
import * as awarenessProtocol from 'y-protocols/awareness';
import type { DocumentStore } from './document-store';
import { stampAwarenessUpdate } from './awareness-stamp';
import { addsNothing } from './update-adds-nothing';

export const MESSAGE_SYNC = 0;
export const MESSAGE_AWARENESS = 1;
export const MESSAGE_QUERY_AWARENESS = 3;
const TOUCH_EVERY_MS = 2000;
// Awareness changes (cursors, selections, arrivals) are gathered and sent at most this often, as one message to
// each peer: relayed one by one, every peer's every cursor move would cost a send to every other peer.
const AWARENESS_EVERY_MS = 40;

export interface Peer {
  user: { id: string; name: string };
  canWrite: boolean;
  /** Set when the socket was opened through a viewer link rather than a membership. */
  linkId?: string;
  clientIds: Set<number>;
  send(message: Uint8Array): void;
  close(code: number, reason: string): void;
}

interface Pending {
  update: Uint8Array;
  userId: string | null;
  origin: Peer | null;
  settle?: (error?: Error) => void;
}

export interface RoomOptions {
  /**
   * Compaction waits for at least this many updates since the snapshot, and for them to weigh at least as much as
   * the snapshot itself: each compaction re-encodes and rewrites the whole document, so tying it to the bytes
   * appended keeps its cost in proportion to the edits (a busy sheet would otherwise rewrite itself many times a second).
   */
  compactEvery?: number;
  log?: (line: string) => void;
  /** Brings a freshly loaded document up to the current format (runs as a server-side transaction when it changes). */
  upgrade?: (doc: Y.Doc) => ((doc: Y.Doc) => void) | null;
}

export class Room {
  readonly doc = new Y.Doc();
  readonly awareness = new awarenessProtocol.Awareness(this.doc);
  readonly peers = new Set<Peer>();
  private pending: Pending[] = [];
  private flushing: Promise<void> | null = null;
  private waiters: (() => void)[] = [];
  private lastSeq = 0;
  private awarenessChanged = new Set<number>();
  private awarenessTimer: ReturnType<typeof setTimeout> | null = null;
  // Who edited last and when, written to the sheet's metadata at most every TOUCH_EVERY_MS and on compaction.
  private lastEdit: { userId: string | null; at: Date } | null = null;
  private lastTouchMs = 0;
  private sinceCompaction = 0;
  private bytesSinceCompaction = 0;
  private snapshotBytes = 0;
  private readonly compactEvery: number;
  private readonly log: (line: string) => void;

  private constructor(
    readonly sheetId: string,
    private readonly store: DocumentStore,
    options: RoomOptions,
  ) {
    this.compactEvery = options.compactEvery ?? 200;
    this.log = options.log ?? (() => {});
    this.awareness.setLocalState(null);
    this.awareness.on('update', ({ added, updated, removed }: Record<string, number[]>) => {
      for (const id of [...added, ...updated, ...removed]) this.awarenessChanged.add(id);
      this.awarenessTimer ??= setTimeout(() => this.sendAwareness(), AWARENESS_EVERY_MS);
    });
  }

  static async load(sheetId: string, store: DocumentStore, options: RoomOptions = {}): Promise<Room> {
    const room = new Room(sheetId, store, options);
    const stored = await store.load(sheetId);
    Y.transact(
      room.doc,
      () => {
        if (stored.snapshot) Y.applyUpdate(room.doc, stored.snapshot, 'load');
        for (const u of stored.updates) Y.applyUpdate(room.doc, u, 'load');
      },
      'load',
    );
    room.lastSeq = stored.lastSeq;
    room.sinceCompaction = stored.updates.length;
    room.bytesSinceCompaction = stored.updates.reduce((n, u) => n + u.byteLength, 0);
    room.snapshotBytes = stored.snapshot?.byteLength ?? 0;
    const migrate = options.upgrade?.(room.doc);
    if (migrate) await room.transact(migrate, null);
    return room;
  }

  join(peer: Peer): void {
    this.peers.add(peer);
    peer.send(syncMessage((e) => syncProtocol.writeSyncStep1(e, this.doc)));
    const states = [...this.awareness.getStates().keys()];
    if (states.length > 0) peer.send(awarenessMessage(awarenessProtocol.encodeAwarenessUpdate(this.awareness, states)));
  }

  leave(peer: Peer): void {
    if (!this.peers.delete(peer)) return;
    const ids = [...peer.clientIds].filter((id) => this.awareness.getStates().has(id));
    if (ids.length > 0) awarenessProtocol.removeAwarenessStates(this.awareness, ids, null);
  }

  receive(peer: Peer, message: Uint8Array): void {
    const decoder = decoding.createDecoder(message);
    const type = decoding.readVarUint(decoder);
    if (type === MESSAGE_SYNC) {
      const step = decoding.readVarUint(decoder);
      if (step === syncProtocol.messageYjsSyncStep1) {
        const stateVector = decoding.readVarUint8Array(decoder);
        peer.send(syncMessage((e) => syncProtocol.writeSyncStep2(e, this.doc, stateVector)));
        return;
      }
      if (step === syncProtocol.messageYjsSyncStep2 || step === syncProtocol.messageYjsUpdate) {
        const update = decoding.readVarUint8Array(decoder);
        if (!peer.canWrite) {
          // Every client answers the room's step 1 with a step 2; a reader's carries nothing the room lacks
          // (empty, or only what it was sent), so it is no write attempt and not worth a line.
          if (!addsNothing(this.doc, update)) this.log(`sync ${this.sheetId}: dropped an update from read-only ${peer.user.id}`);
          return;
        }
        if (!isWellFormed(update)) {
          this.log(`sync ${this.sheetId}: dropped a malformed update from ${peer.user.id}`);
          return;
        }
        this.enqueue({ update, userId: peer.user.id, origin: peer });
        return;
      }
      return;
    }
    if (type === MESSAGE_AWARENESS) {
      const raw = decoding.readVarUint8Array(decoder);
      const stamped = stampAwarenessUpdate(
        raw,
        { id: peer.user.id, name: peer.user.name, readOnly: !peer.canWrite },
        (clientId) => peer.clientIds.has(clientId) || !this.ownedByOther(clientId, peer),
      );
      if (!stamped.update) return;
      for (const id of stamped.clientIds) peer.clientIds.add(id);
      awarenessProtocol.applyAwarenessUpdate(this.awareness, stamped.update, peer);
      return;
    }
    if (type === MESSAGE_QUERY_AWARENESS) {
      const states = [...this.awareness.getStates().keys()];
      peer.send(awarenessMessage(awarenessProtocol.encodeAwarenessUpdate(this.awareness, states)));
    }
  }

  /**
   * A server-side edit (an import, a migration): run on a copy of the document so that the room's document
   * still only holds stored updates; resolves once the edit is stored and relayed.
   */
  async transact(edit: (doc: Y.Doc) => void, userId: string | null): Promise<void> {
    const scratch = new Y.Doc();
    Y.applyUpdate(scratch, Y.encodeStateAsUpdate(this.doc));
    const updates: Uint8Array[] = [];
    scratch.on('update', (u: Uint8Array) => updates.push(u));
    scratch.transact(() => edit(scratch), 'server');
    scratch.destroy();
    if (updates.length === 0) return;
    await Promise.all(
      updates.map(
        (update) =>
          new Promise<void>((resolve, reject) =>
            this.enqueue({ update, userId, origin: null, settle: (err) => (err ? reject(err) : resolve()) }),
          ),
      ),
    );
  }

  /** Resolves when everything received so far is stored and applied. */
  flushed(): Promise<void> {
    if (!this.flushing && this.pending.length === 0) return Promise.resolve();
    return new Promise((resolve) => this.waiters.push(resolve));
  }

  /** Writes a fresh snapshot and drops the updates it folds in. */
  async compact(): Promise<void> {
    await this.flushed();
    await this.touch();
    if (this.sinceCompaction === 0) return;
    await this.writeSnapshot();
  }

  private async writeSnapshot(): Promise<void> {
    const state = Y.encodeStateAsUpdate(this.doc);
    await this.store.compact(this.sheetId, state, this.lastSeq);
    this.sinceCompaction = 0;
    this.bytesSinceCompaction = 0;
    this.snapshotBytes = state.byteLength;
  }

  private compactionDue(): boolean {
    return this.sinceCompaction >= this.compactEvery && this.bytesSinceCompaction >= this.snapshotBytes;
  }

  private async touch(): Promise<void> {
    if (!this.lastEdit) return;
    const edit = this.lastEdit;
    this.lastEdit = null;
    this.lastTouchMs = Date.now();
    await this.store.touch(this.sheetId, edit.userId, edit.at).catch((err) => this.log(`sync ${this.sheetId}: touch failed: ${String(err)}`));
  }

  closeLink(linkId: string): void {
    for (const peer of [...this.peers]) {
      if (peer.linkId !== linkId) continue;
      peer.close(4410, 'link revoked');
      this.leave(peer);
    }
  }

  setAccess(userId: string, access: 'write' | 'read' | 'none'): void {
    for (const peer of this.peers) {
      // A socket opened through a viewer link is governed by the link, not by membership.
      if (peer.user.id !== userId || peer.linkId) continue;
      if (access === 'none') {
        peer.close(4403, 'access removed');
        this.leave(peer);
      } else {
        peer.canWrite = access === 'write';
      }
    }
  }

  destroy(): void {
    if (this.awarenessTimer) clearTimeout(this.awarenessTimer);
    this.awareness.destroy();
    this.doc.destroy();
  }

  private sendAwareness(): void {
    this.awarenessTimer = null;
    const changed = [...this.awarenessChanged];
    this.awarenessChanged.clear();
    // A removed state is encoded as null with its next clock, so departures travel in the same message.
    if (changed.length > 0) this.broadcast(awarenessMessage(awarenessProtocol.encodeAwarenessUpdate(this.awareness, changed)), null);
  }

  private ownedByOther(clientId: number, asker: Peer): boolean {
    for (const p of this.peers) if (p !== asker && p.clientIds.has(clientId)) return true;
    return false;
  }

  private enqueue(item: Pending): void {
    this.pending.push(item);
    if (!this.flushing) this.flushing = this.flushLoop();
  }

  // Stores queued updates a batch at a time: updates arriving during a write wait and go in the next one.
  private async flushLoop(): Promise<void> {
    try {
      // The first batch waits one turn of the event loop, so that the messages already read from other sockets
      // in this turn (a burst) join it: one write and one relay instead of one per message.
      await new Promise((resolve) => setImmediate(resolve));
      while (this.pending.length > 0) {
        const batch = this.pending.splice(0);
        try {
          this.lastSeq = await this.store.append(this.sheetId, batch);
        } catch (err) {
          // Not stored means not applied and not relayed; the writers still hold their edits and resend on reconnect.
          this.log(`sync ${this.sheetId}: could not store ${batch.length} update(s): ${String(err)}`);
          for (const origin of new Set(batch.map((b) => b.origin))) origin?.close(1011, 'storage failed');
          const failure = new Error('The sheet could not be saved; nothing was changed');
          for (const item of batch) item.settle?.(failure);
          continue;
        }
        this.sinceCompaction += batch.length;
        for (const item of batch) this.bytesSinceCompaction += item.update.byteLength;
        for (const item of batch) Y.applyUpdate(this.doc, item.update, item.origin);
        this.relay(batch);
        for (const item of batch) item.settle?.();
        this.lastEdit = { userId: batch.findLast((b) => b.userId)?.userId ?? this.lastEdit?.userId ?? null, at: new Date() };
        // The metadata touch is not waited for: it is grouped and ordered by the store and guards nothing relayed.
        if (Date.now() - this.lastTouchMs >= TOUCH_EVERY_MS) void this.touch();
        // Compaction holds up the next batch, so it waits for a lull (nothing queued) unless far overdue.
        if (this.compactionDue() && (this.pending.length === 0 || this.sinceCompaction >= 4 * this.compactEvery)) {
          await this.writeSnapshot().catch((err) => this.log(`sync ${this.sheetId}: compaction failed: ${String(err)}`));
        }
      }
    } finally {
      this.flushing = null;
      const waiters = this.waiters.splice(0);
      for (const w of waiters) w();
    }
  }

  // One message per stored batch, encoded once and sent to every peer: a peer that wrote part of the batch
  // receives its own edits back too, which Yjs ignores, and that costs far less than a message per update per peer.
  private relay(batch: Pending[]): void {
    const update = batch.length === 1 ? batch[0].update : Y.mergeUpdates(batch.map((b) => b.update));
    const origins = new Set(batch.map((b) => b.origin));
    const soleOrigin = origins.size === 1 ? [...origins][0] : null;
    this.broadcast(syncMessage((e) => syncProtocol.writeUpdate(e, update)), soleOrigin);
  }

  private broadcast(message: Uint8Array, except: Peer | null): void {
    for (const p of this.peers) if (p !== except) p.send(message);
  }
}

function syncMessage(write: (e: encoding.Encoder) => void): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MESSAGE_SYNC);
  write(e);
  return encoding.toUint8Array(e);
}

function awarenessMessage(update: Uint8Array): Uint8Array {
  const e = encoding.createEncoder();
  encoding.writeVarUint(e, MESSAGE_AWARENESS);
  encoding.writeVarUint8Array(e, update);
  return encoding.toUint8Array(e);
}

function isWellFormed(update: Uint8Array): boolean {
  try {
    Y.decodeUpdate(update);
    return true;
  } catch {
    return false;
  }
}
