// Awareness updates from a client are rewritten before the room applies them: each state's `user` is replaced by
// the session's user (a client cannot claim another name), and entries for client ids that belong to another
// connection are dropped (a client cannot move someone else's cursor).
//
// Layout of an awareness update (y-protocols): varUint count, then per entry varUint clientID, varUint clock,
// varString JSON state ("null" when the client went away).
import * as decoding from 'lib0/decoding';
import * as encoding from 'lib0/encoding';

export interface StampedUser {
  id: string;
  name: string;
  readOnly: boolean;
}

export interface StampResult {
  update: Uint8Array | null;
  clientIds: number[];
}

export function stampAwarenessUpdate(
  update: Uint8Array,
  user: StampedUser,
  mayUse: (clientId: number) => boolean,
): StampResult {
  const decoder = decoding.createDecoder(update);
  const count = decoding.readVarUint(decoder);
  const kept: { clientId: number; clock: number; state: string }[] = [];
  for (let i = 0; i < count; i++) {
    const clientId = decoding.readVarUint(decoder);
    const clock = decoding.readVarUint(decoder);
    const raw = decoding.readVarString(decoder);
    if (!mayUse(clientId)) continue;
    let state: unknown = null;
    try {
      state = JSON.parse(raw);
    } catch {
      continue;
    }
    const stamped = state && typeof state === 'object' ? { ...(state as object), user } : null;
    kept.push({ clientId, clock, state: JSON.stringify(stamped) });
  }
  if (kept.length === 0) return { update: null, clientIds: [] };
  const encoder = encoding.createEncoder();
  encoding.writeVarUint(encoder, kept.length);
  for (const k of kept) {
    encoding.writeVarUint(encoder, k.clientId);
    encoding.writeVarUint(encoder, k.clock);
    encoding.writeVarString(encoder, k.state);
  }
  return { update: encoding.toUint8Array(encoder), clientIds: kept.map((k) => k.clientId) };
}
