/**
 * Uploads sent at the same moment cannot take a job past its caps (file count, bytes): the check
 * and the insert are one step. Five uploads race at one short of a cap, through one app (supertest;
 * SQLite, or PostgreSQL with SIGHTFAN_TEST_DATABASE=postgresql) and through two app instances on
 * one PostgreSQL with the bytes in S3 (s3rver), as an operator runs several. Exactly one is kept;
 * the others get 413 with the cap's sentence and leave no object behind.
 */
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { FILE_LIMITS, FILE_MESSAGES } from '../../shared/schemas/files';
import { parseConfig } from '../../server/config';
import { openORM, type Orm } from '../../server/db';
import { createLogger } from '../../server/logger';
import { startServer, type RunningServer } from '../../server/main';
import { StoredFile } from '../../server/modules/files/stored-file.entity';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';
import { startFakeS3ForFile } from './fake-s3';
import { startPostgres, type PostgresCluster } from './postgres-cluster';
import { jpeg } from './upload-fixtures';

/** How many uploads race (the brief's "say 5 at once"). */
const AT_ONCE = 5;
const BUCKET = 'sightfan-races';
const s3 = startFakeS3ForFile(BUCKET);

type Send = (i: number, data: Buffer) => request.Test;

/** Rows alone (no objects: only their count and bytes matter) filling `job` to `count` files of `bytesEach`. */
async function fill(orm: Orm, job: number, count: number, bytesEach: number): Promise<void> {
  const em = orm.em.fork();
  for (let i = 0; i < count; i++)
    em.create(StoredFile, {
      id: `racefiller${job}x${String(i).padStart(4, '0')}`,
      project: job,
      kind: 'photo',
      contentType: 'image/jpeg',
      bytes: bytesEach,
      name: 'filler.jpg',
      widthPx: 1,
      heightPx: 1,
      storageKey: '00/000000000000000000000000000000',
      thumbnailKey: '00/000000000000000000000000000000',
    });
  await em.flush();
}

/** The storage keys of the uploads the job kept (the fillers' shared dummy key left out). */
async function keptKeys(orm: Orm, job: number): Promise<string[]> {
  const rows = await orm.em.fork().find(StoredFile, { project: job, name: { $ne: 'filler.jpg' } });
  return rows.flatMap((f) => [f.storageKey, f.thumbnailKey]).sort();
}

async function race(send: Send, data: Buffer): Promise<{ statuses: number[]; errors: string[] }> {
  const all = await Promise.all(Array.from({ length: AT_ONCE }, (_, i) => send(i, data)));
  return { statuses: all.map((r) => r.status).sort(), errors: all.filter((r) => r.status !== 201).map((r) => r.body.error) };
}

const oneKept = [201, ...Array<number>(AT_ONCE - 1).fill(413)];

/** The two races, run against whichever app(s) and storage the describe sets up. */
function racesOn(
  setup: () => { orm: Orm; newJob: (name: string) => Promise<number>; send: (job: number) => Send; stored: () => Promise<string[]> },
) {
  it(`keeps exactly one of ${AT_ONCE} uploads sent at once at one file short of the job's count, refusing the rest with 413`, async () => {
    const { orm, newJob, send, stored } = setup();
    const job = await newJob('Count race');
    await fill(orm, job, FILE_LIMITS.filesPerJob - 1, 10);
    const before = await stored();
    const { statuses, errors } = await race(send(job), await jpeg(48, 48));
    expect(statuses).toEqual(oneKept);
    expect(errors).toEqual(Array(AT_ONCE - 1).fill(FILE_MESSAGES.tooMany));
    expect(await orm.em.fork().count(StoredFile, { project: job })).toBe(FILE_LIMITS.filesPerJob);
    // The storage holds the kept file and its thumbnail, nothing of the refused ones.
    const kept = await keptKeys(orm, job);
    expect(kept).toHaveLength(2);
    expect((await stored()).filter((k) => !before.includes(k)).sort()).toEqual(kept);
  });

  it(`keeps exactly one of ${AT_ONCE} uploads sent at once when the job's bytes have room for one, refusing the rest with 413`, async () => {
    const { orm, newJob, send, stored } = setup();
    const data = await jpeg(48, 48);
    // The stored size of this photo, from a first upload to a job of its own.
    const probeJob = await newJob('Bytes probe');
    const probe = await send(probeJob)(0, data);
    expect(probe.status).toBe(201);
    const size: number = probe.body.file.bytes;
    const job = await newJob('Bytes race');
    // Room for one and a half: one fits, a second would not.
    await fill(orm, job, 1, FILE_LIMITS.jobBytes - size - Math.floor(size / 2));
    const before = await stored();
    const { statuses, errors } = await race(send(job), data);
    expect(statuses).toEqual(oneKept);
    expect(errors).toEqual(Array(AT_ONCE - 1).fill(FILE_MESSAGES.jobFull));
    expect(await orm.em.fork().count(StoredFile, { project: job })).toBe(2);
    const kept = await keptKeys(orm, job);
    expect((await stored()).filter((k) => !before.includes(k)).sort()).toEqual(kept);
  });
}

describe('through one app', () => {
  let h: Harness;
  let agents: ReturnType<typeof request.agent>[] = [];
  beforeAll(async () => {
    h = await startHarness();
    agents = await Promise.all(Array.from({ length: AT_ONCE }, () => h.signedIn(EMAIL.installer)));
  });
  afterAll(async () => h?.close());

  /** Every object in the harness's storage folder, as a key (`3f/9a0c…`). */
  const stored = async () => {
    const root = h.config.storage.kind === 'folder' ? h.config.storage.dir : '';
    if (!fs.existsSync(root)) return [];
    return fs
      .readdirSync(root, { recursive: true, withFileTypes: true })
      .filter((d) => d.isFile())
      .map((d) => path.relative(root, path.join(d.parentPath, d.name)));
  };

  racesOn(() => ({
    orm: h.orm,
    stored,
    newJob: async (name) =>
      (await agents[0].post('/api/projects').send({ name, scene: { walls: [], zones: [], viewers: [] } })).body.project.id,
    send: (job) => (i, data) => agents[i].post(`/api/projects/${job}/files`).field('kind', 'photo').attach('file', data, 'race.jpg'),
  }));
});

describe('through two app instances on one PostgreSQL, the bytes in S3', () => {
  let pg: PostgresCluster;
  let orm: Orm;
  const instances: RunningServer[] = [];
  let cookie: string[] = [];
  beforeAll(async () => {
    pg = await startPostgres();
    pg.createDatabase('races');
    const config = parseConfig({
      NODE_ENV: 'test',
      PORT: '0',
      HOST: '127.0.0.1',
      DATABASE_URL: pg.url('races'),
      SESSION_SECRET: 'upload-races-share-this-secret-of-enough-length',
      FAKE_SMTP_PORT: '0',
      DEMO_MODE: 'true',
      SHEET_WORKERS: '1',
      PUBLIC_URL: 'http://sightfan.test',
      S3_BUCKET: BUCKET,
      S3_ENDPOINT: s3.endpoint,
      S3_ACCESS_KEY_ID: 'S3RVER',
      S3_SECRET_ACCESS_KEY: 'S3RVER',
    });
    instances.push(...(await Promise.all([startServer(config, createLogger(true)), startServer(config, createLogger(true))])));
    orm = await openORM({ kind: 'postgresql', url: pg.url('races') });
    const signIn = await request(instances[0].url).post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
    cookie = signIn.headers['set-cookie'] as unknown as string[];
  }, 120_000);
  afterAll(async () => {
    await orm?.close();
    await Promise.all(instances.map((s) => s.stop()));
    pg?.stop();
  });

  const stored = async () => {
    const client = new S3Client({
      endpoint: s3.endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    const out = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
    client.destroy();
    // The default S3_PREFIX comes before each storage key.
    return (out.Contents ?? []).map((o) => o.Key!.replace(/^sightfan\//, ''));
  };

  racesOn(() => ({
    orm,
    stored,
    newJob: async (name) =>
      (
        await request(instances[0].url)
          .post('/api/projects')
          .set('Cookie', cookie)
          .send({ name, scene: { walls: [], zones: [], viewers: [] } })
      ).body.project.id,
    // Every other upload to the other instance.
    send: (job) => (i, data) =>
      request(instances[i % 2].url)
        .post(`/api/projects/${job}/files`)
        .set('Cookie', cookie)
        .field('kind', 'photo')
        .attach('file', data, 'race.jpg'),
  }));
});
