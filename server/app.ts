/**
 * createApp builds the Express app from its parts, without listening, so tests can drive it with
 * supertest and a restart can be simulated by building a second app over the same database.
 */
import fs from 'node:fs';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import express, { type Express } from 'express';
import { pinoHttp } from 'pino-http';
import session from 'express-session';
import helmet from 'helmet';
import cors from 'cors';
import type { AppConfig } from './config';
import type { Orm } from './db';
import type { Logger } from './logger';
import { apiNotFound, errorHandler, safePath } from './middleware/errors';
import { loadUser } from './middleware/auth';
import { requestContext } from './middleware/request-context';
import { sameOriginOnly } from './middleware/same-origin';
import { authRoutes } from './modules/auth/auth.routes';
import { SignInLimiter, type SignInLimits, DEFAULT_SIGN_IN_LIMITS } from './modules/auth/sign-in-limiter';
import type { Mailer } from './modules/mail/mailer';
import { outboxRoutes } from './modules/mail/outbox.routes';
import { DEFAULT_OUTBOX_OPTIONS, MailDispatcher, type OutboxOptions } from './modules/mail/outbox';
import { OrmSessionStore } from './modules/sessions/orm-session-store';
import { invitationsRoutes } from './modules/users/invitations.routes';
import { usersRoutes } from './modules/users/users.routes';
import { catalogueRoutes } from './modules/catalogue/catalogue.routes';
import { projectsRoutes } from './modules/projects/projects.routes';
import { sheetsRoutes } from './modules/sheets/sheets.routes';
import { reviewRoutes, reviewersRoutes } from './modules/review/review.routes';
import { createSheetWork, type SheetWork } from './workers/sheet-pool';

/** dist/ files written by scripts/offline-build.ts, served `no-cache`. */
const OFFLINE_FILES = new Set(['sw.js', 'manifest.webmanifest', 'manifest.json']);

export interface AppDeps {
  config: AppConfig;
  orm: Orm;
  mailer: Mailer;
  log: Logger;
  sessionSecret: string;
  signInLimits?: SignInLimits;
  /** Outbox timing (tests shorten the retry delays). */
  outbox?: Partial<OutboxOptions>;
  /** The sheet worker pool; by default one is made from the config and closed with the app. */
  sheetWork?: SheetWork;
}

export interface SightfanApp {
  app: Express;
  /** Delivers queued e-mail from the database; started with the app, stopped by close(). */
  outbox: MailDispatcher;
  /** Turns readiness off (503 on /api/ready) so a proxy stops sending new work before the stop. */
  drain(): void;
  close(): void;
}

/** A request id from the proxy is kept when it looks like one; otherwise a new one is made. */
const INCOMING_REQUEST_ID = /^[A-Za-z0-9._:-]{8,64}$/;

export const SESSION_COOKIE = 'sightfan.sid';
const SESSION_DAYS = 14;

export function createApp(deps: AppDeps): SightfanApp {
  const { config, orm, log } = deps;
  const app = express();
  app.disable('x-powered-by');
  // A hop count, never `true`: with `true` Express takes the left-most X-Forwarded-For entry, which
  // the client writes itself.
  app.set('trust proxy', config.trustProxy);

  // One JSON line per request with its id, method, route, status and time; never headers or bodies.
  app.use(
    pinoHttp({
      logger: log.pino,
      genReqId: (req, res) => {
        const incoming = req.headers['x-request-id'];
        const id = typeof incoming === 'string' && INCOMING_REQUEST_ID.test(incoming) ? incoming : randomUUID();
        res.setHeader('X-Request-Id', id);
        return id;
      },
      customProps: (req) => ({ reqId: req.id }),
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
      serializers: {
        req: (req: { method: string; raw: express.Request }) => ({ method: req.method, path: safePath(req.raw) }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
      autoLogging: { ignore: (req) => req.url === '/api/health' || req.url === '/api/ready' },
    }),
  );

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // react-native-web injects its style sheet at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'", ...config.devOrigins],
          objectSrc: ["'none'"],
          frameAncestors: ["'none'"],
          upgradeInsecureRequests: config.secureCookies ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: config.secureCookies,
    }),
  );

  const store = new OrmSessionStore(orm);
  const outbox = new MailDispatcher(orm, deps.mailer, log, { ...DEFAULT_OUTBOX_OPTIONS, scrubAfterSend: !config.demoMode, ...deps.outbox });
  outbox.start();
  const work = deps.sheetWork ?? createSheetWork({ budgetMs: config.sheetBudgetMs, threads: config.sheetWorkers });
  const api = express.Router();
  // First, before sessions and the database: "is the process up and answering".
  api.get('/health', (_req, res) => {
    res.set('Cache-Control', 'no-store').json({ ok: true });
  });
  // "Can this instance take work": the database answers and every migration is applied.
  let draining = false;
  api.get('/ready', async (_req, res) => {
    res.set('Cache-Control', 'no-store');
    if (draining) {
      res.status(503).json({ ready: false, error: 'This instance is shutting down.' });
      return;
    }
    try {
      await orm.em.getConnection().execute('select 1');
      const pending = await orm.getMigrator().getPendingMigrations();
      if (pending.length) {
        res.status(503).json({ ready: false, error: `${pending.length} database migration(s) not applied yet.` });
        return;
      }
      res.json({ ready: true });
    } catch {
      res.status(503).json({ ready: false, error: 'The database is not reachable.' });
    }
  });
  if (config.devOrigins.length) {
    api.use(cors({ origin: config.devOrigins, credentials: true }));
  }
  api.use(express.json({ limit: '1mb' }));
  api.use(sameOriginOnly(config.devOrigins));
  api.use(
    session({
      name: SESSION_COOKIE,
      secret: deps.sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      proxy: config.trustProxy > 0,
      cookie: {
        httpOnly: true,
        sameSite: 'lax',
        secure: config.secureCookies,
        maxAge: SESSION_DAYS * 24 * 60 * 60 * 1000,
        path: '/',
      },
    }),
  );
  // One entity manager per request from here on (requestEm()); loadUser's user belongs to it.
  api.use(requestContext(orm));
  api.use(loadUser());
  api.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });

  const publicUrl = (host: string) => config.publicUrl ?? `http://${host}`;
  const limiter = new SignInLimiter(orm, deps.signInLimits ?? DEFAULT_SIGN_IN_LIMITS);
  api.use('/auth', authRoutes({ orm, limiter, store, outbox, bcryptCost: config.bcryptCost, publicUrl }));
  api.use('/invitations', invitationsRoutes(config.bcryptCost, store));
  api.use('/users', usersRoutes({ outbox, store, publicUrl }));
  api.use('/outbox', outboxRoutes(config.demoMode, config.mailFrom));
  const catalogue = catalogueRoutes(work);
  api.use('/catalogue', catalogue);
  // The earlier spelling, kept so old clients and links still work: the same router.
  api.use('/catalog', catalogue);
  api.use('/projects', projectsRoutes(work));
  api.use('/projects', sheetsRoutes({ outbox, work, outsidePerHour: config.sheetOutsideEmailsPerHour }));
  api.use('/projects', reviewRoutes({ work, publicUrl }));
  api.use('/reviewers', reviewersRoutes());
  api.use(apiNotFound);
  app.use('/api', api);

  // The exported web app: hashed assets cached long, index.html, sw.js and the manifest always
  // fresh (single-page routes; scripts/offline-build.ts writes the offline files).
  const indexHtml = path.join(config.distDir, 'index.html');
  app.use(
    express.static(config.distDir, {
      index: false,
      setHeaders: (res, file) => {
        if (file.includes(`${path.sep}_expo${path.sep}`) || file.includes(`${path.sep}assets${path.sep}`)) {
          res.set('Cache-Control', 'public, max-age=31536000, immutable');
        } else if (OFFLINE_FILES.has(path.basename(file))) {
          // The service worker and the manifest name no version: always ask (a deploy must reach phones).
          res.set('Cache-Control', 'no-cache');
          if (file.endsWith('.webmanifest')) res.type('application/manifest+json');
        }
      },
    }),
  );
  app.get('/{*splat}', (_req, res) => {
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text').send('The Sightfan web app has not been built yet. Run `npm start`, which builds it first.');
      return;
    }
    res.set('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
  app.use(errorHandler(log));

  return {
    app,
    outbox,
    drain: () => {
      draining = true;
    },
    close: () => {
      outbox.stop();
      store.close();
      if (!deps.sheetWork) void work.close();
    },
  };
}
