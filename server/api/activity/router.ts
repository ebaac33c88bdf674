// /api/projects/:projectId/activity: the membership record, for owners.
import { Router } from 'express';
import { z } from 'zod';
import { idParam } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { requireProjectRole } from '../access';
import { listActivity } from '../membership-events';

const inProject = { params: z.object({ projectId: idParam }) };

export function activityRouter(db: Database): Router {
  const r = Router({ mergeParams: true });
  r.get('/', validate(inProject), async (_req, res) => {
    const { projectId } = valid(res, inProject).params;
    await requireProjectRole(db, projectId, currentUser(res).id, 'owner');
    res.json({ activity: await listActivity(db, projectId) });
  });
  return r;
}
