// /api/projects: list and create; one project: read, change (owners), delete (owners).
import { Router } from 'express';
import { z } from 'zod';
import { idParam, projectCreateBody, projectPatchBody } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { notFound } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { requireProjectRole } from '../access';
import { createProject, deleteProject, getProject, listProjects, updateProject } from './queries';

const byId = { params: z.object({ projectId: idParam }) };
const create = { body: projectCreateBody };
const patch = { params: byId.params, body: projectPatchBody };

export function projectsRouter(db: Database): Router {
  const r = Router();

  r.get('/', async (_req, res) => {
    res.json({ projects: await listProjects(db, currentUser(res).id) });
  });

  r.post('/', validate(create), async (_req, res) => {
    const user = currentUser(res);
    const id = await createProject(db, user.id, valid(res, create).body);
    res.status(201).json({ project: await getProject(db, id, user.id) });
  });

  r.get('/:projectId', validate(byId), async (_req, res) => {
    const user = currentUser(res);
    const found = await getProject(db, valid(res, byId).params.projectId, user.id);
    if (!found) throw notFound('Project');
    res.json({ project: found });
  });

  r.patch('/:projectId', validate(patch), async (_req, res) => {
    const user = currentUser(res);
    const { params, body } = valid(res, patch);
    await requireProjectRole(db, params.projectId, user.id, 'owner');
    await updateProject(db, params.projectId, body);
    res.json({ project: await getProject(db, params.projectId, user.id) });
  });

  r.delete('/:projectId', validate(byId), async (_req, res) => {
    const user = currentUser(res);
    const { projectId } = valid(res, byId).params;
    await requireProjectRole(db, projectId, user.id, 'owner');
    await deleteProject(db, projectId);
    res.status(204).end();
  });

  return r;
}
