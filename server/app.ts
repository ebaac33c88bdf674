// Assembles the server: database, mail, auth, API and the web app on one HTTP server. Tests start it on port 0.
import express from 'express';
import cors from 'cors';
import { createServer as createHttpServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { toNodeHandler } from 'better-auth/node';
import { openDatabase, type DatabaseHandle } from '../db/client';
import { isEmpty, seedDemo, DEMO_PASSWORD } from '../db/seed';
import type { Health } from '../shared/api';
import { createAuth, type Auth } from './auth';
import type { ServerConfig } from './config';
import { apiNotFound, errorHandler, HttpError, notFound } from './http/errors';
import { idParam } from '../shared/api';
import { optionalUser, requireUser } from './http/session';
import { rateLimits } from './http/rate-limits';
import { linksRouter } from './api/links/router';
import { viewRouter, linkAccess } from './api/view/router';
import { pinsRouter } from './api/pins/router';
import { acceptRouter, invitationsRouter } from './api/invitations/router';
import { activityRouter } from './api/activity/router';
import { preferencesRouter } from './api/preferences/router';
import { PinEvents } from './api/pins/events';
import { requireSheetRole } from './api/access';
import { currentUser } from './http/session';
import { startLocalSink, type LocalSink } from './mail/local-sink';
import { createMailer, type Mailer } from './mail/mailer';
import { membersRouter } from './api/members/router';
import { outboxRouter } from './api/outbox/router';
import { projectsRouter } from './api/projects/router';
import { projectSheetsRouter, sheetsRouter } from './api/sheets/router';
import { webRouter } from './web';
import { documentBodyParser, documentsRouter } from './api/documents/router';
import { createDocumentStore } from './sync/document-store';
import { RoomRegistry } from './sync/room-registry';
import { attachSyncServer } from './sync/sync-server';
import { migrateOnLoad } from './sync/migrate-on-load';
import { seedDemoDocuments, seedDemoRevisions } from './demo-documents';
import { revisionsRouter, type RevisionAccess } from './api/revisions/router';
import { exportsRouter } from './api/exports/router';
import { WorkerPool } from './workers/worker-pool';

export interface RunningServer {
  url: string;
  port: number;
  http: Server;
  database: DatabaseHandle;
  auth: Auth;
  mailer: Mailer;
  rooms: RoomRegistry;
  workers: WorkerPool;
  seeded: { email: string; role: string }[] | null;
  close(): Promise<void>;
}

const VERSION = '0.1.0';

export async function startServer(
  config: ServerConfig,
  log: (line: string) => void = (line) => console.log(line),
): Promise<RunningServer> {
  const database = await openDatabase({ dataDir: config.dataDir, databaseUrl: config.databaseUrl });
  await database.migrate();
  const { db } = database;

  let sink: LocalSink | null = null;
  if (!config.smtpUrl) sink = await startLocalSink(db, log);
  const mailer = createMailer({ smtpUrl: config.smtpUrl, sinkPort: sink?.port, from: config.mailFrom });
  const auth = createAuth(db, config, mailer);

  let seeded: RunningServer['seeded'] = null;
  let demoSheets: { id: string; fixture: string }[] = [];
  if (config.seedDemo && (await isEmpty(db))) {
    const demo = await seedDemo(db, async (input) => {
      const created = await auth.api.signUpEmail({ body: input });
      return created.user.id;
    });
    seeded = demo.users;
    demoSheets = demo.sheets;
  }

  const rooms = new RoomRegistry(createDocumentStore(db), { log, upgrade: migrateOnLoad });
  const workers = new WorkerPool(log);
  const revisionDeps = { db, rooms, workers, mailer, config, log };
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', false);
  // Credentialed CORS only for the configured extra origins (the Expo dev server); production is same-origin.
  const extraOrigins = config.trustedOrigins.filter((o) => o !== config.publicUrl);
  if (extraOrigins.length > 0) app.use(cors({ origin: extraOrigins, credentials: true }));

  // better-auth reads its own body: mount it before express.json().
  app.all('/api/auth/{*any}', toNodeHandler(auth));
  app.put('/api/sheets/:sheetId/document', documentBodyParser);
  app.use(express.json({ limit: '1mb' }));

  app.get('/api/health', (_req, res) => {
    res.json({ ok: true, version: VERSION, mail: mailer.kind } satisfies Health);
  });
  if (sink) app.use('/api/outbox', outboxRouter(db));
  else
    app.use('/api/outbox', (_req, _res, next) =>
      next(new HttpError(404, 'not_found', 'The outbox exists only while the local mail sink is in use (no SMTP_URL)')),
    );

  const limits = rateLimits(config.rateLimitScale);
  const pinEvents = new PinEvents();
  const postOnly = (mw: express.RequestHandler): express.RequestHandler => (req, res, next) => (req.method === 'POST' ? mw(req, res, next) : next());

  // Viewer links: no account needed; a guest or a signed-in person may comment.
  const view = express.Router({ mergeParams: true });
  view.use(limits.viewLookups, optionalUser(auth));
  view.use('/pins', postOnly(limits.pins), pinsRouter({ db, mailer, config, events: pinEvents, log, access: (req, res) => linkAccess(db, req, res) }));
  view.use(
    '/revisions',
    revisionsRouter({ ...revisionDeps, access: async (req, res): Promise<RevisionAccess> => ({ ...(await linkAccess(db, req, res)), viaLink: true }) }),
  );
  view.use('/', viewRouter(db, rooms));
  app.use('/api/view/:token', view);

  const invitations = invitationsRouter(db, mailer, config);
  app.use('/api/invitations', limits.viewLookups, invitations.byTokenRouter);

  const api = express.Router();
  api.use(requireUser(auth));
  api.use('/invitations', acceptRouter(db, invitations.findByToken));
  api.use('/projects/:projectId/invitations', postOnly(limits.invitations), invitations.owners);
  api.use('/projects/:projectId/activity', activityRouter(db));
  api.use('/me', preferencesRouter(db));
  api.use(
    '/sheets/:sheetId/pins',
    postOnly(limits.pins),
    pinsRouter({
      db,
      mailer,
      config,
      events: pinEvents,
      log,
      access: async (req, res) => {
        const sheetId = idParam.safeParse((req.params as Record<string, string>).sheetId);
        if (!sheetId.success) throw notFound('Sheet');
        const user = currentUser(res);
        const { sheet, role } = await requireSheetRole(db, sheetId.data, user.id, 'viewer');
        return { sheetId: sheet.id, projectId: sheet.projectId, user, role };
      },
    }),
  );
  api.use(
    '/sheets/:sheetId/revisions',
    revisionsRouter({
      ...revisionDeps,
      access: async (req, res): Promise<RevisionAccess> => {
        const sheetId = idParam.safeParse((req.params as Record<string, string>).sheetId);
        if (!sheetId.success) throw notFound('Sheet');
        const user = currentUser(res);
        const { sheet, role } = await requireSheetRole(db, sheetId.data, user.id, 'viewer');
        return { sheetId: sheet.id, projectId: sheet.projectId, user, role, viaLink: false };
      },
    }),
  );
  api.use('/sheets', exportsRouter(db, rooms, workers));
  api.use('/sheets', postOnly(limits.links), linksRouter(db, rooms, config));
  api.use('/projects/:projectId/sheets', projectSheetsRouter(db));
  api.use('/projects/:projectId/members', membersRouter(db, rooms));
  api.use('/projects', projectsRouter(db));
  api.use('/sheets', documentsRouter(db, rooms));
  api.use('/sheets', sheetsRouter(db));
  app.use('/api', (req, res, next) => (req.path === '/health' || req.path.startsWith('/view/') ? next() : api(req, res, next)));
  app.use('/api', apiNotFound);
  app.use(webRouter());
  app.use(errorHandler(log));

  const http = createHttpServer(app);
  const sync = attachSyncServer(http, { db, auth, rooms, log });
  if (demoSheets.length > 0) {
    await seedDemoDocuments(rooms, demoSheets, null);
    await seedDemoRevisions({ db, rooms, workers }, demoSheets);
  }
  await new Promise<void>((resolve, reject) => {
    http.once('error', reject);
    http.listen(config.port, () => resolve());
  });
  const port = (http.address() as AddressInfo).port;

  return {
    url: `http://localhost:${port}`,
    port,
    http,
    database,
    auth,
    mailer,
    rooms,
    workers,
    seeded,
    async close() {
      pinEvents.closeAll();
      await sync.close();
      await rooms.closeAll();
      await workers.close();
      const closed = new Promise<void>((resolve) => http.close(() => resolve()));
      http.closeAllConnections();
      await closed;
      mailer.close();
      await sink?.close();
      await database.close();
    },
  };
}

export { DEMO_PASSWORD };
