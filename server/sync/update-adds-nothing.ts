// Whether an update would change nothing in a document: every struct in it is already there and every deletion
// in it already made. A read-only client's reply to the room's sync step 1 is such an update (empty on a first
// join; on a reconnect, no structs and the delete set the room already has), unlike a real write attempt.
import * as Y from 'yjs';

export function addsNothing(doc: Y.Doc, update: Uint8Array): boolean {
  try {
    const { structs, ds } = Y.decodeUpdate(update);
    if (structs.length === 0 && ds.clients.size === 0) return true;
    // The room's snapshot is built only for the less common non-empty case (it walks the whole struct store).
    return Y.snapshotContainsUpdate(Y.snapshot(doc), update);
  } catch {
    return false; // malformed: not a no-op
  }
}
