import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, DEMO_USERS } from '../../server/seeders/demo';
import { PHONE, WIDE, byTestId, openPage, shot, signIn, startProduct, type Product } from './browser';

let product: Product;
beforeAll(async () => {
  product = await startProduct();
});
afterAll(async () => {
  await product?.close();
});

const installer = DEMO_USERS.find((u) => u.role === 'installer')!;
const reviewer = DEMO_USERS.find((u) => u.role === 'reviewer')!;

/**
 * A drawing grid laid over the middle of whatever the plan shows: `at(x, y)` turns grid units
 * around the centre into plan metres, and `tap` clicks there using the transform the canvas
 * publishes (scale, offsets). The grid keeps clear of the toolbars that float over the plan's
 * edges, whatever the screen size.
 */
async function planGrid(page: Page) {
  const svg = byTestId(page, 'plan-canvas');
  await page.waitForSelector('[data-testid="plan-canvas"][data-transform]', { state: 'attached' });
  const [scale, offX, offY] = (await svg.getAttribute('data-transform'))!.split(' ').map(Number);
  const box = (await svg.boundingBox())!;
  const unitPx = Math.min(box.width / 14, box.height / 16);
  const cx = (box.width / 2 - offX) / scale;
  const cy = (offY - box.height * 0.45) / scale;
  const unitM = Math.round((unitPx / scale) * 10) / 10;
  const at = (x: number, y: number): [number, number] => [cx + x * unitM, cy + y * unitM];
  const tap = async ([xM, yM]: [number, number]) => {
    await page.mouse.click(box.x + offX + xM * scale, box.y + offY - yM * scale);
    await page.waitForTimeout(150);
  };
  return { at, tap, unitM };
}

async function attr(page: Page, testId: string, name: string): Promise<string> {
  return (await byTestId(page, testId).first().getAttribute(name)) ?? '';
}

async function onlyPlacementId(page: Page): Promise<string> {
  await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
  const ids = await page.locator('[data-testid^="placement-marker-"]').evaluateAll((els) => els.map((e) => e.getAttribute('data-testid')!.replace('placement-marker-', '')));
  expect(ids).toHaveLength(1);
  return ids[0];
}

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
] as const)('an installer on a %s screen', (sizeName, size) => {
  it('sets up a site from nothing, sees the fan and the zone percentage, and finds it all saved after a reload', async () => {
    const { page, errors } = await openPage(product, size);
    await signIn(page, product.server.url, installer.email, DEMO_PASSWORD);
    await byTestId(page, 'projects-new').click();
    await byTestId(page, 'project-form-name').fill(`Aisle crossing ${sizeName}`);
    await byTestId(page, 'project-form-customer').fill('Northgate Foods (demo)');
    await byTestId(page, 'project-form-submit').click();
    await page.waitForURL(/\/projects\/\d+$/);
    await byTestId(page, 'plan-canvas').waitFor({ state: 'visible' });

    const grid = await planGrid(page);
    // A racking run along the south side of the crossing.
    await byTestId(page, 'plan-tool-wall').click();
    await byTestId(page, 'plan-wall-kind-racking').click();
    await grid.tap(grid.at(-6, -2));
    await grid.tap(grid.at(6, -2));

    // The zone that must be seen.
    await byTestId(page, 'plan-tool-zone').click();
    for (const [x, y] of [[-4, -1.4], [4, -1.4], [4, 1.5], [-4, 1.5]]) await grid.tap(grid.at(x, y));
    await byTestId(page, 'plan-zone-finish').click();
    await byTestId(page, 'plan-zone-name').fill('Crossing');
    await byTestId(page, 'plan-zone-save').click();
    const zoneId = (await page.locator('[data-testid^="zone-pct-"]').first().getAttribute('data-testid'))!.replace('zone-pct-', '');

    // The driver, then a mirror across the crossing from them.
    await byTestId(page, 'plan-tool-viewer').click();
    await grid.tap(grid.at(0, 5));
    await byTestId(page, 'plan-tool-mirror').click();
    await grid.tap(grid.at(0, -1.7));
    const placementId = await onlyPlacementId(page);
    const fanId = `placement-fan-${placementId}`;
    await byTestId(page, fanId).waitFor({ state: 'attached' });
    const fanBefore = await attr(page, fanId, 'd');
    expect(fanBefore.length).toBeGreaterThan(20);
    const pctBefore = await byTestId(page, `zone-pct-${zoneId}`).first().textContent();
    expect(pctBefore).toMatch(/\d+\s?%/);
    await shot(page, `${sizeName}-plan-new-project`);

    // Change the height; the numbers and the fan follow.
    await byTestId(page, 'placement-editor').waitFor({ state: 'visible' });
    const rangeBefore = await byTestId(page, 'numbers-range-adult-recognise').first().textContent();
    await byTestId(page, 'placement-height').fill('4.5 m');
    await byTestId(page, 'placement-height').press('Enter');
    // Runs in the page (a function, not a string: the app's CSP forbids eval): the fan's outline
    // has been redrawn for the new height.
    type PageDoc = { document: { querySelector(sel: string): { getAttribute(name: string): string | null } | null } };
    await page.waitForFunction(
      ([id, before]) => (globalThis as unknown as PageDoc).document.querySelector(`[data-testid="${id}"]`)?.getAttribute('d') !== before,
      [fanId, fanBefore] as const,
      { timeout: 15_000 },
    );
    expect(await byTestId(page, 'numbers-range-adult-recognise').first().textContent()).not.toBe(rangeBefore);
    await byTestId(page, 'placement-save-status').filter({ hasText: /All changes saved/ }).first().waitFor({ timeout: 15_000 });
    await shot(page, `${sizeName}-plan-height-changed`);

    // On a wide screen, turn the mirror with its aim handle: the fan swings and the aim is saved.
    let aimedAzimuth: number | null = null;
    if (sizeName === 'wide') {
      const before = await attr(page, fanId, 'd');
      const handle = (await byTestId(page, 'aim-handle').first().boundingBox())!;
      const hx = handle.x + handle.width / 2;
      const hy = handle.y + handle.height / 2;
      await page.mouse.move(hx, hy);
      await page.mouse.down();
      for (let i = 1; i <= 8; i++) await page.mouse.move(hx + i * 8, hy + i * 3);
      await page.mouse.up();
      await page.waitForFunction(
        ([id, b]) => (globalThis as unknown as PageDoc).document.querySelector(`[data-testid="${id}"]`)?.getAttribute('d') !== b,
        [fanId, before] as const,
        { timeout: 15_000 },
      );
      const projectNow = page.url().match(/projects\/(\d+)/)![1];
      const savedAzimuth = async () => (await (await page.request.get(`${product.server.url}/api/projects/${projectNow}`)).json()).project.placements[0].azimuthRad as number;
      const until = Date.now() + 15_000;
      while (Math.abs((await savedAzimuth()) - Math.PI / 2) < 1e-3 && Date.now() < until) await page.waitForTimeout(200);
      aimedAzimuth = await savedAzimuth();
      expect(Math.abs(aimedAzimuth - Math.PI / 2)).toBeGreaterThan(0.05);
      await shot(page, 'wide-plan-aimed');
    }

    await page.reload();
    await byTestId(page, 'plan-canvas').waitFor({ state: 'visible' });
    await byTestId(page, `zone-label-${zoneId}`).first().waitFor({ state: 'attached' });
    expect(await byTestId(page, `zone-label-${zoneId}`).first().textContent()).toContain('Crossing');
    await byTestId(page, fanId).waitFor({ state: 'attached' });
    expect((await attr(page, fanId, 'd')).length).toBeGreaterThan(20);
    const projectId = page.url().match(/projects\/(\d+)/)![1];
    const saved = await (await page.request.get(`${product.server.url}/api/projects/${projectId}`)).json();
    expect(saved.project.placements).toHaveLength(1);
    expect(saved.project.placements[0].heightM).toBeCloseTo(4.5, 9);
    expect(saved.project.scene.walls).toHaveLength(1);
    expect(saved.project.scene.walls[0].kind).toBe('racking');
    if (aimedAzimuth !== null) expect(saved.project.placements[0].azimuthRad).toBeCloseTo(aimedAzimuth, 9);
    expect(await page.locator('[data-testid^="viewer-marker-"]').count()).toBe(1);
    expect(errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
    await page.context().close();
  });
});

describe('a safety officer on a wide screen', () => {
  it('reads the demo project with its zone percentages but cannot change it', async () => {
    const { page } = await openPage(product, WIDE);
    await signIn(page, product.server.url, reviewer.email, DEMO_PASSWORD);
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
