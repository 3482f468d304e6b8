/**
 * An installer's phone (390 × 844) in a basement with no signal: the app opens from its service
 * worker, quick sizing answers from the catalogue kept on the device, a job opens from the kept
 * cache, an edit waits (the shell says one change waits) and lands when the signal returns. A
 * change made meanwhile by someone else is shown beside the installer's and nothing is lost.
 * Then a new build is deployed and the worker serves it after two reloads.
 *
 * The server is started here rather than by startProduct: the deploy restarts it on the same port
 * (the service worker belongs to the origin) over the same database, serving a changed copy of dist/.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { buildOffline } from '../../scripts/offline-build';
import { parseConfig } from '../../server/config';
import { createLogger } from '../../server/logger';
import { startServer, type RunningServer } from '../../server/main';
import { DEMO_PASSWORD, DEMO_USERS } from '../../server/seeders/demo';
import type { PlacementDto, ProjectDto } from '../../shared/schemas';
import { ARTIFACTS, PHONE, byTestId, launchChromium, shot, signIn } from './browser';

/** The page's globals these checks read (the test is compiled without the DOM library; the functions run in the page, so each names `globalThis` itself). */
interface PageGlobals {
  navigator: { onLine: boolean; serviceWorker: { controller: object | null } };
  localStorage: { getItem(key: string): string | null };
}

const DIST = path.resolve(__dirname, '../../dist');
const installer = DEMO_USERS.find((u) => u.role === 'installer')!;
const DEG = Math.PI / 180;
const DEMO_JOB = 'Cold store aisles and dock (demo)';

let dir: string;
let server: RunningServer;
let browser: Browser;
let context: BrowserContext;
let page: Page;
const errors: string[] = [];

async function serve(distDir: string, port: number): Promise<RunningServer> {
  const config = parseConfig({
    NODE_ENV: 'test',
    PORT: String(port),
    HOST: '127.0.0.1',
    FAKE_SMTP_PORT: '0',
    DATABASE_PATH: path.join(dir, 'e2e.sqlite'),
  });
  config.distDir = distDir;
  return startServer(config, createLogger(true));
}

beforeAll(async () => {
  if (!fs.existsSync(path.join(DIST, 'sw.js'))) throw new Error('dist/sw.js is missing: run `npm run build:web` (npm test builds it).');
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-offline-'));
  server = await serve(DIST, 0);
  browser = await launchChromium();
  context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
  page = await context.newPage();
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  if (dir) fs.rmSync(dir, { recursive: true, force: true });
});

/** The server's copy of a job, asked by a signed-in context of its own (never through the page's cache). */
async function savedJob(ctx: BrowserContext, id: number): Promise<ProjectDto> {
  const res = await ctx.request.get(`${server.url}/api/projects/${id}`);
  expect(res.status()).toBe(200);
  return ((await res.json()) as { project: ProjectDto }).project;
}

const connection = () => byTestId(page, 'connection-status');
const status = () => byTestId(page, 'placement-save-status');

/** Opens the demo mirror M2 from the job's details (in the phone's drawer). */
async function openMirrorM2(): Promise<number> {
  const row = page.locator('[data-testid^="summary-placement-"]', { hasText: 'M2 dock corner' }).first();
  if (!(await row.isVisible())) await byTestId(page, 'drawer-toggle').click();
  const id = Number((await row.getAttribute('data-testid'))!.replace('summary-placement-', ''));
  await row.click();
  await byTestId(page, 'placement-tilt').waitFor({ state: 'visible' });
  return id;
}

async function typeInto(testId: string, text: string) {
  await byTestId(page, testId).fill(text);
  await byTestId(page, testId).press('Tab');
}

describe('with no signal', () => {
  let jobId: number;
  let mirrorId: number;
  let other: BrowserContext;

  it('step 1: once signed in with a connection, the worker controls the page and the device keeps the catalogue and the recent jobs', async () => {
    await signIn(page, server.url, installer.email, DEMO_PASSWORD);
    await page.waitForURL(/\/projects$/);
    await page.getByText(DEMO_JOB).first().waitFor();
    await page.waitForFunction(() => (globalThis as unknown as PageGlobals).navigator.serviceWorker.controller !== null, undefined, {
      timeout: 60_000,
    });
    // The shell fetches the catalogue and the recent jobs a few seconds after opening; wait until they are kept.
    await page.waitForFunction(
      () => {
        const kept = (globalThis as unknown as PageGlobals).localStorage.getItem('sightfan-device-cache');
        if (!kept) return false;
        const keys = (JSON.parse(kept) as { clientState: { queries: { queryKey: unknown[] }[] } }).clientState.queries.map((q) =>
          JSON.stringify(q.queryKey),
        );
        return keys.includes('["catalogue","list"]') && keys.some((k) => k.startsWith('["projects","detail",'));
      },
      undefined,
      { timeout: 60_000 },
    );
    const res = await page.request.get(`${server.url}/api/projects?sort=updated`);
    jobId = ((await res.json()) as { projects: { id: number; name: string }[] }).projects.find((p) => p.name === DEMO_JOB)!.id;
  });

  it('step 2: the app opens from the service worker with the network cut, says it is offline, and the person is still signed in', async () => {
    await context.setOffline(true);
    await page.reload();
    await byTestId(page, 'signed-in-person').waitFor({ timeout: 30_000 });
    await expect(connection().textContent()).resolves.toMatch(/^Offline/);
    await page.getByText(DEMO_JOB).first().waitFor();
    await shot(page, 'offline-phone-projects');
  });

  it('step 3: quick sizing answers offline from the kept catalogue', async () => {
    await byTestId(page, 'nav-quick').click();
    await page.waitForURL(/\/quick$/);
    await byTestId(page, 'quick-option-1').waitFor({ timeout: 30_000 });
    expect(await byTestId(page, 'quick-option-1-share').textContent()).toMatch(/^Sees \d+ %$/);
    await shot(page, 'offline-phone-quick');
  });

  it('step 4: the job opens offline with its mirrors, and an edit waits on the device: the shell says 1 change waits', async () => {
    await page.goto(`${server.url}/projects/${jobId}`);
    mirrorId = await openMirrorM2();
    await typeInto('placement-notes', 'Checked in the basement with no signal');
    await byTestId(page, 'placement-save').click();
    await status().filter({ hasText: 'Offline: kept on this device' }).waitFor();
    await connection().filter({ hasText: 'Offline · 1 change waits to be sent' }).waitFor();
    await shot(page, 'offline-phone-waiting');
  });

  it('step 5: when the signal returns the edit is sent, lands on the server, and the shell goes quiet', async () => {
    await context.setOffline(false);
    await status().filter({ hasText: 'All changes saved.' }).waitFor({ timeout: 30_000 });
    other = await browser.newContext();
    await other.request.post(`${server.url}/api/auth/sign-in`, { data: { email: installer.email, password: DEMO_PASSWORD } });
    const saved = (await savedJob(other, jobId)).placements.find((p) => p.id === mirrorId)!;
    expect(saved.notes).toBe('Checked in the basement with no signal');
    await expect(connection().textContent()).resolves.toBe('');
  });

  it('step 6: a change made elsewhere while the phone was offline is shown beside the waiting one; keeping mine loses neither', async () => {
    await context.setOffline(true);
    await page.waitForFunction(() => !(globalThis as unknown as PageGlobals).navigator.onLine);
    await typeInto('placement-tilt', '17°');
    await byTestId(page, 'placement-save').click();
    await connection().filter({ hasText: '1 change waits' }).waitFor();

    // Someone else, with signal, raises the same mirror (within the mounting rule, as in the two-tab test).
    const before = (await savedJob(other, jobId)).placements.find((p) => p.id === mirrorId)!;
    const patched = await other.request.patch(`${server.url}/api/projects/${jobId}/placements/${mirrorId}`, {
      data: { heightM: 3.35, version: before.version },
    });
    expect(patched.status()).toBe(200);

    await context.setOffline(false);
    await byTestId(page, 'placement-conflict').waitFor({ state: 'visible', timeout: 30_000 });
    await expect(byTestId(page, 'placement-conflict-mine-values').textContent()).resolves.toMatch(/tilt 17/);
    // Theirs is shown for the fields the person changed: the tilt as it is saved now.
    await expect(byTestId(page, 'placement-conflict-theirs-values').textContent()).resolves.toMatch(/Saved now: tilt/);
    await byTestId(page, 'placement-conflict').scrollIntoViewIfNeeded();
    await shot(page, 'offline-phone-conflict');

    await byTestId(page, 'placement-conflict-keep').click();
    await status().filter({ hasText: 'All changes saved.' }).waitFor({ timeout: 30_000 });
    const saved: PlacementDto = (await savedJob(other, jobId)).placements.find((p) => p.id === mirrorId)!;
    expect(saved.tiltDownRad).toBeCloseTo(17 * DEG, 6);
    expect(saved.heightM).toBeCloseTo(3.35, 6);
    expect(saved.notes).toBe('Checked in the basement with no signal');
    // The other person's height shows on the phone too.
    await expect(byTestId(page, 'placement-height').inputValue()).resolves.toMatch(/^3\.35/);
    await other.close();
  });

  it('step 7: after a deploy the worker serves the new build: the page says a new version is ready, and the next load is the new build', async () => {
    const next = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-dist-next-'));
    try {
      fs.cpSync(DIST, next, { recursive: true });
      const index = path.join(next, 'index.html');
      fs.writeFileSync(index, fs.readFileSync(index, 'utf8').replace('</head>', '<meta name="sightfan-build" content="next"></head>'));
      await buildOffline(next);
      const port = server.port;
      await server.stop();
      server = await serve(next, port);

      await page.reload();
      await byTestId(page, 'app-updated').waitFor({ timeout: 60_000 });
      expect(await page.locator('meta[name="sightfan-build"]').count()).toBe(0);
      await shot(page, 'offline-phone-updated');
      await page.reload();
      await byTestId(page, 'signed-in-person').waitFor({ timeout: 30_000 });
      expect(await page.locator('meta[name="sightfan-build"]').getAttribute('content')).toBe('next');
    } finally {
      await server.stop();
      server = await serve(DIST, server.port);
      fs.rmSync(next, { recursive: true, force: true });
    }
  });

  it('raised no error in the page beyond the requests the cut network refused', () => {
    expect(errors.filter((e) => !/Failed to load resource|ERR_INTERNET_DISCONNECTED|Failed to fetch/.test(e))).toEqual([]);
  });
});
