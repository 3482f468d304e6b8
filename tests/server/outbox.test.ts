/**
 * Mail that cannot strand an account: the e-mail is stored with the change that causes it and
 * delivered from the database with retries, and the admin can send an invitation again.
 */
import net from 'node:net';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/logger';
import { createMailer, DEFAULT_SMTP_TIMEOUTS } from '../../server/modules/mail/mailer';
import { MailDispatcher, DEFAULT_OUTBOX_OPTIONS } from '../../server/modules/mail/outbox';
import { OutgoingMail } from '../../server/modules/mail/outgoing-mail.entity';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

/** A port on 127.0.0.1 where nothing listens (connections are refused). */
const closedPort = () =>
  new Promise<number>((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as AddressInfo).port;
      s.close(() => resolve(port));
    });
  });

/** The app over the test database with its mail server unreachable and its worker stopped. */
async function appWithMailDown() {
  const built = createApp({
    config: h.config,
    orm: h.orm,
    mailer: createMailer({ fakePort: await closedPort(), from: h.config.mailFrom }),
    log: createLogger(true),
    sessionSecret: 'another-secret-long-enough-for-the-config-check',
  });
  built.outbox.stop();
  const admin = request.agent(built.app);
  expect((await admin.post('/api/auth/sign-in').send({ email: EMAIL.admin, password: PASSWORD })).status).toBe(200);
  return { built, admin };
}

const tokenIn = (text: string) => /token=([A-Za-z0-9_-]+)/.exec(text)?.[1];
const rowsFor = (to: string) => h.orm.em.fork().find(OutgoingMail, { toAddress: to }, { orderBy: { id: 'asc' } });

describe('an invitation while the mail server is down', () => {
  it('creates the account with its e-mail queued, then delivers it when the server is back, and the link works', async () => {
    const { built, admin } = await appWithMailDown();
    try {
      const to = 'stranded.not@sightfan-demo.example';
      const res = await admin.post('/api/users').send({ email: to, name: 'Noor Patel (demo)', role: 'installer' });
      expect(res.status).toBe(201);
      await built.outbox.runOnce();
      const [row] = await rowsFor(to);
      expect(row).toMatchObject({ kind: 'invitation', status: 'queued', attempts: 1 });
      expect(row.lastError).toMatch(/ECONNREFUSED/);
      expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());

      await h.orm.em.fork().nativeUpdate(OutgoingMail, { id: row.id }, { nextAttemptAt: new Date(0) });
      expect(await h.outbox.runOnce()).toBeGreaterThanOrEqual(1);
      const token = tokenIn((await h.waitForMail(to)).text);
      const accepted = await request(h.app)
        .post('/api/invitations/accept')
        .send({ token, password: 'a-long-enough-password', confirm: 'a-long-enough-password' });
      expect(accepted.status).toBe(200);
    } finally {
      built.close();
    }
  });

  it('writes nothing at all when the account cannot be created', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    const before = await h.orm.em.fork().count(OutgoingMail, {});
    expect((await admin.post('/api/users').send({ email: EMAIL.reviewer, name: 'Twice', role: 'reviewer' })).status).toBe(409);
    expect(await h.orm.em.fork().count(OutgoingMail, {})).toBe(before);
  });
});

describe('sending an invitation again', () => {
  it('sends a new link and retires the old one', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    const to = 'again.invited@sightfan-demo.example';
    const created = await admin.post('/api/users').send({ email: to, name: 'Ravi Sato (demo)', role: 'reviewer' });
    const first = tokenIn((await h.waitForMail(to)).text)!;
    const again = await admin.post(`/api/users/${created.body.user.id}/invitation`);
    expect(again.status).toBe(201);
    let rows = await rowsFor(to);
    for (let i = 0; i < 100 && rows.some((r) => r.status !== 'sent'); i++) {
      await new Promise((r) => setTimeout(r, 50));
      rows = await rowsFor(to);
    }
    expect(rows.map((r) => r.status)).toEqual(['sent', 'sent']);
    const second = tokenIn(rows[1].text)!;
    expect(second).not.toBe(first);
    expect((await request(h.app).get(`/api/invitations/${first}`)).status).toBe(410);
    expect((await request(h.app).get(`/api/invitations/${second}`)).status).toBe(200);
  });

  it('points an admin who invites a pending person again to "Invite again"', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    const to = 'pending.twice@sightfan-demo.example';
    expect((await admin.post('/api/users').send({ email: to, name: 'Pending Twice (demo)', role: 'installer' })).status).toBe(201);
    const again = await admin.post('/api/users').send({ email: to, name: 'Pending Twice (demo)', role: 'installer' });
    expect(again.status).toBe(409);
    expect(again.body.fields.email).toMatch(/Invite again/);
  });

  it('refuses to invite someone who already chose a password', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    const me = await (await h.signedIn(EMAIL.installer)).get('/api/auth/me');
    const res = await admin.post(`/api/users/${me.body.user.id}/invitation`);
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/already chosen a password/);
  });
});

describe('retries', () => {
  it('waits longer after each failure and gives up after the last attempt', async () => {
    const to = 'never.arrives@sightfan-demo.example';
    const em = h.orm.em.fork();
    const org = (await (await h.signedIn(EMAIL.admin)).get('/api/auth/me')).body.user.organizationId as number;
    const row = em.create(OutgoingMail, {
      organization: org,
      kind: 'sheet',
      toAddress: to,
      subject: 's',
      text: 't',
      nextAttemptAt: new Date(0),
    });
    await em.flush();
    const down = createMailer({ fakePort: await closedPort(), from: 'x@y.example' });
    const worker = new MailDispatcher(h.orm, down, createLogger(true), { ...DEFAULT_OUTBOX_OPTIONS, firstRetryMs: 1000, maxAttempts: 3 });
    const waits: number[] = [];
    for (let i = 0; i < 3; i++) {
      const before = Date.now();
      await h.orm.em.fork().nativeUpdate(OutgoingMail, { id: row.id }, { nextAttemptAt: new Date(0) });
      expect(await worker.deliver(row.id)).toBe(i < 2 ? 'queued' : 'failed');
      const after = await h.orm.em.fork().findOneOrFail(OutgoingMail, { id: row.id });
      waits.push(Math.round((after.nextAttemptAt.getTime() - before) / 1000));
    }
    down.close();
    // Doubling from the first delay (common practice: exponential back-off).
    expect(waits.slice(0, 2)).toEqual([1, 2]);
    expect((await h.orm.em.fork().findOneOrFail(OutgoingMail, { id: row.id })).status).toBe('failed');
  });
});

describe('what stays in the database', () => {
  it('blanks a delivered message outside demo mode, so no working link is stored in clear', async () => {
    const to = 'scrubbed.link@sightfan-demo.example';
    const em = h.orm.em.fork();
    const org = (await (await h.signedIn(EMAIL.admin)).get('/api/auth/me')).body.user.organizationId as number;
    const row = em.create(OutgoingMail, {
      organization: org,
      kind: 'password-reset',
      toAddress: to,
      subject: 's',
      text: 'http://sightfan.test/set-password?token=secret-token-value',
      nextAttemptAt: new Date(0),
    });
    await em.flush();
    const worker = new MailDispatcher(h.orm, h.mailer, createLogger(true), { ...DEFAULT_OUTBOX_OPTIONS, scrubAfterSend: true });
    expect(await worker.deliver(row.id)).toBe('sent');
    expect((await h.waitForMail(to)).text).toContain('secret-token-value');
    const stored = await h.orm.em.fork().findOneOrFail(OutgoingMail, { id: row.id });
    expect(stored.text).not.toContain('secret-token-value');
  });
});

describe('a mail server that accepts the connection and then says nothing', () => {
  it('fails the send within the bounded greeting time instead of holding on', async () => {
    const sockets: net.Socket[] = [];
    const silent = net.createServer((s) => sockets.push(s));
    await new Promise<void>((r) => silent.listen(0, '127.0.0.1', () => r()));
    const mailer = createMailer({
      fakePort: (silent.address() as AddressInfo).port,
      from: 'x@y.example',
      timeouts: { connectionMs: 300, greetingMs: 300, socketMs: 300 },
    });
    const started = Date.now();
    await expect(mailer.send({ to: 'a@b.example', subject: 's', text: 't' })).rejects.toThrow();
    expect(Date.now() - started).toBeLessThan(3000);
    mailer.close();
    sockets.forEach((s) => s.destroy());
    await new Promise<void>((r) => silent.close(() => r()));
  });

  it('uses connection and greeting limits of seconds, not nodemailer’s minutes (nodemailer documents 2 min / 30 s defaults)', () => {
    expect(DEFAULT_SMTP_TIMEOUTS.connectionMs).toBeLessThanOrEqual(10_000);
    expect(DEFAULT_SMTP_TIMEOUTS.greetingMs).toBeLessThanOrEqual(10_000);
  });
});

describe('the admin outbox', () => {
  it('shows an admin only their own organisation’s mail', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    await admin.post('/api/users').send({ email: 'walled.in@sightfan-demo.example', name: 'Walled In (demo)', role: 'installer' });
    await h.addUser('outsider.admin@northgate.test', 'admin', 'Northgate Logistics (test organisation)');
    const outsider = await h.signedIn('outsider.admin@northgate.test');
    const theirs = (await outsider.get('/api/outbox')).body.messages as { to: string[] }[];
    const ours = (await admin.get('/api/outbox')).body.messages as { to: string[]; status: string }[];
    expect(theirs).toEqual([]);
    expect(ours.some((m) => m.to.includes('walled.in@sightfan-demo.example'))).toBe(true);
  });
});
