// Issuing a revision: freeze the room's document, solve it in the worker thread, store it with its hash and the
// solver's version under the sheet's next number. Used by the API and by the demo seed.
import type { Database } from '../../db/client';
import { insertRevision, type RevisionRow } from '../api/revisions/queries';
import { freezeDocument, sheetNames } from './freeze';
import type { RoomRegistry } from '../sync/room-registry';
import type { WorkerPool } from '../workers/worker-pool';
import { inputHash } from './input-hash';

export async function issueRevision(
  deps: { db: Database; rooms: RoomRegistry; workers: WorkerPool },
  sheetId: string,
  by: { id: string; name: string },
  note: string,
): Promise<RevisionRow> {
  const names = await sheetNames(deps.db, sheetId);
  const frozen = await freezeDocument(deps.rooms, sheetId, names.sheetName);
  const results = await deps.workers.run('study', { document: frozen.json });
  return insertRevision(deps.db, {
    sheetId,
    note,
    state: frozen.state,
    document: frozen.json,
    inputHash: inputHash(frozen.json),
    solverVersion: results.solverVersion,
    results,
    issuedBy: by,
  });
}
