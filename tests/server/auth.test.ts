import request from 'supertest';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

const WRONG = 'That e-mail address and password do not match an account. Check both and try again.';

describe('sign-in', () => {
  it('signs in a demo installer and returns the user without any password hash', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: EMAIL.installer, role: 'installer', disabled: false, units: 'metric' });
    expect(JSON.stringify(res.body)).not.toMatch(/passwordHash|\$2[aby]\$/);
  });

  it('sets an httpOnly, SameSite=Lax session cookie that is not Secure on plain http', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: EMAIL.reviewer, password: PASSWORD });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/^sightfan\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('accepts the e-mail address in any case and with spaces around it', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .send({ email: `  ${EMAIL.admin.toUpperCase()} `, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe('admin');
  });

  it('gives the same message for a wrong password and for an unknown address', async () => {
    const wrongPassword = await request(h.app).post('/api/auth/sign-in').send({ email: EMAIL.reviewer, password: 'not-the-password' });
    const unknown = await request(h.app).post('/api/auth/sign-in').send({ email: 'nobody@sightfan-demo.example', password: PASSWORD });
    expect(wrongPassword.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrongPassword.body).toEqual({ error: WRONG });
    expect(unknown.body).toEqual({ error: WRONG });
  });

  it('answers a bad body with 400 and a sentence for each field', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').send({ email: 'not-an-address', password: '' });
    expect(res.status).toBe(400);
    expect(res.body.fields).toEqual({
      email: 'Enter a full e-mail address, like name@company.com.',
      password: 'Enter your password.',
    });
    expect(typeof res.body.error).toBe('string');
  });

  it('answers a body that is not JSON with 400', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('The request body is not valid JSON.');
  });
});

describe('the session', () => {
  it('answers /me with 401 when signed out and with the user when signed in', async () => {
    expect((await request(h.app).get('/api/auth/me')).status).toBe(401);
    const agent = await h.signedIn(EMAIL.installer);
    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(EMAIL.installer);
  });

  it('answers the start-up probe /session with 200 and no user when signed out, and with the user when signed in', async () => {
    const out = await request(h.app).get('/api/auth/session');
    expect(out.status).toBe(200);
    expect(out.body).toEqual({ user: null });
    const agent = await h.signedIn(EMAIL.installer);
    const inside = await agent.get('/api/auth/session');
    expect(inside.status).toBe(200);
    expect(inside.body.user.email).toBe(EMAIL.installer);
    expect(inside.body.user).not.toHaveProperty('passwordHash');
  });

  it('ends on sign-out: 204, and /me is 401 after', async () => {
    const agent = await h.signedIn(EMAIL.installer);
    expect((await agent.post('/api/auth/sign-out')).status).toBe(204);
    expect((await agent.get('/api/auth/me')).status).toBe(401);
  });

  it('issues a new session id at sign-in (no fixation)', async () => {
    const agent = request.agent(h.app);
    const first = await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
    const second = await agent.post('/api/auth/sign-in').send({ email: EMAIL.installer, password: PASSWORD });
    const sid = (r: request.Response) => String(r.headers['set-cookie']).split(';')[0];
    expect(sid(first)).not.toBe(sid(second));
  });

  it('stores the units preference on the user', async () => {
    const agent = await h.signedIn(EMAIL.reviewer);
    const res = await agent.patch('/api/auth/me').send({ units: 'imperial' });
    expect(res.status).toBe(200);
    expect(res.body.user.units).toBe('imperial');
    expect((await agent.get('/api/auth/me')).body.user.units).toBe('imperial');
    const bad = await agent.patch('/api/auth/me').send({ units: 'cubits' });
    expect(bad.status).toBe(400);
    expect(bad.body.fields.units).toBe('Choose metric or imperial units.');
    await agent.patch('/api/auth/me').send({ units: 'metric' });
  });

  it('survives a restart of the app over the same database file', async () => {
    const signIn = await request(h.app).post('/api/auth/sign-in').send({ email: EMAIL.admin, password: PASSWORD });
    const cookie = String(signIn.headers['set-cookie']).split(';')[0];
    await h.restart();
    const res = await request(h.app).get('/api/auth/me').set('Cookie', cookie);
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(EMAIL.admin);
  });
});

describe('protection', () => {
  it('refuses a state-changing request from another origin with 403', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Origin', 'https://evil.example')
      .send({ email: EMAIL.installer, password: PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/another website/);
  });

  it('refuses a cross-site request that carries only Sec-Fetch-Site', async () => {
    const res = await request(h.app).post('/api/auth/sign-out').set('Sec-Fetch-Site', 'cross-site');
    expect(res.status).toBe(403);
  });

  it('accepts the same request from its own origin', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Host', 'sightfan.test')
      .set('Origin', 'http://sightfan.test')
      .send({ email: EMAIL.installer, password: PASSWORD });
    expect(res.status).toBe(200);
  });

  it('sends helmet security headers', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('answers an unknown API route with 404 and a sentence', async () => {
    const res = await request(h.app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error).toBe('There is no API route GET /api/nothing-here.');
  });
});
