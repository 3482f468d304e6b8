/**
 * An installer on a phone (390 × 844) adds a test cylinder to the demo school bus, places it on
 * the top view beside the right front wheel where no mirror shows it, then moves the right
 * cross-view mirror back along the fender until the cylinder is seen.
 */
import type { Page } from 'playwright-core';
import { DEMO_SCHOOL_BUS } from '../../server/seeders/demo-vehicles';
import { PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs, openProjectNamed, waitForText, vehicleScreen } from './browser';

const product = productForFile();

/*
 * Plan points (metres, x forward of the bumper, y left) on the demo bus, found with the engine
 * (shared/vehicle scoreVehicle) while writing this test: a cylinder at CYLINDER_AT is seen by
 * neither cross-view mirror as seeded; with the right one moved from its seeded place back to
 * MIRROR_TO (same height and aim) it is.
 */
const CYLINDER_AT: [number, number] = [-1.6, -1.75];
const MIRROR_FROM = DEMO_SCHOOL_BUS.placements[1].positionM;
const MIRROR_TO: [number, number] = [-0.6, -1.3];

describe('an installer on a phone checks a test cylinder on the demo school bus', () => {
  let page: Page;
  let errors: string[];
  let projectId = 0;

  beforeAll(async () => {
    ({ page, errors } = await openPage(product, PHONE));
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('opens the demo school bus and adds a test cylinder from the details', async () => {
    await signInAs(page, product, 'installer');
    projectId = await openProjectNamed(page, product, DEMO_SCHOOL_BUS.name);
    await byTestId(page, 'vehicle-canvas').waitFor({ state: 'visible' });
    await byTestId(page, 'vehicle-drawer-toggle').click();
    await byTestId(page, 'vehicle-cylinder-add').scrollIntoViewIfNeeded();
    await byTestId(page, 'vehicle-cylinder-add').click();
    await byTestId(page, 'vehicle-cylinder-cyl-1').waitFor({ state: 'visible' });
    await shot(page, 'vehicle-bus-phone-cylinder-added');
  });

  it('places the cylinder on the top view beside the right front wheel, where no mirror shows it', async () => {
    await byTestId(page, 'vehicle-cylinder-place-cyl-1').click();
    await byTestId(page, 'vehicle-placing').waitFor({ state: 'visible' });
    const at = await vehicleScreen(page);
    const [px, py] = at(CYLINDER_AT);
    await page.mouse.click(px, py);
    await byTestId(page, 'vehicle-placing').waitFor({ state: 'detached' });
    await waitForText(page, 'plan-save-status', /^$/);
    await shot(page, 'vehicle-bus-phone-cylinder-placed');
    await byTestId(page, 'vehicle-drawer-toggle').click();
    await waitForText(page, 'vehicle-target-cyl-1', /Not seen in any mirror/);
    await byTestId(page, 'vehicle-cylinder-cyl-1').scrollIntoViewIfNeeded();
    await waitForText(page, 'vehicle-cylinder-seen-cyl-1', /^Not seen$/);
    await byTestId(page, 'vehicle-drawer-toggle').click();
  });

  it('moves the right cross-view mirror back along the fender, and the cylinder is seen', async () => {
    const before = await vehicleScreen(page);
    const [mx, my] = before(MIRROR_FROM);
    await page.mouse.move(mx, my);
    for (let i = 0; i < 3; i++) await page.mouse.wheel(0, -300);
    await page.waitForTimeout(300);
    const at = await vehicleScreen(page);
    const from = at(MIRROR_FROM);
    const to = at(MIRROR_TO);
    await page.mouse.move(from[0], from[1]);
    await page.mouse.down();
    for (let k = 1; k <= 8; k++) await page.mouse.move(from[0] + ((to[0] - from[0]) * k) / 8, from[1] + ((to[1] - from[1]) * k) / 8);
    await page.mouse.up();
    await waitForText(page, 'plan-save-status', /^$/);
    await shot(page, 'vehicle-bus-phone-mirror-moved');
    await byTestId(page, 'vehicle-drawer-toggle').click();
    await waitForText(page, 'vehicle-target-cyl-1', /^.*Seen/);
    await byTestId(page, 'vehicle-cylinder-cyl-1').scrollIntoViewIfNeeded();
    await waitForText(page, 'vehicle-cylinder-seen-cyl-1', /^Seen/);
    await shot(page, 'vehicle-bus-phone-cylinder-seen');
  });

  it('shows the bus with its cylinders and parts side by side on a wide screen', async () => {
    const wide = await openPage(product, WIDE);
    await signInAs(wide.page, product, 'installer');
    await wide.page.waitForURL(/\/projects/);
    await wide.page.goto(`${product.server.url}/projects/${projectId}`);
    await byTestId(wide.page, 'vehicle-cylinder-mark-cyl-1').waitFor({ state: 'attached' });
    await shot(wide.page, 'vehicle-bus-wide');
    await byTestId(wide.page, 'vehicle-parts').scrollIntoViewIfNeeded();
    await shot(wide.page, 'vehicle-bus-wide-parts');
    expect(wide.errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
    await wide.page.context().close();
  });

  it('logged no errors in the browser along the way', () => {
    expect(errors.filter((e) => !/Failed to load resource/.test(e))).toEqual([]);
  });
});
