/**
 * A phone (390 × 844) shared by two people: the installer edits a mirror with no signal; before
 * the signal returns, the safety officer signs in on the same browser (another tab's sign-in: the
 * cookie is now theirs). Nothing of the installer's reaches the server under the officer's session,
 * and the officer sees a quiet line saying another account's changes wait on this device. When the
 * installer signs in again, the change lands.
 */
import type { BrowserContext, Page, Request } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import type { ProjectDto } from '../../shared/schemas';
import { PHONE, byTestId, demoUser, productForFile, shot, signInAs } from './browser';

/** The page's global this check reads (the test is compiled without the DOM library). */
interface SwGlobals {
  navigator: { serviceWorker: { controller: object | null } };
}

const product = productForFile();
const installer = demoUser('installer');
const reviewer = demoUser('reviewer');
const DEMO_JOB = 'Cold store aisles and dock (demo)';
const NOTE = 'Edited by the installer with no signal';
const OTHER_ACCOUNT_WAITING = 'Changes made by another account on this device are waiting for it.';

let context: BrowserContext;
let page: Page;
let jobId: number;
let mirrorId: number;
const errors: string[] = [];
/** Every write the page sends to the jobs API, in order. */
const writes: string[] = [];

beforeAll(async () => {
  context = await product.browser.newContext({ viewport: PHONE, deviceScaleFactor: 1 });
  page = await context.newPage();
  page.on('pageerror', (e) => errors.push(e.message));
  page.on('console', (m) => {
    if (m.type() === 'error') errors.push(m.text());
  });
  page.on('request', (r: Request) => {
    if (r.method() !== 'GET' && r.url().includes('/api/projects')) writes.push(`${r.method()} ${new URL(r.url()).pathname}`);
  });
});
afterAll(async () => context?.close());

/** The server's copy of the mirror, read by a context of its own signed in as the installer. */
async function savedMirrorNotes(): Promise<string> {
  const ctx = await product.browser.newContext();
  try {
    await ctx.request.post(`${product.server.url}/api/auth/sign-in`, { data: { email: installer.email, password: DEMO_PASSWORD } });
    const res = await ctx.request.get(`${product.server.url}/api/projects/${jobId}`);
    const job = ((await res.json()) as { project: ProjectDto }).project;
    return job.placements.find((p) => p.id === mirrorId)!.notes ?? '';
  } finally {
    await ctx.close();
  }
}

const connection = () => byTestId(page, 'connection-status');

describe('one phone, two people, a change waiting for a connection', () => {
  it('step 1: the installer edits a mirror with no signal: the shell says 1 change waits', async () => {
    await signInAs(page, product, 'installer');
    await page.waitForURL(/\/projects$/);
    await page.getByText(DEMO_JOB).first().waitFor();
    const list = await page.request.get(`${product.server.url}/api/projects`);
    jobId = ((await list.json()) as { projects: { id: number; name: string }[] }).projects.find((p) => p.name === DEMO_JOB)!.id;
    await page.goto(`${product.server.url}/projects/${jobId}`);
    const row = page.locator('[data-testid^="summary-placement-"]', { hasText: 'M2 dock corner' }).first();
    // On a phone the job's details (with its mirrors) are in the drawer.
    await byTestId(page, 'drawer-toggle').or(row).first().waitFor({ timeout: 30_000 });
    if (!(await row.isVisible())) await byTestId(page, 'drawer-toggle').click();
    await row.waitFor({ state: 'visible' });
    mirrorId = Number((await row.getAttribute('data-testid'))!.replace('summary-placement-', ''));
    await row.click();
    await byTestId(page, 'placement-notes').waitFor({ state: 'visible' });

    // The service worker's precache done first: a late answer to one of its requests would put
    // the installer's session cookie back (sessions roll) after the officer's replaces it.
    await page.waitForFunction(() => (globalThis as unknown as SwGlobals).navigator.serviceWorker.controller !== null, undefined, {
      timeout: 60_000,
    });
    await context.setOffline(true);
    await byTestId(page, 'placement-notes').fill(NOTE);
    await byTestId(page, 'placement-notes').press('Tab');
    await byTestId(page, 'placement-save').click();
    await connection().filter({ hasText: 'Offline · 1 change waits to be sent' }).waitFor();
    expect(writes).toEqual([]);
  });

  it('step 2: the safety officer signs in on the same browser; when the signal returns nothing of the installer’s is sent, and the officer sees the line', async () => {
    // Another tab signs the officer in: the browser's session cookie is now theirs.
    const tab = await product.browser.newContext();
    await tab.request.post(`${product.server.url}/api/auth/sign-in`, { data: { email: reviewer.email, password: DEMO_PASSWORD } });
    // (Cleared first: an added cookie sits beside the page's own rather than replacing it.)
    await context.clearCookies();
    await context.addCookies(await tab.cookies());
    await tab.close();

    await context.setOffline(false);
    await byTestId(page, 'signed-in-person').filter({ hasText: reviewer.name }).waitFor({ timeout: 30_000 });
    await byTestId(page, 'connection-status-others').filter({ hasText: OTHER_ACCOUNT_WAITING }).waitFor();
    await shot(page, 'offline-accounts-other-waiting');
    // Give a would-be send time to happen, then check none did.
    await page.waitForTimeout(1500);
    expect(writes).toEqual([]);
    expect(await savedMirrorNotes()).not.toBe(NOTE);
  });

  it('step 3: the change stays set aside through a reload and the officer’s sign-out (nothing of theirs waits, so nothing is asked)', async () => {
    await page.goto(`${product.server.url}/account`);
    await byTestId(page, 'connection-status-others').filter({ hasText: OTHER_ACCOUNT_WAITING }).waitFor({ timeout: 30_000 });
    await byTestId(page, 'account-sign-out').click();
    await page.waitForURL(/\/sign-in/);
    expect(await byTestId(page, 'sign-out-confirmation').count()).toBe(0);
    expect(writes).toEqual([]);
  });

  it('step 4: the installer signs in again and the change lands on the server', async () => {
    await signInAs(page, product, 'installer');
    await page.waitForURL(/\/projects$/);
    for (let tries = 0; tries < 60 && (await savedMirrorNotes()) !== NOTE; tries++) await page.waitForTimeout(500);
    expect(await savedMirrorNotes()).toBe(NOTE);
    expect(writes).toEqual([`PATCH /api/projects/${jobId}/placements/${mirrorId}`]);
    expect(await byTestId(page, 'connection-status-others').count()).toBe(0);
  });

  it('raised no error in the page beyond the requests the cut network refused', () => {
    expect(errors.filter((e) => !/Failed to load resource|ERR_INTERNET_DISCONNECTED|Failed to fetch/.test(e))).toEqual([]);
  });
});
