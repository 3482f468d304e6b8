import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import request from 'supertest';
import { initORM, type Orm } from '../../server/db';
import { requestContext, requestEm } from '../../server/middleware/request-context';
import { User } from '../../server/modules/users/user.entity';
import { EMAIL, startHarness, type Harness } from './harness';

describe('one entity manager per request', () => {
  let orm: Orm;
  let dir: string;
  beforeAll(async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-rc-'));
    orm = await initORM(path.join(dir, 'rc.sqlite'));
  });
  afterAll(async () => {
    await orm.close(true);
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('gives two requests running at the same time different entity managers, each kept across awaits', async () => {
    const app = express();
    app.use(requestContext(orm));
    app.get('/:wait', async (req, res) => {
      const before = requestEm();
      await new Promise((resolve) => setTimeout(resolve, Number(req.params.wait)));
      const after = requestEm();
      res.json({ before: before.id, after: after.id, global: orm.em._id });
    });
    const [slow, fast] = await Promise.all([request(app).get('/60'), request(app).get('/5')]);
    expect(slow.body.before).toBe(slow.body.after);
    expect(fast.body.before).toBe(fast.body.after);
    expect(slow.body.before).not.toBe(fast.body.before);
    expect(slow.body.before).not.toBe(slow.body.global);
  });

  it('refuses to hand out an entity manager outside a request, with a sentence saying what to mount', () => {
    expect(() => requestEm()).toThrow(/outside a request: mount requestContext\(orm\)/);
  });
});

describe('the signed-in user', () => {
  let h: Harness;
  beforeAll(async () => {
    h = await startHarness();
  });
  afterAll(async () => {
    await h.close();
  });

  it('is loaded into the entity manager the route flushes, so changing it and flushing saves it', async () => {
    const agent = await h.signedIn(EMAIL.installer);
    const res = await agent.patch('/api/auth/me').send({ name: 'Renamed Installer (demo)' });
    expect(res.status).toBe(200);
    const stored = await h.orm.em.fork().findOneOrFail(User, { email: EMAIL.installer });
    expect(stored.name).toBe('Renamed Installer (demo)');
  });
});
