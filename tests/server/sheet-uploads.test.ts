/**
 * The sheet with uploads: the plan page draws the calibrated plan image under the plan at the
 * stated scale, faded; each mirror's page shows its newest photo beside its numbers. Read back
 * with poppler (pdftotext, pdfimages, pdftoppm) as a reader's tools would; the rendered pages are
 * written to tests/e2e/artifacts/sheet-uploads/ to look at.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type request from 'supertest';
import { crossingMirror, EMAIL, startHarness, type Harness } from './harness';
import { binary } from './pdf-tools';
import { jpeg } from './upload-fixtures';

type Agent = ReturnType<typeof request.agent>;
let h: Harness;
let a: Agent;
let tmp: string;
const ARTIFACTS = path.resolve(__dirname, '..', 'e2e', 'artifacts', 'sheet-uploads');
beforeAll(async () => {
  h = await startHarness();
  a = await h.signedIn(EMAIL.installer);
  tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-sheet-uploads-'));
  fs.mkdirSync(ARTIFACTS, { recursive: true });
});
afterAll(async () => {
  await h?.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

async function sheetOf(projectId: number): Promise<string> {
  const issued = await a.post(`/api/projects/${projectId}/sheet/revisions`);
  expect([200, 201]).toContain(issued.status);
  const res = await a.get(`/api/projects/${projectId}/sheet.pdf?revision=${issued.body.revision.number}`).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  const file = path.join(tmp, `job-${projectId}.pdf`);
  fs.writeFileSync(file, res.body as Buffer);
  return file;
}
const pageTexts = (file: string) => execFileSync('/usr/bin/pdftotext', [file, '-'], { encoding: 'utf8' }).split('\f');
const flat = (s: string) => s.replace(/\s+/g, ' ');

/** A 2000 × 1000 px demo plan: white, with a magenta block from (500, 250) to (1500, 750) px. */
async function demoPlanImage(): Promise<Buffer> {
  const block = await sharp({ create: { width: 1000, height: 500, channels: 3, background: '#ff00ff' } })
    .png()
    .toBuffer();
  return sharp({ create: { width: 2000, height: 1000, channels: 3, background: '#ffffff' } })
    .composite([{ input: block, left: 500, top: 250 }])
    .png()
    .toBuffer();
}

const room = (w: number, h: number) => [
  { id: 'w1', kind: 'wall', aM: [0, 0], bM: [w, 0], heightM: 3 },
  { id: 'w2', kind: 'wall', aM: [w, 0], bM: [w, h], heightM: 3 },
  { id: 'w3', kind: 'wall', aM: [w, h], bM: [0, h], heightM: 3 },
  { id: 'w4', kind: 'wall', aM: [0, h], bM: [0, 0], heightM: 3 },
];

// The image is calibrated at 20 m across its 2000 px width; its magenta block is 10 m × 5 m.
// Square: top-left at (0, 10) in a 20 m × 10 m room. Turned a quarter anticlockwise about its
// top-left at (0, 0): its width runs north, its height east, so the block is 5 m across, 10 m up.
it.each([
  ['square to the plan', room(20, 10), [0, 10], 0, 10, 5],
  ['turned a quarter', room(20, 20), [0, 0], Math.PI / 2, 5, 10],
] as const)(
  'draws the plan image %s under the plan at the stated scale: its block measures so at 1:N on paper, within 0.5 %%',
  async (_how, walls, originM, rotationRad, acrossM, upM) => {
    const created = await a.post('/api/projects').send({ name: 'Underlay scale (demo)', scene: { walls, zones: [], viewers: [] } });
    const job = created.body.project;
    const up = await a
      .post(`/api/projects/${job.id}/files`)
      .field('kind', 'plan')
      .attach('file', await demoPlanImage(), 'demo plan.png');
    expect(up.status).toBe(201);
    const underlay = {
      fileId: up.body.file.id,
      calibration: { aPx: [0, 0], bPx: [2000, 0], distanceM: 20 },
      originM,
      rotationRad,
      opacity: 0.5,
    };
    const patched = await a.patch(`/api/projects/${job.id}`).send({ version: job.version, scene: { ...job.scene, underlay } });
    expect(patched.status).toBe(200);

    const file = await sheetOf(job.id);
    const pages = pageTexts(file);
    const planIndex = pages.findIndex((t) => t.includes('Plan: what each mirror shows on the floor'));
    expect(planIndex).toBeGreaterThanOrEqual(0);
    const planText = flat(pages[planIndex]);
    expect(planText).toContain(
      'Under the drawing, faded: the uploaded plan image, scaled from its calibration (20.00 m between two marked points).',
    );
    const denominator = Number(/Scale 1:(\d+)/.exec(planText)?.[1]);
    expect(denominator).toBeGreaterThan(0);

    // The image is embedded at its own size (it is under the print limit).
    const images = execFileSync('/usr/bin/pdfimages', ['-list', file], { encoding: 'utf8' });
    expect(images).toMatch(/\s2000\s+1000\s/);

    // Render the plan page at 144 dpi and measure the faded magenta block.
    const dpi = 144;
    const out = path.join(ARTIFACTS, rotationRad ? 'plan-turned' : 'plan');
    execFileSync('/usr/bin/pdftoppm', [
      '-png',
      '-r',
      String(dpi),
      '-f',
      String(planIndex + 1),
      '-l',
      String(planIndex + 1),
      '-singlefile',
      file,
      out,
    ]);
    const { data, info } = await sharp(`${out}.png`).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    let minX = Infinity;
    let maxX = -Infinity;
    let minY = Infinity;
    let maxY = -Infinity;
    for (let y = 0; y < info.height; y++)
      for (let x = 0; x < info.width; x++) {
        const i = (y * info.width + x) * 3;
        // Magenta at half opacity over white: red and blue full, green about half.
        if (data[i] > 235 && data[i + 2] > 235 && data[i + 1] > 100 && data[i + 1] < 160) {
          minX = Math.min(minX, x);
          maxX = Math.max(maxX, x);
          minY = Math.min(minY, y);
          maxY = Math.max(maxY, y);
        }
      }
    // 10 m by 5 m at 1:N, in pixels at `dpi` (1 in = 0.0254 m): the definition of a drawing scale (docs/sources.md, *Uploaded files*).
    const pxPerM = dpi / 0.0254 / denominator;
    // Within 0.5 % of the length (the calibration tolerance), plus a pixel for the edges.
    const near = (measured: number, metres: number) =>
      expect(Math.abs(measured - metres * pxPerM)).toBeLessThanOrEqual(0.005 * metres * pxPerM + 1);
    near(maxX - minX + 1, acrossM);
    near(maxY - minY + 1, upM);
  },
);

it('shows each mirror’s newest photo beside its numbers, and says which file it is', async () => {
  const scene = {
    walls: [{ id: 'w1', kind: 'racking', aM: [0, 0], bM: [10, 0], heightM: 6 }],
    zones: [],
    viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 8], eyeHeightM: 2.1 }],
  };
  const job = (await a.post('/api/projects').send({ name: 'Mirror photos (demo)', scene })).body.project;
  const catalogueItemId = (await a.get('/api/catalogue')).body.items[0].id;
  const mirror = (await a.post(`/api/projects/${job.id}/placements`).send(crossingMirror(catalogueItemId))).body.placement;
  const older = await a
    .post(`/api/projects/${job.id}/files`)
    .field('kind', 'photo')
    .field('placementId', mirror.id)
    .attach('file', await jpeg(400, 300), 'first try.jpg');
  expect(older.status).toBe(201);
  const newer = await a
    .post(`/api/projects/${job.id}/files`)
    .field('kind', 'photo')
    .field('placementId', mirror.id)
    .attach(
      'file',
      await sharp({ create: { width: 640, height: 480, channels: 3, background: '#2a6fdb' } })
        .jpeg()
        .toBuffer(),
      'as mounted.jpg',
    );
  expect(newer.status).toBe(201);

  const file = await sheetOf(job.id);
  const text = flat(pageTexts(file).join(' '));
  expect(text).toContain('Photo beside: as mounted.jpg, uploaded');
  expect(text).not.toContain('first try.jpg');
  // The photo is embedded from its thumbnail: 320 × 240 for a 640 × 480 photo.
  const images = execFileSync('/usr/bin/pdfimages', ['-list', file], { encoding: 'utf8' });
  expect(images).toMatch(/\s320\s+240\s/);
  const pages = pageTexts(file);
  const mirrorPage = pages.findIndex((t) => t.includes('MIRROR 1 OF 1'));
  execFileSync('/usr/bin/pdftoppm', [
    '-png',
    '-r',
    '60',
    '-f',
    String(mirrorPage + 1),
    '-l',
    String(mirrorPage + 1),
    '-singlefile',
    file,
    path.join(ARTIFACTS, 'mirror'),
  ]);
});

it('refuses an underlay that names a file that is not one of this job’s plans', async () => {
  const job = (await a.post('/api/projects').send({ name: 'Foreign underlay (demo)', scene: { walls: [], zones: [], viewers: [] } })).body
    .project;
  const other = (await a.post('/api/projects').send({ name: 'Other (demo)', scene: { walls: [], zones: [], viewers: [] } })).body.project;
  const photo = (
    await a
      .post(`/api/projects/${job.id}/files`)
      .field('kind', 'photo')
      .attach('file', await jpeg(64, 64), 'p.jpg')
  ).body.file;
  const foreign = (
    await a
      .post(`/api/projects/${other.id}/files`)
      .field('kind', 'plan')
      .attach('file', await demoPlanImage(), 'x.png')
  ).body.file;
  for (const fileId of [photo.id, foreign.id, 'AAAAAAAAAAAAAAAAAAAAAAAA']) {
    const underlay = { fileId, calibration: { aPx: [0, 0], bPx: [100, 0], distanceM: 5 } };
    const res = await a.patch(`/api/projects/${job.id}`).send({ version: job.version, scene: { ...job.scene, underlay } });
    expect(res.status).toBe(400);
    expect(res.body.fields['scene.underlay.fileId']).toBe('Choose one of this job’s uploaded plans for the underlay.');
  }
});
