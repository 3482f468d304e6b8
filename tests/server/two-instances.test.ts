/**
 * Two Sightfan instances on one PostgreSQL behind a round-robin proxy, as an operator runs them:
 * nothing a person relies on lives in one instance's memory. Each instance is `startServer`, the
 * function `npm start` runs, with DATABASE_URL set.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { parseConfig } from '../../server/config';
import { createLogger } from '../../server/logger';
import { startServer, type RunningServer } from '../../server/main';
import { EMAIL, PASSWORD } from './harness';
import { startPostgres, type PostgresCluster } from './postgres-cluster';

let pg: PostgresCluster;
const instances: RunningServer[] = [];
let proxy: http.Server;
let proxyUrl: string;
/** Which instance (0 or 1) answered each request through the proxy, in order. */
const servedBy: number[] = [];

/** A few lines of round robin: each request goes to the next instance, whatever its cookie says. */
function startProxy(targets: number[]): Promise<http.Server> {
  let next = 0;
  const server = http.createServer((req, res) => {
    const which = next++ % targets.length;
    servedBy.push(which);
    const upstream = http.request(
      { host: '127.0.0.1', port: targets[which], method: req.method, path: req.url, headers: req.headers },
      (answer) => {
        res.writeHead(answer.statusCode ?? 502, answer.headers);
        answer.pipe(res);
      },
    );
    upstream.on('error', () => {
      res.writeHead(502);
      res.end();
    });
    req.pipe(upstream);
  });
  return new Promise((resolve) => server.listen(0, '127.0.0.1', () => resolve(server)));
}

beforeAll(async () => {
  pg = await startPostgres();
  pg.createDatabase('shared');
  const config = parseConfig({
    NODE_ENV: 'test',
    PORT: '0',
    HOST: '127.0.0.1',
    DATABASE_URL: pg.url('shared'),
    SESSION_SECRET: 'two-instances-share-this-secret-of-enough-length',
    FAKE_SMTP_PORT: '0',
    DEMO_MODE: 'true',
    // The demo seed stores its plan image: in a folder of this run, not the working copy's data/.
    UPLOADS_DIR: fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-two-instances-')),
    SHEET_WORKERS: '1',
    PUBLIC_URL: 'http://sightfan.test',
  });
  // Both at once on an empty database: they take turns to migrate and seed (the startup lock).
  instances.push(...(await Promise.all([startServer(config, createLogger(true)), startServer(config, createLogger(true))])));
  proxy = await startProxy(instances.map((s) => s.port));
  proxyUrl = `http://127.0.0.1:${(proxy.address() as AddressInfo).port}`;
}, 120_000);

afterAll(async () => {
  await new Promise<void>((resolve) => (proxy ? proxy.close(() => resolve()) : resolve()));
  await Promise.all(instances.map((s) => s.stop()));
  pg?.stop();
});

const signIn = (url: string, email: string, password: string) => request(url).post('/api/auth/sign-in').send({ email, password });

const newProject = (name: string) => ({
  name,
  customer: 'Two-instance test (demo)',
  site: 'Unit 9',
  scene: { walls: [], zones: [], viewers: [] },
});

it('keeps a signed-in person signed in while the proxy sends each request to the other instance', async () => {
  const agent = request.agent(proxyUrl);
  expect((await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD })).status).toBe(200);
  const from = servedBy.length;
  for (let i = 0; i < 4; i++) {
    const me = await agent.get('/api/auth/me');
    expect([me.status, me.body.user.email]).toEqual([200, EMAIL.installer]);
  }
  expect(new Set(servedBy.slice(from))).toEqual(new Set([0, 1]));
});

it('reads on one instance what was written on the other', async () => {
  const agent = request.agent(proxyUrl);
  await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
  const created = await agent.post('/api/projects').send(newProject('Written on one'));
  expect(created.status).toBe(201);
  const writer = servedBy[servedBy.length - 1];
  const read = await agent.get(`/api/projects/${created.body.project.id}`);
  expect(servedBy[servedBy.length - 1]).not.toBe(writer);
  expect([read.status, read.body.project.name]).toEqual([200, 'Written on one']);
});

it('lets exactly one of two simultaneous edits of the same version through when each instance takes one', async () => {
  const agent = request.agent(proxyUrl);
  await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
  const p = (await agent.post('/api/projects').send(newProject('Edited twice at once'))).body.project;
  const cookie = (await signIn(instances[0].url, EMAIL.installer, PASSWORD)).headers['set-cookie'];
  const edit = (i: number, name: string) =>
    request(`http://127.0.0.1:${instances[i].port}`)
      .patch(`/api/projects/${p.id}`)
      .set('Cookie', cookie)
      .send({ version: p.version, name });
  const [one, two] = await Promise.all([edit(0, 'Edit through the first'), edit(1, 'Edit through the second')]);
  expect([one.status, two.status].sort()).toEqual([200, 409]);
  const [won, lost] = one.status === 200 ? [one, two] : [two, one];
  expect(lost.body.current).toMatchObject({ name: won.body.project.name, version: won.body.project.version });
});

it('counts sign-in attempts across both instances: of 40 wrong passwords at once, split between them, at most 5 are checked', async () => {
  const attempts = Array.from({ length: 40 }, (_, i) => signIn(`http://127.0.0.1:${instances[i % 2].port}`, EMAIL.reviewer, `wrong-${i}`));
  const all = await Promise.all(attempts);
  const checked = all.filter((r) => r.status === 401).length;
  expect(checked).toBeGreaterThan(0);
  expect(checked).toBeLessThanOrEqual(5);
  expect(all.filter((r) => r.status === 429).length).toBe(40 - checked);
});
