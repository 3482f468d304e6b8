/**
 * Starts the whole product in one process: database and migrations, demo seed, the local fake
 * mail server, and the HTTP server for the app and /api. Returns a handle that stops it all.
 */
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { createApp } from './app';
import { databaseTarget, describeDatabase, type AppConfig } from './config';
import { openORM, underStartupLock } from './db';
import type { Logger } from './logger';
import { createStorage } from './modules/files/storage';
import { startFakeSmtp, type FakeSmtp } from './modules/mail/fake-smtp';
import { createMailer } from './modules/mail/mailer';
import { seedDemo } from './seeders/demo';
import { clearEvaluationCache } from './modules/sheets/sheet-service';
import { demoSessionSecret } from './session-secret';

export interface RunningServer {
  port: number;
  url: string;
  fakeSmtpPort?: number;
  stop(): Promise<void>;
}

export async function startServer(config: AppConfig, log: Logger): Promise<RunningServer> {
  const target = databaseTarget(config);
  const orm = await openORM(target);
  // One storage for the seed (the demo plan image) and the app.
  const storage = createStorage(config.storage);
  // Migrations and the demo seed run under a lock, so instances started together take turns.
  const seeded = await underStartupLock(orm, async () => {
    await orm.getMigrator().up();
    return config.demoMode && (await seedDemo(orm, config.bcryptCost, storage));
  });
  log.info(`database ready: ${describeDatabase(target)} (migrations applied)`);
  await clearEvaluationCache(orm.em);
  if (seeded) log.info('demo data seeded (see README.md for the demo accounts)');

  let fake: FakeSmtp | undefined;
  if (!config.smtpUrl) {
    fake = await startFakeSmtp(orm, log, config.fakeSmtpPort);
    log.info(`fake mail server listening on 127.0.0.1:${fake.port}; received mail shows in the admin's Outbox`);
  } else {
    log.info('mail goes to the SMTP server in SMTP_URL');
  }
  const mailer = createMailer({ smtpUrl: config.smtpUrl, fakePort: fake?.port, from: config.mailFrom });
  const sessionSecret = config.sessionSecret ?? demoSessionSecret(config.databasePath);
  const { app, close, drain } = createApp({ config, orm, mailer, log, sessionSecret, storage });

  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.port, config.host, () => resolve(s));
    s.once('error', reject);
  });
  const port = (server.address() as AddressInfo).port;
  const url = `http://localhost:${port}`;
  log.info(`Sightfan is serving ${url} (app and /api)`);

  let stopped = false;
  return {
    port,
    url,
    fakeSmtpPort: fake?.port,
    async stop() {
      if (stopped) return;
      stopped = true;
      // Readiness off first, then no new connections; requests already in flight run to the end.
      drain();
      await new Promise<void>((resolve) => {
        // A keep-alive connection goes idle once its last answer is sent: close it then, rather than
        // waiting out the keep-alive timeout.
        const idle = setInterval(() => server.closeIdleConnections(), 50);
        server.close(() => {
          clearInterval(idle);
          resolve();
        });
        server.closeIdleConnections();
      });
      close();
      mailer.close();
      await fake?.close();
      await orm.close(true);
    },
  };
}
