/**
 * A throwaway PostgreSQL for one test file: `initdb` into a temp folder, started on a free port on
 * 127.0.0.1 (and a socket in the same folder), stopped and deleted by `stop()`. PostgreSQL refuses
 * to run as root, so as root the folder is given to the `postgres` user (Debian's package makes it)
 * and the programs run through `runuser`.
 *
 * `POSTGRES_BIN` names the folder with initdb and pg_ctl; otherwise the newest
 * /usr/lib/postgresql/<n>/bin, then PATH.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

export interface PostgresCluster {
  /** postgresql://… for a database named `db` in this cluster (created by `createDatabase`). */
  url(db: string): string;
  createDatabase(db: string): void;
  stop(): void;
}

function binDir(): string | undefined {
  if (process.env.POSTGRES_BIN) return process.env.POSTGRES_BIN;
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return undefined;
  const versions = fs
    .readdirSync(root)
    .filter((v) => fs.existsSync(path.join(root, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(root, versions[0], 'bin') : undefined;
}

/** True when PostgreSQL's server programs are on this machine. */
export function postgresAvailable(): boolean {
  const dir = binDir();
  return dir !== undefined && fs.existsSync(path.join(dir, 'pg_ctl'));
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

export async function startPostgres(): Promise<PostgresCluster> {
  const bin = binDir();
  if (!bin) throw new Error('PostgreSQL is not installed (initdb not found); set POSTGRES_BIN or install postgresql.');
  const asRoot = process.getuid?.() === 0;
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-pg-'));
  const data = path.join(dir, 'data');
  fs.mkdirSync(data, { mode: 0o700 });
  if (asRoot) execFileSync('chown', ['-R', 'postgres:postgres', dir]);
  const run = (program: string, args: string[]) => {
    const file = path.join(bin, program);
    if (asRoot) execFileSync('runuser', ['-u', 'postgres', '--', file, ...args], { stdio: 'pipe', cwd: dir });
    else execFileSync(file, args, { stdio: 'pipe', cwd: dir });
  };
  run('initdb', ['-D', data, '-A', 'trust', '-U', 'sightfan', '-E', 'UTF8', '--no-sync', '--locale=C']);
  const port = await freePort();
  const options = `-p ${port} -k ${dir} -c listen_addresses=127.0.0.1 -c fsync=off -c synchronous_commit=off -c full_page_writes=off -c max_connections=60`;
  run('pg_ctl', ['-D', data, '-l', path.join(dir, 'log'), '-o', options, '-w', '-t', '60', 'start']);
  let stopped = false;
  return {
    url: (db) => `postgresql://sightfan@127.0.0.1:${port}/${db}`,
    createDatabase(db) {
      run('createdb', ['-h', '127.0.0.1', '-p', String(port), '-U', 'sightfan', db]);
    },
    stop() {
      if (stopped) return;
      stopped = true;
      try {
        run('pg_ctl', ['-D', data, '-m', 'immediate', '-w', 'stop']);
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
