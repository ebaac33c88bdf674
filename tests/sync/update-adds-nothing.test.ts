// Which updates change nothing in a room's document (a reader's sync reply) and which are real writes.
import * as Y from 'yjs';
import { describe, expect, it } from 'vitest';
import { addsNothing } from '../../server/sync/update-adds-nothing';

/** A room's document with one kept and one deleted entry, and a reader's copy of it. */
function roomAndCopy() {
  const room = new Y.Doc();
  room.getMap('elements').set('kept', 1);
  room.getMap('elements').set('gone', 2);
  room.getMap('elements').delete('gone');
  const copy = new Y.Doc();
  Y.applyUpdate(copy, Y.encodeStateAsUpdate(room));
  return { room, copy };
}

/** What `from` sends in reply to `to`'s sync step 1: what `to` lacks, by state vector (y-protocols' step 2). */
const step2 = (from: Y.Doc, to: Y.Doc) => Y.encodeStateAsUpdate(from, Y.encodeStateVector(to));

describe('an update that adds nothing', () => {
  it('is the empty reply of a fresh reader', () => {
    const { room } = roomAndCopy();
    expect(addsNothing(room, step2(new Y.Doc(), room))).toBe(true);
  });

  it('is the reply of a reader holding the same document (its delete set is the room’s)', () => {
    const { room, copy } = roomAndCopy();
    const reply = step2(copy, room);
    expect(Y.decodeUpdate(reply).ds.clients.size).toBe(1);
    expect(addsNothing(room, reply)).toBe(true);
  });

  it('is the reply of a reader that saw only part of the room’s edits', () => {
    const { room, copy } = roomAndCopy();
    room.getMap('elements').set('later', 3);
    room.getMap('elements').delete('kept');
    expect(addsNothing(room, step2(copy, room))).toBe(true);
  });
});

describe('a write', () => {
  it('adds an entry the room lacks', () => {
    const { room, copy } = roomAndCopy();
    copy.getMap('elements').set('forged', 1);
    expect(addsNothing(room, step2(copy, room))).toBe(false);
  });

  it('deletes an entry the room keeps (a reply with no new structs, only a new deletion)', () => {
    const { room, copy } = roomAndCopy();
    copy.getMap('elements').delete('kept');
    const reply = step2(copy, room);
    expect(Y.decodeUpdate(reply).structs).toHaveLength(0);
    expect(addsNothing(room, reply)).toBe(false);
  });

  it('or a malformed message is not taken for nothing', () => {
    expect(addsNothing(new Y.Doc(), new Uint8Array([7, 7, 7]))).toBe(false);
  });
});
