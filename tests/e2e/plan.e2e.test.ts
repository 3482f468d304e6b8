import type { Page } from 'playwright-core';
import { PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs, planGrid } from './browser';

const product = productForFile();

type PageDoc = { document: { querySelector(sel: string): { getAttribute(name: string): string | null; innerHTML: string } | null } };

async function attr(page: Page, testId: string, name: string): Promise<string> {
  return (await byTestId(page, testId).first().getAttribute(name)) ?? '';
}

/** Waits until the outline of a fan differs from `before` (a function, not a string: the app's CSP forbids eval). */
async function fanChanged(page: Page, fanId: string, before: string): Promise<void> {
  await page.waitForFunction(
    ([id, b]) => (globalThis as unknown as PageDoc).document.querySelector(`[data-testid="${id}"]`)?.getAttribute('d') !== b,
    [fanId, before] as const,
    { timeout: 15_000 },
  );
}

async function onlyPlacementId(page: Page): Promise<string> {
  await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
  const ids = await page
    .locator('[data-testid^="placement-marker-"]')
    .evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.replace('placement-marker-', '')));
  expect(ids).toHaveLength(1);
  return ids[0];
}

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
] as const)('an installer on a %s screen sets up a site from nothing', (sizeName, size) => {
  // The steps share one page, in order; a failing step names what broke.
  let page: Page;
  let errors: string[];
  let grid: Awaited<ReturnType<typeof planGrid>>;
  let zoneId = '';
  let placementId = '';
  let fanId = '';
  let projectId = '';
  let aimedAzimuth: number | null = null;

  beforeAll(async () => {
    ({ page, errors } = await openPage(product, size));
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('creates a project and lands on its empty plan', async () => {
    await signInAs(page, product, 'installer');
    await byTestId(page, 'projects-new').click();
    await byTestId(page, 'project-form-name').fill(`Aisle crossing ${sizeName}`);
    await byTestId(page, 'project-form-customer').fill('Northgate Foods (demo)');
    await byTestId(page, 'project-form-submit').click();
    await page.waitForURL(/\/projects\/\d+$/);
    projectId = page.url().match(/projects\/(\d+)/)![1];
    await byTestId(page, 'plan-canvas').waitFor({ state: 'visible' });
    grid = await planGrid(page);
  });

  it('draws a racking run along the south side of the crossing', async () => {
    await byTestId(page, 'plan-tool-wall').click();
    await byTestId(page, 'plan-wall-kind-racking').click();
    await grid.tap(grid.at(-6, -2));
    await grid.tap(grid.at(6, -2));
  });

  it('draws and names the zone that must be seen', async () => {
    await byTestId(page, 'plan-tool-zone').click();
    for (const [x, y] of [
      [-4, -1.4],
      [4, -1.4],
      [4, 1.5],
      [-4, 1.5],
    ])
      await grid.tap(grid.at(x, y));
    await byTestId(page, 'plan-zone-finish').click();
    // The prompt opens with its default name selected, so typing replaces it.
    const nameField = byTestId(page, 'plan-zone-name');
    await page.waitForFunction(() => {
      const el = (
        globalThis as unknown as { document: { activeElement: { value?: string; selectionStart?: number; selectionEnd?: number } | null } }
      ).document.activeElement;
      return !!el?.value && el.selectionStart === 0 && el.selectionEnd === el.value.length;
    });
    await page.keyboard.type('Crossing');
    expect(await nameField.inputValue()).toBe('Crossing');
    await byTestId(page, 'plan-zone-save').click();
    await page.locator('[data-testid^="zone-pct-"]').first().waitFor({ state: 'attached' });
    zoneId = (await page.locator('[data-testid^="zone-pct-"]').first().getAttribute('data-testid'))!.replace('zone-pct-', '');
  });

  it('places the driver and a mirror across the crossing, and sees the fan and the zone percentage', async () => {
    await byTestId(page, 'plan-tool-viewer').click();
    await grid.tap(grid.at(0, 5));
    await byTestId(page, 'plan-tool-mirror').click();
    await grid.tap(grid.at(0, -1.7));
    placementId = await onlyPlacementId(page);
    fanId = `placement-fan-${placementId}`;
    await byTestId(page, fanId).waitFor({ state: 'attached' });
    expect((await attr(page, fanId, 'd')).length).toBeGreaterThan(20);
    expect(await byTestId(page, `zone-pct-${zoneId}`).first().textContent()).toMatch(/\d+\s?%/);
    await shot(page, `${sizeName}-plan-new-project`);
  });

  it('changes the mounting height, and the fan, the numbers and the saved state follow', async () => {
    await byTestId(page, 'placement-editor').waitFor({ state: 'visible' });
    const fanBefore = await attr(page, fanId, 'd');
    const rangeBefore = await byTestId(page, 'numbers-range-adult-recognise').first().textContent();
    await byTestId(page, 'placement-height').fill('4.5 m');
    await byTestId(page, 'placement-height').press('Enter');
    await fanChanged(page, fanId, fanBefore);
    expect(await byTestId(page, 'numbers-range-adult-recognise').first().textContent()).not.toBe(rangeBefore);
    await byTestId(page, 'placement-save-status')
      .filter({ hasText: /All changes saved/ })
      .first()
      .waitFor({ timeout: 15_000 });
    await shot(page, `${sizeName}-plan-height-changed`);
  });

  if (sizeName === 'wide') {
    it('turns the mirror with its aim handle: the fan swings and the new aim is saved', async () => {
      const before = await attr(page, fanId, 'd');
      const handle = (await byTestId(page, 'aim-handle').first().boundingBox())!;
      const hx = handle.x + handle.width / 2;
      const hy = handle.y + handle.height / 2;
      const saved = page.waitForResponse(
        (r) =>
          r.request().method() === 'PATCH' &&
          r.url().includes(`/placements/${placementId}`) &&
          r.ok() &&
          (r.request().postData() ?? '').includes('azimuthRad'),
        { timeout: 15_000 },
      );
      await page.mouse.move(hx, hy);
      await page.mouse.down();
      for (let i = 1; i <= 8; i++) await page.mouse.move(hx + i * 8, hy + i * 3);
      await page.mouse.up();
      await fanChanged(page, fanId, before);
      aimedAzimuth = ((await (await saved).json()) as { placement: { azimuthRad: number } }).placement.azimuthRad;
      expect(Math.abs(aimedAzimuth - Math.PI / 2)).toBeGreaterThan(0.05);
      await shot(page, 'wide-plan-aimed');
    });
  }

  it('finds the zone, the wall, the viewer and the mirror as left after a reload', async () => {
    await page.reload();
    await byTestId(page, 'plan-canvas').waitFor({ state: 'visible' });
    await byTestId(page, `zone-label-${zoneId}`).first().waitFor({ state: 'attached' });
    expect(await byTestId(page, `zone-label-${zoneId}`).first().textContent()).toContain('Crossing');
    await byTestId(page, fanId).waitFor({ state: 'attached' });
    expect((await attr(page, fanId, 'd')).length).toBeGreaterThan(20);
    const saved = await (await page.request.get(`${product.server.url}/api/projects/${projectId}`)).json();
    expect(saved.project.placements).toHaveLength(1);
    expect(saved.project.placements[0].heightM).toBeCloseTo(4.5, 9);
    expect(saved.project.scene.walls).toHaveLength(1);
    expect(saved.project.scene.walls[0].kind).toBe('racking');
    if (aimedAzimuth !== null) expect(saved.project.placements[0].azimuthRad).toBeCloseTo(aimedAzimuth, 9);
    expect(await page.locator('[data-testid^="viewer-marker-"]').count()).toBe(1);
  });

  it('logged no errors in the browser along the way', () => {
    expect(errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
  });
});

describe('a safety officer on a wide screen', () => {
  it('reads the demo project with its zone percentages but cannot change it', async () => {
    const { page } = await openPage(product, WIDE);
    await signInAs(page, product, 'reviewer');
    await byTestId(page, 'nav-projects').first().click();
    await page.getByText('Cold store aisles and dock (demo)').first().click();
    await page.waitForURL(/\/projects\/\d+$/);
    await byTestId(page, 'zone-pct-z-dock').first().waitFor({ state: 'attached' });
    expect(await byTestId(page, 'zone-pct-z-dock').first().textContent()).toMatch(/\d+\s?%/);
    await byTestId(page, 'project-read-only').first().waitFor({ state: 'visible' });
    for (const tool of ['plan-tool-mirror', 'plan-tool-viewer', 'plan-tool-zone', 'plan-tool-wall']) {
      expect(await byTestId(page, tool).count()).toBe(0);
    }
    await shot(page, 'wide-reviewer-demo-plan');
    await page.context().close();
  });
});
