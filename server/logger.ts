/** Readable one-line logs with a time stamp; quiet in tests unless LOG_LEVEL says otherwise. */
export interface Logger {
  info(message: string): void;
  warn(message: string): void;
  error(message: string, err?: unknown): void;
}

export function createLogger(quiet = process.env.NODE_ENV === 'test' && process.env.LOG_LEVEL !== 'debug'): Logger {
  const stamp = () => new Date().toISOString().replace('T', ' ').slice(0, 19);
  return {
    info: (m) => {
      if (!quiet) console.log(`${stamp()}  ${m}`);
    },
    warn: (m) => {
      if (!quiet) console.warn(`${stamp()}  warning: ${m}`);
    },
    error: (m, err) => {
      console.error(`${stamp()}  error: ${m}`, err instanceof Error ? err.stack : (err ?? ''));
    },
  };
}
