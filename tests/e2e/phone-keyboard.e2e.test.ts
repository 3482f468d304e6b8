/**
 * The plan on a phone and from a keyboard, in the real product: a tap on a mirror opens the
 * editor and it stays open, the drawer peeks with the mirror in view above it, no control covers a
 * caution at either size, a keyboard-only person opens a project and selects, nudges and closes a
 * mirror, the wide side panel opens with a caution in view, and expected answers (signed out, a
 * section the role may not visit) leave no failed request behind.
 */
import type { Locator, Page } from 'playwright-core';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs } from './browser';

const product = productForFile();

/** The page's document, typed without the DOM library (the e2e tests compile with the server's tsconfig). */
interface DomEl {
  closest(sel: string): DomEl | null;
  contains(other: DomEl | null): boolean;
  getAttribute(name: string): string | null;
}
type PageDoc = {
  document: { elementFromPoint(x: number, y: number): DomEl | null; querySelector(sel: string): DomEl | null; activeElement: DomEl | null };
  getComputedStyle(el: DomEl): { outlineStyle: string; outlineWidth: string };
};

async function openDemoProject(page: Page): Promise<number> {
  await byTestId(page, 'nav-projects').first().waitFor({ state: 'visible' });
  await page.goto(`${product.server.url}/projects`);
  await page.locator('[data-testid^="project-row-"]', { hasText: DEMO_PROJECT.name }).first().click();
  await page.waitForURL(/\/projects\/\d+$/);
  await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
  return Number(/\/projects\/(\d+)$/.exec(page.url())![1]);
}

async function centreOf(locator: Locator): Promise<[number, number]> {
  const box = (await locator.boundingBox())!;
  return [box.x + box.width / 2, box.y + box.height / 2];
}

/**
 * What covers an element: at each sample point of its box (its centre and four points inset from
 * the corners), the element the browser finds there unless it is the element itself or inside it.
 * An empty list means nothing is drawn on top of it.
 */
async function coveredBy(page: Page, testId: string): Promise<string[]> {
  const el = byTestId(page, testId).first();
  await el.scrollIntoViewIfNeeded();
  const b = (await el.boundingBox())!;
  const inset = 4;
  const points: [number, number][] = [
    [b.x + b.width / 2, b.y + b.height / 2],
    [b.x + inset, b.y + inset],
    [b.x + b.width - inset, b.y + inset],
    [b.x + inset, b.y + b.height - inset],
    [b.x + b.width - inset, b.y + b.height - inset],
  ];
  return page.evaluate(
    ([id, pts]) => {
      const d = (globalThis as unknown as PageDoc).document;
      const target = d.querySelector(`[data-testid="${id}"]`);
      const covers: string[] = [];
      for (const [x, y] of pts) {
        const hit = d.elementFromPoint(x, y);
        if (hit === null || target === null || !target.contains(hit)) {
          const named = hit?.closest('[data-testid]');
          covers.push(`${Math.round(x)},${Math.round(y)}: ${named?.getAttribute('data-testid') ?? 'nothing'}`);
        }
      }
      return covers;
    },
    [testId, points] as const,
  );
}

async function placementOf(page: Page, projectId: number, placementId: number): Promise<{ positionM: [number, number] }> {
  return page.evaluate(
    async ([pid, id]) => {
      const res = await fetch(`/api/projects/${pid}`, { credentials: 'include' });
      const body = (await res.json()) as { project: { placements: { id: number; positionM: [number, number] }[] } };
      return body.project.placements.find((p) => p.id === id)!;
    },
    [projectId, placementId] as const,
  );
}

describe('the plan on a phone', () => {
  let page: Page;
  let errors: string[];
  beforeAll(async () => {
    const context = await product.browser.newContext({ viewport: PHONE, deviceScaleFactor: 1, hasTouch: true, isMobile: true });
    page = await context.newPage();
    errors = [];
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(m.text());
    });
    page.on('pageerror', (e) => errors.push(e.message));
    await signInAs(page, product, 'installer');
    await openDemoProject(page);
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('opens the editor on a tap of a mirror, and the follow-up click does not close it', async () => {
    const marker = page.locator('[data-testid^="placement-marker-"]').first();
    const [x, y] = await centreOf(marker);
    await page.touchscreen.tap(x, y);
    await byTestId(page, 'placement-editor').first().waitFor({ state: 'visible' });
    // Long enough for the browser's synthesised mouse events and click to have landed.
    await page.waitForTimeout(700);
    expect(await byTestId(page, 'placement-editor').first().isVisible()).toBe(true);
    await shot(page, 'phone-editor-peek');
  });

  it('opens the drawer to a peek that leaves the mirror in view above it', async () => {
    const drawer = (await byTestId(page, 'plan-drawer').boundingBox())!;
    // Less than half the screen: the plan keeps the rest (the peek is 44 % of the window's height).
    expect(drawer.height).toBeLessThan(PHONE.height / 2);
    const id = (await page.locator('[data-testid^="placement-marker-"]').first().getAttribute('data-testid'))!;
    await page.waitForTimeout(300);
    const [, markerY] = await centreOf(byTestId(page, id));
    const plan = (await byTestId(page, 'plan-canvas').boundingBox())!;
    expect(markerY).toBeGreaterThan(plan.y);
    expect(markerY).toBeLessThan(drawer.y);
  });

  it('keeps the short caution whole in the drawer at every size', async () => {
    const text = await byTestId(page, 'drawer-caution').textContent();
    expect(text).toMatch(/smaller and farther away than they are\. Read the cautions under Details\.$/);
    expect(await coveredBy(page, 'drawer-caution')).toEqual([]);
    await byTestId(page, 'drawer-toggle').click();
    expect(await coveredBy(page, 'drawer-caution')).toEqual([]);
    await byTestId(page, 'drawer-toggle').click();
    await byTestId(page, 'drawer-size').click();
    expect(await coveredBy(page, 'drawer-caution')).toEqual([]);
  });

  it('leaves every caution in the open editor uncovered by its buttons', async () => {
    const boxes = await page.locator('[data-testid="placement-editor"] [data-testid^="safety-caution-"]').count();
    expect(boxes).toBe(4);
    for (const key of ['smaller-farther', 'supplements', 'codes', 'verify']) {
      expect(await coveredBy(page, `safety-caution-${key}`)).toEqual([]);
    }
    await shot(page, 'phone-editor-cautions');
  });

  it('puts the zoom buttons in the lower half of the screen, within thumb reach', async () => {
    await byTestId(page, 'drawer-toggle').click();
    const [, zoomY] = await centreOf(byTestId(page, 'plan-zoom-in'));
    expect(zoomY).toBeGreaterThan(PHONE.height / 2);
  });

  it('logged no errors in the browser', () => {
    expect(errors).toEqual([]);
  });
});

describe('the plan and the list from a keyboard on a wide screen', () => {
  let page: Page;
  let errors: string[];
  let projectId = 0;
  beforeAll(async () => {
    ({ page, errors } = await openPage(product, WIDE));
    await signInAs(page, product, 'installer');
    await byTestId(page, 'nav-projects').first().waitFor({ state: 'visible' });
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it.each([['Enter'], [' ']])('opens a focused project row with %j', async (key) => {
    await page.goto(`${product.server.url}/projects`);
    const row = page.locator('[data-testid^="project-row-"]', { hasText: DEMO_PROJECT.name }).first();
    await row.focus();
    await page.keyboard.press(key === ' ' ? 'Space' : key);
    await page.waitForURL(/\/projects\/\d+$/);
    projectId = Number(/\/projects\/(\d+)$/.exec(page.url())![1]);
  });

  it('shows the first caution at the top of the side panel, in view beside the coverage without scrolling', async () => {
    const caution = byTestId(page, 'side-caution');
    await caution.waitFor({ state: 'visible' });
    expect(await caution.textContent()).toMatch(/smaller and farther away than they are/);
    const box = (await caution.boundingBox())!;
    const plan = (await byTestId(page, 'plan-canvas').boundingBox())!;
    // Inside the window as the job opens, and beside the plan (to its right), not under it.
    expect(box.y).toBeGreaterThanOrEqual(0);
    expect(box.y + box.height).toBeLessThanOrEqual(WIDE.height);
    expect(box.x).toBeGreaterThanOrEqual(plan.x + plan.width - 1);
    expect(await coveredBy(page, 'side-caution')).toEqual([]);
  });

  it('reaches a mirror on the plan with Tab, shows the focus, and selects it with Enter', async () => {
    await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
    const stop = page.locator('[data-testid^="marker-stop-placement-"]').first();
    await stop.waitFor({ state: 'attached' });
    // Arrive from the keyboard (Tab from the stop before it, or back), so the browser treats the focus as visible.
    await stop.focus();
    await page.keyboard.press('Shift+Tab');
    await page.keyboard.press('Tab');
    const outline = await stop.evaluate((el) => {
      const s = (globalThis as unknown as PageDoc).getComputedStyle(el as unknown as DomEl);
      return `${s.outlineStyle} ${s.outlineWidth}`;
    });
    expect(outline).toBe('solid 3px');
    await page.keyboard.press('Enter');
    await byTestId(page, 'placement-editor').first().waitFor({ state: 'visible' });
    await shot(page, 'wide-keyboard-marker-selected');
  });

  it('nudges the selected mirror with an arrow key, saved through the usual write path', async () => {
    const stopId = (await page.locator('[data-testid^="marker-stop-placement-"]').first().getAttribute('data-testid'))!;
    const placementId = Number(stopId.replace('marker-stop-placement-', ''));
    const before = await placementOf(page, projectId, placementId);
    await byTestId(page, stopId).focus();
    const saved = page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/placements\//.test(r.url()));
    await page.keyboard.press('ArrowRight');
    expect((await saved).status()).toBe(200);
    const after = await placementOf(page, projectId, placementId);
    // One nudge is 0.1 m east (NUDGE_STEP_M, a product choice), rounded to the plan's millimetres; north is untouched.
    expect(Math.abs(after.positionM[0] - before.positionM[0] - 0.1)).toBeLessThanOrEqual(0.0005 + 1e-9);
    expect(after.positionM[1]).toBe(before.positionM[1]);
  });

  it('closes the editor with Escape', async () => {
    await page.keyboard.press('Escape');
    await byTestId(page, 'placement-editor').first().waitFor({ state: 'detached' });
  });

  it('leaves every caution in the open editor uncovered by its buttons', async () => {
    await page.locator('[data-testid^="marker-stop-placement-"]').first().focus();
    await page.keyboard.press('Enter');
    await byTestId(page, 'placement-editor').first().waitFor({ state: 'visible' });
    for (const key of ['smaller-farther', 'supplements', 'codes', 'verify']) {
      expect(await coveredBy(page, `safety-caution-${key}`)).toEqual([]);
    }
  });

  it('logged no errors in the browser', () => {
    expect(errors).toEqual([]);
  });
});

describe('expected answers', () => {
  it('leaves no failed request when a visitor opens the sign-in page and a reviewer types an admin address', async () => {
    const { page, errors } = await openPage(product, WIDE);
    const failed: string[] = [];
    page.on('response', (r) => {
      if (r.status() >= 400) failed.push(`${r.status()} ${r.url()}`);
    });
    await page.goto(product.server.url);
    await page.waitForURL(/\/sign-in/);
    await byTestId(page, 'illustration-caution').waitFor({ state: 'visible' });
    await signInAs(page, product, 'reviewer');
    await byTestId(page, 'nav-reviews').first().waitFor({ state: 'visible' });
    for (const admin of ['/users', '/outbox']) {
      await page.goto(`${product.server.url}${admin}`);
      await page.waitForURL(/\/reviews/);
      await page.waitForLoadState('networkidle');
    }
    expect(failed).toEqual([]);
    expect(errors).toEqual([]);
    await page.context().close();
  });
});
