import { mkdirSync } from 'node:fs';
import express, { type Express, type RequestHandler } from 'express';
import type { AppConfig } from './config';
import { isPostgres, openDatabase, type Db } from './db/knex';
import { migrateLatest } from './db/migrate';
import { createSessionStore, stopSessionStore } from './db/session-store';
import { countUsers } from './db/users';
import { apiNotFound, errorHandler } from './http/errors';
import { createSessionMiddleware } from './http/middleware/session';
import { originCheck } from './http/middleware/origin';
import { createRateLimits } from './http/middleware/rate-limits';
import { securityHeaders } from './http/middleware/security';
import { clientRouter } from './http/middleware/static';
import { authRouter } from './http/routes/auth';
import { boardsRouter } from './http/routes/boards';
import { healthRouter } from './http/routes/health';
import { invitationsRouter } from './http/routes/invitations';
import { membersRouter } from './http/routes/members';
import { outboxRouter } from './http/routes/outbox';
import { createServices, type Services } from './services';
import { createEvents, type AppEvents } from './services/events';
import { createMailer, type Mailer } from './services/mail';
import { seedDemo, type BoardContentSeeder } from './seed/demo';
import { boardFileRouter } from './http/routes/board-file';
import { BoardRegistry, exampleBoardContent } from './boards-live';
import { createKnexBoardStore } from './db/board-store';
import { analyzeRouter } from './http/routes/analyze';
import { buildRouter } from './http/routes/build';
import { mountSnapshots } from './snapshots';
import { createAnalysisRunner } from './services/analysis-runner';
import { bringupRouter } from './http/routes/bringup';
import { createBringupFeature } from './services/bringup';
import { attachRooms, boardStoreFor, openScaleOut, type ScaleOut } from './scale-out';
import { createShareLinksService, type ShareLinksService } from './services/share-links';
import { shareLinksRouter } from './http/routes/share-links';
import { linkAudience } from './boards-live/share-guests';
import { libraryRouter } from './http/routes/library';

/** Everything a feature needs from the running app. */
export interface AppContext {
  app: Express;
  db: Db;
  config: AppConfig;
  /** The express-session middleware; run it on a websocket upgrade request to read `req.session.userId`. */
  sessionMiddleware: RequestHandler;
  services: Services;
  events: AppEvents;
  mail: Mailer;
  /** The open board rooms and the way to every board's content (server/boards-live), one per app. */
  boardRegistry: BoardRegistry;
  /** Several servers (REDIS_URL): the board fan-out, relayed events, shared rate limits; undefined on one server. */
  scaleOut?: ScaleOut;
  /** Set by the SIGTERM drain: /api/ready answers 503 from then on. */
  draining: boolean;
  /** Share links (class mode): the routes use them, and the sockets let guests in with them. */
  shareLinks: ShareLinksService;
  /** Fills a new demo board's document (the example files). */
  boardContent?: BoardContentSeeder;
  /** Async shutdown work of features, run (last registered first) before the mail catcher and Knex close. */
  onClose: Array<() => Promise<void>>;
  /** Runs and empties `onClose` (startServer calls it before waiting for open connections). */
  closeFeatures(): Promise<void>;
  /** Closes features, the mail catcher and the database. Safe to call twice. */
  close(): Promise<void>;
}

/** Builds the app (migrated database, mail, sessions, routes) without listening. */
export async function createApp(config: AppConfig): Promise<AppContext> {
  mkdirSync(config.uploadDir, { recursive: true });
  const db = openDatabase(config);
  let mail: Mailer | undefined;
  const events = createEvents();
  let scaleOut: ScaleOut | undefined;
  try {
    await migrateLatest(db);
    scaleOut = await openScaleOut(config, events);
    mail = await createMailer(config, db);
  } catch (err) {
    await scaleOut?.close();
    await db.destroy();
    throw err;
  }
  const store = createSessionStore(db);
  await store.ready;
  const boardRegistry = new BoardRegistry({ store: boardStoreFor(createKnexBoardStore(db), scaleOut), options: config.collab, logErrors: config.logErrors, fanout: scaleOut?.fanout });
  attachRooms(scaleOut, boardRegistry);
  const services = createServices(db, config, events, mail, boardRegistry);
  const sessionMiddleware = createSessionMiddleware(config, store);
  const limits = createRateLimits(config, scaleOut?.rateLimitStore);
  const shareLinks = createShareLinksService(db, events, (boardId, linkId) => linkAudience(boardRegistry, boardId, linkId));

  const app = express();
  app.disable('x-powered-by');
  // Proxies are trusted only as TRUST_PROXY says (never guessed from address ranges): otherwise
  // X-Forwarded-* are ignored and rate limits count the socket's address. The Secure session cookie
  // behind an https proxy does not depend on this (see createSessionMiddleware).
  app.set('trust proxy', config.trustProxy ?? false);

  app.use(securityHeaders(config));
  app.use('/api', express.json({ limit: config.jsonLimit }));
  app.use('/api', sessionMiddleware);
  app.use('/api', originCheck(config));

  app.use('/api', healthRouter(config.version, {
    database: { dialect: isPostgres(db) ? 'postgres' : 'sqlite', ping: () => db.raw('select 1').then(() => true) },
    redis: scaleOut,
    draining: () => ctx.draining,
  }));
  app.use('/api', authRouter(services, config, limits));
  app.use('/api', shareLinksRouter(services, shareLinks, config, boardRegistry)); // before the boards routes: a guest's two reads
  app.use('/api', boardsRouter(services));
  app.use('/api', membersRouter(services, config, limits));
  app.use('/api', invitationsRouter(services));
  app.use('/api', outboxRouter(services));

  // Rooms store everything before the database closes (the sockets, attached later, close first).
  const onClose: Array<() => Promise<void>> = [() => boardRegistry.close()];
  const closeFeatures = async () => {
    for (let fn = onClose.pop(); fn; fn = onClose.pop()) {
      try {
        await fn();
      } catch (err) {
        console.error('a shutdown hook failed:', err);
      }
    }
  };
  let closing: Promise<void> | undefined;
  const ctx: AppContext = {
    app, db, config, sessionMiddleware, services, events, mail, boardRegistry, shareLinks, scaleOut, draining: false, onClose, closeFeatures,
    close: () =>
      (closing ??= (async () => {
        await closeFeatures();
        // after the rooms stored everything: their last confirmations go out, then Redis closes
        await scaleOut?.close();
        stopSessionStore(store);
        await mail.close();
        await db.destroy();
      })()),
  };

  // routers of other features are mounted here (before the /api 404 below); shutdown work goes in ctx.onClose
  app.use('/api', boardFileRouter(services, boardRegistry));
  const analyses = createAnalysisRunner(config.analyze);
  onClose.push(() => analyses.close());
  app.use('/api', analyzeRouter(config.analyze, analyses));
  app.use('/api', buildRouter());
  ctx.boardContent = exampleBoardContent(boardRegistry);
  app.use('/api', mountSnapshots(ctx));
  app.use('/api', bringupRouter(services, createBringupFeature({ db, uploadDir: config.uploadDir, events, readBoardFile: (id) => boardRegistry.readBoardFile(id) })));
  app.use('/api', libraryRouter(services));

  app.use('/api', apiNotFound);
  const client = clientRouter(config.distDir);
  if (client) app.use(client);
  app.use(errorHandler(config.logErrors));

  try {
    if (config.seedDemo && (await countUsers(db)) === 0) await seedDemo(ctx);
  } catch (err) {
    await ctx.close();
    throw err;
  }
  return ctx;
}
