import request from 'supertest';
import { catalogueItemBody, EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

const item = (code: string) => catalogueItemBody(code, 'Test round 700');

describe('the catalogue', () => {
  it('is readable by every signed-in role and by nobody signed out', async () => {
    for (const email of Object.values(EMAIL)) {
      const res = await (await h.signedIn(email)).get('/api/catalogue');
      expect(res.status).toBe(200);
      expect(res.body.items.length).toBe(20);
    }
    expect((await request(h.app).get('/api/catalogue')).status).toBe(401);
  });

  it('seeds a demo catalogue spanning round 300–1,200 mm, rectangular panels and three kinds of dome', async () => {
    const items = (await (await h.signedIn(EMAIL.installer)).get('/api/catalogue')).body.items as {
      mirror: { shape: string; diameterM?: number; portion?: string };
      demo: boolean;
      name: string;
    }[];
    const rounds = items.filter((i) => i.mirror.shape === 'round').map((i) => i.mirror.diameterM!);
    expect(Math.min(...rounds)).toBeCloseTo(0.3);
    expect(Math.max(...rounds)).toBeCloseTo(1.2);
    expect(items.some((i) => i.mirror.shape === 'rect')).toBe(true);
    expect(new Set(items.filter((i) => i.mirror.shape === 'dome').map((i) => i.mirror.portion))).toEqual(
      new Set(['full', 'half', 'quarter']),
    );
    expect(items.every((i) => i.demo && /\(demo\)/.test(i.name))).toBe(true);
  });

  it('lets only the admin create and edit items', async () => {
    expect((await (await h.signedIn(EMAIL.installer)).post('/api/catalogue').send(item('T-1'))).status).toBe(403);
    expect((await (await h.signedIn(EMAIL.reviewer)).post('/api/catalogue').send(item('T-1'))).status).toBe(403);
    const admin = await h.signedIn(EMAIL.admin);
    const created = await admin.post('/api/catalogue').send(item('T-1'));
    expect(created.status).toBe(201);
    const id = created.body.item.id;
    expect((await (await h.signedIn(EMAIL.installer)).patch(`/api/catalogue/${id}`).send({ version: 1, name: 'x' })).status).toBe(403);
    const edited = await admin.patch(`/api/catalogue/${id}`).send({ version: 1, unitPriceMinor: 15900 });
    expect(edited.body.item).toMatchObject({ unitPriceMinor: 15900, version: 2 });
    const stale = await admin.patch(`/api/catalogue/${id}`).send({ version: 1, unitPriceMinor: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.current.unitPriceMinor).toBe(15900);
  });

  it('refuses a duplicate code, a sphere smaller than the panel, and a bad currency', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    await admin.post('/api/catalogue').send(item('T-dup'));
    expect((await admin.post('/api/catalogue').send(item('T-dup'))).status).toBe(409);
    const tooCurved = await admin.post('/api/catalogue').send({ ...item('T-2'), mirror: { shape: 'round', diameterM: 1, radiusM: 0.45 } });
    expect(tooCurved.status).toBe(400);
    expect(tooCurved.body.fields['mirror.radiusM']).toMatch(/more than half the diameter/);
    const badCurrency = await admin.post('/api/catalogue').send({ ...item('T-3'), currency: 'euro' });
    expect(badCurrency.body.fields.currency).toBe('Use a three-letter currency code, like EUR or USD.');
  });

  it('answers at the earlier address /api/catalog with the same router, writes included', async () => {
    const admin = await h.signedIn(EMAIL.admin);
    const created = await admin.post('/api/catalog').send(item('T-alias'));
    expect(created.status).toBe(201);
    const listed = (await admin.get('/api/catalogue')).body.items as { code: string }[];
    expect(listed.map((i) => i.code)).toContain('T-alias');
    expect((await request(h.app).get('/api/catalog')).status).toBe(401);
  });
});
