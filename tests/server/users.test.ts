import request from 'supertest';
import { EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

type Who = 'anonymous' | 'installer' | 'reviewer' | 'admin';
async function as(who: Who) {
  return who === 'anonymous' ? request.agent(h.app) : h.signedIn(EMAIL[who]);
}

describe('who may use /api/users', () => {
  const matrix: [Who, number][] = [
    ['anonymous', 401],
    ['installer', 403],
    ['reviewer', 403],
    ['admin', 200],
  ];

  it.each(matrix)('GET /api/users as %s answers %i', async (who, status) => {
    const res = await (await as(who)).get('/api/users');
    expect(res.status).toBe(status);
    if (status === 200) expect(res.body.users.map((u: { email: string }) => u.email).sort()).toEqual(Object.values(EMAIL).sort());
    else expect(typeof res.body.error).toBe('string');
  });

  it.each(matrix)('POST /api/users as %s answers %i (201 for the admin)', async (who, status) => {
    const email = `matrix-${who}@sightfan-demo.example`;
    const res = await (await as(who)).post('/api/users').send({ email, name: `Matrix ${who}`, role: 'installer' });
    expect(res.status).toBe(status === 200 ? 201 : status);
  });

  it.each(matrix)('PATCH /api/users/:id as %s answers %i', async (who, status) => {
    const admin = await as('admin');
    const target = (await admin.get('/api/users')).body.users.find((u: { email: string }) => u.email === EMAIL.reviewer);
    const res = await (await as(who)).patch(`/api/users/${target.id}`).send({ role: 'reviewer' });
    expect(res.status).toBe(status);
  });
});

describe('bad bodies', () => {
  it('rejects an invitation with a sentence beside each bad field', async () => {
    const admin = await as('admin');
    const res = await admin.post('/api/users').send({ email: 'x', name: '', role: 'boss' });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      email: 'Enter a full e-mail address, like name@company.com.',
      name: 'Enter a name.',
      role: 'Choose a role: installer, reviewer or admin.',
    });
  });

  it('rejects a change that changes nothing, and an unknown field', async () => {
    const admin = await as('admin');
    const me = (await admin.get('/api/auth/me')).body.user;
    const empty = await admin.patch(`/api/users/${me.id}`).send({});
    expect(empty.status).toBe(400);
    expect(empty.body.error).toBe('Nothing to change: give a role or the disabled flag.');
    const extra = await admin.patch(`/api/users/${me.id}`).send({ email: 'new@x.example' });
    expect(extra.status).toBe(400);
  });

  it('answers 404 for a user that does not exist and 400 for an id that is not a number', async () => {
    const admin = await as('admin');
    expect((await admin.patch('/api/users/99999').send({ role: 'admin' })).status).toBe(404);
    const bad = await admin.patch('/api/users/abc').send({ role: 'admin' });
    expect(bad.status).toBe(400);
  });

  it('answers 409 when the address already has an account', async () => {
    const admin = await as('admin');
    const res = await admin.post('/api/users').send({ email: EMAIL.installer.toUpperCase(), name: 'Again', role: 'installer' });
    expect(res.status).toBe(409);
    expect(res.body.fields.email).toBe('This e-mail address already has an account.');
  });

  it('does not let an admin demote or turn off their own account', async () => {
    const admin = await as('admin');
    const me = (await admin.get('/api/auth/me')).body.user;
    const res = await admin.patch(`/api/users/${me.id}`).send({ role: 'installer' });
    expect(res.status).toBe(409);
    expect(res.body.fields.role).toBe('Not for your own account.');
  });
});

describe('invitations', () => {
  it('e-mails a one-time link through the fake mail server, and the link works exactly once', async () => {
    const admin = await as('admin');
    const email = 'noor.newhire@sightfan-demo.example';
    const created = await admin.post('/api/users').send({ email, name: 'Noor Newhire', role: 'installer' });
    expect(created.status).toBe(201);
    expect(created.body.user.hasPassword).toBe(false);

    const mail = await h.waitForMail(email);
    expect(mail.subject).toBe('Ada Moreau (demo admin) invited you to Sightfan');
    const link = mail.text.match(/http:\/\/sightfan\.test\/set-password\?token=([A-Za-z0-9_-]+)/);
    expect(link).not.toBeNull();
    const token = link![1];

    // The outbox shows it to the admin in demo mode.
    const outbox = await admin.get('/api/outbox');
    expect(outbox.status).toBe(200);
    expect(outbox.body.messages.some((m: { to: string[] }) => m.to.includes(email))).toBe(true);

    // Someone without a password cannot sign in yet.
    expect((await request(h.app).post('/api/auth/sign-in').send({ email, password: 'whatever-it-is' })).status).toBe(401);

    const info = await request(h.app).get(`/api/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body.invitation).toEqual({
      email,
      name: 'Noor Newhire',
      organizationName: 'Harbourline Cold Storage (demo)',
      purpose: 'invite',
    });

    const mismatch = await request(h.app)
      .post('/api/invitations/accept')
      .send({ token, password: 'a-good-long-password', confirm: 'different' });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.fields.confirm).toBe('The two passwords are not the same.');

    const agent = request.agent(h.app);
    const accepted = await agent
      .post('/api/invitations/accept')
      .send({ token, password: 'a-good-long-password', confirm: 'a-good-long-password' });
    expect(accepted.status).toBe(200);
    expect(accepted.body.user.hasPassword).toBe(true);
    expect((await agent.get('/api/auth/me')).body.user.email).toBe(email);

    const again = await request(h.app)
      .post('/api/invitations/accept')
      .send({ token, password: 'another-long-password', confirm: 'another-long-password' });
    expect(again.status).toBe(410);
    expect((await request(h.app).get(`/api/invitations/${token}`)).status).toBe(410);

    const signIn = await request(h.app).post('/api/auth/sign-in').send({ email, password: 'a-good-long-password' });
    expect(signIn.status).toBe(200);
  });

  it('answers 404 for a made-up token and 400 for a malformed one', async () => {
    expect((await request(h.app).get(`/api/invitations/${'a'.repeat(43)}`)).status).toBe(404);
    expect((await request(h.app).get('/api/invitations/short')).status).toBe(400);
  });

  it('keeps the outbox from everyone but the admin', async () => {
    expect((await (await as('installer')).get('/api/outbox')).status).toBe(403);
    expect((await (await as('anonymous')).get('/api/outbox')).status).toBe(401);
  });
});

describe('turning an account off', () => {
  it('ends that person’s open sessions and refuses their next sign-in', async () => {
    const admin = await as('admin');
    await admin.post('/api/users').send({ email: 'temp.worker@sightfan-demo.example', name: 'Temp Worker', role: 'installer' });
    const mail = await h.waitForMail('temp.worker@sightfan-demo.example');
    const token = mail.text.match(/token=([A-Za-z0-9_-]+)/)![1];
    const worker = request.agent(h.app);
    await worker.post('/api/invitations/accept').send({ token, password: 'temporary-password', confirm: 'temporary-password' });
    expect((await worker.get('/api/auth/me')).status).toBe(200);

    const id = (await worker.get('/api/auth/me')).body.user.id;
    const off = await admin.patch(`/api/users/${id}`).send({ disabled: true });
    expect(off.status).toBe(200);
    expect(off.body.user.disabled).toBe(true);

    expect((await worker.get('/api/auth/me')).status).toBe(401);
    const again = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: 'temp.worker@sightfan-demo.example', password: 'temporary-password' });
    // Answered exactly like a wrong password, so the answer does not confirm the password.
    expect(again.status).toBe(401);
  });
});
