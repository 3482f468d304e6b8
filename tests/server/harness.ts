/**
 * A fresh Sightfan for one test file: its own SQLite file in a temp folder (or, with
 * SIGHTFAN_TEST_DATABASE=postgresql, its own database in a PostgreSQL this file starts), migrations applied, the
 * demo users seeded, the real fake SMTP server on a free port, and the Express app (not listening;
 * supertest drives it). `restart()` builds a new ORM and app over the same file, as a server restart would.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createApp } from '../../server/app';
import type { MailDispatcher, OutboxOptions } from '../../server/modules/mail/outbox';
import { databaseTarget, parseConfig, type AppConfig } from '../../server/config';
import { startPostgres, type PostgresCluster } from './postgres-cluster';
import { initORM, type Orm } from '../../server/db';
import { createLogger } from '../../server/logger';
import { startFakeSmtp, type FakeSmtp } from '../../server/modules/mail/fake-smtp';
import { createMailer, type Mailer } from '../../server/modules/mail/mailer';
import { MailMessage } from '../../server/modules/mail/mail-message.entity';
import type { SignInLimits } from '../../server/modules/auth/sign-in-limiter';
import { hashPassword } from '../../server/modules/auth/passwords';
import { Organization } from '../../server/modules/users/organization.entity';
import { User } from '../../server/modules/users/user.entity';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from '../../server/seeders/demo';
import type { FileStorage } from '../../server/modules/files/storage';

export const PASSWORD = DEMO_PASSWORD;
export const EMAIL = {
  installer: DEMO_USERS[0].email,
  reviewer: DEMO_USERS[1].email,
  admin: DEMO_USERS[2].email,
};

/** A catalogue item an admin may add to their organisation's own catalogue (a 700 mm round acrylic mirror). */
export const catalogueItemBody = (code: string, name = `Test round ${code}`) => ({
  code,
  name,
  mirror: { shape: 'round', diameterM: 0.7, radiusM: 1.4 },
  material: 'acrylic',
  reflectance: 0.8,
  massKg: 4,
  unitPriceMinor: 14900,
  currency: 'EUR',
});

/**
 * An invented aisle crossing: racking along the x axis, a 5 × 3 m crossing for adults in front of
 * it, and a forklift driver 8 m out. The scene the project, review and criteria tests send.
 */
export const CROSSING_ZONE = {
  id: 'z1',
  name: 'Crossing',
  polygonM: [
    [0, 1],
    [5, 1],
    [5, 4],
    [0, 4],
  ],
  target: { kind: 'adult' },
};
export const CROSSING_SCENE = {
  walls: [{ id: 'w1', kind: 'racking', aM: [0, 0], bM: [10, 0], heightM: 6 }],
  zones: [CROSSING_ZONE],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 8], eyeHeightM: 2.1 }],
};
/** A new project over the crossing, for an invented customer. */
export const crossingProject = (name: string) => ({ name, customer: 'Northgate Foods (demo)', site: 'Unit 4', scene: CROSSING_SCENE });
/** The crossing's mirror "M1": on the racking face, 3 m up, aimed along +y at the crossing, for the driver. */
export const crossingMirror = (catalogueItemId: number) => ({
  label: 'M1',
  catalogueItemId,
  positionM: [2.5, 0.4],
  heightM: 3,
  azimuthRad: Math.PI / 2,
  tiltDownRad: 0.3,
  viewerId: 'v1',
});

export interface Harness {
  app: Express;
  /** The app's outbox worker (delivers queued e-mail through the fake SMTP server). */
  outbox: MailDispatcher;
  /** The app's mailer toward the fake SMTP server. */
  mailer: Mailer;
  orm: Orm;
  config: AppConfig;
  dir: string;
  restart(): Promise<void>;
  signedIn(email: string, password?: string): Promise<ReturnType<typeof request.agent>>;
  waitForMail(to: string, timeoutMs?: number): Promise<MailMessage>;
  /** Adds a user straight to the database (the demo organisation, or the one named, made on first use), with the demo password. */
  addUser(email: string, role: 'installer' | 'reviewer' | 'admin', organizationName?: string): Promise<number>;
  close(): Promise<void>;
}

const SECRET = 'test-secret-that-is-long-enough-for-the-config-check';

/** The database the API tests run on: SQLite unless SIGHTFAN_TEST_DATABASE=postgresql. */
export const TEST_DATABASE: 'sqlite' | 'postgresql' = process.env.SIGHTFAN_TEST_DATABASE === 'postgresql' ? 'postgresql' : 'sqlite';

let cluster: Promise<PostgresCluster> | undefined;
let databases = 0;
/** One PostgreSQL per test file (started on first use, stopped after the file); one database per harness. */
if (TEST_DATABASE === 'postgresql') {
  // Registered while the test file is collected (hooks cannot be added inside a test).
  afterAll(async () => {
    if (cluster) (await cluster).stop();
  });
}
async function freshPostgresUrl(): Promise<string> {
  cluster ??= startPostgres();
  const pg = await cluster;
  const name = `sightfan_${++databases}`;
  pg.createDatabase(name);
  return pg.url(name);
}

export async function startHarness(
  opts: {
    signInLimits?: SignInLimits;
    env?: Record<string, string>;
    outbox?: Partial<OutboxOptions>;
    /** Uploads' storage (default: the one the config names, a folder beside the test's SQLite file). */
    storage?: FileStorage;
  } = {},
): Promise<Harness> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-test-'));
  const config = parseConfig({
    NODE_ENV: 'test',
    DATABASE_PATH: path.join(dir, 'test.sqlite'),
    PUBLIC_URL: 'http://sightfan.test',
    ...(TEST_DATABASE === 'postgresql' ? { DATABASE_URL: await freshPostgresUrl() } : {}),
    ...opts.env,
  });
  const log = createLogger(true);
  let orm: Orm = await initORM(databaseTarget(config));
  await seedDemo(orm, config.bcryptCost);
  let fake: FakeSmtp = await startFakeSmtp(orm, log, 0);
  let mailer: Mailer = createMailer({ fakePort: fake.port, from: config.mailFrom });
  let built = createApp({
    config,
    orm,
    mailer,
    log,
    sessionSecret: SECRET,
    signInLimits: opts.signInLimits,
    outbox: opts.outbox,
    storage: opts.storage,
  });

  const h: Harness = {
    app: built.app,
    outbox: built.outbox,
    mailer,
    orm,
    config,
    dir,
    async restart() {
      built.close();
      mailer.close();
      await fake.close();
      await orm.close(true);
      orm = await initORM(databaseTarget(config));
      fake = await startFakeSmtp(orm, log, 0);
      mailer = createMailer({ fakePort: fake.port, from: config.mailFrom });
      built = createApp({
        config,
        orm,
        mailer,
        log,
        sessionSecret: SECRET,
        signInLimits: opts.signInLimits,
        outbox: opts.outbox,
        storage: opts.storage,
      });
      h.app = built.app;
      h.outbox = built.outbox;
      h.mailer = mailer;
      h.orm = orm;
    },
    async signedIn(email, password = PASSWORD) {
      const agent = request.agent(h.app);
      const res = await agent.post('/api/auth/sign-in').send({ email, password });
      if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
      return agent;
    },
    async waitForMail(to, timeoutMs = 5000) {
      const until = Date.now() + timeoutMs;
      while (Date.now() < until) {
        const rows = await h.orm.em.fork().find(MailMessage, {}, { orderBy: { id: 'desc' }, populate: ['raw'] });
        const hit = rows.find((m) => m.toAddresses.includes(to));
        if (hit) return hit;
        await new Promise((r) => setTimeout(r, 50));
      }
      throw new Error(`no mail for ${to} within ${timeoutMs} ms`);
    },
    async addUser(email, role, organizationName) {
      const em = h.orm.em.fork();
      const org = organizationName
        ? ((await em.findOne(Organization, { name: organizationName })) ?? em.create(Organization, { name: organizationName }))
        : await em.findOneOrFail(Organization, { demo: true });
      const user = em.create(User, {
        email,
        name: email.split('@')[0],
        role,
        organization: org,
        passwordHash: await hashPassword(PASSWORD, 12),
      });
      await em.flush();
      return user.id;
    },
    async close() {
      built.close();
      mailer.close();
      await fake.close();
      await orm.close(true);
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
  return h;
}
