/**
 * Every screen checked by an outside tool: axe-core (the Deque rules engine, installed from npm)
 * is injected into the real product in Chromium and run with the WCAG 2.0 / 2.1 level A and AA
 * tags. A "critical" or "serious" finding fails the test with the rule, its help text and the
 * first elements it names, so the failure says what to fix.
 */
import fs from 'node:fs';
import type { Page } from 'playwright-core';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { PHONE, WIDE, byTestId, shot, productForFile, signInAs } from './browser';

const product = productForFile();

const AXE_SOURCE = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');
/** WCAG 2.0 and 2.1, levels A and AA: the rule tags axe-core documents for that conformance target. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

interface AxeFinding {
  id: string;
  impact: string | null;
  help: string;
  targets: string[];
}
type AxeWindow = {
  axe: {
    run(
      context: unknown,
      options: unknown,
    ): Promise<{ violations: { id: string; impact?: string | null; help: string; nodes: { target: unknown[] }[] }[] }>;
  };
  document: unknown;
};

/** Runs axe-core on the page as it stands and returns its critical and serious findings. */
async function seriousFindings(page: Page): Promise<AxeFinding[]> {
  if (!(await page.evaluate(() => 'axe' in globalThis))) await page.addScriptTag({ content: AXE_SOURCE });
  const found = await page.evaluate(async (tags) => {
    const w = globalThis as unknown as AxeWindow;
    const result = await w.axe.run(w.document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return result.violations.map((v) => ({
      id: v.id,
      impact: v.impact ?? null,
      help: v.help,
      targets: v.nodes.slice(0, 4).map((n) => n.target.map(String).join(' ')),
    }));
  }, WCAG_TAGS);
  return found.filter((f) => f.impact === 'critical' || f.impact === 'serious');
}

/** A context that lets the test inject axe's script despite the app's content security policy. */
async function openChecked(size: { width: number; height: number }): Promise<Page> {
  const context = await product.browser.newContext({ viewport: size, deviceScaleFactor: 1, bypassCSP: true });
  return context.newPage();
}

async function openProject(page: Page, name: string): Promise<void> {
  await page.goto(`${product.server.url}/projects`);
  await page.locator('[data-testid^="project-row-"]', { hasText: name }).first().click();
  await page.waitForURL(/\/projects\/\d+$/);
}

interface ScreenCheck {
  name: string;
  role: 'installer' | 'reviewer' | 'admin' | null;
  open(page: Page): Promise<void>;
}

const SCREENS: ScreenCheck[] = [
  {
    name: 'sign-in',
    role: null,
    async open(page) {
      await page.goto(`${product.server.url}/sign-in`);
      await byTestId(page, 'sign-in-email').waitFor({ state: 'visible' });
    },
  },
  {
    name: 'projects',
    role: 'installer',
    async open(page) {
      await page.goto(`${product.server.url}/projects`);
      await page.locator('[data-testid^="project-row-"]').first().waitFor({ state: 'visible' });
    },
  },
  {
    name: 'plan',
    role: 'installer',
    async open(page) {
      await openProject(page, DEMO_PROJECT.name);
      await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
    },
  },
  {
    name: 'plan-editor',
    role: 'installer',
    async open(page) {
      await openProject(page, DEMO_PROJECT.name);
      const marker = page.locator('[data-testid^="placement-marker-"]').first();
      await marker.waitFor({ state: 'attached' });
      const box = (await marker.boundingBox())!;
      await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
      await byTestId(page, 'placement-editor').first().waitFor({ state: 'visible' });
    },
  },
  {
    name: 'catalogue',
    role: 'admin',
    async open(page) {
      await page.goto(`${product.server.url}/catalogue`);
      await byTestId(page, 'catalogue-new').waitFor({ state: 'visible' });
      await page.getByText('Round convex mirror 600 mm', { exact: false }).first().waitFor({ state: 'visible' });
    },
  },
  {
    name: 'catalogue-form',
    role: 'admin',
    async open(page) {
      await page.goto(`${product.server.url}/catalogue/new`);
      await page.locator('input').first().waitFor({ state: 'visible' });
    },
  },
  {
    name: 'users',
    role: 'admin',
    async open(page) {
      await page.goto(`${product.server.url}/users`);
      await byTestId(page, 'invite-email').waitFor({ state: 'visible' });
    },
  },
  {
    name: 'outbox',
    role: 'admin',
    async open(page) {
      await page.goto(`${product.server.url}/outbox`);
      await byTestId(page, 'nav-outbox').first().waitFor({ state: 'visible' });
      await page.waitForLoadState('networkidle');
    },
  },
  {
    name: 'account',
    role: 'installer',
    async open(page) {
      await page.goto(`${product.server.url}/account`);
      await byTestId(page, 'account-sign-out').waitFor({ state: 'visible' });
    },
  },
  {
    name: 'reviews',
    role: 'reviewer',
    async open(page) {
      await page.goto(`${product.server.url}/reviews`);
      await byTestId(page, 'nav-reviews').first().waitFor({ state: 'visible' });
      await page.waitForLoadState('networkidle');
    },
  },
  {
    name: 'vehicle-job',
    role: 'installer',
    async open(page) {
      await openProject(page, 'Rigid delivery truck, fleet no. 14 (demo)');
      await byTestId(page, 'vehicle-canvas').waitFor({ state: 'visible' });
    },
  },
];

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
] as const)('axe-core on a %s screen', (sizeName, size) => {
  const pages = new Map<string, Page>();
  async function pageFor(role: ScreenCheck['role']): Promise<Page> {
    const key = role ?? 'nobody';
    const known = pages.get(key);
    if (known) return known;
    const page = await openChecked(size);
    if (role) {
      await signInAs(page, product, role);
      await byTestId(page, 'nav-account').first().waitFor({ state: 'visible' });
    }
    pages.set(key, page);
    return page;
  }
  afterAll(async () => {
    for (const page of pages.values()) await page.context().close();
  });

  it.each(SCREENS.map((s) => [s.name, s] as const))('finds no critical or serious WCAG 2.1 A/AA violation on %s', async (name, screen) => {
    const page = await pageFor(screen.role);
    await screen.open(page);
    await shot(page, `a11y-${sizeName}-${name}`);
    expect(await seriousFindings(page)).toEqual([]);
  });
});
