// Live pin updates for everyone looking at a sheet, as Server-Sent Events (pins live in the database, not in the
// sheet's document, so that viewers and guests can write them).
import type { Response } from 'express';

export class PinEvents {
  private listeners = new Map<string, Set<Response>>();

  subscribe(sheetId: string, res: Response): void {
    res.writeHead(200, { 'Content-Type': 'text/event-stream', 'Cache-Control': 'no-cache', Connection: 'keep-alive' });
    res.write(': connected\n\n');
    let set = this.listeners.get(sheetId);
    if (!set) this.listeners.set(sheetId, (set = new Set()));
    set.add(res);
    const keepAlive = setInterval(() => res.write(': keep-alive\n\n'), 25_000);
    res.on('close', () => {
      clearInterval(keepAlive);
      set!.delete(res);
      if (set!.size === 0) this.listeners.delete(sheetId);
    });
  }

  publish(sheetId: string, event: { type: 'pin-added' | 'reply-added' | 'pin-resolved' | 'pin-reopened'; pinId: string; number: number }): void {
    const data = `event: pins\ndata: ${JSON.stringify(event)}\n\n`;
    for (const res of this.listeners.get(sheetId) ?? []) res.write(data);
  }

  closeAll(): void {
    for (const set of this.listeners.values()) for (const res of set) res.end();
    this.listeners.clear();
  }
}
