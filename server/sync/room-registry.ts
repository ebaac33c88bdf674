// The open rooms, one per sheet: loaded on first join, unloaded (compacted) when the last peer leaves.
import type { DocumentStore } from './document-store';
import { Room, type Peer, type RoomOptions } from './room';

export class RoomRegistry {
  private rooms = new Map<string, Promise<Room>>();
  private unloading = new Map<string, Promise<void>>();

  constructor(
    private readonly store: DocumentStore,
    private readonly options: RoomOptions = {},
  ) {}

  /** The room of a sheet, loading it if needed; a room still unloading is waited for, then loaded afresh. */
  async open(sheetId: string): Promise<Room> {
    await this.unloading.get(sheetId);
    let room = this.rooms.get(sheetId);
    if (!room) {
      room = Room.load(sheetId, this.store, this.options);
      this.rooms.set(sheetId, room);
      room.catch(() => this.rooms.delete(sheetId));
    }
    return room;
  }

  /** The room if it is open (for server-side edits that must go through the live document). */
  peek(sheetId: string): Promise<Room> | undefined {
    return this.rooms.get(sheetId);
  }

  async join(sheetId: string, peer: Peer): Promise<Room> {
    const room = await this.open(sheetId);
    room.join(peer);
    return room;
  }

  leave(room: Room, peer: Peer): void {
    room.leave(peer);
    if (room.peers.size === 0) void this.unloadIfIdle(room);
  }

  /** Runs a server-side edit in the sheet's room, opening it for the edit when nobody is connected. */
  async withRoom<T>(sheetId: string, use: (room: Room) => Promise<T>): Promise<T> {
    const room = await this.open(sheetId);
    try {
      return await use(room);
    } finally {
      if (room.peers.size === 0) void this.unloadIfIdle(room);
    }
  }

  /** Applies a changed role to every open socket of that user on the given sheets. */
  async setAccess(sheetIds: string[], userId: string, access: 'write' | 'read' | 'none'): Promise<void> {
    for (const id of sheetIds) {
      const room = await this.rooms.get(id);
      room?.setAccess(userId, access);
      if (room && room.peers.size === 0) void this.unloadIfIdle(room);
    }
  }

  /** Closes every socket opened through a revoked link. */
  closeLink(sheetId: string, linkId: string): void {
    void this.rooms.get(sheetId)?.then((room) => {
      room.closeLink(linkId);
      if (room.peers.size === 0) void this.unloadIfIdle(room);
    });
  }

  async closeAll(): Promise<void> {
    const rooms = await Promise.all([...this.rooms.values()].map((r) => r.catch(() => null)));
    for (const room of rooms) {
      if (!room) continue;
      for (const peer of room.peers) peer.close(1001, 'server shutting down');
      await room.compact().catch(() => {});
      room.destroy();
    }
    this.rooms.clear();
  }

  private async unloadIfIdle(room: Room): Promise<void> {
    if (this.unloading.has(room.sheetId)) return;
    const job = (async () => {
      await room.flushed();
      if (room.peers.size > 0 || (await this.rooms.get(room.sheetId)) !== room) return;
      this.rooms.delete(room.sheetId);
      await room.compact().catch(() => {});
      room.destroy();
    })();
    this.unloading.set(room.sheetId, job);
    try {
      await job;
    } finally {
      this.unloading.delete(room.sheetId);
    }
  }
}
