/**
 * Load (issue 15): 50 connections on the project list and on one project, signed in as the demo
 * installer, against
 *   - one Sightfan instance on SQLite (its own process, a demo SQLite file),
 *   - one instance on PostgreSQL (a throwaway cluster started as the tests start theirs),
 *   - two instances on that PostgreSQL behind a small round-robin proxy (its own process),
 * beside a bare Express server returning the same JSON, alone and as two processes behind the same
 * proxy (the ceiling: what two processes can gain on this machine at all), and the SQLite instance
 * signed out (every layer of its middleware, no database work: the floor for any signed-in route). For each run: requests
 * per second, p50 and p99 latency, and the CPU each part used while it ran (app processes,
 * PostgreSQL, the proxy, this process generating the load) as a share of one core, plus the app's
 * CPU per request, which does not depend on how busy the machine is.
 *
 * `BENCH_ONLY=load npm run bench` runs this alone; LOAD_SECONDS (20) sets each run's length;
 * LOAD_LOG_LEVEL (info, the servers' default) the instances' log level.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seeders/demo';
import { postgresAvailable, startPostgres, type PostgresCluster } from '../tests/server/postgres-cluster';

const root = path.resolve(__dirname, '..');
const CONNECTIONS = 50;
const SESSION_SECRET = 'load-bench-secret-shared-by-every-instance-0123456789';
const TICKS_PER_SECOND = 100; // Linux USER_HZ, what /proc/<pid>/stat counts in

async function freePort(): Promise<number> {
  return new Promise((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

async function waitUntilUp(url: string, children: ChildProcess[]): Promise<void> {
  const until = Date.now() + 180_000;
  while (Date.now() < until) {
    for (const child of children) if (child.exitCode !== null) throw new Error(`a benchmark process exited (${child.exitCode})`);
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      /* not yet listening */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} did not answer within three minutes`);
}

function start(script: string, env: Record<string, string>): ChildProcess {
  return spawn(process.execPath, ['--import', 'tsx', script], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

/** CPU seconds (user + system) a process has used so far; 0 once it is gone. */
function cpuSeconds(pid: number): number {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / TICKS_PER_SECOND;
  } catch {
    return 0;
  }
}

/** The PostgreSQL server listening on `port` and its backends (children of the postmaster). */
function postgresPids(port: number): number[] {
  const all = fs.readdirSync('/proc').filter((d) => /^\d+$/.test(d));
  const read = (pid: string, file: string) => {
    try {
      return fs.readFileSync(`/proc/${pid}/${file}`, 'utf8');
    } catch {
      return '';
    }
  };
  const master = all.find((pid) => {
    const args = read(pid, 'cmdline').split('\0');
    return args.some((a) => a.endsWith('postgres')) && args.includes('-p') && args[args.indexOf('-p') + 1] === String(port);
  });
  if (!master) return [];
  const children = all.filter((pid) => {
    const stat = read(pid, 'stat');
    return stat && stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1] === master;
  });
  return [master, ...children].map(Number);
}

interface Setup {
  label: string;
  base: string;
  cookie?: string;
  appPids: number[];
  proxyPid?: number;
  postgresPort?: number;
  /** Signed out on purpose: the 401 answers are what is measured, not errors. */
  signedOut?: boolean;
}

interface Run {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  /** Shares of one core over the run. */
  app: number;
  db: number | null;
  proxy: number | null;
  loadGenerator: number;
  appMsPerRequest: number;
}

async function measure(setup: Setup, route: string, seconds: number): Promise<Run> {
  const dbPids = () => (setup.postgresPort ? postgresPids(setup.postgresPort) : []);
  const sum = (pids: number[]) => pids.reduce((s, pid) => s + cpuSeconds(pid), 0);
  const before = { app: sum(setup.appPids), db: sum(dbPids()), proxy: setup.proxyPid ? cpuSeconds(setup.proxyPid) : 0 };
  const ownBefore = process.cpuUsage();
  const startedAt = process.hrtime.bigint();
  const result = await autocannon({
    url: `${setup.base}${route}`,
    connections: CONNECTIONS,
    duration: seconds,
    headers: setup.cookie ? { cookie: setup.cookie } : {},
  });
  const wall = Number(process.hrtime.bigint() - startedAt) / 1e9;
  const own = process.cpuUsage(ownBefore);
  const app = (sum(setup.appPids) - before.app) / wall;
  // Backends that ended during the run take their seconds with them: PostgreSQL's share is a floor.
  const db = setup.postgresPort ? Math.max(0, sum(dbPids()) - before.db) / wall : null;
  const proxy = setup.proxyPid ? (cpuSeconds(setup.proxyPid) - before.proxy) / wall : null;
  const requests = result.requests.total || 1;
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + (setup.signedOut ? 0 : result.non2xx),
    app,
    db,
    proxy,
    loadGenerator: (own.user + own.system) / 1e6 / wall,
    appMsPerRequest: (1000 * app * wall) / requests,
  };
}

const pct = (share: number | null) => (share === null ? '   —' : `${(100 * share).toFixed(0).padStart(3)} %`);

/** Everything this benchmark runs, as a share of one core: app processes, PostgreSQL, the proxy and the load generator. */
const ours = (r: Run) => r.app + (r.db ?? 0) + (r.proxy ?? 0) + r.loadGenerator;

function line(route: string, setup: string, r: Run): string {
  return (
    `  ${route.padEnd(12)} ${setup.padEnd(31)} ${r.rps.toFixed(0).padStart(6)} req/s  p50 ${String(r.p50).padStart(4)} ms  p99 ${String(r.p99).padStart(5)} ms` +
    `  | CPU app ${pct(r.app)} (${r.appMsPerRequest.toFixed(2)} ms/req) db ${pct(r.db)} proxy ${pct(r.proxy)} load gen ${pct(r.loadGenerator)}` +
    ` = ${pct(ours(r))} of ${100 * os.cpus().length} %` +
    (r.errors ? `  | ${r.errors} errors` : '')
  );
}

async function signIn(base: string): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email: DEMO_USERS[0].email, password: DEMO_PASSWORD }),
  });
  const cookie = res.headers.get('set-cookie')?.split(';')[0];
  if (!res.ok || !cookie) throw new Error(`demo sign-in failed: ${res.status}`);
  return cookie;
}

async function firstProjectId(base: string, cookie: string): Promise<number> {
  const list = (await (await fetch(`${base}/api/projects`, { headers: { cookie } })).json()) as { projects: { id: number }[] };
  return list.projects[0].id;
}

export async function runLoadBench(): Promise<void> {
  const seconds = Number(process.env.LOAD_SECONDS ?? 20);
  const logLevel = process.env.LOAD_LOG_LEVEL ?? 'info';
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-load-'));
  const children: ChildProcess[] = [];
  let pg: PostgresCluster | undefined;
  const launch = (script: string, env: Record<string, string>) => {
    const child = start(script, env);
    children.push(child);
    return child;
  };
  const instance = async (env: Record<string, string>) => {
    const port = await freePort();
    const child = launch('server/index.ts', {
      NODE_ENV: 'development',
      PORT: String(port),
      HOST: '127.0.0.1',
      FAKE_SMTP_PORT: '0',
      SESSION_SECRET,
      SHEET_WORKERS: '1',
      LOG_LEVEL: logLevel,
      ...env,
    });
    await waitUntilUp(`http://127.0.0.1:${port}/api/ready`, children);
    return { port, pid: child.pid! };
  };
  const proxyTo = async (ports: number[], probe: string) => {
    const port = await freePort();
    const child = launch('bench/round-robin-proxy.ts', { PORT: String(port), UPSTREAMS: ports.join(',') });
    await waitUntilUp(`http://127.0.0.1:${port}${probe}`, children);
    return { base: `http://127.0.0.1:${port}`, pid: child.pid! };
  };
  const stopAll = async (list: ChildProcess[]) => {
    for (const child of list) child.kill('SIGTERM');
    await Promise.all(list.map((c) => (c.exitCode !== null ? undefined : new Promise((r) => c.once('exit', r)))));
  };

  try {
    console.log(
      `load: ${CONNECTIONS} connections, ${seconds} s per run, log level ${logLevel}; ${os.cpus().length} cores shared by the app, ` +
        `the database, the proxy and the load generator. CPU shares are of ONE core (200 % = the whole machine).`,
    );
    const loadAtStart = os.loadavg()[0];
    console.log(`  machine load average (1 min) at the start: ${loadAtStart.toFixed(1)} on ${os.cpus().length} cores`);
    const results = new Map<string, Run>();
    const record = (key: string, route: string, setupLabel: string, r: Run) => {
      results.set(key, r);
      console.log(line(route, setupLabel, r));
    };
    const routes = (id: number) =>
      [
        ['list', 'project list', '/api/projects'],
        ['one', 'one project', `/api/projects/${id}`],
      ] as const;

    // 1. One instance on SQLite; its answers are the bare servers' bodies.
    const sqlite = await instance({ DATABASE_PATH: path.join(dir, 'load.sqlite') });
    const sqliteBase = `http://127.0.0.1:${sqlite.port}`;
    const sqliteCookie = await signIn(sqliteBase);
    const sqliteId = await firstProjectId(sqliteBase, sqliteCookie);
    const bodies: Record<string, unknown> = {};
    for (const [, , route] of routes(sqliteId))
      bodies[route] = await (await fetch(`${sqliteBase}${route}`, { headers: { cookie: sqliteCookie } })).json();
    for (const [key, label, route] of routes(sqliteId))
      record(
        `sqlite1:${key}`,
        label,
        'Sightfan ×1, SQLite',
        await measure({ label, base: sqliteBase, cookie: sqliteCookie, appPids: [sqlite.pid] }, route, seconds),
      );
    // The same middleware with no database work: signed out, the list is refused (401) after the
    // request log, helmet, the body parser, the same-origin check, the session middleware (no
    // cookie, so no statement) and loadUser: the most any signed-in route could reach here.
    record(
      'sqlite1:floor',
      'stack only',
      'Sightfan ×1, signed out (401)',
      await measure({ label: 'stack only', base: sqliteBase, appPids: [sqlite.pid], signedOut: true }, '/api/projects', seconds),
    );
    await stopAll(children.splice(0));

    // 2. Bare Express: one process, then two behind the proxy (the machine's ceiling for two).
    const bodiesFile = path.join(dir, 'bodies.json');
    fs.writeFileSync(bodiesFile, JSON.stringify(bodies));
    const bare = async () => {
      const port = await freePort();
      const child = launch('bench/bare-server.ts', { PORT: String(port), BARE_BODIES: bodiesFile });
      await waitUntilUp(`http://127.0.0.1:${port}/api/projects`, children);
      return { port, pid: child.pid! };
    };
    const bareOne = await bare();
    for (const [key, label, route] of routes(sqliteId))
      record(
        `bare1:${key}`,
        label,
        'bare Express ×1',
        await measure({ label, base: `http://127.0.0.1:${bareOne.port}`, appPids: [bareOne.pid] }, route, seconds),
      );
    const bareTwo = await bare();
    const bareProxy = await proxyTo([bareOne.port, bareTwo.port], '/api/projects');
    for (const [key, label, route] of routes(sqliteId))
      record(
        `bare2:${key}`,
        label,
        'bare Express ×2 behind proxy',
        await measure({ label, base: bareProxy.base, appPids: [bareOne.pid, bareTwo.pid], proxyPid: bareProxy.pid }, route, seconds),
      );
    await stopAll(children.splice(0));

    // 3. PostgreSQL: one instance, then two behind the proxy, on the same database.
    if (!postgresAvailable()) {
      console.log('  PostgreSQL is not installed here (initdb not found): its runs are skipped.');
    } else {
      pg = await startPostgres();
      pg.createDatabase('load');
      const url = pg.url('load');
      const pgPort = Number(new URL(url).port);
      const first = await instance({ DATABASE_URL: url });
      const firstBase = `http://127.0.0.1:${first.port}`;
      const pgCookie = await signIn(firstBase);
      const pgId = await firstProjectId(firstBase, pgCookie);
      for (const [key, label, route] of routes(pgId))
        record(
          `pg1:${key}`,
          label,
          'Sightfan ×1, PostgreSQL',
          await measure({ label, base: firstBase, cookie: pgCookie, appPids: [first.pid], postgresPort: pgPort }, route, seconds),
        );
      const second = await instance({ DATABASE_URL: url });
      const proxy = await proxyTo([first.port, second.port], '/api/health');
      for (const [key, label, route] of routes(pgId))
        record(
          `pg2:${key}`,
          label,
          'Sightfan ×2, PostgreSQL, proxy',
          await measure(
            { label, base: proxy.base, cookie: pgCookie, appPids: [first.pid, second.pid], proxyPid: proxy.pid, postgresPort: pgPort },
            route,
            seconds,
          ),
        );
    }

    console.log('  summary:');
    const ratio = (a?: Run, b?: Run) => (a && b ? a.rps / b.rps : NaN);
    for (const [key, label] of [
      ['list', 'project list'],
      ['one', 'one project'],
    ] as const) {
      const s1 = results.get(`sqlite1:${key}`);
      const b1 = results.get(`bare1:${key}`);
      const b2 = results.get(`bare2:${key}`);
      const p1 = results.get(`pg1:${key}`);
      const p2 = results.get(`pg2:${key}`);
      const parts = [
        `one instance on SQLite ${(100 * ratio(s1, b1)).toFixed(0)} % of bare Express (goal ≥ 50 %, p99 ≤ 50 ms: p99 ${s1?.p99} ms)`,
        p1 ? `PostgreSQL ×1 ${(100 * ratio(p1, b1)).toFixed(0)} % of bare` : '',
        p2 ? `two/one on PostgreSQL ${ratio(p2, p1).toFixed(2)}×` : '',
        `bare two/one (the ceiling here) ${ratio(b2, b1).toFixed(2)}×`,
      ].filter(Boolean);
      console.log(`  ${label.padEnd(12)} ${parts.join('; ')}`);
    }
    const floor = results.get('sqlite1:floor');
    const bareList = results.get('bare1:list');
    if (floor && bareList)
      console.log(
        `  stack only   Sightfan's middleware with no database work (signed out, 401) ${(100 * ratio(floor, bareList)).toFixed(0)} % of bare ` +
          `Express at ${floor.appMsPerRequest.toFixed(2)} ms of CPU per answer: the most a signed-in route could reach with this stack.`,
      );
    // Where the ceiling was in this run: the parts' CPU against the whole machine.
    const cores = os.cpus().length;
    const runs = [...results.values()];
    const busiest = Math.max(...runs.map(ours));
    const loadAtEnd = os.loadavg()[0];
    console.log(
      `  ceiling: machine load average ${loadAtStart.toFixed(1)} → ${loadAtEnd.toFixed(1)} on ${cores} cores; the most CPU this ` +
        `benchmark's parts took in one run was ${pct(busiest).trim()} of ${100 * cores} %.`,
    );
    console.log(
      busiest < 0.75 * cores && Math.max(loadAtStart, loadAtEnd) > cores
        ? '  → other work on the machine held most of the CPU: req/s and latency here measure that contention; compare the\n' +
            "    app's ms/request (CPU per answer) between versions, and rerun on a quiet machine for throughput."
        : '  → when the parts add up to about the whole machine, the cores are the ceiling: a second instance can only take CPU\n' +
            '    from the others (app, PostgreSQL, proxy, load generator), so two/one cannot pass the bare two/one figure here.',
    );
    console.log(
      '  reading: on a quiet machine Sightfan ×1 is bound by its own CPU per request (app near 100 % of a core) long before\n' +
        '  PostgreSQL (db share); two instances on one PostgreSQL scale the list with spare cores, up to what the db share allows;\n' +
        '  on this 2-core machine the load generator, the proxy and PostgreSQL take the second core the second instance needs.',
    );
  } finally {
    await stopAll(children);
    pg?.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
