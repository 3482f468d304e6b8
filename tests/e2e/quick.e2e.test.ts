/**
 * An installer on a phone (390 × 844), signed in on the home screen, answers "which mirror, how
 * high, pointed where?" for a blind corner with quick sizing, counting every tap and keystroke,
 * then saves the answer as a job and finds it on the server with the mirror placed.
 */
import type { Locator, Page } from 'playwright-core';
import { PHONE, WIDE, byTestId, openPage, shot, productForFile, signInAs } from './browser';

const product = productForFile();

/** Every tap and key press the person makes, counted as the test makes them. */
class Thumb {
  taps = 0;
  keys = 0;
  constructor(private readonly page: Page) {}
  async tap(target: Locator): Promise<void> {
    this.taps += 1;
    await target.click();
  }
  /** Tap the field, delete what it holds one key at a time, type the value. */
  async enter(target: Locator, text: string): Promise<void> {
    await this.tap(target);
    const held = (await target.inputValue()).length;
    for (let i = 0; i < held; i++) await this.page.keyboard.press('End').then(() => this.page.keyboard.press('Backspace'));
    this.keys += held;
    await this.page.keyboard.type(text);
    this.keys += text.length;
  }
}

describe('quick sizing on a phone', () => {
  let page: Page;
  let errors: string[];
  const thumb = (p: Page) => new Thumb(p);
  let t: Thumb;

  beforeAll(async () => {
    ({ page, errors } = await openPage(product, PHONE));
    t = thumb(page);
    await signInAs(page, product, 'installer');
    await page.waitForURL(/\/projects$/);
  });
  afterAll(async () => {
    await page?.context().close();
  });

  it('goes from the home screen to a sized, aimed mirror with its fan and share in at most 8 taps', async () => {
    const started = Date.now();
    await t.tap(byTestId(page, 'nav-quick'));
    await page.waitForURL(/\/quick$/);
    // A basement corner as measured with a tape: 2.8 m passage, 3.5 m crossing aisle, 12 m to see, mirror at 3 m.
    await t.enter(byTestId(page, 'quick-passageWidthM'), '2.8');
    await t.enter(byTestId(page, 'quick-openingWidthM'), '3.5');
    await t.enter(byTestId(page, 'quick-depthM'), '12');
    await t.enter(byTestId(page, 'quick-mirrorHeightM'), '3');
    const first = byTestId(page, 'quick-option-1');
    await first.waitFor({ timeout: 30_000 });
    await page.waitForSelector('[data-testid="quick-answers"][aria-busy="false"]', { timeout: 30_000 });
    expect(await byTestId(page, 'quick-option-1-share').textContent()).toMatch(/^Sees \d+ %$/);
    expect(await byTestId(page, 'quick-option-1-aim').textContent()).toMatch(
      /^At 3\.00 m\. (Turn \d+° from square toward the (viewer|opening)|Square to the wall), tilt \d+° down\.$/,
    );
    expect(await byTestId(page, 'quick-option-1-sketch-fan').getAttribute('d')).toMatch(/^M[\d.]+,[\d.]+L/);
    await t.tap(first);
    await byTestId(page, 'placement-elevation').waitFor();
    const seconds = (Date.now() - started) / 1000;
    console.log(`quick sizing, phone: ${t.taps} taps, ${t.keys} keystrokes, ${seconds.toFixed(1)} s driven by the test`);
    expect(t.taps).toBeLessThanOrEqual(8);
    expect(await byTestId(page, 'safety-cautions').count()).toBeGreaterThan(0);
    await shot(page, 'quick-phone-answer');
    await byTestId(page, 'placement-elevation').scrollIntoViewIfNeeded();
    await shot(page, 'quick-phone-side-view');
  });

  it('saves the answer as a job that the server holds with the scene and the mirror placed', async () => {
    await t.tap(byTestId(page, 'quick-save'));
    await page.waitForURL(/\/projects\/\d+$/, { timeout: 30_000 });
    const id = Number(/\/projects\/(\d+)$/.exec(page.url())![1]);
    const res = await page.request.get(`${product.server.url}/api/projects/${id}`);
    expect(res.status()).toBe(200);
    const { project } = (await res.json()) as {
      project: {
        name: string;
        scene: { zones: { polygonM: [number, number][] }[]; walls: { id: string; aM: [number, number] }[] };
        placements: { heightM: number; positionM: [number, number] }[];
      };
    };
    expect(project.name).toMatch(/^Blind corner /);
    // The passage wall, the corner's near side, and the far side of the 2.8 m passage the mirror hangs on.
    expect(project.scene.walls.map((w) => w.id)).toEqual(['passage', 'near-side', 'far-side-of-passage']);
    expect(project.scene.walls[2].aM[1]).toBe(2.8);
    expect(project.scene.zones[0].polygonM).toContainEqual([3.5, -12]);
    expect(project.placements).toHaveLength(1);
    expect(project.placements[0].heightM).toBe(3);
    // Its vertex stands just off that wall's face (its back on the wall).
    expect(project.placements[0].positionM[1]).toBeLessThan(2.8);
    expect(project.placements[0].positionM[1]).toBeGreaterThan(2.3);
    await byTestId(page, 'nav-projects').click();
    await page.getByText(project.name).first().waitFor();
    // Before signing in the app asks who is signed in and is told 401; that is not an error.
    expect(errors.filter((e) => !/401/.test(e))).toEqual([]);
  });

  it('lays the same screen out on a wide screen', async () => {
    const wide = await openPage(product, WIDE);
    await signInAs(wide.page, product, 'installer');
    await wide.page.waitForURL(/\/projects$/);
    await byTestId(wide.page, 'nav-quick').click();
    await byTestId(wide.page, 'quick-option-1').click({ timeout: 30_000 });
    await byTestId(wide.page, 'placement-elevation').waitFor();
    await shot(wide.page, 'quick-wide-answer');
    expect(wide.errors.filter((e) => !/401/.test(e))).toEqual([]);
    await wide.page.context().close();
  });
});
