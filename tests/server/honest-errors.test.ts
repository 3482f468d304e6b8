/**
 * Requests that are wrong in ways a client or a fuzzer produces (odd charsets and encodings,
 * broken percent-encoding, control characters) get a 4xx with a sentence, never a 500.
 */
import zlib from 'node:zlib';
import express from 'express';
import * as fc from 'fast-check';
import { DriverException } from '@mikro-orm/core';
import { errorHandler } from '../../server/middleware/errors';
import { createLogger } from '../../server/logger';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { EMAIL, PASSWORD, startHarness, type Harness } from './harness';

let h: Harness;
let installer: TestAgent;
let admin: TestAgent;
let projectId: number;
beforeAll(async () => {
  h = await startHarness();
  installer = await h.signedIn(EMAIL.installer);
  admin = await h.signedIn(EMAIL.admin);
  const created = await installer.post('/api/projects').send({ name: 'Fuzz target (demo)' });
  projectId = created.body.project.id;
});
afterAll(async () => {
  await h.close();
});

/** superagent types its serializer as returning a string; a Buffer passes through unchanged at run time. */
const rawBody = ((b: Buffer) => b) as unknown as (o: unknown) => string;
const isSentence = (s: unknown) => typeof s === 'string' && /^[A-Z].*[.!?]$/s.test(s);

type Case = { name: string; run: () => Promise<request.Response> };
const nul = '\u0000';

/** The corpus: each case was a 500 before the error middleware honoured the status errors carry. */
const corpus = (): Case[] => [
  {
    name: 'a JSON body declared as latin1',
    run: () =>
      request(h.app)
        .post('/api/auth/sign-in')
        .set('Content-Type', 'application/json; charset=latin1')
        .send(JSON.stringify({ email: EMAIL.installer, password: PASSWORD })),
  },
  {
    name: 'a JSON body declared as Shift JIS',
    run: () => installer.post('/api/projects').set('Content-Type', 'application/json; charset=shift_jis').send('{"name":"x"}'),
  },
  {
    name: 'a body in the compress encoding',
    run: () =>
      request(h.app)
        .post('/api/auth/sign-in')
        .set('Content-Type', 'application/json')
        .set('Content-Encoding', 'compress')
        .send('{"email":"a@b.c"}'),
  },
  {
    name: 'a body in an invented encoding',
    run: () =>
      installer.post('/api/projects').set('Content-Type', 'application/json').set('Content-Encoding', 'x-squeeze').send('{"name":"x"}'),
  },
  {
    name: 'a body that claims gzip but is not',
    run: () => installer.post('/api/projects').set('Content-Type', 'application/json').set('Content-Encoding', 'gzip').send('{"name":"x"}'),
  },
  { name: 'a cut percent-escape in a project id', run: () => installer.get('/api/projects/%E0%A4%A') },
  { name: 'an invalid percent-escape in an invitation token', run: () => request(h.app).get('/api/invitations/%ZZabc') },
  { name: 'a lone percent sign in a catalogue id', run: () => admin.patch('/api/catalogue/%').send({ version: 1 }) },
  { name: 'an invalid percent-escape in an app path', run: () => request(h.app).get('/projects/%E0') },
  { name: 'an invalid percent-escape in a placement id', run: () => installer.delete(`/api/projects/${projectId}/placements/%C0%AF%`) },
  { name: 'NUL in a project name', run: () => installer.post('/api/projects').send({ name: `Cold${nul}store` }) },
  { name: 'NUL in project notes', run: () => installer.patch(`/api/projects/${projectId}`).send({ version: 1, notes: `a${nul}b` }) },
  { name: 'NUL in a project search', run: () => installer.get(`/api/projects?q=a%00b`) },
  {
    name: 'NUL in a sign-in address',
    run: () =>
      request(h.app)
        .post('/api/auth/sign-in')
        .send({ email: `ines${nul}@x.example`, password: PASSWORD }),
  },
  {
    name: 'NUL in a sign-in password',
    run: () =>
      request(h.app)
        .post('/api/auth/sign-in')
        .send({ email: EMAIL.reviewer, password: `demo${nul}` }),
  },
  { name: 'NUL in my own name', run: () => installer.patch('/api/auth/me').send({ name: `Ines${nul}` }) },
  {
    name: 'NUL in an invited name',
    run: () => admin.post('/api/users').send({ email: 'nul@sightfan-demo.example', name: `N${nul}`, role: 'installer' }),
  },
  {
    name: 'NUL in a catalogue name',
    run: () =>
      admin.post('/api/catalogue').send({
        code: 'NUL-1',
        name: `Dome${nul}`,
        mirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 },
        unitPriceMinor: 100,
        currency: 'EUR',
      }),
  },
  {
    name: 'NUL in a sheet e-mail note',
    run: () => installer.post(`/api/projects/${projectId}/sheet/email`).send({ to: 'buyer@example.com', message: `hi${nul}` }),
  },
  {
    name: 'a session cookie with a broken percent-escape',
    run: () => request(h.app).get('/api/auth/me').set('Cookie', 'sightfan.sid=s%3A%ZZ%E0'),
  },
  { name: 'a broken percent-escape in a query string', run: () => installer.get('/api/projects?q=%E0%A4%A&sort=%ZZ') },
  {
    name: 'a JSON body nested ten thousand deep',
    run: () =>
      installer
        .post('/api/projects')
        .set('Content-Type', 'application/json')
        .send(`{"name":${'['.repeat(10000)}${']'.repeat(10000)}}`),
  },
  {
    name: 'a scene id with NUL',
    run: () =>
      installer
        .patch(`/api/projects/${projectId}`)
        .send({ version: 1, scene: { walls: [], zones: [], viewers: [{ id: `v${nul}`, name: 'V', positionM: [0, 0], eyeHeightM: 1.6 }] } }),
  },
  { name: 'a line break in a project name', run: () => installer.post('/api/projects').send({ name: 'Cold\nstore' }) },
  {
    name: 'a bell character in a mirror label',
    run: () =>
      installer.post(`/api/projects/${projectId}/placements`).send({
        label: 'M\u0007',
        customMirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 },
        positionM: [0, 0],
        heightM: 2.5,
        azimuthRad: 0,
        tiltDownRad: 0.2,
        viewerId: null,
        notes: '',
      }),
  },
];

describe('the fuzz corpus of malformed requests', () => {
  it.each(corpus().map((c) => [c.name, c] as const))('answers %s with a 4xx and a sentence', async (_name, c) => {
    const res = await c.run();
    expect(res.status).toBeGreaterThanOrEqual(400);
    expect(res.status).toBeLessThan(500);
    expect(isSentence(res.body.error ?? res.text)).toBe(true);
  });
});

describe('statuses that say what was wrong', () => {
  it('answers a body in an unsupported charset with 415', async () => {
    const res = await request(h.app).post('/api/auth/sign-in').set('Content-Type', 'application/json; charset=latin1').send('{}');
    expect(res.status).toBe(415);
    expect(res.body.error).toMatch(/UTF-8/);
  });

  it('answers a body in an unsupported content encoding with 415', async () => {
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'compress')
      .send('{}');
    expect(res.status).toBe(415);
  });

  it('still accepts a gzip-compressed JSON body', async () => {
    const body = zlib.gzipSync(JSON.stringify({ email: EMAIL.reviewer, password: PASSWORD }));
    const res = await request(h.app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .set('Content-Encoding', 'gzip')
      .serialize(rawBody)
      .send(body);
    expect(res.status).toBe(200);
  });

  it('answers broken percent-encoding in a path with 400', async () => {
    const res = await installer.get('/api/projects/%E0%A4%A');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/address/i);
  });

  it('names the field that holds a control character', async () => {
    const res = await installer.post('/api/projects').send({ name: `Cold${nul}store` });
    expect(res.status).toBe(400);
    expect(res.body.fields.name).toMatch(/control character/i);
  });

  it('refuses a line break in a single-line field but keeps it in notes', async () => {
    const name = await installer.post('/api/projects').send({ name: 'Cold\nstore' });
    expect(name.status).toBe(400);
    expect(name.body.fields.name).toMatch(/one line/i);
    const notes = await installer.post('/api/projects').send({ name: 'Notes with lines (demo)', notes: 'line one\nline two\r\n\ttabbed' });
    expect(notes.status).toBe(201);
    expect(notes.body.project.notes).toBe('line one\nline two\r\n\ttabbed');
  });
});

describe('the log of an unexpected failure', () => {
  /** The real JSON logger, writing into an array instead of stdout. */
  const capture = () => {
    const lines: string[] = [];
    const log = createLogger(false, { write: (line: string) => void lines.push(line) });
    return { lines, log };
  };
  const token = 'Zq9'.repeat(15);
  const hash = `$2b$12$${'a'.repeat(53)}`;

  it('keeps the kind of a database error but not its statement, values, path token or session id', async () => {
    const { lines, log } = capture();
    const app = express();
    app.get('/api/invitations/:token', () => {
      throw new DriverException(
        new Error(`insert into \`user\` (\`email\`, \`password_hash\`) values ('ada@leak.example', '${hash}') - SQLITE_CONSTRAINT`),
      );
    });
    app.use(errorHandler(log));
    const res = await request(app).get(`/api/invitations/${token}`).set('Cookie', `sightfan.sid=s%3A${token}`);
    expect(res.status).toBe(500);
    const logged = lines.join('\n');
    expect(logged).toContain('DriverException');
    expect(logged).toContain('/api/invitations/:token');
    expect(logged).not.toMatch(/insert into|ada@leak|\$2b\$|Zq9Zq9/);
  });

  it('masks a token or a hash that an ordinary error message carries', async () => {
    const { lines, log } = capture();
    const app = express();
    app.get('/boom', () => {
      throw new Error(`reset token ${token} did not match ${hash}`);
    });
    app.use(errorHandler(log));
    expect((await request(app).get('/boom?session=abc')).status).toBe(500);
    const logged = lines.join('\n');
    expect(logged).toContain('reset token');
    expect(logged).not.toMatch(/Zq9Zq9|\$2b\$/);
  });
});

describe('any text at all in stored and searched fields', () => {
  // Whole code-point space, controls and lone surrogates included ("binary" units), up to 300 units.
  const anyText = fc.string({ unit: 'binary', maxLength: 300 });
  const fields: [string, (t: string) => Promise<request.Response>][] = [
    ['a project name', (t) => installer.post('/api/projects').send({ name: t })],
    ['project notes', (t) => installer.post('/api/projects').send({ name: 'Fuzzed notes (demo)', notes: t })],
    ['a project search', (t) => installer.get('/api/projects').query({ q: t })],
    ['my own name', (t) => installer.patch('/api/auth/me').send({ name: t })],
    ['a sign-in address', (t) => request(h.app).post('/api/auth/sign-in').send({ email: t, password: 'x' })],
    [
      'a catalogue name',
      (t) =>
        admin
          .post('/api/catalogue')
          .send({ code: 'FUZZ', name: t, mirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 }, unitPriceMinor: 1, currency: 'EUR' }),
    ],
  ];

  it.each(fields)('never answers 5xx for %s', async (_what, send) => {
    await fc.assert(
      fc.asyncProperty(anyText, async (t) => {
        const res = await send(t);
        expect(res.status).toBeLessThan(500);
      }),
      { numRuns: 40 },
    );
  });
});
