/**
 * An installer on a phone (390 × 844) sets up a truck job from a preset, fits a close-proximity
 * mirror that leaves the class V field short of the EU retrofit rule's 85 %, moves it until the
 * field passes, and finds the field's share and verdict in the sheet's text.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import type { Page } from 'playwright-core';
import { ARTIFACTS, PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs, textOf, waitForText, vehicleScreen } from './browser';

const product = productForFile();

/*
 * The two mirror positions (vehicle plan metres, x forward of the bumper, y left) on the rigid
 * truck preset, left-hand drive, with the class V mirror's starting aim from the first tap. Found
 * with the engine (shared/vehicle scoreVehicle) while writing this test: ahead of the cab's
 * passenger corner the mirror shows about 81 % of the class V field, beside it about 96 %.
 */
const SHORT_AT: [number, number] = [0.05, -1.1];
const PASSES_AT: [number, number] = [0.05, -1.4];

describe('an installer on a phone fits a truck with a close-proximity mirror', () => {
  let page: Page;
  let errors: string[];
  let projectId = '';
  let mirrorId = '';
  let passShare = '';

  beforeAll(async () => {
    ({ page, errors } = await openPage(product, PHONE));
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('creates a rigid truck job from its preset and lands on the top view with its fields', async () => {
    await signInAs(page, product, 'installer');
    await byTestId(page, 'projects-new').click();
    await byTestId(page, 'project-form-kind-vehicle').click();
    await byTestId(page, 'project-form-name').fill('Delivery truck 14 (demo)');
    await byTestId(page, 'vehicle-kind-rigid-truck').click();
    // The preset's length, as the installer would check it with a tape.
    expect(await byTestId(page, 'vehicle-lengthM').inputValue()).toMatch(/^10(\.0+)? m$/);
    await shot(page, 'vehicle-phone-form');
    await byTestId(page, 'vehicle-eyeHeightM').scrollIntoViewIfNeeded();
    await shot(page, 'vehicle-phone-form-eye');
    await byTestId(page, 'project-form-submit').click();
    await page.waitForURL(/\/projects\/\d+$/);
    projectId = page.url().match(/projects\/(\d+)/)![1];
    await byTestId(page, 'vehicle-canvas').waitFor({ state: 'visible' });
    await byTestId(page, 'vehicle-field-un-v-right').waitFor({ state: 'attached' });
    await expect(byTestId(page, 'vehicle-drawer-caution').isVisible()).resolves.toBe(true);
    await shot(page, 'vehicle-phone-empty');
  });

  it('adds a close-proximity mirror ahead of the cab, and the class V field is short', async () => {
    await byTestId(page, 'vehicle-add-mirror').click();
    await byTestId(page, 'vehicle-add-class-V').click();
    const at = await vehicleScreen(page);
    const [px, py] = at(SHORT_AT);
    await page.mouse.click(px, py);
    const marker = page.locator('[data-testid^="vehicle-marker-"]');
    await marker.first().waitFor({ state: 'attached' });
    expect(await marker.count()).toBe(1);
    mirrorId = (await marker.first().getAttribute('data-testid'))!.replace('vehicle-marker-', '');
    await waitForText(page, 'vehicle-drawer-numbers', /V passenger [\d.]+ % short/);
    await shot(page, 'vehicle-phone-short');
  });

  it('moves the mirror beside the cab until the class V field passes', async () => {
    // Zoom in about the mirror first, as a person would, so the move is more than a tap.
    const before = await vehicleScreen(page);
    const [mx, my] = before(SHORT_AT);
    await page.mouse.move(mx, my);
    for (let i = 0; i < 3; i++) await page.mouse.wheel(0, -300);
    await page.waitForTimeout(300);
    const at = await vehicleScreen(page);
    const from = at(SHORT_AT);
    const to = at(PASSES_AT);
    expect(Math.hypot(to[0] - from[0], to[1] - from[1])).toBeGreaterThan(10);
    await page.mouse.move(from[0], from[1]);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(from[0] + ((to[0] - from[0]) * k) / 8, from[1] + ((to[1] - from[1]) * k) / 8);
    await page.mouse.up();
    await waitForText(page, 'vehicle-drawer-numbers', /V passenger [\d.]+ % pass/);
    passShare = (await textOf(page, 'vehicle-drawer-numbers')).match(/V passenger ([\d.]+ %) pass/)![1];
    await waitForText(page, 'plan-save-status', /^$/);
    await shot(page, 'vehicle-phone-passes');
  });

  it('shows the field list with rule, class, mark and verdict, and the cautions, in the drawer', async () => {
    await byTestId(page, 'vehicle-drawer-toggle').click();
    const row = await textOf(page, 'vehicle-field-row-un-v-right');
    expect(row).toContain('UN Regulation No. 46');
    expect(row).toContain('class V');
    expect(row).toMatch(/\[M\] from memory, fairly sure/);
    expect(row).toMatch(/[\d.]+ %/);
    expect(row).toContain('Pass');
    await expect(byTestId(page, 'vehicle-planning-line').isVisible()).resolves.toBe(true);
    await expect(byTestId(page, 'safety-cautions').isVisible()).resolves.toBe(true);
    await shot(page, 'vehicle-phone-drawer');
    await byTestId(page, 'vehicle-mirror-editor').scrollIntoViewIfNeeded();
    await shot(page, 'vehicle-phone-mirror');
    await byTestId(page, 'vehicle-side-view').scrollIntoViewIfNeeded();
    await shot(page, 'vehicle-phone-side');
  });

  it('finds the class V field, its share and its verdict in the sheet’s text', async () => {
    const issued = await page.request.post(`${product.server.url}/api/projects/${projectId}/sheet/revisions`, {
      headers: { origin: product.server.url },
    });
    expect(issued.status()).toBeLessThan(300);
    const pdf = await page.request.get(`${product.server.url}/api/projects/${projectId}/sheet.pdf`);
    expect(pdf.status()).toBe(200);
    const raw = execFileSync('/usr/bin/pdftotext', ['-', '-'], { input: await pdf.body(), encoding: 'utf8' });
    fs.writeFileSync(path.join(ARTIFACTS, 'vehicle-sheet.txt'), raw);
    const text = raw.replace(/\s+/g, ' ');
    // The sheet's field-by-field sentence (server/pdf/vehicle-sheet.ts), with the share the phone showed;
    // 85 % is the EU retrofit rule's class V pass mark (Directive 2007/38/EC).
    const m = text.match(
      /Class V \(close-proximity\), passenger side — class V, UN Regulation No\. 46: ([\d.]+ %) seen, 85 % needed, (pass|short)\./,
    );
    expect(m).not.toBeNull();
    expect(m![1]).toBe(passShare);
    expect(m![2]).toBe('pass');
  });

  it('shows the same job side by side on a wide screen', async () => {
    const wide = await openPage(product, WIDE);
    await signInAs(wide.page, product, 'installer');
    await wide.page.waitForURL(/\/projects/);
    await wide.page.goto(`${product.server.url}/projects/${projectId}`);
    await byTestId(wide.page, 'vehicle-canvas').waitFor({ state: 'visible' });
    await byTestId(wide.page, `vehicle-marker-${mirrorId}`).waitFor({ state: 'attached' });
    await expect(byTestId(wide.page, 'vehicle-planning-line').isVisible()).resolves.toBe(true);
    await expect(byTestId(wide.page, 'vehicle-field-row-un-v-right').isVisible()).resolves.toBe(true);
    await shot(wide.page, 'vehicle-wide');
    expect(wide.errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
    await wide.page.context().close();
  });

  it('logged no errors in the browser along the way', () => {
    // Before signing in the app asks who is signed in and is told 401; that is not an error.
    expect(errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
  });
});
