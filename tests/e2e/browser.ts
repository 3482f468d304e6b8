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
