// A Node collaborator on a sheet: a Y.Doc synced through y-websocket's provider over `ws`, with the session cookie.
import WebSocket from 'ws';
import * as Y from 'yjs';
import { WebsocketProvider } from 'y-websocket';
import type { TestClient } from './http-client';

export interface SyncClient {
  doc: Y.Doc;
  provider: WebsocketProvider;
  synced(): Promise<void>;
  destroy(): void;
}

export function cookieWebSocket(cookie: string): typeof WebSocket {
  return class extends WebSocket {
    constructor(address: string, protocols?: string | string[]) {
      super(address, protocols, { headers: { cookie } });
    }
  } as typeof WebSocket;
}

/** `http` only lends its address and session cookie (a benchmark worker passes those alone). */
export function connectSheet(http: Pick<TestClient, 'baseUrl' | 'cookieHeader'>, sheetId: string, doc = new Y.Doc()): SyncClient {
  const wsUrl = http.baseUrl.replace(/^http/, 'ws') + '/sync';
  const provider = new WebsocketProvider(wsUrl, sheetId, doc, {
    WebSocketPolyfill: cookieWebSocket(http.cookieHeader()) as any,
    disableBc: true,
    maxBackoffTime: 200,
  });
  return {
    doc,
    provider,
    synced: () =>
      new Promise<void>((resolve) => {
        if (provider.synced) return resolve();
        const on = (s: boolean) => {
          if (!s) return;
          provider.off('sync', on);
          resolve();
        };
        provider.on('sync', on);
      }),
    destroy() {
      provider.destroy();
      doc.destroy();
    },
  };
}

/** Resolves once `check` holds, polling briefly; rejects with `what` after the timeout. */
export async function eventually(check: () => boolean, what: string, timeoutMs = 5000): Promise<void> {
  const start = Date.now();
  while (!check()) {
    if (Date.now() - start > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 10));
  }
}
