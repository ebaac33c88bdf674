// Revisions of a sheet, reached two ways: by members (/api/sheets/:sheetId/revisions) and through a viewer link
// (/api/view/:token/revisions, read and review only). Editors and owners issue; owners restore (as a new edit in the
// room, like an import); anyone who can see the sheet may review or approve, and the owners get an e-mail.
import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import type { Database } from '../../../db/client';
import { roleAtLeast, type Role } from '../../../shared/roles';
import { reviewCreateBody, revisionCreateBody, revisionNumberParam, type RevisionDetail } from '../../../shared/revisions';
import type { ServerConfig } from '../../config';
import { forbidden, HttpError, unauthorized } from '../../http/errors';
import type { SessionUser } from '../../http/session';
import { valid, validate } from '../../http/validate';
import type { Mailer } from '../../mail/mailer';
import { reviewMail } from '../../mail/templates';
import { compareDocuments } from '../../revisions/compare';
import { inputHash } from '../../revisions/input-hash';
import type { StudyResults } from '../../revisions/study';
import type { RoomRegistry } from '../../sync/room-registry';
import type { WorkerPool } from '../../workers/worker-pool';
import { applySheetDocument } from '../documents/router';
import { sendExport, EXPORT_FILES } from '../exports/send-export';
import { issueRevision } from '../../revisions/issue';
import { freezeDocument, sheetNames } from '../../revisions/freeze';
import { addReview, findRevision, listRevisions, ownerEmails, revisionSummary, type RevisionRow } from './queries';

/** Who is asking, for one sheet: a member with a role, or someone holding a viewer link. */
export interface RevisionAccess {
  sheetId: string;
  projectId: string;
  user: SessionUser | null;
  role: Role | null;
  viaLink: boolean;
}

export interface RevisionDeps {
  db: Database;
  rooms: RoomRegistry;
  workers: WorkerPool;
  mailer: Mailer;
  config: ServerConfig;
  log: (line: string) => void;
  access: (req: Request, res: Response) => Promise<RevisionAccess>;
}

const byNumber = { params: z.object({ number: revisionNumberParam }) };
const issue = { body: revisionCreateBody };
const review = { params: byNumber.params, body: reviewCreateBody };
const exportFile = { params: z.object({ number: revisionNumberParam, file: z.enum(EXPORT_FILES, { error: `file must be one of ${EXPORT_FILES.join(', ')}` }) }) };

export function revisionsRouter(deps: RevisionDeps): Router {
  const { db, rooms, workers } = deps;
  const r = Router({ mergeParams: true });

  const need = (a: RevisionAccess, role: Role, what: string) => {
    if (a.viaLink) throw forbidden(`Through a viewer link you can look at and review revisions, not ${what}`);
    if (!a.role || !roleAtLeast(a.role, role)) throw forbidden(role === 'owner' ? `Only an owner of this project may ${what}` : `Only an editor or owner of this project may ${what}`);
    if (!a.user) throw unauthorized();
    return a.user;
  };

  const revisionOr404 = async (a: RevisionAccess, number: number): Promise<RevisionRow> => {
    const row = await findRevision(db, a.sheetId, number);
    if (!row) throw new HttpError(404, 'not_found', `This sheet has no revision ${number}`);
    return row;
  };

  r.get('/', async (req, res) => {
    const a = await deps.access(req, res);
    res.json({ revisions: await listRevisions(db, a.sheetId) });
  });

  r.post('/', validate(issue), async (req, res) => {
    const a = await deps.access(req, res);
    const user = need(a, 'editor', 'issue a revision');
    const { body } = valid(res, issue);
    const row = await issueRevision(deps, a.sheetId, { id: user.id, name: user.name }, body.note);
    res.status(201).json({ revision: await revisionSummary(db, row) });
  });

  r.get('/:number', validate(byNumber), async (req, res) => {
    const a = await deps.access(req, res);
    const row = await revisionOr404(a, valid(res, byNumber).params.number);
    const detail: RevisionDetail = { ...(await revisionSummary(db, row)), document: row.document as Record<string, unknown> };
    res.json({ revision: detail });
  });

  r.get('/:number/results', validate(byNumber), async (req, res) => {
    const a = await deps.access(req, res);
    const row = await revisionOr404(a, valid(res, byNumber).params.number);
    res.json({ results: row.results });
  });

  r.get('/:number/compare', validate(byNumber), async (req, res) => {
    const a = await deps.access(req, res);
    const row = await revisionOr404(a, valid(res, byNumber).params.number);
    const names = await sheetNames(db, a.sheetId);
    const live = await freezeDocument(rooms, a.sheetId, names.sheetName);
    const liveResults = await workers.run('study', { document: live.json, baseOnly: true });
    const stored = row.results as StudyResults;
    res.json({
      comparison: compareDocuments(
        { number: row.number, document: row.document as Record<string, unknown>, hash: row.inputHash, base: stored.base.result ?? null },
        { document: live.json, hash: inputHash(live.json), base: liveResults.base.result ?? null },
      ),
    });
  });

  r.post('/:number/restore', validate(byNumber), async (req, res) => {
    const a = await deps.access(req, res);
    const user = need(a, 'owner', 'restore a revision');
    const row = await revisionOr404(a, valid(res, byNumber).params.number);
    const read = await applySheetDocument(rooms, a.sheetId, row.document, user.id);
    res.json({ ok: true, restoredFrom: row.number, warnings: read.warnings });
  });

  r.post('/:number/reviews', validate(review), async (req, res) => {
    const a = await deps.access(req, res);
    if (!a.user) throw new HttpError(401, 'unauthorized', 'Sign in, or give your name through the link, to review a revision');
    const { params, body } = valid(res, review);
    const row = await revisionOr404(a, params.number);
    const saved = await addReview(db, { revisionId: row.id, reviewer: { id: a.user.id, name: a.user.name }, verdict: body.verdict, comment: body.comment, viaLink: a.viaLink });
    try {
      const to = await ownerEmails(db, a.projectId, a.user.id);
      if (to.length > 0) {
        const names = await sheetNames(db, a.sheetId);
        const url = `${deps.config.publicUrl}/revisions/${a.sheetId}?number=${row.number}`;
        await deps.mailer.send({ to, ...reviewMail({ reviewer: a.user.name, verdict: body.verdict, sheetName: names.sheetName, number: row.number, comment: body.comment, url, viaLink: a.viaLink }) });
      }
    } catch (err) {
      // The review stands even when its notice cannot be sent; the operator sees why in the log.
      deps.log(`review mail for revision ${row.id} failed: ${String(err)}`);
    }
    res.status(201).json({ review: saved, revision: await revisionSummary(db, row) });
  });

  r.get('/:number/export/:file', validate(exportFile), async (req, res) => {
    const a = await deps.access(req, res);
    const { params } = valid(res, exportFile);
    const row = await revisionOr404(a, params.number);
    const names = await sheetNames(db, a.sheetId);
    const summary = await revisionSummary(db, row);
    await sendExport(res, params.file, {
      workers,
      baseName: `${names.sheetName}-rev${row.number}`,
      document: row.document as Record<string, unknown>,
      results: async () => row.results as StudyResults,
      report: { projectName: names.projectName, sheetName: names.sheetName, revision: summary },
    });
  });

  return r;
}
