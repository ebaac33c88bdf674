// /api/sheets/:sheetId/export/:file: the live sheet's exports (its JSON document, the drawing as SVG or PNG, the
// results as CSV), made from the room's document as it is now. A report PDF is made for an issued revision.
import { Router } from 'express';
import { z } from 'zod';
import { idParam } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import type { RoomRegistry } from '../../sync/room-registry';
import type { WorkerPool } from '../../workers/worker-pool';
import { requireSheetRole } from '../access';
import { freezeDocument } from '../../revisions/freeze';
import { EXPORT_FILES, sendExport } from './send-export';

const LIVE_FILES = EXPORT_FILES.filter((f) => f !== 'report.pdf') as [string, ...string[]];
const byFile = { params: z.object({ sheetId: idParam, file: z.enum(LIVE_FILES, { error: `file must be one of ${LIVE_FILES.join(', ')} (a report is made for a revision)` }) }) };

export function exportsRouter(db: Database, rooms: RoomRegistry, workers: WorkerPool): Router {
  const r = Router();
  r.get('/:sheetId/export/:file', validate(byFile), async (_req, res) => {
    const { sheetId, file } = valid(res, byFile).params;
    const { sheet } = await requireSheetRole(db, sheetId, currentUser(res).id, 'viewer');
    const live = await freezeDocument(rooms, sheetId, sheet.name);
    await sendExport(res, file as (typeof EXPORT_FILES)[number], {
      workers,
      baseName: sheet.name,
      document: live.json,
      results: (baseOnly) => workers.run('study', { document: live.json, baseOnly }),
    });
  });
  return r;
}
