/**
 * Passwords a person can manage: change it (current one required, other sessions end) and
 * "forgot password" by a one-time e-mailed link that expires, works once and does not tell
 * whether an address has an account.
 */
import request from 'supertest';
import { FORGOT_PASSWORD_ANSWER } from '../../shared/schemas';
import { Invitation } from '../../server/modules/users/invitation.entity';
import { User } from '../../server/modules/users/user.entity';
import { PASSWORD, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

const NEW = 'a-brand-new-password';
let n = 0;
async function freshUser(): Promise<string> {
  const email = `pw.person${++n}@sightfan-demo.example`;
  await h.addUser(email, 'installer');
  return email;
}
const signIn = (email: string, password: string) => request(h.app).post('/api/auth/sign-in').send({ email, password });
const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)![1];
const accept = (token: string, password = NEW) =>
  request(h.app).post('/api/invitations/accept').send({ token, password, confirm: password });

describe('changing my password', () => {
  it('refuses without the right current password and names the field', async () => {
    const email = await freshUser();
    const me = await h.signedIn(email);
    const res = await me.post('/api/auth/password').send({ currentPassword: 'not-it-at-all', password: NEW, confirm: NEW });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({ currentPassword: 'This is not your current password.' });
    expect((await signIn(email, PASSWORD)).status).toBe(200);
  });

  it('replaces the password: the old one stops working and the new one signs in', async () => {
    const email = await freshUser();
    const me = await h.signedIn(email);
    expect((await me.post('/api/auth/password').send({ currentPassword: PASSWORD, password: NEW, confirm: NEW })).status).toBe(200);
    expect((await signIn(email, PASSWORD)).status).toBe(401);
    expect((await signIn(email, NEW)).status).toBe(200);
  });

  it('ends my other sessions and keeps this one', async () => {
    const email = await freshUser();
    const here = await h.signedIn(email);
    const elsewhere = await h.signedIn(email);
    expect((await here.post('/api/auth/password').send({ currentPassword: PASSWORD, password: NEW, confirm: NEW })).status).toBe(200);
    expect((await here.get('/api/auth/me')).status).toBe(200);
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401);
  });

  it('answers a mismatched confirmation and a too-short password next to their fields', async () => {
    const me = await h.signedIn(await freshUser());
    const res = await me.post('/api/auth/password').send({ currentPassword: PASSWORD, password: 'short', confirm: 'other' });
    expect(res.status).toBe(400);
    expect(res.body.fields.password).toBe('Use at least 10 characters.');
    expect(res.body.fields.confirm).toBe('The two passwords are not the same.');
  });

  it('needs a session', async () => {
    expect((await request(h.app).post('/api/auth/password').send({ currentPassword: PASSWORD, password: NEW, confirm: NEW })).status).toBe(
      401,
    );
  });
});

describe('forgot password', () => {
  it('answers an unknown address exactly as a known one', async () => {
    const known = await request(h.app)
      .post('/api/auth/password-reset')
      .send({ email: await freshUser() });
    const unknown = await request(h.app).post('/api/auth/password-reset').send({ email: 'no.such.person@sightfan-demo.example' });
    expect([known.status, known.body]).toEqual([202, { message: FORGOT_PASSWORD_ANSWER }]);
    expect([unknown.status, unknown.body]).toEqual([known.status, known.body]);
  });

  it('mails a link that sets a new password once, signs out old sessions, and then is spent', async () => {
    const email = await freshUser();
    const old = await h.signedIn(email);
    await request(h.app).post('/api/auth/password-reset').send({ email });
    const token = tokenIn((await h.waitForMail(email)).text);
    expect((await request(h.app).get(`/api/invitations/${token}`)).body.invitation).toMatchObject({ email, purpose: 'reset' });
    expect((await accept(token)).status).toBe(200);
    expect((await old.get('/api/auth/me')).status).toBe(401);
    expect((await signIn(email, NEW)).status).toBe(200);
    expect((await accept(token, 'yet-another-password')).status).toBe(410);
  });

  it('makes links that expire within the hour', async () => {
    const email = await freshUser();
    await request(h.app).post('/api/auth/password-reset').send({ email });
    const token = tokenIn((await h.waitForMail(email)).text);
    const em = h.orm.em.fork();
    const link = await em.findOneOrFail(Invitation, { user: { email }, purpose: 'reset' });
    expect(link.expiresAt.getTime() - link.createdAt.getTime()).toBeLessThanOrEqual(60 * 60 * 1000 + 1000);
    await em.nativeUpdate(Invitation, { id: link.id }, { expiresAt: new Date(Date.now() - 1000) });
    const res = await accept(token);
    expect(res.status).toBe(410);
    expect(res.body.error).toMatch(/expired/);
  });

  it('retires the earlier link when a newer one is asked for', async () => {
    const email = await freshUser();
    await request(h.app).post('/api/auth/password-reset').send({ email });
    const first = tokenIn((await h.waitForMail(email)).text);
    await request(h.app).post('/api/auth/password-reset').send({ email });
    let second = first;
    for (let i = 0; i < 100 && second === first; i++) {
      second = tokenIn((await h.waitForMail(email)).text);
      if (second === first) await new Promise((r) => setTimeout(r, 50));
    }
    expect(second).not.toBe(first);
    expect((await accept(first)).status).toBe(410);
    expect((await accept(second)).status).toBe(200);
  });

  it('sends nothing to a turned-off account but answers the same', async () => {
    const email = await freshUser();
    await h.orm.em.fork().nativeUpdate(User, { email }, { disabled: true });
    const res = await request(h.app).post('/api/auth/password-reset').send({ email });
    expect([res.status, res.body]).toEqual([202, { message: FORGOT_PASSWORD_ANSWER }]);
    await expect(h.waitForMail(email, 500)).rejects.toThrow(/no mail/);
  });
});
