import { DEMO_PASSWORD, DEMO_USERS } from '../../server/seeders/demo';
import { PHONE, WIDE, byTestId, openPage, shot, signIn, productForFile, signInAs, demoUser } from './browser';

const product = productForFile();

const NAV: Record<string, { shown: string[]; hidden: string[] }> = {
  installer: { shown: ['nav-projects', 'nav-quick', 'nav-catalogue', 'nav-account'], hidden: ['nav-users', 'nav-outbox', 'nav-reviews'] },
  reviewer: { shown: ['nav-reviews', 'nav-projects', 'nav-catalogue', 'nav-account'], hidden: ['nav-users', 'nav-outbox'] },
  admin: { shown: ['nav-users', 'nav-outbox', 'nav-projects', 'nav-catalogue', 'nav-account'], hidden: ['nav-reviews'] },
};

const sizes = [
  ['phone', PHONE],
  ['wide', WIDE],
] as const;

describe.each(sizes)('the app shell on a %s screen', (sizeName, size) => {
  it.each(DEMO_USERS.map((u) => [u.role, u.email] as const))(
    'lets the demo %s sign in, see their navigation and sign out',
    async (role, email) => {
      const { page, errors } = await openPage(product, size);
      await page.goto(product.server.url);
      await page.waitForURL(/\/sign-in/);
      await signIn(page, product.server.url, email, DEMO_PASSWORD);
      for (const id of NAV[role].shown) await byTestId(page, id).first().waitFor({ state: 'visible' });
      for (const id of NAV[role].hidden) expect(await byTestId(page, id).count()).toBe(0);
      await shot(page, `${sizeName}-${role}-home`);

      await byTestId(page, 'nav-account').first().click();
      await byTestId(page, 'account-sign-out').waitFor({ state: 'visible' });
      await shot(page, `${sizeName}-${role}-account`);
      await byTestId(page, 'account-sign-out').click();
      await page.waitForURL(/\/sign-in/);
      await byTestId(page, 'sign-in-email').waitFor({ state: 'visible' });

      // Signed out means signed out: a protected page sends you back to sign-in.
      await page.goto(`${product.server.url}/account`);
      await page.waitForURL(/\/sign-in/);
      expect(errors.filter((e) => !/401|Failed to load resource/.test(e))).toEqual([]);
      await page.context().close();
    },
  );

  it('shows the message for a wrong password and keeps what was typed', async () => {
    const { page } = await openPage(product, size);
    await signIn(page, product.server.url, DEMO_USERS[0].email, 'not-the-password');
    const error = byTestId(page, 'sign-in-error');
    await error.waitFor({ state: 'visible' });
    expect(await error.textContent()).toContain('do not match an account');
    expect(await byTestId(page, 'sign-in-email').inputValue()).toBe(DEMO_USERS[0].email);
    await shot(page, `${sizeName}-sign-in-wrong-password`);
    await page.context().close();
  });

  it('shows a message beside each empty field', async () => {
    const { page } = await openPage(product, size);
    await page.goto(`${product.server.url}/sign-in`);
    await byTestId(page, 'sign-in-submit').click();
    await byTestId(page, 'field-error-email').waitFor({ state: 'visible' });
    await byTestId(page, 'field-error-password').waitFor({ state: 'visible' });
    await shot(page, `${sizeName}-sign-in-empty`);
    await page.context().close();
  });
});

describe('the admin on a wide screen', () => {
  it('invites a new installer, who sets a password from the e-mailed link and lands signed in', async () => {
    const { page } = await openPage(product, WIDE);
    await signInAs(page, product, 'admin');
    await byTestId(page, 'nav-users').first().click();
    await byTestId(page, 'invite-email').fill('pia.newhire@sightfan-demo.example');
    await byTestId(page, 'invite-name').fill('Pia Newhire');
    await byTestId(page, 'invite-role-installer').click();
    await byTestId(page, 'invite-submit').click();
    await page.getByText('pia.newhire@sightfan-demo.example').first().waitFor({ state: 'visible' });
    await shot(page, 'wide-admin-users');

    await byTestId(page, 'nav-outbox').first().click();
    const link = page.getByText(/set-password\?token=/).first();
    await link.waitFor({ state: 'visible' });
    await shot(page, 'wide-admin-outbox');
    const text = (await link.textContent()) ?? '';
    const token = text.match(/token=([A-Za-z0-9_-]+)/)![1];
    await page.context().close();

    const { page: newcomer } = await openPage(product, PHONE);
    await newcomer.goto(`${product.server.url}/set-password?token=${token}`);
    await byTestId(newcomer, 'set-password-password').fill('pia-chooses-this-one');
    await byTestId(newcomer, 'set-password-confirm').fill('pia-chooses-this-one');
    await shot(newcomer, 'phone-set-password');
    await byTestId(newcomer, 'set-password-submit').click();
    await byTestId(newcomer, 'nav-projects').first().waitFor({ state: 'visible' });
    await newcomer.context().close();
  });
});

describe('a forgotten password on a phone', () => {
  it('mails a reset link from the sign-in page, sets a new password through it, and changes it back on the account page', async () => {
    const reviewer = demoUser('reviewer');
    const { page } = await openPage(product, PHONE);
    await page.goto(`${product.server.url}/sign-in`);
    await byTestId(page, 'sign-in-forgot').click();
    await page.waitForURL(/\/forgot-password/);
    await byTestId(page, 'forgot-password-email').fill(reviewer.email);
    await byTestId(page, 'forgot-password-submit').click();
    await byTestId(page, 'forgot-password-done').waitFor({ state: 'visible' });
    await shot(page, 'phone-forgot-password-done');
    await page.context().close();

    // The demo admin reads the reset e-mail in the outbox (demo mode).
    const { page: admin } = await openPage(product, WIDE);
    await signInAs(admin, product, 'admin');
    await byTestId(admin, 'nav-outbox').first().click();
    await admin.getByText('Choose a new Sightfan password').first().waitFor({ state: 'visible' });
    const text =
      (await admin
        .getByText(/set-password\?token=/)
        .first()
        .textContent()) ?? '';
    const token = text.match(/token=([A-Za-z0-9_-]+)/)![1];
    await admin.context().close();

    const { page: again } = await openPage(product, PHONE);
    await again.goto(`${product.server.url}/set-password?token=${token}`);
    await again.getByText('Choose a new password').first().waitFor({ state: 'visible' });
    await byTestId(again, 'set-password-password').fill('rafael-picked-a-new-one');
    await byTestId(again, 'set-password-confirm').fill('rafael-picked-a-new-one');
    await byTestId(again, 'set-password-submit').click();
    await byTestId(again, 'nav-account').first().waitFor({ state: 'visible' });

    await byTestId(again, 'nav-account').first().click();
    await byTestId(again, 'change-password-current').fill('rafael-picked-a-new-one');
    await byTestId(again, 'change-password-new').fill(DEMO_PASSWORD + '-x');
    await byTestId(again, 'change-password-confirm').fill(DEMO_PASSWORD + '-x');
    await byTestId(again, 'change-password-submit').click();
    await byTestId(again, 'change-password-done').waitFor({ state: 'visible' });
    await shot(again, 'phone-account-password-changed');
    await again.context().close();
  });
});
