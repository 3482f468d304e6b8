/**
 * Uploads with the bytes in S3 (configured by the environment, as an operator would) against
 * s3rver on a port the OS picks; and a failed upload, whichever step fails, leaves neither an
 * object nor a row.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { FILE_LIMITS, FILE_MESSAGES } from '../../shared/schemas/files';
import { folderStorage, type FileStorage } from '../../server/modules/files/storage';
import { StoredFile } from '../../server/modules/files/stored-file.entity';
import { EMAIL, startHarness, type Harness } from './harness';
import { jpeg, png } from './upload-fixtures';
import { startFakeS3ForFile } from './fake-s3';

const BUCKET = 'sightfan-uploads';
const s3 = startFakeS3ForFile(BUCKET);

async function job(h: Harness) {
  const a = await h.signedIn(EMAIL.installer);
  const res = await a.post('/api/projects').send({ name: 'Uploads', scene: { walls: [], zones: [], viewers: [] } });
  return { a, id: res.body.project.id as number };
}

describe('with S3_BUCKET set', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness({
      env: {
        S3_BUCKET: BUCKET,
        S3_ENDPOINT: s3.endpoint,
        S3_PREFIX: 'jobs/',
        S3_ACCESS_KEY_ID: 'S3RVER',
        S3_SECRET_ACCESS_KEY: 'S3RVER',
      },
    });
  });
  afterAll(async () => h?.close());

  const objects = async () => {
    const client = new S3Client({
      endpoint: s3.endpoint,
      region: 'us-east-1',
      forcePathStyle: true,
      credentials: { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' },
    });
    const out = await client.send(new ListObjectsV2Command({ Bucket: BUCKET }));
    client.destroy();
    return (out.Contents ?? []).map((o) => o.Key!);
  };

  it('keeps the file and its thumbnail in the bucket under the prefix, serves them, and removes them with the job', async () => {
    expect(h.config.storage).toMatchObject({ kind: 's3', bucket: BUCKET, prefix: 'jobs/', forcePathStyle: true });
    const { a, id } = await job(h);
    const up = await a
      .post(`/api/projects/${id}/files`)
      .field('kind', 'plan')
      .attach('file', await png(300, 200), 'plan.png');
    expect(up.status).toBe(201);
    const keys = await objects();
    expect(keys).toHaveLength(2);
    for (const k of keys) expect(k).toMatch(/^jobs\/[0-9a-f]{2}\/[0-9a-f]{30}$/);
    const got = await a.get(up.body.file.url).buffer(true);
    expect(got.status).toBe(200);
    expect((await sharp(got.body).metadata()).width).toBe(300);
    expect((await a.get(up.body.file.thumbnailUrl)).status).toBe(200);
    expect(fs.existsSync(path.join(h.dir, 'uploads'))).toBe(false);
    expect((await a.delete(`/api/projects/${id}`)).status).toBe(204);
    expect(await objects()).toEqual([]);
  });
});

describe('a failed upload', () => {
  let h: Harness;
  let failOn: 'none' | 'thumbnail' | 'fill-the-job' = 'none';
  const root = () => path.join(s3.dir, 'failing');
  const onDisk = () => (fs.existsSync(root()) ? fs.readdirSync(root(), { recursive: true }).filter((f) => String(f).length > 3) : []);
  beforeAll(async () => {
    const real = folderStorage(root());
    let puts = 0;
    // The real folder, with a fault or a rival's upload slipped in at the second write.
    const storage: FileStorage = {
      ...real,
      async put(key, data, type) {
        puts++;
        if (puts % 2 === 0 && failOn === 'thumbnail') throw new Error('disk full');
        await real.put(key, data, type);
        if (puts % 2 === 0 && failOn === 'fill-the-job') {
          const em = h.orm.em.fork();
          em.create(StoredFile, {
            id: `rivalrivalrivalrival${puts}`,
            project: currentJob,
            kind: 'plan',
            contentType: 'image/png',
            bytes: FILE_LIMITS.jobBytes,
            name: 'rival.png',
            widthPx: 1,
            heightPx: 1,
            storageKey: '00/000000000000000000000000000000',
            thumbnailKey: '00/000000000000000000000000000000',
          });
          await em.flush();
        }
      },
    };
    h = await startHarness({ storage });
  });
  afterAll(async () => h?.close());
  let currentJob = 0;

  it('when the storage fails on the second object, removes the first and keeps no row', async () => {
    const { a, id } = await job(h);
    currentJob = id;
    failOn = 'thumbnail';
    const res = await a
      .post(`/api/projects/${id}/files`)
      .field('kind', 'photo')
      .attach('file', await jpeg(64, 64), 'a.jpg');
    expect(res.status).toBe(500);
    expect(onDisk()).toEqual([]);
    expect(await h.orm.em.fork().count(StoredFile, { project: id })).toBe(0);
  });

  it('when the row is refused after both objects are written (the job filled meanwhile), removes both', async () => {
    const { a, id } = await job(h);
    currentJob = id;
    failOn = 'fill-the-job';
    const res = await a
      .post(`/api/projects/${id}/files`)
      .field('kind', 'photo')
      .attach('file', await jpeg(64, 64), 'a.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error).toBe(FILE_MESSAGES.jobFull);
    expect(onDisk()).toEqual([]);
    // Only the rival's row.
    expect(await h.orm.em.fork().count(StoredFile, { project: id })).toBe(1);
  });
});
