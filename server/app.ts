/**
 * createApp builds the Express app from its parts, without listening, so tests can drive it with
 * supertest and a restart can be simulated by building a second app over the same database.
 */
import fs from 'node:fs';
import path from 'node:path';
import express, { type Express, type Request } from 'express';
import expressStaticGzip from 'express-static-gzip';
import session from 'express-session';
import helmet from 'helmet';
import cors from 'cors';
import type { AppConfig } from './config';
import type { Orm } from './db';
import type { Logger } from './logger';
import { apiNotFound, errorHandler } from './middleware/errors';
import { loadUser } from './middleware/auth';
import { requestContext } from './middleware/request-context';
import { requestLog } from './middleware/request-log';
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
import { createPdfWork, type PdfWork } from './workers/pdf-pool';
import { createStorage, type FileStorage } from './modules/files/storage';
import { filesRoutes, projectFilesRoutes } from './modules/files/files.routes';

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
  /** Where uploads' bytes go; by default the one the config names (a folder, or S3). */
  storage?: FileStorage;
  /** The PDF plan worker; by default one is made and closed with the app. */
  pdfWork?: PdfWork;
}

export interface SightfanApp {
  app: Express;
  /** Delivers queued e-mail from the database; started with the app, stopped by close(). */
  outbox: MailDispatcher;
  /** Turns readiness off (503 on /api/ready) so a proxy stops sending new work before the stop. */
  drain(): void;
  close(): void;
}

export const SESSION_COOKIE = 'sightfan.sid';
const SESSION_DAYS = 14;

export function createApp(deps: AppDeps): SightfanApp {
  const { config, orm, log } = deps;
  const app = express();
  app.disable('x-powered-by');
  // No ETag on res.send/res.json: every API answer is `no-store`, so a hash of each body (SHA-1 per
  // response) bought nothing. Static files keep theirs (express.static and sendFile make their own).
  app.set('etag', false);
  // A hop count, never `true`: with `true` Express takes the left-most X-Forwarded-For entry, which
  // the client writes itself.
  app.set('trust proxy', config.trustProxy);

  // One JSON line per request with its id, method, path, status and time; never headers or bodies.
  app.use(requestLog(log.pino));

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
  const storage = deps.storage ?? createStorage(config.storage);
  const pdfWork = deps.pdfWork ?? createPdfWork();
  const files = { storage, pdf: pdfWork, log };
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
  api.use('/projects', projectsRoutes(work, files));
  api.use('/projects', projectFilesRoutes(files));
  api.use('/files', filesRoutes(files));
  api.use('/projects', sheetsRoutes({ outbox, work, outsidePerHour: config.sheetOutsideEmailsPerHour, storage }));
  api.use('/projects', reviewRoutes({ work, publicUrl }));
  api.use('/reviewers', reviewersRoutes());
  api.use(apiNotFound);
  app.use('/api', api);

  // The exported web app (see serveWebApp): compressed, hashed assets cached long, index.html
  // always fresh and only for page navigations.
  serveWebApp(app, config.distDir);
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
      if (!deps.pdfWork) void pdfWork.close();
    },
  };
}

/**
 * Only a page navigation gets the app's HTML: a request that asks for text/html, for a path whose
 * last part has no file extension (`/projects/12`, `/quick`). Anything else that is not a file of
 * the build (`/favicon.ico` before it exists, `/foo.png`, a script a stale page asks for) is a 404,
 * never the HTML page, so a browser or service worker never caches a page as an image or script.
 */
export function isPageNavigation(req: Request): boolean {
  const last = req.path.slice(req.path.lastIndexOf('/') + 1);
  return (req.get('accept') ?? '').includes('text/html') && !last.includes('.');
}

/**
 * The exported web app from `distDir`. Files are served pre-compressed where the build left a
 * `.br` / `.gz` beside them (scripts/web-finish.ts; brotli first, then gzip, `Vary: Accept-Encoding`),
 * hashed assets with a year's immutable cache, everything else revalidated.
 */
function serveWebApp(app: Express, distDir: string): void {
  const indexHtml = path.join(distDir, 'index.html');
  /** A hashed file of the build (`/_expo/static/…`, `/assets/…`): its name changes with its content. */
  const hashed = (file: string) => ['_expo', 'assets'].includes(path.relative(distDir, file).split(path.sep)[0]);
  // A broken percent-escape goes to the error handler's sentence (express-static-gzip would answer
  // it with its own bare message).
  app.use((req, _res, next) => {
    try {
      decodeURIComponent(req.path);
      next();
    } catch (e) {
      next(Object.assign(e instanceof URIError ? e : new URIError(String(e)), { status: 400 }));
    }
  });
  app.use(
    expressStaticGzip(distDir, {
      enableBrotli: true,
      orderPreference: ['br', 'gzip'],
      index: false,
      serveStatic: {
        index: false,
        setHeaders: (res, file) => {
          // Everything not hashed (index.html, sw.js, the manifests, the favicon) is asked for again
          // each time: a deploy must reach phones that keep the service worker.
          res.setHeader('Cache-Control', hashed(file) ? 'public, max-age=31536000, immutable' : 'no-cache');
          if (file.endsWith('.webmanifest')) res.setHeader('Content-Type', 'application/manifest+json');
        },
      },
    }),
  );
  app.get('/{*splat}', (req, res) => {
    if (!isPageNavigation(req)) {
      res.status(404).set('Cache-Control', 'no-cache').type('text').send('Not found.');
      return;
    }
    if (!fs.existsSync(indexHtml)) {
      res.status(503).type('text').send('The Sightfan web app has not been built yet. Run `npm start`, which builds it first.');
      return;
    }
    res.set('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
