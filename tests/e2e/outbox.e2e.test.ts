/**
 * A sheet e-mailed to a buyer, read by the demo admin in the Outbox on a phone: the page describes
 * it, its attachment line stays within the screen, the attachment opens (downloads) the PDF, and
 * the scroll area is reachable from the keyboard.
 */
import { PHONE, byTestId, openPage, shot, productForFile, signInAs } from './browser';

const product = productForFile();

/** The page's document, typed without the DOM library (the e2e tests compile with the server's tsconfig). */
type PageDoc = { document: { documentElement: { scrollWidth: number }; activeElement: unknown } };

describe('a sheet e-mail in the outbox on a phone', () => {
  it('is described, fits the screen, opens its PDF and can be scrolled from the keyboard', async () => {
    // The installer e-mails the demo project's sheet (through the API, as the app's form does).
    const { page: installer } = await openPage(product, PHONE);
    await signInAs(installer, product, 'installer');
    await byTestId(installer, 'nav-projects').first().waitFor({ state: 'visible' });
    const sent = await installer.evaluate(async () => {
      const list = (await (await fetch('/api/projects', { credentials: 'include' })).json()) as { projects: { id: number }[] };
      const res = await fetch(`/api/projects/${list.projects[0].id}/sheet/email`, {
        method: 'POST',
        credentials: 'include',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ to: 'buyer.desk@purchasing-demo.example' }),
      });
      return (await res.json()) as { filename: string };
    });
    expect(sent.filename).toMatch(/-a4\.pdf$/);
    await installer.context().close();

    const { page } = await openPage(product, PHONE);
    await signInAs(page, product, 'admin');
    await byTestId(page, 'nav-outbox').first().click();
    await page
      .getByText(/specification sheets sent to buyers/)
      .first()
      .waitFor({ state: 'visible' });
    const attachment = page.getByRole('button', { name: new RegExp(`^Open ${sent.filename.replace(/\./g, '\\.')}`) }).first();
    await attachment.waitFor({ state: 'visible' });
    await shot(page, 'phone-admin-outbox-sheet');

    // Nothing pushes the page sideways: the attachment line wraps within the screen.
    const box = await attachment.boundingBox();
    expect(box!.x + box!.width).toBeLessThanOrEqual(PHONE.width);
    expect(await page.evaluate(() => (globalThis as unknown as PageDoc).document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      PHONE.width,
    );

    // The scroll area takes keyboard focus (then arrow keys scroll it).
    const region = page.getByRole('region', { name: 'Outbox messages' });
    await region.focus();
    expect(await region.evaluate((el) => el === (globalThis as unknown as PageDoc).document.activeElement)).toBe(true);

    const download = page.waitForEvent('download');
    await attachment.click();
    expect((await download).suggestedFilename()).toBe(sent.filename);
    await page.context().close();
  });
});
