/**
 * Sign-in limits hold under concurrency, slow a guesser, and never lock the real user out of
 * their own account. TRUST_PROXY=true (one proxy hop) lets each test choose the client address the
 * way a proxy would report it: the right-most X-Forwarded-For entry.
 */
import request from 'supertest';
import { accountDelayS, DEFAULT_SIGN_IN_LIMITS, SignInLimiter, type SignInLimits } from '../../server/modules/auth/sign-in-limiter';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

const WRONG = 'That e-mail address and password do not match an account. Check both and try again.';
const limits = (over: Partial<SignInLimits>): SignInLimits => ({ ...DEFAULT_SIGN_IN_LIMITS, ...over });

let h: Harness;
afterEach(async () => {
  await h?.close();
});

const signIn = (email: string, password: string, forwardedFor?: string) => {
  const req = request(h.app).post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password });
};

describe('the limit under concurrency', () => {
  it('checks at most the pair limit of passwords when 100 wrong attempts arrive at once', async () => {
    h = await startHarness({ signInLimits: limits({ perPair: 5 }) });
    const all = await Promise.all(Array.from({ length: 100 }, (_, i) => signIn(EMAIL.reviewer, `wrong-${i}`)));
    const checked = all.filter((r) => r.status === 401).length;
    expect(checked).toBeLessThanOrEqual(5);
    expect(all.filter((r) => r.status === 429).length).toBe(100 - checked);
  });

  it('answers 429 with a Retry-After within the window once the pair limit is spent', async () => {
    h = await startHarness({ signInLimits: limits({ perPair: 3, windowS: 60 }) });
    for (let i = 0; i < 3; i++) expect((await signIn(EMAIL.reviewer, `wrong-${i}`)).status).toBe(401);
    const blocked = await signIn(EMAIL.reviewer, PASSWORD);
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(60);
    expect(blocked.body.error).toBe('Too many sign-in attempts for now.');
    // Another account from the same address is not affected by this pair's limit.
    expect((await signIn(EMAIL.installer, PASSWORD)).status).toBe(200);
  });
});

describe('no lock-out of the real user', () => {
  it('lets the owner in from their usual address while others hammer the account from elsewhere', async () => {
    h = await startHarness({ env: { TRUST_PROXY: 'true' }, signInLimits: limits({ perPair: 5, accountFreeAttempts: 3 }) });
    const home = '203.0.113.10';
    expect((await signIn(EMAIL.reviewer, PASSWORD, home)).status).toBe(200);
    const attack = await Promise.all(Array.from({ length: 40 }, (_, i) => signIn(EMAIL.reviewer, `guess-${i}`, `198.51.100.${i + 1}`)));
    expect(attack.filter((r) => r.status === 401).length).toBeLessThanOrEqual(4);
    expect((await signIn(EMAIL.reviewer, PASSWORD, home)).status).toBe(200);
  });

  it('slows attempts from unusual addresses with a delay instead of a lock', async () => {
    h = await startHarness({ env: { TRUST_PROXY: 'true' }, signInLimits: limits({ accountFreeAttempts: 2 }) });
    for (let i = 0; i < 2; i++) expect((await signIn(EMAIL.installer, 'nope', `198.51.100.${i + 1}`)).status).toBe(401);
    // The third attempt opens a 2-second gate and is checked; the next one inside the gate waits.
    expect((await signIn(EMAIL.installer, 'nope', '198.51.100.3')).status).toBe(401);
    const waiting = await signIn(EMAIL.installer, PASSWORD, '198.51.100.4');
    expect(waiting.status).toBe(429);
    expect(Number(waiting.headers['retry-after'])).toBeLessThanOrEqual(2);
    await new Promise((r) => setTimeout(r, 2100));
    expect((await signIn(EMAIL.installer, PASSWORD, '198.51.100.4')).status).toBe(200);
  });

  it('admits the owner from a usual address at once while the account gate is closed to others', async () => {
    h = await startHarness();
    const l = new SignInLimiter(h.orm, limits({ accountFreeAttempts: 1, knownAddressDays: 30 }));
    const home = await l.admit('owner@x.example', '203.0.113.1');
    expect(home.ok).toBe(true);
    if (home.ok) await home.release(true);
    const others = [];
    for (let i = 0; i < 5; i++) others.push(await l.admit('owner@x.example', `198.51.100.${i}`));
    expect(others.map((a) => a.ok)).toEqual([true, true, false, false, false]);
    expect((await l.admit('owner@x.example', '203.0.113.1')).ok).toBe(true);
    expect((await l.admit('owner@x.example', '198.51.100.99')).ok).toBe(false);
  });

  it('doubles the delay per attempt past the free ones, up to the cap (common practice: exponential back-off)', () => {
    const l = limits({ accountFreeAttempts: 10, accountMaxDelayS: 300 });
    expect([10, 11, 12, 13, 18, 19, 1000].map((n) => accountDelayS(n, l))).toEqual([0, 2, 4, 8, 256, 300, 300]);
  });
});

describe('the client address', () => {
  it('believes X-Forwarded-For only for the trusted hop, so a client cannot pick a fresh address per guess', async () => {
    h = await startHarness({ env: { TRUST_PROXY: 'true' }, signInLimits: limits({ perPair: 3 }) });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await signIn(EMAIL.admin, `wrong-${i}`, `10.66.0.${i}, 203.0.113.77`)).status);
    expect(statuses).toEqual([401, 401, 401, 429, 429, 429]);
  });

  it('ignores X-Forwarded-For entirely when no proxy is declared', async () => {
    h = await startHarness({ signInLimits: limits({ perPair: 2 }) });
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) statuses.push((await signIn(EMAIL.admin, `wrong-${i}`, `10.66.1.${i}`)).status);
    expect(statuses).toEqual([401, 401, 429, 429]);
  });
});

describe('a turned-off account', () => {
  it('answers the right password exactly as it answers a wrong one', async () => {
    h = await startHarness();
    const admin = await h.signedIn(EMAIL.admin);
    const me = await h.signedIn(EMAIL.installer);
    const id = (await me.get('/api/auth/me')).body.user.id;
    expect((await admin.patch(`/api/users/${id}`).send({ disabled: true })).status).toBe(200);
    const right = await signIn(EMAIL.installer, PASSWORD);
    const wrong = await signIn(EMAIL.installer, 'not-the-password');
    expect([right.status, right.body]).toEqual([401, { error: WRONG }]);
    expect([wrong.status, wrong.body]).toEqual([401, { error: WRONG }]);
  });
});

describe('ids in paths', () => {
  it('answers ids that are not plain digits with 400, where a coercing parse took them as aliases', async () => {
    h = await startHarness();
    const agent = await h.signedIn(EMAIL.installer);
    for (const raw of ['0x10', '1.0', '%201', '1e1', '+1', '01', '-1', '0', '99999999999999999999']) {
      const res = await agent.get(`/api/projects/${raw}`);
      expect([raw, res.status]).toEqual([raw, 400]);
      expect(res.body.error).toMatch(/digits only/);
    }
  });
});
