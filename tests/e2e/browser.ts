/**
 * The real product for end-to-end tests: the exported web build served by the real server on a
 * free port (its own SQLite file and fake mail server), driven by Debian's Chromium.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { parseConfig } from '../../server/config';
import { createLogger } from '../../server/logger';
import { startServer, type RunningServer } from '../../server/main';
import { DEMO_PASSWORD, DEMO_USERS } from '../../server/seeders/demo';

export const ARTIFACTS = path.resolve(__dirname, 'artifacts');
export const PHONE = { width: 390, height: 844 };
export const WIDE = { width: 1440, height: 900 };

/** Debian's Chromium (never a downloaded one), quiet: no sandbox, GPU, QUIC or background traffic. */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export interface Product {
  server: RunningServer;
  browser: Browser;
  dir: string;
  close(): Promise<void>;
}

/**
 * One product for the whole test file: started before its first test, closed after its last. The
 * object answers for the running product (reading it before `beforeAll` has run is an error).
 */
export function productForFile(): Product {
  let running: Product | undefined;
  beforeAll(async () => {
    running = await startProduct();
  });
  afterAll(async () => {
    await running?.close();
  });
  const now = (): Product => {
    if (!running) throw new Error('The product starts in beforeAll: use it inside a test or a hook.');
    return running;
  };
  return {
    get server() {
      return now().server;
    },
    get browser() {
      return now().browser;
    },
    get dir() {
      return now().dir;
    },
    close: () => now().close(),
  };
}

export async function startProduct(): Promise<Product> {
  if (!fs.existsSync(path.resolve(__dirname, '../../dist/index.html'))) {
    throw new Error('dist/ is missing: run the tests with `npm test`, which builds the web app first.');
  }
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-e2e-'));
  const config = parseConfig({
    NODE_ENV: 'test',
    PORT: '0',
    HOST: '127.0.0.1',
    FAKE_SMTP_PORT: '0',
    DATABASE_PATH: path.join(dir, 'e2e.sqlite'),
  });
  const server = await startServer(config, createLogger(true));
  const browser = await launchChromium();
  return {
    server,
    browser,
    dir,
    async close() {
      await browser.close();
      await server.stop();
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}

/** A fresh browser context (no cookies) at a given size, with page errors collected. */
export async function openPage(product: Product, size: { width: number; height: number }): Promise<{ page: Page; errors: string[] }> {
  const context = await product.browser.newContext({ viewport: size, deviceScaleFactor: 1 });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  return { page, errors };
}

export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(ARTIFACTS, `${name}.png`), fullPage: false });
}

export const byTestId = (page: Page, id: string) => page.locator(`[data-testid="${id}"]`);

export async function signIn(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await byTestId(page, 'sign-in-email').fill(email);
  await byTestId(page, 'sign-in-password').fill(password);
  // Enter submits, as it would for a person on a keyboard.
  await byTestId(page, 'sign-in-password').press('Enter');
}

export type DemoRole = (typeof DEMO_USERS)[number]['role'];

/** The seeded demo person with this role. */
export const demoUser = (role: DemoRole) => DEMO_USERS.find((u) => u.role === role)!;

/** Signs in as the seeded demo person with this role, with the demo password (as signIn: Enter submits). */
export const signInAs = (page: Page, product: Product, role: DemoRole) =>
  signIn(page, product.server.url, demoUser(role).email, DEMO_PASSWORD);

/** Opens the signed-in person's project with this name (the seeded demo jobs), after the sign-in has landed; returns its id. */
export async function openProjectNamed(page: Page, product: Product, name: string): Promise<number> {
  await page.waitForURL(/\/projects/);
  const list = await page.request.get(`${product.server.url}/api/projects`);
  const { projects } = (await list.json()) as { projects: { id: number; name: string }[] };
  const id = projects.find((p) => p.name === name)!.id;
  await page.goto(`${product.server.url}/projects/${id}`);
  return id;
}

type PageDoc = { document: { querySelector(sel: string): { textContent: string | null; innerHTML: string } | null } };

/** The text of the first element with this test id ('' when it has none). */
export async function textOf(page: Page, testId: string): Promise<string> {
  return (await byTestId(page, testId).first().textContent()) ?? '';
}

/** Waits until an element's text matches (a function, not a string: the app's CSP forbids eval). */
export async function waitForText(page: Page, testId: string, re: RegExp): Promise<void> {
  await page.waitForFunction(
    ([id, source]) =>
      new RegExp(source).test((globalThis as unknown as PageDoc).document.querySelector(`[data-testid="${id}"]`)?.textContent ?? ''),
    [testId, re.source] as const,
    { timeout: 20_000 },
  );
}

/**
 * Screen points for vehicle plan points, from the transform the top view publishes. It shows the
 * vehicle front up: display (dx, dy) = (−y, x) (components/vehicle/vehicle-frame.ts, footgun 42).
 */
export async function vehicleScreen(page: Page): Promise<(pointM: [number, number]) => [number, number]> {
  const svg = byTestId(page, 'vehicle-canvas');
  await page.waitForSelector('[data-testid="vehicle-canvas"][data-transform]', { state: 'attached' });
  const [scale, offX, offY] = (await svg.getAttribute('data-transform'))!.split(' ').map(Number);
  const box = (await svg.boundingBox())!;
  return ([x, y]) => [box.x + offX - y * scale, box.y + offY - x * scale];
}

/**
 * A drawing grid laid over the middle of whatever the plan shows: `at(x, y)` turns grid units
 * around the centre into plan metres, `px` plan metres into page pixels, and `tap` clicks there
 * using the transform the canvas publishes (scale, offsets), then waits until the drawing has
 * changed (a corner, a wall, a marker appeared). The grid keeps clear of the toolbars that float
 * over the plan's edges, whatever the screen size.
 */
export async function planGrid(page: Page) {
  const svg = byTestId(page, 'plan-canvas');
  await page.waitForSelector('[data-testid="plan-canvas"][data-transform]', { state: 'attached' });
  const [scale, offX, offY] = (await svg.getAttribute('data-transform'))!.split(' ').map(Number);
  const box = (await svg.boundingBox())!;
  const unitPx = Math.min(box.width / 14, box.height / 16);
  const cx = (box.width / 2 - offX) / scale;
  const cy = (offY - box.height * 0.45) / scale;
  const unitM = Math.round((unitPx / scale) * 10) / 10;
  const at = (x: number, y: number): [number, number] => [cx + x * unitM, cy + y * unitM];
  const px = ([xM, yM]: [number, number]): [number, number] => [box.x + offX + xM * scale, box.y + offY - yM * scale];
  const drawing = () =>
    page.evaluate(() => (globalThis as unknown as PageDoc).document.querySelector('svg[data-testid="plan-canvas"]')?.innerHTML ?? '');
  const tap = async (pointM: [number, number]) => {
    const before = await drawing();
    await page.mouse.click(...px(pointM));
    await page.waitForFunction(
      (b) => (globalThis as unknown as PageDoc).document.querySelector('svg[data-testid="plan-canvas"]')?.innerHTML !== b,
      before,
      { timeout: 10_000 },
    );
  };
  return { at, tap, px, unitM };
}
