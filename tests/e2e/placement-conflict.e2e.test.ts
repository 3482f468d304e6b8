/**
 * Two tabs on one mirror: one changes its height, the other its tilt. Whatever the order, no edit
 * may be lost without the person being told and shown both versions.
 */
import type { Page } from 'playwright-core';
import type { PlacementDto, ProjectDto } from '../../shared/schemas';
import { WIDE, byTestId, openPage, shot, productForFile, signInAs } from './browser';

const product = productForFile();

const DEG = Math.PI / 180;

async function openDemoMirror(page: Page): Promise<{ projectId: number; placementId: number }> {
  await signInAs(page, product, 'installer');
  await page.getByText('Cold store aisles and dock (demo)').first().click();
  await page.waitForURL(/\/projects\/\d+$/);
  const projectId = Number(new URL(page.url()).pathname.split('/').pop());
  // The round panel on the rack's end face: its tilt can change within the mounting rule (the
  // junction's half dome sits with its flat faces on a column and keeps its mounting tilt).
  const row = page.locator('[data-testid^="summary-placement-"]', { hasText: 'M2 dock corner' }).first();
  const placementId = Number((await row.getAttribute('data-testid'))!.replace('summary-placement-', ''));
  await row.click();
  await byTestId(page, 'placement-height').waitFor({ state: 'visible' });
  return { projectId, placementId };
}

async function savedPlacement(page: Page, projectId: number, placementId: number): Promise<PlacementDto> {
  const res = await page.request.get(`${product.server.url}/api/projects/${projectId}`);
  const project = (await res.json()).project as ProjectDto;
  return project.placements.find((p) => p.id === placementId)!;
}

async function typeInto(page: Page, testId: string, text: string) {
  await byTestId(page, testId).fill(text);
  await byTestId(page, testId).press('Tab');
}

const status = (page: Page) => byTestId(page, 'placement-save-status');

describe('two tabs editing one mirror', () => {
  let a: Page;
  let b: Page;
  let ids: { projectId: number; placementId: number };
  let before: PlacementDto;

  beforeAll(async () => {
    a = (await openPage(product, WIDE)).page;
    b = (await openPage(product, WIDE)).page;
    ids = await openDemoMirror(a);
    await openDemoMirror(b);
    before = await savedPlacement(a, ids.projectId, ids.placementId);
  });

  it('step 1: the first tab saves a new height', async () => {
    await typeInto(a, 'placement-height', '3.35 m');
    await byTestId(a, 'placement-save').click();
    await status(a).filter({ hasText: 'All changes saved.' }).waitFor();
    expect((await savedPlacement(a, ids.projectId, ids.placementId)).heightM).toBeCloseTo(3.35, 6);
  });

  it('step 2: the second tab changes the tilt and is told, with both versions, that the mirror changed', async () => {
    await typeInto(b, 'placement-tilt', '17°');
    await byTestId(b, 'placement-save').click();
    await byTestId(b, 'placement-conflict').waitFor({ state: 'visible' });
    await expect(byTestId(b, 'placement-conflict-mine-values').textContent()).resolves.toMatch(/tilt 17/);
    await expect(byTestId(b, 'placement-conflict-theirs-values').textContent()).resolves.toMatch(/Saved now: tilt/);
    await expect(status(b).textContent()).resolves.toBe('Not saved: changed elsewhere.');
    await byTestId(b, 'placement-conflict').scrollIntoViewIfNeeded();
    await shot(b, 'wide-placement-conflict');
  });

  it('step 3: a later change in the second tab is kept, not dropped, while the conflict waits', async () => {
    await typeInto(b, 'placement-notes', 'Checked from the second tab');
    await expect(byTestId(b, 'placement-conflict-mine-values').textContent()).resolves.toMatch(/notes “Checked from the second tab”/);
    const saved = await savedPlacement(b, ids.projectId, ids.placementId);
    expect(saved.tiltDownRad).toBeCloseTo(before.tiltDownRad, 9);
    expect(saved.notes).toBe(before.notes);
  });

  it('step 4: choosing "Save mine over it" in the second tab keeps the tilt and the notes on top of the first tab’s height', async () => {
    await byTestId(b, 'placement-conflict-keep').click();
    await status(b).filter({ hasText: 'All changes saved.' }).waitFor();
    const saved = await savedPlacement(b, ids.projectId, ids.placementId);
    expect(saved.heightM).toBeCloseTo(3.35, 6);
    expect(saved.tiltDownRad).toBeCloseTo(17 * DEG, 6);
    expect(saved.notes).toBe('Checked from the second tab');
    await byTestId(b, 'placement-save').scrollIntoViewIfNeeded();
    await shot(b, 'wide-placement-after-conflict');
    // The editor's buttons sit below the cautions, never over them.
    const cautions = (await b.locator('[data-testid="placement-editor"] [data-testid="safety-cautions"]').boundingBox())!;
    const saveButton = (await byTestId(b, 'placement-save').boundingBox())!;
    expect(saveButton.y).toBeGreaterThanOrEqual(cautions.y + cautions.height);
  });

  it('step 5: the first tab, now behind, is told too when it changes the height again, and can take the saved values', async () => {
    await typeInto(a, 'placement-height', '3.6 m');
    await byTestId(a, 'placement-save').click();
    await byTestId(a, 'placement-conflict').waitFor({ state: 'visible' });
    await expect(byTestId(a, 'placement-conflict-mine-values').textContent()).resolves.toMatch(/height 3\.60 m/);
    await expect(byTestId(a, 'placement-conflict-theirs-values').textContent()).resolves.toMatch(/height 3\.35 m/);
    await byTestId(a, 'placement-conflict-theirs').click();
    await byTestId(a, 'placement-conflict').waitFor({ state: 'detached' });
    // The first tab now shows the second tab's tilt: nothing either person chose is lost.
    await expect(byTestId(a, 'placement-tilt').inputValue()).resolves.toMatch(/^17/);
    const saved = await savedPlacement(a, ids.projectId, ids.placementId);
    expect(saved.heightM).toBeCloseTo(3.35, 6);
    expect(saved.tiltDownRad).toBeCloseTo(17 * DEG, 6);
  });
});
