/**
 * Uploads over real HTTP (supertest), a real SQLite file and the real storage folder, with bytes
 * made by sharp and pdfkit. Each refusal is checked for its status and sentence and for leaving
 * nothing behind: no row, no object.
 */
import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { fromBuffer } from 'file-type';
import request from 'supertest';
import { FILE_LIMITS, FILE_MESSAGES, fileDto } from '../../shared/schemas/files';
import { StoredFile } from '../../server/modules/files/stored-file.entity';
import { crossingMirror, EMAIL, startHarness, type Harness } from './harness';
import { elf, jpeg, mz, pdf, png, pngClaiming, svgWithScript, zipAndHtmlTail } from './upload-fixtures';

let h: Harness;
const OTHER_INSTALLER = 'other.installer@sightfan-demo.example';
const OUTSIDE_INSTALLER = 'outside.installer@elsewhere-demo.example';
beforeAll(async () => {
  h = await startHarness();
  await h.addUser(OTHER_INSTALLER, 'installer');
  await h.addUser(OUTSIDE_INSTALLER, 'installer', 'Elsewhere Depots (demo)');
});
afterAll(async () => h?.close());

type Agent = ReturnType<typeof request.agent>;
const agents = new Map<string, Agent>();
async function as(email: string): Promise<Agent> {
  if (!agents.has(email)) agents.set(email, await h.signedIn(email));
  return agents.get(email)!;
}
const owner = () => as(EMAIL.installer);

const scene = {
  walls: [{ id: 'w1', kind: 'racking', aM: [0, 0], bM: [10, 0], heightM: 6 }],
  zones: [],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 8], eyeHeightM: 2.1 }],
};
async function newJob(name: string): Promise<number> {
  const res = await (await owner()).post('/api/projects').send({ name, customer: 'Demo customer', site: 'Demo site', scene });
  expect(res.status).toBe(201);
  return res.body.project.id;
}
async function newMirror(projectId: number): Promise<number> {
  const a = await owner();
  const catalogueItemId = (await a.get('/api/catalogue')).body.items[0].id;
  const res = await a.post(`/api/projects/${projectId}/placements`).send(crossingMirror(catalogueItemId));
  expect(res.status).toBe(201);
  return res.body.placement.id;
}

function send(agent: Agent, projectId: number, data: Buffer, name: string, fields: Record<string, string | number> = { kind: 'photo' }) {
  let req = agent.post(`/api/projects/${projectId}/files`);
  for (const [k, v] of Object.entries(fields)) req = req.field(k, String(v));
  return req.attach('file', data, { filename: name, contentType: 'application/octet-stream' });
}

/** Every object in the storage folder (the harness keeps uploads beside its SQLite file). */
function objectsOnDisk(): string[] {
  const root = h.config.storage.kind === 'folder' ? h.config.storage.dir : '';
  if (!fs.existsSync(root)) return [];
  return fs
    .readdirSync(root, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name));
}
const rowsOf = (projectId: number) => h.orm.em.fork().count(StoredFile, { project: projectId });

describe('each allowed type uploads and round-trips', () => {
  it('keeps a PNG plan as a PNG of the same size, served with its type, name, nosniff and a private cache', async () => {
    const job = await newJob('PNG plan');
    const a = await owner();
    const res = await send(a, job, await png(800, 500), 'ground floor.png', { kind: 'plan' });
    expect(res.status).toBe(201);
    const file = fileDto.parse(res.body.file);
    expect(file).toMatchObject({
      kind: 'plan',
      contentType: 'image/png',
      widthPx: 800,
      heightPx: 500,
      name: 'ground floor.png',
      placementId: null,
    });
    const got = await a.get(file.url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(got.headers['cache-control']).toMatch(/^private/);
    expect(got.headers['content-disposition']).toBe(`inline; filename="ground floor.png"; filename*=UTF-8''ground%20floor.png`);
    expect(got.body.length).toBe(file.bytes);
    expect((await fromBuffer(got.body))?.mime).toBe('image/png');
    const meta = await sharp(got.body).metadata();
    expect([meta.width, meta.height]).toEqual([800, 500]);
  });

  it('keeps a JPEG photo as a JPEG and makes a JPEG thumbnail no longer than the thumbnail side', async () => {
    const job = await newJob('JPEG photo');
    const a = await owner();
    const res = await send(a, job, await jpeg(1200, 900), 'IMG_0001.jpg');
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ contentType: 'image/jpeg', widthPx: 1200, heightPx: 900 });
    const thumb = await a.get(res.body.file.thumbnailUrl).buffer(true);
    expect(thumb.status).toBe(200);
    expect(thumb.headers['content-type']).toBe('image/jpeg');
    expect(thumb.headers['content-disposition']).toContain('IMG_0001-thumbnail.jpg');
    const meta = await sharp(thumb.body).metadata();
    expect(meta.format).toBe('jpeg');
    expect(Math.max(meta.width!, meta.height!)).toBe(FILE_LIMITS.thumbnailSidePx);
  });

  it('brings a photo larger than the stored side down to it, keeping its proportions', async () => {
    const job = await newJob('Big photo');
    const res = await send(await owner(), job, await jpeg(5000, 2500), 'wide.jpg');
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ widthPx: FILE_LIMITS.storedSidePx, heightPx: FILE_LIMITS.storedSidePx / 2 });
  });

  it('draws a PDF plan’s first page, or the page asked for, and keeps it as a PNG with the page and page count', async () => {
    const job = await newJob('PDF plan');
    const a = await owner();
    // Page 1 portrait A4, page 2 landscape A3 (ISO 216 sizes in points, docs/sources.md *Uploaded files*).
    const doc = await pdf(3, [
      [595.28, 841.89],
      [1190.55, 841.89],
    ]);
    const first = await send(a, job, doc, 'site plan.pdf', { kind: 'plan' });
    expect(first.status).toBe(201);
    expect(first.body.file).toMatchObject({ contentType: 'image/png', sourcePage: 1, sourcePages: 3 });
    expect(first.body.file.heightPx).toBeGreaterThan(first.body.file.widthPx);
    const second = await send(a, job, doc, 'site plan.pdf', { kind: 'plan', page: 2 });
    expect(second.status).toBe(201);
    expect(second.body.file).toMatchObject({ sourcePage: 2, sourcePages: 3 });
    expect(second.body.file.widthPx).toBeGreaterThan(second.body.file.heightPx);
    const got = await a.get(second.body.file.url).buffer(true);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['content-disposition']).toContain('site plan-page-2.png');
    expect((await fromBuffer(got.body))?.mime).toBe('image/png');
  });

  it('lists the job’s files oldest first, each matching the contract', async () => {
    const job = await newJob('Listed');
    const a = await owner();
    await send(a, job, await png(100, 100), 'a.png', { kind: 'plan' });
    await send(a, job, await jpeg(100, 100), 'b.jpg');
    const res = await a.get(`/api/projects/${job}/files`);
    expect(res.status).toBe(200);
    expect(res.body.files.map((f: unknown) => fileDto.parse(f).name)).toEqual(['a.png', 'b.jpg']);
  });
});

describe('what an upload keeps of the original', () => {
  it('drops EXIF, location included', async () => {
    const job = await newJob('GPS');
    const a = await owner();
    const withGps = await jpeg(64, 48, {
      IFD0: { Copyright: 'Demo' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '51/1 30/1 0/1', GPSLongitudeRef: 'W', GPSLongitude: '0/1 7/1 0/1' },
    });
    const before = (await sharp(withGps).metadata()).exif;
    // The fixture really carries a GPS block: its pointer tag 0x8825 is in the EXIF data (docs/sources.md, *Uploaded files*).
    expect(before && (before.includes(Buffer.from([0x88, 0x25])) || before.includes(Buffer.from([0x25, 0x88])))).toBe(true);
    const res = await send(a, job, withGps, 'gps.jpg');
    expect(res.status).toBe(201);
    const stored = (await a.get(res.body.file.url).buffer(true)).body as Buffer;
    expect((await sharp(stored).metadata()).exif).toBeUndefined();
    expect(stored.includes(Buffer.from('Exif\0'))).toBe(false);
  });

  it('turns a photo upright from its EXIF orientation (6: a quarter turn clockwise, docs/sources.md *Uploaded files*)', async () => {
    const job = await newJob('Orientation');
    const sideways = await sharp(await jpeg(80, 40))
      .withMetadata({ orientation: 6 })
      .toBuffer();
    const res = await send(await owner(), job, sideways, 'portrait.jpg');
    expect(res.status).toBe(201);
    expect(res.body.file).toMatchObject({ widthPx: 40, heightPx: 80 });
  });

  it('keeps a JPEG with a zip and an HTML page after it as a clean JPEG with nothing after its end', async () => {
    const job = await newJob('Polyglot');
    const a = await owner();
    const polyglot = Buffer.concat([await jpeg(64, 64), zipAndHtmlTail()]);
    const res = await send(a, job, polyglot, 'innocent.jpg');
    expect(res.status).toBe(201);
    const stored = (await a.get(res.body.file.url).buffer(true)).body as Buffer;
    expect(stored.includes(Buffer.from('<script'))).toBe(false);
    expect(stored.includes(Buffer.from([0x50, 0x4b, 0x03, 0x04]))).toBe(false);
    // A JPEG ends with its EOI marker, FF D9 (docs/sources.md, *Uploaded files*).
    expect([...stored.subarray(-2)]).toEqual([0xff, 0xd9]);
  });
});

describe('refused uploads leave nothing behind', () => {
  let job: number;
  let objects: number;
  beforeAll(async () => {
    job = await newJob('Refusals');
  });
  beforeEach(() => {
    objects = objectsOnDisk().length;
  });
  afterEach(async () => {
    expect(await rowsOf(job)).toBe(0);
    expect(objectsOnDisk().length).toBe(objects);
  });

  const cases: [string, () => Promise<Buffer> | Buffer, string, Record<string, string | number>, number, string][] = [
    ['a Linux executable named .png', elf, 'plan.png', { kind: 'plan' }, 415, FILE_MESSAGES.wrongType],
    ['a Windows executable named .jpg', mz, 'photo.jpg', { kind: 'photo' }, 415, FILE_MESSAGES.wrongType],
    ['an SVG with a script', svgWithScript, 'plan.svg', { kind: 'plan' }, 415, FILE_MESSAGES.wrongType],
    [
      'an HTML page with a JPEG after it',
      async () => Buffer.concat([zipAndHtmlTail().subarray(22), await jpeg(16, 16)]),
      'x.jpg',
      { kind: 'photo' },
      415,
      FILE_MESSAGES.wrongType,
    ],
    // Found by the property test: the sniffer ran off the end of it (a 500 before).
    [
      'a bare PNG signature',
      () => Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      'sig.png',
      { kind: 'plan' },
      422,
      FILE_MESSAGES.unreadable,
    ],
    ['a zero-byte file', () => Buffer.alloc(0), 'empty.jpg', { kind: 'photo' }, 400, FILE_MESSAGES.empty],
    [
      'a JPEG cut short',
      async () => (await jpeg(400, 300)).subarray(0, 20_000),
      'cut.jpg',
      { kind: 'photo' },
      422,
      FILE_MESSAGES.unreadable,
    ],
    [
      'a PNG whose header claims 20 000 × 20 000 pixels',
      () => pngClaiming(20_000, 20_000),
      'bomb.png',
      { kind: 'plan' },
      413,
      FILE_MESSAGES.tooManyPixels,
    ],
    ['a PDF as a photo', () => pdf(1), 'photo.pdf', { kind: 'photo' }, 415, FILE_MESSAGES.pdfPhoto],
    [
      'a PDF page of 200 in × 200 in (the largest PDF allows)',
      () => pdf(1, [[14_400, 14_400]]),
      'huge.pdf',
      { kind: 'plan' },
      413,
      FILE_MESSAGES.pdfPageSize,
    ],
    ['a PDF of more pages than the limit', () => pdf(FILE_LIMITS.pdfPages + 1), 'many.pdf', { kind: 'plan' }, 413, FILE_MESSAGES.pdfPages],
    [
      'a damaged PDF',
      async () => Buffer.concat([Buffer.from('%PDF-1.7\n'), Buffer.alloc(500, 0x41)]),
      'bad.pdf',
      { kind: 'plan' },
      422,
      FILE_MESSAGES.unreadable,
    ],
  ];
  it.each(cases)('refuses %s', async (_what, make, name, fields, status, sentence) => {
    const res = await send(await owner(), job, await make(), name, fields);
    expect(res.status).toBe(status);
    expect(res.body.error).toBe(sentence);
    expect(res.body.fields.file).toBe(sentence);
  });

  it('refuses a file over the size limit with 413 and its sentence', async () => {
    const res = await send(await owner(), job, Buffer.alloc(FILE_LIMITS.fileBytes + 1, 0xff), 'big.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error).toBe(FILE_MESSAGES.tooLarge);
  });

  it('refuses a page the PDF does not have, saying how many it has', async () => {
    const res = await send(await owner(), job, await pdf(2), 'two.pdf', { kind: 'plan', page: 3 });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe(`${FILE_MESSAGES.pdfPageMissing} It has 2 pages.`);
  });

  it('refuses an upload with no file, a missing kind, a plan sent with a mirror, or another job’s mirror', async () => {
    const a = await owner();
    const none = await a.post(`/api/projects/${job}/files`).field('kind', 'photo');
    expect(none.status).toBe(400);
    expect(none.body.error).toBe(FILE_MESSAGES.noFile);
    const noKind = await send(a, job, await jpeg(16, 16), 'x.jpg', {});
    expect(noKind.status).toBe(400);
    expect(noKind.body.fields.kind).toBe('Say whether the file is a plan or a photo.');
    const mirror = await newMirror(job);
    const planWithMirror = await send(a, job, await png(16, 16), 'p.png', { kind: 'plan', placementId: mirror });
    expect(planWithMirror.status).toBe(400);
    expect(planWithMirror.body.fields.placementId).toBe(FILE_MESSAGES.planNoMirror);
    const otherJob = await newJob('Another job');
    const otherMirror = await newMirror(otherJob);
    const wrongMirror = await send(a, job, await jpeg(16, 16), 'x.jpg', { kind: 'photo', placementId: otherMirror });
    expect(wrongMirror.status).toBe(400);
    expect(wrongMirror.body.fields.placementId).toBe('Choose a mirror of this job.');
  });

  it('refuses a multipart body that ends early, or a body that is not multipart, with 400 and a sentence', async () => {
    const a = await owner();
    const cut = await a
      .post(`/api/projects/${job}/files`)
      .set('Content-Type', 'multipart/form-data; boundary=XyZ')
      .send(
        '--XyZ\r\nContent-Disposition: form-data; name="kind"\r\n\r\nphoto\r\n--XyZ\r\nContent-Disposition: form-data; name="file"; filename="a.jpg"\r\n\r\n\xff\xd8\xff',
      );
    expect(cut.status).toBe(400);
    expect(cut.body.error).toBe('The upload was cut off before the whole file arrived. Try again.');
    const json = await a.post(`/api/projects/${job}/files`).send({ kind: 'photo' });
    expect(json.status).toBe(400);
    expect(json.body.error).toBe(FILE_MESSAGES.noFile);
  });

  it('takes a multipart upload sent by the app itself (same origin)', async () => {
    const res = await send(await owner(), job, await jpeg(16, 16), 'x.jpg')
      .set('Host', 'sightfan.test')
      .set('Origin', 'http://sightfan.test');
    expect(res.status).toBe(201);
    // Not a refusal: remove it so this block's "nothing behind" check holds.
    expect((await (await owner()).delete(`/api/files/${res.body.file.id}`)).status).toBe(204);
  });

  it('refuses a multipart request sent from another website', async () => {
    const res = await send(await owner(), job, await jpeg(16, 16), 'x.jpg').set('Origin', 'https://elsewhere.example');
    expect(res.status).toBe(403);
  });
});

describe('the job’s caps', () => {
  it('refuses the upload past the job’s file count with 413, and takes one again after a delete', async () => {
    const job = await newJob('Count cap');
    const a = await owner();
    const em = h.orm.em.fork();
    // Fill the job up to one short of the cap by rows alone (their objects are not needed to count).
    for (let i = 0; i < FILE_LIMITS.filesPerJob - 1; i++)
      em.create(StoredFile, {
        id: `fillerfillerfiller${String(i).padStart(4, '0')}`,
        project: job,
        kind: 'photo',
        contentType: 'image/jpeg',
        bytes: 10,
        name: 'filler.jpg',
        widthPx: 1,
        heightPx: 1,
        storageKey: '00/000000000000000000000000000000',
        thumbnailKey: '00/000000000000000000000000000000',
      });
    await em.flush();
    const last = await send(a, job, await jpeg(16, 16), 'last.jpg');
    expect(last.status).toBe(201);
    const objects = objectsOnDisk().length;
    const over = await send(a, job, await jpeg(16, 16), 'over.jpg');
    expect(over.status).toBe(413);
    expect(over.body.error).toBe(FILE_MESSAGES.tooMany);
    expect(objectsOnDisk().length).toBe(objects);
    expect((await a.delete(`/api/files/${last.body.file.id}`)).status).toBe(204);
    expect((await send(a, job, await jpeg(16, 16), 'again.jpg')).status).toBe(201);
  });

  it('refuses the upload that would take the job past its bytes with 413', async () => {
    const job = await newJob('Bytes cap');
    const em = h.orm.em.fork();
    em.create(StoredFile, {
      id: 'bigfillerbigfillerbig1',
      project: job,
      kind: 'plan',
      contentType: 'image/png',
      bytes: FILE_LIMITS.jobBytes - 100,
      name: 'big.png',
      widthPx: 1,
      heightPx: 1,
      storageKey: '00/000000000000000000000000000000',
      thumbnailKey: '00/000000000000000000000000000000',
    });
    await em.flush();
    const res = await send(await owner(), job, await jpeg(64, 64), 'one more.jpg');
    expect(res.status).toBe(413);
    expect(res.body.error).toBe(FILE_MESSAGES.jobFull);
    expect(await rowsOf(job)).toBe(1);
  });
});

describe('who may do what', () => {
  let job: number;
  let fileId: string;
  beforeAll(async () => {
    job = await newJob('Access matrix');
    fileId = (await send(await owner(), job, await jpeg(32, 32), 'a.jpg')).body.file.id;
  });

  const people: [
    string,
    () => Promise<Agent> | Agent,
    { upload: number; list: number; read: number; thumbnail: number; remove: number },
  ][] = [
    ['anonymous', () => request.agent(h.app), { upload: 401, list: 401, read: 401, thumbnail: 401, remove: 401 }],
    ['the owning installer', owner, { upload: 201, list: 200, read: 200, thumbnail: 200, remove: 204 }],
    [
      'another installer of the organisation',
      () => as(OTHER_INSTALLER),
      { upload: 404, list: 404, read: 404, thumbnail: 404, remove: 404 },
    ],
    [
      'an installer of another organisation',
      () => as(OUTSIDE_INSTALLER),
      { upload: 404, list: 404, read: 404, thumbnail: 404, remove: 404 },
    ],
    ['a reviewer', () => as(EMAIL.reviewer), { upload: 403, list: 200, read: 200, thumbnail: 200, remove: 403 }],
    ['an admin', () => as(EMAIL.admin), { upload: 403, list: 200, read: 200, thumbnail: 200, remove: 403 }],
  ];
  it.each(people)('gives %s the statuses of the job’s rules', async (_who, agentOf, want) => {
    const a = await agentOf();
    const rows = await rowsOf(job);
    const up = await send(a, job, await jpeg(16, 16), 'm.jpg');
    expect(up.status).toBe(want.upload);
    expect(await rowsOf(job)).toBe(rows + (up.status === 201 ? 1 : 0));
    expect((await a.get(`/api/projects/${job}/files`)).status).toBe(want.list);
    expect((await a.get(`/api/files/${fileId}`)).status).toBe(want.read);
    expect((await a.get(`/api/files/${fileId}/thumbnail`)).status).toBe(want.thumbnail);
    // Delete the file just uploaded when there is one, so the shared file stays for the others.
    const target = up.status === 201 ? up.body.file.id : fileId;
    expect((await a.delete(`/api/files/${target}`)).status).toBe(want.remove);
  });

  it('answers 404 for an id that does not exist or is malformed, with the file sentence', async () => {
    const a = await owner();
    for (const id of ['AAAAAAAAAAAAAAAAAAAAAAAA', '..%2F..%2Fetc', 'x']) {
      const res = await a.get(`/api/files/${id}`);
      expect(res.status).toBe(404);
      expect(res.body.error).toBe(FILE_MESSAGES.notFound);
    }
  });
});

describe('deleting', () => {
  it('removes a deleted file’s row and both objects', async () => {
    const job = await newJob('Delete one');
    const a = await owner();
    const before = objectsOnDisk().length;
    const id = (await send(a, job, await jpeg(32, 32), 'a.jpg')).body.file.id;
    expect(objectsOnDisk().length).toBe(before + 2);
    expect((await a.delete(`/api/files/${id}`)).status).toBe(204);
    expect(objectsOnDisk().length).toBe(before);
    expect((await a.get(`/api/files/${id}`)).status).toBe(404);
  });

  it('removes a mirror’s photos with the mirror, and a job’s files with the job', async () => {
    const job = await newJob('Delete job');
    const a = await owner();
    const before = objectsOnDisk().length;
    const mirror = await newMirror(job);
    const photo = (await send(a, job, await jpeg(32, 32), 'm.jpg', { kind: 'photo', placementId: mirror })).body.file;
    expect(photo.placementId).toBe(mirror);
    await send(a, job, await png(64, 64), 'plan.png', { kind: 'plan' });
    expect(objectsOnDisk().length).toBe(before + 4);
    expect((await a.delete(`/api/projects/${job}/placements/${mirror}`)).status).toBe(200);
    expect((await a.get(`/api/files/${photo.id}`)).status).toBe(404);
    expect(objectsOnDisk().length).toBe(before + 2);
    expect((await a.delete(`/api/projects/${job}`)).status).toBe(204);
    expect(await rowsOf(job)).toBe(0);
    expect(objectsOnDisk().length).toBe(before);
  });
});
