// The websocket endpoint /sync/:sheetId on the same HTTP server as Express. The upgrade is authenticated from the
// session cookie: no session is 401, a sheet the user may not see is 404 (both before the upgrade); the role
// decides whether the socket may write.
import type { IncomingMessage, Server } from 'node:http';
import type { Duplex } from 'node:stream';
import { WebSocketServer, type WebSocket } from 'ws';
import { z } from 'zod';
import type { Database } from '../../db/client';
import { roleAtLeast } from '../../shared/roles';
import type { Auth } from '../auth';
import { projectRoleOf } from '../api/access';
import { sheet as sheetTable } from '../../db/schema';
import { eq } from 'drizzle-orm';
import type { Peer } from './room';
import { sessionUser } from '../http/session';
import { requireActiveLink } from '../api/links/queries';
import { HttpError } from '../http/errors';
import { randomUUID } from 'node:crypto';
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
    const url = new URL(req.url ?? '/', 'http://x');
    const match = PATH.exec(url.pathname);
    if (!match) return refuse(socket, 404, 'Not Found');
    void (async () => {
      try {
        const sheetId = decodeURIComponent(match[1]);
        const user = await sessionUser(deps.auth, req.headers);
        const linkToken = url.searchParams.get('link');
        if (linkToken) {
          // Through a viewer link: read-only, no account needed; the link is checked now and watched while open.
          let link;
          try {
            link = await requireActiveLink(deps.db, linkToken);
          } catch (err) {
            if (err instanceof HttpError) return refuse(socket, err.status, err.status === 410 ? 'Gone' : 'Not Found');
            throw err;
          }
          if (link.sheetId !== sheetId) return refuse(socket, 404, 'Not Found');
          const who = user ? { id: user.id, name: user.name } : { id: `visitor-${randomUUID()}`, name: 'Visitor' };
          return wss.handleUpgrade(req, socket, head, (ws) => connect(ws, sheetId, who, false, link.id, link.expiresAt));
        }
        if (!user) return refuse(socket, 401, 'Unauthorized');
        if (!uuid.safeParse(sheetId).success) return refuse(socket, 404, 'Not Found');
        const [row] = await deps.db.select({ projectId: sheetTable.projectId }).from(sheetTable).where(eq(sheetTable.id, sheetId)).limit(1);
        const role = row && !user.isGuest ? await projectRoleOf(deps.db, row.projectId, user.id) : null;
        if (!role) return refuse(socket, 404, 'Not Found');
        wss.handleUpgrade(req, socket, head, (ws) => connect(ws, sheetId, { id: user.id, name: user.name }, roleAtLeast(role, 'editor')));
      } catch (err) {
        deps.log(`sync upgrade failed: ${String(err)}`);
        refuse(socket, 500, 'Internal Server Error');
      }
    })();
  });

  function connect(
    ws: WebSocket,
    sheetId: string,
    user: { id: string; name: string },
    canWrite: boolean,
    linkId?: string,
    linkExpiresAt?: Date | null,
  ) {
    ws.binaryType = 'nodebuffer';
    const peer: Peer = {
      user,
      canWrite,
      linkId,
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
    // An expiring link closes its sockets when it expires (revocation closes them through the registry).
    const untilExpiry = linkExpiresAt ? linkExpiresAt.getTime() - Date.now() : null;
    const expiry = untilExpiry !== null && untilExpiry < 2 ** 31 ? setTimeout(() => ws.close(4410, 'link expired'), Math.max(0, untilExpiry)) : null;
    ws.on('close', () => expiry && clearTimeout(expiry));
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
