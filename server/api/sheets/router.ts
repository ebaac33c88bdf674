// Sheets: listed and created under their project; read, renamed and deleted by their own id.
import { Router } from 'express';
import { z } from 'zod';
import { idParam, sheetCreateBody, sheetPatchBody } from '../../../shared/api';
import type { Database } from '../../../db/client';
import { notFound } from '../../http/errors';
import { currentUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import { requireProjectRole, requireSheetRole } from '../access';
import { getProject } from '../projects/queries';
import { createSheet, deleteSheet, getSheet, listSheets, renameSheet } from './queries';

const inProject = { params: z.object({ projectId: idParam }) };
const createInProject = { params: inProject.params, body: sheetCreateBody };
const bySheet = { params: z.object({ sheetId: idParam }) };
const patch = { params: bySheet.params, body: sheetPatchBody };

/** Mounted at /api/projects/:projectId/sheets. */
export function projectSheetsRouter(db: Database): Router {
  const r = Router({ mergeParams: true });

  r.get('/', validate(inProject), async (_req, res) => {
    const { projectId } = valid(res, inProject).params;
    await requireProjectRole(db, projectId, currentUser(res).id, 'viewer');
    res.json({ sheets: await listSheets(db, projectId) });
  });

  r.post('/', validate(createInProject), async (_req, res) => {
    const user = currentUser(res);
    const { params, body } = valid(res, createInProject);
    await requireProjectRole(db, params.projectId, user.id, 'editor');
    const id = await createSheet(db, params.projectId, user.id, body.name);
    res.status(201).json({ sheet: await getSheet(db, id) });
  });

  return r;
}

/** Mounted at /api/sheets. */
export function sheetsRouter(db: Database): Router {
  const r = Router();

  r.get('/:sheetId', validate(bySheet), async (_req, res) => {
    const { sheetId } = valid(res, bySheet).params;
    const user = currentUser(res);
    const { sheet, role } = await requireSheetRole(db, sheetId, user.id, 'viewer');
    const [summary, project] = await Promise.all([getSheet(db, sheetId), getProject(db, sheet.projectId, user.id)]);
    if (!summary || !project) throw notFound('Sheet');
    res.json({ sheet: summary, project: { id: project.id, name: project.name, role } });
  });

  r.patch('/:sheetId', validate(patch), async (_req, res) => {
    const user = currentUser(res);
    const { params, body } = valid(res, patch);
    await requireSheetRole(db, params.sheetId, user.id, 'editor');
    await renameSheet(db, params.sheetId, user.id, body.name);
    res.json({ sheet: await getSheet(db, params.sheetId) });
  });

  r.delete('/:sheetId', validate(bySheet), async (_req, res) => {
    const user = currentUser(res);
    const { sheetId } = valid(res, bySheet).params;
    await requireSheetRole(db, sheetId, user.id, 'editor');
    await deleteSheet(db, sheetId);
    res.status(204).end();
  });

  return r;
}
