/**
 * On a phone, an installer reshapes what they drew and leans on undo: draws a zone, renames it,
 * drags a corner, deletes a mirror and undoes that, aims the mirror at the zone, compares catalogue
 * mirrors for it and undoes the choice, and undoes a height typed in the mirror editor.
 */
import type { Page } from 'playwright-core';
import { PHONE, byTestId, openPage, shot, productForFile, signInAs, planGrid } from './browser';

const product = productForFile();

type PageDoc = { document: { querySelector(sel: string): { innerHTML: string } | null } };
type SavedProject = {
  project: {
    scene: { zones: { name: string; polygonM: [number, number][] }[] };
    placements: {
      id: number;
      label: string;
      positionM: [number, number];
      heightM: number;
      azimuthRad: number;
      tiltDownRad: number;
      viewerId: string | null;
      catalogueItemId: number | null;
    }[];
  };
};

const sharePct = async (page: Page, zoneId: string) =>
  Number(((await byTestId(page, `zone-pct-${zoneId}`).first().textContent()) ?? '').replace(/[^\d.]/g, ''));

describe('an installer on a phone edits what they drew and undoes a delete', () => {
  let page: Page;
  let errors: string[];
  let grid: Awaited<ReturnType<typeof planGrid>>;
  let projectId = '';
  let zoneId = '';
  const saved = async () => (await (await page.request.get(`${product.server.url}/api/projects/${projectId}`)).json()) as SavedProject;
  const drawerOpen = async (open: boolean) => {
    const isOpen = (await byTestId(page, 'plan-drawer-body').count()) > 0 && (await byTestId(page, 'plan-drawer-body').isVisible());
    if (isOpen !== open) await byTestId(page, 'drawer-toggle').click();
  };

  beforeAll(async () => {
    ({ page, errors } = await openPage(product, PHONE));
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('draws a zone on a new project', async () => {
    await signInAs(page, product, 'installer');
    await byTestId(page, 'projects-new').click();
    await byTestId(page, 'project-form-name').fill('Dock edits (demo)');
    await byTestId(page, 'project-form-submit').click();
    await page.waitForURL(/\/projects\/\d+$/);
    projectId = page.url().match(/projects\/(\d+)/)![1];
    await byTestId(page, 'plan-canvas').waitFor({ state: 'visible' });
    grid = await planGrid(page);
    await byTestId(page, 'plan-tool-zone').click();
    for (const [x, y] of [
      [-4, -1],
      [4, -1],
      [4, 2],
      [-4, 2],
    ])
      await grid.tap(grid.at(x, y));
    await byTestId(page, 'plan-zone-finish').click();
    await byTestId(page, 'plan-zone-save').click();
    await page.locator('[data-testid^="zone-pct-"]').first().waitFor({ state: 'attached' });
    zoneId = (await page.locator('[data-testid^="zone-pct-"]').first().getAttribute('data-testid'))!.replace('zone-pct-', '');
  });

  it('renames the zone in its editor', async () => {
    await drawerOpen(true);
    await byTestId(page, 'zone-name').fill('Dock crossing');
    await byTestId(page, 'zone-rename').click();
    await page.waitForFunction(
      (id) =>
        (globalThis as unknown as PageDoc).document.querySelector(`[data-testid="zone-label-${id}"]`)?.innerHTML.includes('Dock crossing'),
      zoneId,
      {
        timeout: 10_000,
      },
    );
    await shot(page, 'phone-zone-editor');
    await drawerOpen(false);
  });

  it('drags a corner of the selected zone and the new outline is saved', async () => {
    const corner = (await byTestId(page, 'plan-corner-2').boundingBox())!;
    const from: [number, number] = [corner.x + corner.width / 2, corner.y + corner.height / 2];
    const to = grid.px(grid.at(3, 3.5));
    const patched = page.waitForResponse(
      (r) => r.request().method() === 'PATCH' && r.url().endsWith(`/api/projects/${projectId}`) && r.ok(),
      { timeout: 15_000 },
    );
    await page.mouse.move(...from);
    await page.mouse.down();
    for (let i = 1; i <= 8; i++) await page.mouse.move(from[0] + ((to[0] - from[0]) * i) / 8, from[1] + ((to[1] - from[1]) * i) / 8);
    await page.mouse.up();
    await patched;
    const zone = (await saved()).project.scene.zones[0];
    expect(zone.name).toBe('Dock crossing');
    const moved = zone.polygonM[2];
    const target = grid.at(3, 3.5);
    // Within a pixel or two of where the finger let go (the plan rounds to the millimetre).
    expect(Math.hypot(moved[0] - target[0], moved[1] - target[1])).toBeLessThan(0.3);
    await shot(page, 'phone-zone-corner-dragged');
  });

  it('deletes a mirror at once and Undo brings it back with the same values', async () => {
    await byTestId(page, 'plan-tool-viewer').click();
    await grid.tap(grid.at(-5, 5));
    await byTestId(page, 'plan-tool-mirror').click();
    await grid.tap(grid.at(0, -2.5));
    await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached' });
    const before = (await saved()).project.placements;
    expect(before).toHaveLength(1);
    await drawerOpen(false);
    await byTestId(page, 'plan-delete').click();
    await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'detached' });
    expect((await saved()).project.placements).toHaveLength(0);
    await byTestId(page, 'plan-undo').click();
    await page.locator('[data-testid^="placement-marker-"]').first().waitFor({ state: 'attached', timeout: 15_000 });
    const back = (await saved()).project.placements;
    expect(back).toHaveLength(1);
    const { id: _a, ...was } = before[0];
    const { id: _b, ...now } = back[0];
    expect(pick(now)).toEqual(pick(was));
    await shot(page, 'phone-mirror-undone');
  });

  it('aims the mirror at the zone and the zone’s share rises', async () => {
    const shareBefore = await sharePct(page, zoneId);
    await page.locator('[data-testid^="placement-marker-"]').first().click({ force: true });
    await drawerOpen(true);
    await byTestId(page, 'aim-at-zone-run').click();
    const outcome = byTestId(page, 'aim-at-zone-outcome');
    await outcome.waitFor({ timeout: 30_000 });
    expect(await outcome.textContent()).toContain('→');
    await page.waitForFunction(
      ([id, b]) =>
        Number(
          ((globalThis as unknown as PageDoc).document.querySelector(`[data-testid="zone-pct-${id}"]`)?.innerHTML ?? '').replace(
            /<[^>]*>|[^\d.]/g,
            '',
          ),
        ) > Number(b),
      [zoneId, String(shareBefore)] as const,
      { timeout: 15_000 },
    );
    expect(await sharePct(page, zoneId)).toBeGreaterThan(shareBefore);
    await shot(page, 'phone-aimed-at-zone');
  });

  it('compares catalogue mirrors for the zone, puts another in place, and Undo puts the first back', async () => {
    const was = (await saved()).project.placements[0].catalogueItemId;
    await drawerOpen(true);
    await byTestId(page, 'size-for-zone-run').click();
    await byTestId(page, 'size-for-zone-choices').waitFor({ timeout: 30_000 });
    await byTestId(page, 'size-for-zone-choices').scrollIntoViewIfNeeded();
    await shot(page, 'phone-compare-mirrors');
    const uses = page.locator('[data-testid^="size-choice-use-"]');
    const ids: string[] = [];
    for (let i = 0; i < (await uses.count()); i++) ids.push((await uses.nth(i).getAttribute('data-testid'))!);
    expect(ids.length).toBeGreaterThan(1);
    const other = ids.find((id) => id !== `size-choice-use-${was}`)!;
    const chosen = page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/placements\//.test(r.url()) && r.ok(), {
      timeout: 15_000,
    });
    await byTestId(page, other).click();
    await chosen;
    expect((await saved()).project.placements[0].catalogueItemId).toBe(Number(other.replace('size-choice-use-', '')));
    await drawerOpen(false);
    const undone = page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/placements\//.test(r.url()) && r.ok(), {
      timeout: 15_000,
    });
    await byTestId(page, 'plan-undo').click();
    await undone;
    expect((await saved()).project.placements[0].catalogueItemId).toBe(was);
  });

  it('types a new height in the mirror editor, and Undo puts back the height from before the typing', async () => {
    const before = (await saved()).project.placements[0].heightM;
    await drawerOpen(true);
    const field = byTestId(page, 'placement-height');
    await field.waitFor({ state: 'visible' });
    const typed = page.waitForResponse(
      (r) => r.request().method() === 'PATCH' && /\/placements\//.test(r.url()) && (r.request().postData() ?? '').includes('4.2'),
      { timeout: 15_000 },
    );
    // Keystroke by keystroke, as a thumb types: each is a change; together they are one step to undo.
    await field.fill('');
    await field.pressSequentially('4.2', { delay: 60 });
    await field.blur();
    expect((await typed).ok()).toBe(true);
    expect((await saved()).project.placements[0].heightM).toBe(4.2);
    await drawerOpen(false);
    const undone = page.waitForResponse((r) => r.request().method() === 'PATCH' && /\/placements\//.test(r.url()) && r.ok(), {
      timeout: 15_000,
    });
    await byTestId(page, 'plan-undo').click();
    await undone;
    expect((await saved()).project.placements[0].heightM).toBe(before);
  });

  it('logged no errors in the browser along the way', () => {
    expect(errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
  });
});

/** The values a mirror is set out by (its id, version and dates are the server's). */
function pick(p: Omit<SavedProject['project']['placements'][number], 'id'>) {
  return {
    label: p.label,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: p.azimuthRad,
    tiltDownRad: p.tiltDownRad,
    viewerId: p.viewerId,
    catalogueItemId: p.catalogueItemId,
  };
}
