// The websocket endpoint /sync/:sheetId on the same HTTP server as Express. The upgrade is authenticated from the
// session cookie: no session is 401, a sheet the user may not see is 404 (both before the upgrade); the role
// decides whether the socket may write.
import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import { fromNodeHeaders } from 'better-auth/node';
import { WebSocketServer, type WebSocket } from 'ws';
import { z } from 'zod';
import type { Database } from '../../db/client';
import { roleAtLeast } from '../../shared/roles';
import type { Auth } from '../auth';
import { projectRoleOf } from '../api/access';
import { sheet as sheetTable } from '../../db/schema';
import { eq } from 'drizzle-orm';
import type { Peer } from './room';
import type { RoomRegistry } from './room-registry';

const PATH = /^\/sync\/([^/?#]+)\/?$/;
const uuid = z.string().uuid();
const PING_INTERVAL_MS = 30_000;

export interface SyncServer {
  close(): Promise<void>;
}

function refuse(socket: Duplex, status: number, text: string) {
  socket.write(`HTTP/1.1 ${status} ${text}\r\nConnection: close\r\nContent-Type: text/plain\r\nContent-Length: ${text.length}\r\n\r\n${text}`);
  socket.destroy();
}

export function attachSyncServer(http: Server, deps: { db: Database; auth: Auth; rooms: RoomRegistry; log: (l: string) => void }): SyncServer {
  const wss = new WebSocketServer({ noServer: true, maxPayload: 16 * 1024 * 1024 });

  http.on('upgrade', (req: IncomingMessage, socket: Duplex, head: Buffer) => {
    const match = PATH.exec(new URL(req.url ?? '/', 'http://x').pathname);
    if (!match) return refuse(socket, 404, 'Not Found');
    void (async () => {
      try {
        const sheetId = decodeURIComponent(match[1]);
        const session = await deps.auth.api.getSession({ headers: fromNodeHeaders(req.headers) });
        if (!session) return refuse(socket, 401, 'Unauthorized');
        if (!uuid.safeParse(sheetId).success) return refuse(socket, 404, 'Not Found');
        const [row] = await deps.db.select({ projectId: sheetTable.projectId }).from(sheetTable).where(eq(sheetTable.id, sheetId)).limit(1);
        const role = row ? await projectRoleOf(deps.db, row.projectId, session.user.id) : null;
        if (!role) return refuse(socket, 404, 'Not Found');
        wss.handleUpgrade(req, socket, head, (ws) =>
          connect(ws, sheetId, { id: session.user.id, name: session.user.name }, roleAtLeast(role, 'editor')),
        );
      } catch (err) {
        deps.log(`sync upgrade failed: ${String(err)}`);
        refuse(socket, 500, 'Internal Server Error');
      }
    })();
  });

  function connect(ws: WebSocket, sheetId: string, user: { id: string; name: string }, canWrite: boolean) {
    ws.binaryType = 'nodebuffer';
    const peer: Peer = {
      user,
      canWrite,
      clientIds: new Set(),
      send(message) {
        if (ws.readyState === ws.OPEN) ws.send(message, (err) => err && ws.terminate());
      },
      close(code, reason) {
        ws.close(code, reason);
      },
    };
    // Messages that arrive while the room loads are kept and handled in order once it is ready.
    const early: Uint8Array[] = [];
    let room: Awaited<ReturnType<RoomRegistry['join']>> | null = null;
    let alive = true;
    ws.on('message', (data: Buffer) => {
      const message = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
      if (!room) early.push(message);
      else handle(message);
    });
    const handle = (message: Uint8Array) => {
      try {
        room!.receive(peer, message);
      } catch (err) {
        deps.log(`sync ${sheetId}: bad message from ${user.id}: ${String(err)}`);
        ws.close(1003, 'bad message');
      }
    };
    const ping = setInterval(() => {
      if (!alive) return ws.terminate();
      alive = false;
      ws.ping();
    }, PING_INTERVAL_MS);
    ws.on('pong', () => (alive = true));
    let closed = false;
    ws.on('close', () => {
      closed = true;
      clearInterval(ping);
      if (room) deps.rooms.leave(room, peer);
    });
    deps.rooms
      .join(sheetId, peer)
      .then((r) => {
        room = r;
        if (closed) return deps.rooms.leave(r, peer);
        for (const m of early.splice(0)) handle(m);
      })
      .catch((err) => {
        deps.log(`sync ${sheetId}: could not open the room: ${String(err)}`);
        ws.close(1011, 'could not open the sheet');
      });
  }

  return {
    async close() {
      for (const ws of wss.clients) ws.terminate();
      await new Promise<void>((resolve) => wss.close(() => resolve()));
    },
  };
}
