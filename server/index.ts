/** `npm start` runs this after the web build is fresh: parse the environment, start, stop cleanly. */
import { ConfigError, parseConfig } from './config';
import { createLogger } from './logger';
import { startServer } from './main';

async function main(): Promise<void> {
  const log = createLogger(false);
  let config;
  try {
    config = parseConfig();
  } catch (e) {
    if (e instanceof ConfigError) {
      console.error(e.message);
      process.exit(2);
    }
    throw e;
  }
  const running = await startServer(config, log);
  let stopping = false;
  const shutdown = (signal: string) => {
    if (stopping) return;
    stopping = true;
    log.info(`${signal} received, shutting down`);
    const force = setTimeout(() => {
      log.warn('shutdown took over 10 s; exiting anyway');
      process.exit(1);
    }, 10_000);
    force.unref();
    running
      .stop()
      .then(() => {
        log.info('stopped cleanly');
        process.exit(0);
      })
      .catch((err) => {
        log.error('shutdown failed', err);
        process.exit(1);
      });
  };
  process.on('SIGINT', () => shutdown('SIGINT'));
  process.on('SIGTERM', () => shutdown('SIGTERM'));
}

main().catch((err) => {
  console.error('Sightfan could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
