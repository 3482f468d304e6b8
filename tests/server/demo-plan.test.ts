/**
 * The demo cold store's fictional plan image: seeded once through the upload path, served like
 * any upload, calibrated so the drawn walls lie on the job's walls, and drawn on the sheet. The
 * rendered plan page is written to tests/e2e/artifacts/demo-plan/ to look at.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type request from 'supertest';
import { databaseTarget, parseConfig } from '../../server/config';
import { initORM } from '../../server/db';
import { createStorage } from '../../server/modules/files/storage';
import { StoredFile } from '../../server/modules/files/stored-file.entity';
import { Project } from '../../server/modules/projects/project.entity';
import { seedDemo } from '../../server/seeders/demo';
import { DEMO_PLAN_FILE_NAME, seedDemoPlan } from '../../server/seeders/demo-plan';
import { drawDemoPlan } from '../../server/seeders/demo-plan-image';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { planToUnderlay, underlayToPlan } from '../../shared/geometry/underlay';
import { fileDto, type Underlay } from '../../shared/schemas/files';
import type { SceneWall } from '../../shared/schemas';
import { binary } from './pdf-tools';
import { EMAIL, startHarness, TEST_DATABASE, type Harness } from './harness';

type Agent = ReturnType<typeof request.agent>;
let h: Harness;
let a: Agent;
let tmp: string;
const ARTIFACTS = path.resolve(__dirname, '..', 'e2e', 'artifacts', 'demo-plan');

beforeAll(async () => {
  // The harness seeds the demo without a storage (no plan image); the plan is added as npm start adds it.
  h = await startHarness();
  expect(await seedDemoPlan(h.orm, createStorage(h.config.storage))).toBe(true);
  a = await h.signedIn(EMAIL.installer);
  tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-demo-plan-'));
  fs.mkdirSync(ARTIFACTS, { recursive: true });
});
afterAll(async () => {
  await h?.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

async function demoJob(): Promise<{ id: number; scene: { walls: SceneWall[]; underlay?: Underlay } }> {
  const list = await a.get('/api/projects');
  const summary = list.body.projects.find((p: { name: string }) => p.name === DEMO_PROJECT.name);
  return (await a.get(`/api/projects/${summary.id}`)).body.project;
}

/** The served plan image as grey levels (0 black … 255 white). */
async function servedImage(fileId: string) {
  const res = await a.get(`/api/files/${fileId}`).buffer(true).parse(binary);
  expect(res.status).toBe(200);
  const { data, info } = await sharp(res.body as Buffer)
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { res, data, width: info.width, height: info.height };
}

describe('the demo plan image', () => {
  it('is the demo job’s calibrated underlay, one plan file stored through the upload path', async () => {
    const job = await demoJob();
    expect(job.scene.underlay).toBeDefined();
    const files = (await a.get(`/api/projects/${job.id}/files`)).body.files.map((f: unknown) => fileDto.parse(f));
    const plans = files.filter((f: { kind: string }) => f.kind === 'plan');
    expect(plans).toHaveLength(1);
    expect(plans[0]).toMatchObject({ id: job.scene.underlay!.fileId, name: DEMO_PLAN_FILE_NAME, contentType: 'image/png' });
    expect((await a.get(plans[0].thumbnailUrl)).headers['content-type']).toBe('image/jpeg');
  });

  it('is added once: seeding again changes nothing', async () => {
    expect(await seedDemoPlan(h.orm, createStorage(h.config.storage))).toBe(false);
    const job = await demoJob();
    expect(await h.orm.em.fork().count(StoredFile, { project: job.id, kind: 'plan' })).toBe(1);
  });

  it('is served by GET /api/files/:id as a PNG image, with nosniff', async () => {
    const job = await demoJob();
    const { res, width, height } = await servedImage(job.scene.underlay!.fileId);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(width).toBeGreaterThan(1000);
    expect(height).toBeGreaterThan(700);
  });

  it('puts two drawn wall corners on the scene’s wall ends within 1 cm', async () => {
    const job = await demoJob();
    const u = job.scene.underlay!;
    const { data, width } = await servedImage(u.fileId);
    const wall = (id: string) => job.scene.walls.find((w) => w.id === id)!;
    /**
     * Where a straight wall is drawn across a line of pixels: the centre of its dark stroke, as the
     * darkness-weighted mean position over ±15 px of where the calibration expects it (light grid
     * lines and paper do not count), so the measurement reads the image, not the calibration.
     */
    const strokeCentre = (expected: number, at: number, across: 'x' | 'y'): number => {
      let sum = 0;
      let weight = 0;
      for (let k = Math.round(expected) - 15; k <= Math.round(expected) + 15; k++) {
        const [x, y] = across === 'x' ? [k, Math.round(at)] : [Math.round(at), k];
        const darkness = Math.max(0, 255 - data[y * width + x] - 100);
        sum += darkness * (k + 0.5); // a pixel's centre
        weight += darkness;
      }
      expect(weight).toBeGreaterThan(0);
      return sum / weight;
    };
    // Each wall measured at three places clear of the drawn doors and labels, averaged.
    const drawnAt = (w: SceneWall, along: number[]): number => {
      const vertical = w.aM[0] === w.bM[0];
      const values = along.map((t) => {
        const p: [number, number] = vertical ? [w.aM[0], t] : [t, w.aM[1]];
        const px = planToUnderlay(u, p);
        return vertical ? strokeCentre(px[0], px[1], 'x') : strokeCentre(px[1], px[0], 'y');
      });
      return values.reduce((s, v) => s + v, 0) / values.length;
    };
    const west = drawnAt(wall('hall-w'), [5, 8, 12]);
    const south = drawnAt(wall('hall-s'), [5, 10, 15]);
    const east = drawnAt(wall('hall-e'), [5, 10, 15]);
    const north = drawnAt(wall('hall-n'), [5, 30, 35]);
    const southWest = underlayToPlan(u, [west, south]);
    const northEast = underlayToPlan(u, [east, north]);
    const near = (got: [number, number], want: readonly [number, number]) => {
      expect(Math.abs(got[0] - want[0])).toBeLessThanOrEqual(0.01);
      expect(Math.abs(got[1] - want[1])).toBeLessThanOrEqual(0.01);
    };
    near(southWest, wall('hall-s').aM); // (0, 0)
    near(northEast, wall('hall-n').aM); // (40, 25)
  });

  it('is drawn on the job’s sheet, under the plan, at its own size', async () => {
    const job = await demoJob();
    const issued = await a.post(`/api/projects/${job.id}/sheet/revisions`);
    expect([200, 201]).toContain(issued.status);
    const pdf = await a.get(`/api/projects/${job.id}/sheet.pdf?revision=${issued.body.revision.number}`).buffer(true).parse(binary);
    expect(pdf.status).toBe(200);
    const file = path.join(tmp, 'demo.pdf');
    fs.writeFileSync(file, pdf.body as Buffer);
    const pages = execFileSync('/usr/bin/pdftotext', [file, '-'], { encoding: 'utf8' }).split('\f');
    const planIndex = pages.findIndex((t) => t.includes('Plan: what each mirror shows on the floor'));
    expect(planIndex).toBeGreaterThanOrEqual(0);
    expect(pages[planIndex].replace(/\s+/g, ' ')).toContain(
      'Under the drawing, faded: the uploaded plan image, scaled from its calibration (40.00 m between two marked points).',
    );
    const { widthPx, heightPx } = (await a.get(`/api/projects/${job.id}/files`)).body.files[0];
    expect(execFileSync('/usr/bin/pdfimages', ['-list', file], { encoding: 'utf8' })).toMatch(
      new RegExp(`\\s${widthPx}\\s+${heightPx}\\s`),
    );
    execFileSync('/usr/bin/pdftoppm', [
      '-png',
      '-r',
      '110',
      '-f',
      String(planIndex + 1),
      '-l',
      String(planIndex + 1),
      '-singlefile',
      file,
      path.join(ARTIFACTS, 'sheet-plan'),
    ]);
  });
});

// Once per run, on SQLite: a fresh demo database seeded as npm start seeds it (with the storage).
(TEST_DATABASE === 'sqlite' ? it : it.skip)(
  'comes with a fresh demo database seeded with the uploads’ storage, and only once',
  async () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-demo-seed-'));
    const config = parseConfig({ NODE_ENV: 'test', DATABASE_PATH: path.join(dir, 'fresh.sqlite') });
    const orm = await initORM(databaseTarget(config));
    try {
      const storage = createStorage(config.storage);
      expect(await seedDemo(orm, config.bcryptCost, storage)).toBe(true);
      expect(await seedDemo(orm, config.bcryptCost, storage)).toBe(false);
      const em = orm.em.fork();
      const project = await em.findOneOrFail(Project, { demo: true, name: DEMO_PROJECT.name });
      const plans = await em.find(StoredFile, { project: project.id, kind: 'plan' });
      expect(plans).toHaveLength(1);
      expect(project.scene.underlay?.fileId).toBe(plans[0].id);
      expect(await storage.exists(plans[0].storageKey)).toBe(true);
      // Its title block says what it is.
      expect(drawDemoPlan(project.scene, '').svg).toContain('>DEMO PLAN — fictional</text>');
    } finally {
      await orm.close(true);
      fs.rmSync(dir, { recursive: true, force: true });
    }
  },
);
