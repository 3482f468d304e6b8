/**
 * A project's detect and recognise angles through the API: stored in the scene, validated with a
 * sentence per field, and absent (the defaults) for a project that never set them.
 */
import { CROSSING_SCENE, CROSSING_ZONE, EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
beforeAll(async () => {
  h = await startHarness();
});
afterAll(async () => {
  await h.close();
});

const ARCMIN = Math.PI / 10800;
/** The crossing with no walls, its zone judged by the detect angle. */
const scene = { ...CROSSING_SCENE, walls: [], zones: [{ ...CROSSING_ZONE, criterion: 'detect' }] };

describe('a project’s criteria through the API', () => {
  it('keeps the angles and each zone’s criterion it was given, and leaves them out when never set', async () => {
    const a = await h.signedIn(EMAIL.installer);
    const plain = await a.post('/api/projects').send({ name: 'No angles set', scene });
    expect(plain.status).toBe(201);
    expect(plain.body.project.scene.criteria).toBeUndefined();
    const criteria = { detectRad: 5 * ARCMIN, recogniseRad: 25 * ARCMIN };
    const own = await a
      .patch(`/api/projects/${plain.body.project.id}`)
      .send({ version: plain.body.project.version, scene: { ...scene, criteria } });
    expect(own.status).toBe(200);
    const back = (await a.get(`/api/projects/${plain.body.project.id}`)).body.project.scene;
    expect(back.criteria).toEqual(criteria);
    expect(back.zones[0].criterion).toBe('detect');
  });

  it('refuses a recognise angle smaller than the detect angle with 400 and a sentence for that field', async () => {
    const a = await h.signedIn(EMAIL.installer);
    const res = await a
      .post('/api/projects')
      .send({ name: 'Backwards angles', scene: { ...scene, criteria: { detectRad: 20 * ARCMIN, recogniseRad: 6 * ARCMIN } } });
    expect(res.status).toBe(400);
    const messages = Object.entries(res.body.fields as Record<string, string>);
    expect(messages).toHaveLength(1);
    expect(messages[0][0]).toMatch(/criteria.*recogniseRad/);
    expect(messages[0][1]).toMatch(/larger than the detect angle/);
  });
});
