/**
 * Load (issue 15): 50 connections for 20 s on the project list and on one project, against one
 * Sightfan instance (its own process, a demo SQLite file), beside a bare Express server returning
 * the same JSON in the same run. Prints requests per second, p99 latency and the ratios.
 * Goal: one instance ≥ 50 % of bare Express, p99 ≤ 50 ms.
 *
 * `BENCH_ONLY=load npm run bench` runs this alone; LOAD_SECONDS shortens it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seeders/demo';

const root = path.resolve(__dirname, '..');
const CONNECTIONS = 50;

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

async function waitUntilUp(url: string, child: ChildProcess): Promise<void> {
  const until = Date.now() + 120_000;
  while (Date.now() < until) {
    if (child.exitCode !== null) throw new Error(`the server process exited (${child.exitCode})`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not yet listening */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within two minutes`);
}

function start(script: string, env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', script], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

async function hit(url: string, cookie: string | undefined, seconds: number) {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: seconds, headers: cookie ? { cookie } : {} });
  return { rps: result.requests.average, p99: result.latency.p99, errors: result.errors + result.non2xx };
}

export async function runLoadBench(): Promise<void> {
  const seconds = Number(process.env.LOAD_SECONDS ?? 20);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-load-'));
  const appPort = await freePort();
  const app = start('server/index.ts', {
    NODE_ENV: 'development',
    PORT: String(appPort),
    HOST: '127.0.0.1',
    FAKE_SMTP_PORT: '0',
    DATABASE_PATH: path.join(dir, 'load.sqlite'),
    LOG_LEVEL: 'warn',
  });
  let bare: ChildProcess | undefined;
  try {
    const base = `http://127.0.0.1:${appPort}`;
    await waitUntilUp(`${base}/api/health`, app);
    const signIn = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: DEMO_USERS[0].email, password: DEMO_PASSWORD }),
    });
    const cookie = signIn.headers.get('set-cookie')?.split(';')[0];
    if (!signIn.ok || !cookie) throw new Error(`demo sign-in failed: ${signIn.status}`);
    const list = (await (await fetch(`${base}/api/projects`, { headers: { cookie } })).json()) as { projects: { id: number }[] };
    const id = list.projects[0].id;
    const one = await (await fetch(`${base}/api/projects/${id}`, { headers: { cookie } })).json();

    const barePort = await freePort();
    const bodiesFile = path.join(dir, 'bodies.json');
    fs.writeFileSync(bodiesFile, JSON.stringify({ '/api/projects': list, [`/api/projects/${id}`]: one }));
    bare = start('bench/bare-server.ts', { PORT: String(barePort), BARE_BODIES: bodiesFile });
    const bareBase = `http://127.0.0.1:${barePort}`;
    await waitUntilUp(`${bareBase}/api/projects`, bare);

    console.log(`load: ${CONNECTIONS} connections, ${seconds} s per route, ${os.cpus().length} cores shared by server and load generator`);
    for (const [label, route] of [
      ['project list', '/api/projects'],
      ['one project', `/api/projects/${id}`],
    ] as const) {
      const ours = await hit(`${base}${route}`, cookie, seconds);
      const theirs = await hit(`${bareBase}${route}`, undefined, seconds);
      console.log(
        `  ${label.padEnd(13)} Sightfan ${ours.rps.toFixed(0).padStart(6)} req/s p99 ${String(ours.p99).padStart(5)} ms` +
          ` | bare Express ${theirs.rps.toFixed(0).padStart(6)} req/s p99 ${String(theirs.p99).padStart(4)} ms` +
          ` | ratio ${((100 * ours.rps) / theirs.rps).toFixed(0)} % (goal ≥ 50 %, p99 ≤ 50 ms)${ours.errors ? ` | ${ours.errors} errors` : ''}`,
      );
    }
  } finally {
    app.kill('SIGTERM');
    bare?.kill('SIGTERM');
    await new Promise((r) => setTimeout(r, 500));
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
