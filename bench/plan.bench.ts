/**
 * Speed of the live plan in Chromium: with 30 placements, dragging one recomputes its coverage and
 * the zone fractions and redraws, once per animation frame. The budget is 50 ms a frame.
 * The plan code marks each live frame (components/plan/perf-marks.ts: 'plan-recompute-start' →
 * 'plan-redraw-end', measured as 'plan-frame'); this script reads those measures. It prints
 * figures and never fails.
 *
 * Needs the web build in dist/ (`npm run build:web`); the real server serves it on a free port
 * with its own temporary database, as in the end-to-end tests.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser } from 'playwright-core';
import { parseConfig } from '../server/config';
import { createLogger } from '../server/logger';
import { startServer, type RunningServer } from '../server/main';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seeders/demo';
import { DEMO_PROJECT } from '../server/seeders/demo-project';
import type { CatalogueItemDto, PlacementDto, ProjectDto } from '../shared/schemas';
import { byTestId, launchChromium, signIn, WIDE } from '../tests/e2e/browser';

const PLACEMENTS = 30;
const STEPS = 20;
const BUDGET_MS = 50;

async function api<T>(base: string, cookie: string, method: string, url: string, body?: unknown): Promise<T> {
  const res = await fetch(`${base}${url}`, {
    method,
    headers: { 'content-type': 'application/json', cookie, origin: base },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  if (!res.ok) throw new Error(`${method} ${url} answered ${res.status}: ${await res.text()}`);
  return (await res.json()) as T;
}

/** A project like the demo cold store, with 30 mirrors spread over the hall, each aimed at its viewer. */
async function seedProject(base: string): Promise<{ cookie: string; project: ProjectDto }> {
  const installer = DEMO_USERS.find((u) => u.role === 'installer')!;
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: base },
    body: JSON.stringify({ email: installer.email, password: DEMO_PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in answered ${res.status}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0];
  const { items } = await api<{ items: CatalogueItemDto[] }>(base, cookie, 'GET', '/api/catalogue');
  const item = items.find((i) => i.mirror.shape === 'round') ?? items[0];
  const { project } = await api<{ project: ProjectDto }>(base, cookie, 'POST', '/api/projects', {
    name: `Benchmark: ${PLACEMENTS} mirrors (demo)`,
    scene: DEMO_PROJECT.scene,
  });
  const viewers = DEMO_PROJECT.scene.viewers;
  for (let i = 0; i < PLACEMENTS; i++) {
    const positionM: [number, number] = [2 + (i % 6) * 7, 1.5 + Math.floor(i / 6) * 5.5];
    const viewer = viewers[i % viewers.length];
    await api<{ placement: PlacementDto }>(base, cookie, 'POST', `/api/projects/${project.id}/placements`, {
      label: `B${i + 1}`,
      catalogueItemId: item.id,
      positionM,
      heightM: 3,
      azimuthRad: Math.atan2(viewer.positionM[1] - positionM[1], viewer.positionM[0] - positionM[0]),
      tiltDownRad: 0.26,
      viewerId: viewer.id,
    });
  }
  return { cookie, project: (await api<{ project: ProjectDto }>(base, cookie, 'GET', `/api/projects/${project.id}`)).project };
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];

export async function runPlanBench(): Promise<void> {
  // PLAN_BENCH_DIST lets a developer time their own export without touching the shared dist/.
  const distDir = process.env.PLAN_BENCH_DIST ?? path.resolve(__dirname, '..', 'dist');
  if (!fs.existsSync(path.join(distDir, 'index.html'))) {
    console.log(`plan in Chromium: skipped — ${distDir} has no web build; run \`npm run build:web\` first.`);
    return;
  }
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-bench-'));
  let server: RunningServer | undefined;
  let browser: Browser | undefined;
  try {
    const config = parseConfig({
      NODE_ENV: 'test',
      PORT: '0',
      HOST: '127.0.0.1',
      FAKE_SMTP_PORT: '0',
      DATABASE_PATH: path.join(dir, 'bench.sqlite'),
    });
    server = await startServer({ ...config, distDir }, createLogger(true));
    const base = server.url;
    const { project } = await seedProject(base);
    browser = await launchChromium();
    const page = await (await browser.newContext({ viewport: WIDE, deviceScaleFactor: 1 })).newPage();
    const installer = DEMO_USERS.find((u) => u.role === 'installer')!;
    await signIn(page, base, installer.email, DEMO_PASSWORD);
    await byTestId(page, 'nav-projects').first().waitFor({ state: 'visible' });
    await page.goto(`${base}/projects/${project.id}`);
    const canvas = page.locator('svg[data-testid="plan-canvas"]');
    await canvas.waitFor({ state: 'visible', timeout: 60_000 });
    await page
      .locator('[data-testid^="placement-marker-"]')
      .nth(PLACEMENTS - 1)
      .waitFor({ state: 'attached', timeout: 60_000 });

    // Metres to page pixels from the transform the canvas publishes: "scale offsetX offsetY".
    const toPage = async (p: readonly [number, number]): Promise<[number, number]> => {
      const [scale, ox, oy] = ((await canvas.getAttribute('data-transform')) ?? '').split(' ').map(Number);
      const box = (await canvas.boundingBox())!;
      return [box.x + ox + p[0] * scale, box.y + oy - p[1] * scale];
    };
    const target = project.placements[14];
    const [x0, y0] = await toPage(target.positionM);
    await page.mouse.click(x0, y0);
    await page.locator('[data-testid="aim-handle"]').waitFor({ state: 'visible' });
    await page.evaluate(() => performance.clearMeasures('plan-frame'));

    await page.mouse.move(x0, y0);
    await page.mouse.down();
    for (let i = 1; i <= STEPS; i++) {
      await page.mouse.move(x0 + i * 6, y0 - i * 2);
      // About one frame between moves, as a finger would give.
      await page.waitForTimeout(20);
    }
    await page.mouse.up();
    await page.waitForTimeout(300);
    const frames = await page.evaluate(() => performance.getEntriesByName('plan-frame').map((e) => e.duration));
    if (frames.length === 0) {
      console.log('plan in Chromium: no live frames were measured (did the drag reach the mirror?)');
      return;
    }
    const sorted = [...frames].sort((a, b) => a - b);
    const median = quantile(sorted, 0.5);
    const p95 = quantile(sorted, 0.95);
    console.log(`plan in Chromium (${PLACEMENTS} placements, dragging one in ${STEPS} steps)`);
    console.log(
      `  recompute + redraw per frame: median ${median.toFixed(1)} ms, p95 ${p95.toFixed(1)} ms over ${frames.length} frames (budget ${BUDGET_MS} ms) ${p95 <= BUDGET_MS ? 'meets' : 'MISSES'}`,
    );
  } catch (e) {
    console.log(`plan in Chromium: could not run — ${e instanceof Error ? e.message : String(e)}`);
  } finally {
    await browser?.close();
    await server?.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

// Run on its own with `npx tsx bench/plan.bench.ts`.
if (require.main === module) void runPlanBench();
