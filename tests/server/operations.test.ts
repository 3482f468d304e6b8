/**
 * What an operator relies on: health and readiness, request ids in structured logs with no secrets,
 * a stop that lets requests in flight finish, and a backup taken while writing that restores whole.
 */
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '../../server/app';
import { parseConfig } from '../../server/config';
import { createLogger } from '../../server/logger';
import { startServer } from '../../server/main';
import { backupDatabase, restoreDatabase } from '../../server/ops/backup';
import { initORM } from '../../server/db';
import type { SessionData } from 'express-session';
import { Project } from '../../server/modules/projects/project.entity';
import { OrmSessionStore, TOUCH_GRANULARITY_MS } from '../../server/modules/sessions/orm-session-store';
import { SessionRecord } from '../../server/modules/sessions/session.entity';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

describe('health and readiness', () => {
  it('answers /api/health without touching the database and /api/ready after checking it', async () => {
    expect((await request(h.app).get('/api/health')).body).toEqual({ ok: true });
    const ready = await request(h.app).get('/api/ready');
    expect(ready.status).toBe(200);
    expect(ready.body).toEqual({ ready: true });
  });

  it('says it is not ready once draining, while health still answers', async () => {
    const built = createApp({
      config: h.config,
      orm: h.orm,
      mailer: h.mailer,
      log: createLogger(true),
      sessionSecret: 'test-secret-that-is-long-enough-for-the-config-check',
    });
    built.drain();
    const ready = await request(built.app).get('/api/ready');
    expect(ready.status).toBe(503);
    expect(ready.body.error).toMatch(/shutting down/);
    expect((await request(built.app).get('/api/health')).status).toBe(200);
    built.close();
  });
});

describe('request ids and structured logs', () => {
  it('gives every answer an X-Request-Id, keeping a well-formed one from the proxy and replacing a malformed one', async () => {
    const fresh = await request(h.app).get('/api/health');
    expect(fresh.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    const kept = await request(h.app).get('/api/health').set('X-Request-Id', 'proxy-abc-12345');
    expect(kept.headers['x-request-id']).toBe('proxy-abc-12345');
    const replaced = await request(h.app).get('/api/health').set('X-Request-Id', 'a b <script>');
    expect(replaced.headers['x-request-id']).not.toBe('a b <script>');
  });

  it('writes one JSON line per request with its id, route and status, and never a password, cookie or hash', async () => {
    const lines: string[] = [];
    const prev = process.env.LOG_LEVEL;
    process.env.LOG_LEVEL = 'info';
    const log = createLogger(false, { write: (l: string) => void lines.push(l) });
    process.env.LOG_LEVEL = prev;
    const built = createApp({
      config: h.config,
      orm: h.orm,
      mailer: h.mailer,
      log,
      sessionSecret: 'test-secret-that-is-long-enough-for-the-config-check',
    });
    const agent = request.agent(built.app);
    const secret = 'not-the-password-but-secret-9Xq';
    const wrong = await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: secret });
    expect(wrong.status).toBe(401);
    const ok = await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
    expect(ok.status).toBe(200);
    const list = await agent.get('/api/projects');
    expect(list.status).toBe(200);
    const sheet = await agent.get('/api/projects/987654/sheet/revisions-unknown');
    built.close();

    const records = lines.map(
      (l) => JSON.parse(l) as { level: string; reqId?: string; req?: { method: string; path: string }; res?: { status: number } },
    );
    const forList = records.find((r) => r.reqId === list.headers['x-request-id']);
    expect(forList).toMatchObject({ level: 'info', req: { method: 'GET', path: '/api/projects' }, res: { status: 200 } });
    expect(records.find((r) => r.reqId === wrong.headers['x-request-id'])).toMatchObject({ level: 'warn', res: { status: 401 } });
    const sheetPath = records.find((r) => r.reqId === sheet.headers['x-request-id'])?.req?.path;
    expect(sheetPath).toMatch(/^\/api\/projects\//);
    const all = lines.join('\n');
    expect(all).not.toContain(secret);
    expect(all).not.toContain(PASSWORD);
    expect(all).not.toMatch(/sightfan\.sid|\$2[aby]\$/);
  });
});

describe('a stop that finishes what it started', () => {
  it('answers a request whose body is still arriving when the stop begins, then refuses new connections', async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-stop-'));
    const config = parseConfig({
      NODE_ENV: 'test',
      PORT: '0',
      HOST: '127.0.0.1',
      FAKE_SMTP_PORT: '0',
      DATABASE_PATH: path.join(dir, 's.sqlite'),
    });
    const server = await startServer(config, createLogger(true));
    const body = JSON.stringify({ email: EMAIL.installer, password: PASSWORD });
    const answer = new Promise<{ status: number; text: string }>((resolve, reject) => {
      const req = http.request(
        {
          host: '127.0.0.1',
          port: server.port,
          method: 'POST',
          path: '/api/auth/sign-in',
          headers: { 'Content-Type': 'application/json', 'Content-Length': Buffer.byteLength(body) },
        },
        (res) => {
          let text = '';
          res.on('data', (c) => (text += c));
          res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
        },
      );
      req.on('error', reject);
      req.write(body.slice(0, 10));
      setTimeout(() => req.end(body.slice(10)), 300);
    });
    await new Promise((r) => setTimeout(r, 100));
    const stopping = server.stop();
    const res = await answer;
    expect(res.status).toBe(200);
    expect(JSON.parse(res.text).user.email).toBe(EMAIL.installer);
    await stopping;
    await expect(fetch(`http://127.0.0.1:${server.port}/api/health`)).rejects.toThrow();
    fs.rmSync(dir, { recursive: true, force: true });
  });
});

describe('backup and restore', () => {
  it('takes a consistent copy while projects are being written, and restores it whole on a fresh machine', async () => {
    const installer = await h.signedIn(EMAIL.installer);
    const writes: Promise<unknown>[] = [];
    for (let i = 0; i < 20; i++) writes.push(installer.post('/api/projects').send({ name: `Backup load ${i} (demo)` }));
    const backupDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-backup-'));
    const { dir, manifest } = await backupDatabase(h.config.databasePath, backupDir);
    await Promise.all(writes);
    expect(manifest.rows.project).toBeGreaterThan(0);
    expect(manifest.migrations.length).toBeGreaterThan(0);

    const freshMachine = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-restore-'));
    const target = path.join(freshMachine, 'data', 'sightfan.sqlite');
    await restoreDatabase(dir, target);
    const orm = await initORM(target);
    try {
      expect(await orm.em.fork().count(Project, {})).toBe(manifest.rows.project);
    } finally {
      await orm.close(true);
    }
    await expect(restoreDatabase(dir, target)).rejects.toThrow(/already exists/);
    fs.rmSync(backupDir, { recursive: true, force: true });
    fs.rmSync(freshMachine, { recursive: true, force: true });
  });

  it('refuses a backup whose database does not match its manifest', async () => {
    const backupDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-backup-'));
    const { dir } = await backupDatabase(h.config.databasePath, backupDir);
    const manifestPath = path.join(dir, 'manifest.json');
    const m = JSON.parse(fs.readFileSync(manifestPath, 'utf8'));
    m.rows.project += 1;
    fs.writeFileSync(manifestPath, JSON.stringify(m));
    const target = path.join(backupDir, 'restored.sqlite');
    await expect(restoreDatabase(dir, target)).rejects.toThrow(/manifest says/);
    expect(fs.existsSync(target)).toBe(false);
    fs.rmSync(backupDir, { recursive: true, force: true });
  });
});

describe('signed-in reads do not write the session row', () => {
  const rowExpiry = async (): Promise<number[]> =>
    (await h.orm.em.fork().find(SessionRecord, {}, { orderBy: { sid: 'asc' } })).map((r) => r.expiresAt.getTime());

  it('leaves the stored expiry alone across many GETs within the hour, and the session still works', async () => {
    const agent = await h.signedIn(EMAIL.reviewer);
    const before = await rowExpiry();
    for (let i = 0; i < 20; i++) expect((await agent.get('/api/projects')).status).toBe(200);
    expect(await rowExpiry()).toEqual(before);
  });

  it('moves the stored expiry once it would move by more than the granularity, and not before', async () => {
    const store = new OrmSessionStore(h.orm);
    const start = Date.now() + 14 * 24 * 3600_000;
    const sess = (expires: number) => ({ cookie: { expires: new Date(expires), originalMaxAge: 0 } }) as unknown as SessionData;
    await new Promise<void>((r, j) => store.set('touch-test', sess(start), (e) => (e ? j(e) : r())));
    const stored = async () => (await h.orm.em.fork().findOneOrFail(SessionRecord, { sid: 'touch-test' })).expiresAt.getTime();
    await new Promise<void>((r) => store.touch('touch-test', sess(start + TOUCH_GRANULARITY_MS - 1000), () => r()));
    expect(await stored()).toBe(start);
    await new Promise<void>((r) => store.touch('touch-test', sess(start + TOUCH_GRANULARITY_MS + 1000), () => r()));
    expect(await stored()).toBe(start + TOUCH_GRANULARITY_MS + 1000);
    store.close();
  });
});
