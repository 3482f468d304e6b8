import request from 'supertest';
import { evaluateProject } from '../../shared/project-optics';
import { catalogueItemBody, crossingMirror, crossingProject, EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
const OTHER_INSTALLER = 'otto.other@sightfan-demo.example';
const OUTSIDE_REVIEWER = 'olga.outside@elsewhere-demo.example';
beforeAll(async () => {
  h = await startHarness();
  await h.addUser(OTHER_INSTALLER, 'installer');
  await h.addUser(OUTSIDE_REVIEWER, 'reviewer', 'Elsewhere Depots (demo)');
});
afterAll(async () => {
  await h.close();
});

type Who = 'anonymous' | 'installerA' | 'installerB' | 'reviewer' | 'admin';
const emailOf: Record<Exclude<Who, 'anonymous'>, string> = {
  installerA: EMAIL.installer,
  installerB: OTHER_INSTALLER,
  reviewer: EMAIL.reviewer,
  admin: EMAIL.admin,
};
async function as(who: Who) {
  return who === 'anonymous' ? request.agent(h.app) : h.signedIn(emailOf[who]);
}

const newProject = (name = 'Aisle 7 crossing') => crossingProject(name);

async function firstCatalogueId(): Promise<number> {
  const res = await (await as('installerA')).get('/api/catalogue');
  return res.body.items[0].id;
}

describe('projects: create, read, change, delete', () => {
  it('lets an installer create a project, read it back, change it and delete it', async () => {
    const a = await as('installerA');
    const created = await a.post('/api/projects').send(newProject());
    expect(created.status).toBe(201);
    const p = created.body.project;
    expect(p).toMatchObject({ name: 'Aisle 7 crossing', kind: 'site', state: 'drawing_up', version: 1, canEdit: true, placements: [] });

    const read = await a.get(`/api/projects/${p.id}`);
    expect(read.body.project.scene.zones[0].name).toBe('Crossing');

    const changed = await a.patch(`/api/projects/${p.id}`).send({ version: 1, name: 'Aisle 7 crossing, east' });
    expect(changed.status).toBe(200);
    expect(changed.body.project).toMatchObject({ name: 'Aisle 7 crossing, east', version: 2 });

    const placement = await a.post(`/api/projects/${p.id}/placements`).send(crossingMirror(await firstCatalogueId()));
    expect(placement.status).toBe(201);
    expect(placement.body.placement).toMatchObject({ label: 'M1', positionM: [2.5, 0.4], heightM: 3, version: 1 });
    const moved = await a.patch(`/api/projects/${p.id}/placements/${placement.body.placement.id}`).send({ version: 1, heightM: 3.5 });
    expect(moved.body.placement).toMatchObject({ heightM: 3.5, version: 2 });

    expect((await a.delete(`/api/projects/${p.id}`)).status).toBe(204);
    expect((await a.get(`/api/projects/${p.id}`)).status).toBe(404);
  });

  it('lists with search and sort', async () => {
    const a = await as('installerA');
    await a.post('/api/projects').send(newProject('Zebra yard'));
    await a.post('/api/projects').send(newProject('Alpha dock'));
    const byName = await a.get('/api/projects?sort=name');
    const names = byName.body.projects.map((p: { name: string }) => p.name);
    expect(names).toEqual([...names].sort((x: string, y: string) => x.localeCompare(y)));
    const found = await a.get('/api/projects?q=zebra');
    expect(found.body.projects.map((p: { name: string }) => p.name)).toEqual(['Zebra yard']);
    expect((await a.get('/api/projects?sort=colour')).status).toBe(400);
  });

  it('ships the demo project with two placements to the demo installer', async () => {
    const a = await as('installerA');
    const list = await a.get('/api/projects?q=demo');
    const demo = list.body.projects.find((p: { name: string }) => p.name === 'Cold store aisles and dock (demo)');
    expect(demo.placementCount).toBe(2);
  });
});

describe('who may do what with a project', () => {
  let projectId: number;
  let placementId: number;
  beforeAll(async () => {
    const a = await as('installerA');
    projectId = (await a.post('/api/projects').send(newProject('Matrix project'))).body.project.id;
    placementId = (await a.post(`/api/projects/${projectId}/placements`).send(crossingMirror(await firstCatalogueId()))).body.placement.id;
  });

  const current = async (path: string) => (await (await as('installerA')).get(path)).body;

  const cases: [string, Who, number][] = [
    ['GET project', 'anonymous', 401],
    ['GET project', 'installerA', 200],
    ['GET project', 'installerB', 404],
    ['GET project', 'reviewer', 200],
    ['GET project', 'admin', 200],
    ['PATCH project', 'anonymous', 401],
    ['PATCH project', 'installerB', 404],
    ['PATCH project', 'reviewer', 403],
    ['PATCH project', 'admin', 403],
    ['PATCH project', 'installerA', 200],
    ['POST placement', 'anonymous', 401],
    ['POST placement', 'installerB', 404],
    ['POST placement', 'reviewer', 403],
    ['POST placement', 'admin', 403],
    ['POST placement', 'installerA', 201],
    ['PATCH placement', 'anonymous', 401],
    ['PATCH placement', 'installerB', 404],
    ['PATCH placement', 'reviewer', 403],
    ['PATCH placement', 'admin', 403],
    ['PATCH placement', 'installerA', 200],
    ['DELETE placement', 'installerB', 404],
    ['DELETE placement', 'reviewer', 403],
    ['DELETE project', 'anonymous', 401],
    ['DELETE project', 'installerB', 404],
    ['DELETE project', 'reviewer', 403],
    ['DELETE project', 'admin', 403],
  ];

  it.each(cases)('%s as %s answers %i', async (action, who, status) => {
    const agent = await as(who);
    const base = `/api/projects/${projectId}`;
    let res: request.Response;
    switch (action) {
      case 'GET project':
        res = await agent.get(base);
        break;
      case 'PATCH project':
        res = await agent.patch(base).send({ version: (await current(base)).project.version, notes: `by ${who}` });
        break;
      case 'POST placement':
        res = await agent.post(`${base}/placements`).send(crossingMirror(await firstCatalogueId()));
        break;
      case 'PATCH placement': {
        const p = (await current(base)).project.placements.find((x: { id: number }) => x.id === placementId);
        res = await agent.patch(`${base}/placements/${placementId}`).send({ version: p.version, tiltDownRad: 0.2 });
        break;
      }
      case 'DELETE placement':
        res = await agent.delete(`${base}/placements/${placementId}`);
        break;
      default:
        res = await agent.delete(base);
    }
    expect(res.status).toBe(status);
    if (status >= 400) expect(typeof res.body.error).toBe('string');
  });

  it('shows reviewers only their own organisation’s projects', async () => {
    expect((await (await h.signedIn(OUTSIDE_REVIEWER)).get(`/api/projects/${projectId}`)).status).toBe(404);
    expect((await (await as('reviewer')).get(`/api/projects/${projectId}`)).body.project.canEdit).toBe(false);
  });

  it('lets only installers create projects', async () => {
    expect((await (await as('reviewer')).post('/api/projects').send(newProject())).status).toBe(403);
    expect((await (await as('anonymous')).post('/api/projects').send(newProject())).status).toBe(401);
  });

  it('lists only the installer’s own projects', async () => {
    const b = await as('installerB');
    expect((await b.get('/api/projects')).body.projects).toEqual([]);
  });
});

describe('stale versions and bad bodies', () => {
  it('answers 409 with the current record when the version is stale, and saves nothing', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Stale test'))).body.project;
    await a.patch(`/api/projects/${p.id}`).send({ version: 1, name: 'First edit' });
    const stale = await a.patch(`/api/projects/${p.id}`).send({ version: 1, name: 'Second edit from an old screen' });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ name: 'First edit', version: 2 });
    expect((await a.get(`/api/projects/${p.id}`)).body.project.name).toBe('First edit');
  });

  it('answers 409 with the current placement for a stale placement edit', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Stale placement'))).body.project;
    const pl = (await a.post(`/api/projects/${p.id}/placements`).send(crossingMirror(await firstCatalogueId()))).body.placement;
    await a.patch(`/api/projects/${p.id}/placements/${pl.id}`).send({ version: 1, heightM: 4 });
    const stale = await a.patch(`/api/projects/${p.id}/placements/${pl.id}`).send({ version: 1, heightM: 2.5 });
    expect(stale.status).toBe(409);
    expect(stale.body.current).toMatchObject({ heightM: 4, version: 2 });
  });

  it("counts every mirror write on the project's version and answers with it, so the plan saves with the version it was given", async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Mirror edits beside plan edits'))).body.project;
    const added = await a.post(`/api/projects/${p.id}/placements`).send(crossingMirror(await firstCatalogueId()));
    expect(added.body.projectVersion).toBe(p.version + 1);
    const pl = added.body.placement;
    const changed = await a.patch(`/api/projects/${p.id}/placements/${pl.id}`).send({ version: pl.version, heightM: 3.4 });
    expect(changed.body.projectVersion).toBe(p.version + 2);
    const removed = await a.delete(`/api/projects/${p.id}/placements/${pl.id}`);
    expect(removed.status).toBe(200);
    expect(removed.body.projectVersion).toBe(p.version + 3);
    const stalePlan = await a.patch(`/api/projects/${p.id}`).send({ version: p.version, notes: 'Plan edited with the old version' });
    expect(stalePlan.status).toBe(409);
    const planSave = await a
      .patch(`/api/projects/${p.id}`)
      .send({ version: removed.body.projectVersion, notes: 'Plan edited after the mirror changes' });
    expect(planSave.status).toBe(200);
  });

  it('lets two simultaneous saves of two different mirrors of one job both through', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Two mirrors at once'))).body.project;
    const catalogueId = await firstCatalogueId();
    const one = (await a.post(`/api/projects/${p.id}/placements`).send(crossingMirror(catalogueId))).body.placement;
    const two = (await a.post(`/api/projects/${p.id}/placements`).send({ ...crossingMirror(catalogueId), label: 'M2', positionM: [4, 4] }))
      .body.placement;
    const [r1, r2] = await Promise.all([
      a.patch(`/api/projects/${p.id}/placements/${one.id}`).send({ version: one.version, heightM: 3.1 }),
      a.patch(`/api/projects/${p.id}/placements/${two.id}`).send({ version: two.version, heightM: 3.2 }),
    ]);
    expect([r1.status, r2.status]).toEqual([200, 200]);
    expect(new Set([r1.body.projectVersion, r2.body.projectVersion]).size).toBe(2);
  });

  it('lets only one of two simultaneous edits of the same version through, and tells the other what was saved', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Simultaneous edits'))).body.project;
    const pl = (await a.post(`/api/projects/${p.id}/placements`).send(crossingMirror(await firstCatalogueId()))).body.placement;
    const [one, two] = await Promise.all([
      a.patch(`/api/projects/${p.id}/placements/${pl.id}`).send({ version: pl.version, heightM: 3.3 }),
      a.patch(`/api/projects/${p.id}/placements/${pl.id}`).send({ version: pl.version, heightM: 4.4 }),
    ]);
    expect([one.status, two.status].sort()).toEqual([200, 409]);
    const [won, lost] = one.status === 200 ? [one, two] : [two, one];
    expect(lost.body.current).toMatchObject({ heightM: won.body.placement.heightM, version: won.body.placement.version });
  });

  it('answers 409 for a duplicate catalogue code found only by the database, naming the field', async () => {
    const admin = await as('admin');
    // The organisation's own items (the shared demo set is read-only).
    const own = (code: string) => catalogueItemBody(code, `Own round ${code}`);
    const first = (await admin.post('/api/catalogue').send(own('OWN-1'))).body.item;
    const second = (await admin.post('/api/catalogue').send(own('OWN-2'))).body.item;
    const res = await admin.patch(`/api/catalogue/${second.id}`).send({ version: second.version, code: first.code });
    expect(res.status).toBe(409);
    expect(res.body.fields.code).toBe('This code is already in use.');
  });

  it.each([
    ['a project without a name', { ...newProject(), name: '' }, 'name', 'Give the project a name.'],
    [
      'a zone that crosses itself',
      {
        ...newProject(),
        scene: {
          zones: [
            {
              id: 'z',
              name: 'Bow tie',
              polygonM: [
                [0, 0],
                [2, 2],
                [2, 0],
                [0, 2],
              ],
            },
          ],
        },
      },
      'scene.zones.0.polygonM',
      'The zone outline crosses or touches itself; redraw it as one simple outline.',
    ],
    [
      'a wall with both ends at one point',
      { ...newProject(), scene: { walls: [{ id: 'w', aM: [1, 1], bM: [1, 1], heightM: 3 }] } },
      'scene.walls.0.bM',
      'A wall needs two different ends (at least 10 mm apart).',
    ],
    [
      'a viewer with an eye height of 10 m',
      { ...newProject(), scene: { viewers: [{ id: 'v', name: 'Crane', positionM: [0, 0], eyeHeightM: 10 }] } },
      'scene.viewers.0.eyeHeightM',
      'An eye height over 6 m is not a person on the floor.',
    ],
  ])('rejects %s with 400 and the field message', async (_what, body, field, message) => {
    const res = await (await as('installerA')).post('/api/projects').send(body);
    expect(res.status).toBe(400);
    expect(res.body.fields[field]).toBe(message);
  });

  it.each([
    ['a custom mirror wider than its sphere', { customMirror: { shape: 'round', diameterM: 1, radiusM: 0.4 } }, 'customMirror.radiusM'],
    ['both a catalogue item and a custom mirror', { customMirror: { shape: 'round', diameterM: 0.5, radiusM: 1 } }, 'catalogueItemId'],
    ['a mounting height of 10 cm', { heightM: 0.1 }, 'heightM'],
  ])('rejects a placement with %s', async (_what, patch, field) => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Bad placements'))).body.project;
    const base = crossingMirror(await firstCatalogueId());
    const body =
      'customMirror' in patch && _what.startsWith('a custom') ? { ...base, catalogueItemId: null, ...patch } : { ...base, ...patch };
    const res = await a.post(`/api/projects/${p.id}/placements`).send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.fields)).toContain(field);
  });

  it('refuses a mirror whose body the rack passes through, naming the rack, and accepts it on the face', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Mirror in the rack'))).body.project;
    const base = crossingMirror(await firstCatalogueId());
    const inside = await a.post(`/api/projects/${p.id}/placements`).send({ ...base, positionM: [2.5, 0.01], tiltDownRad: 0 });
    expect(inside.status).toBe(400);
    expect(inside.body.fields.positionM).toMatch(
      /^“M1” reaches .* into rack “w1”; a mirror cannot hang inside a wall or rack\. Move it .*, to x 2\.50 m, y 0\.\d\d m, where it sits on the face\.$/,
    );
    const y = Number(/y (0\.\d\d) m/.exec(inside.body.fields.positionM)![1]);
    const onFace = await a.post(`/api/projects/${p.id}/placements`).send({ ...base, positionM: [2.5, y], tiltDownRad: 0 });
    expect(onFace.status).toBe(201);
    const pushed = await a
      .patch(`/api/projects/${p.id}/placements/${onFace.body.placement.id}`)
      .send({ version: 1, positionM: [2.5, 0.01] });
    expect(pushed.status).toBe(400);
    expect(pushed.body.fields.positionM).toMatch(/into rack “w1”/);
  });

  it('rejects a placement for a viewer that is not in the plan, or a catalogue item that does not exist', async () => {
    const a = await as('installerA');
    const p = (await a.post('/api/projects').send(newProject('Bad references'))).body.project;
    const base = crossingMirror(await firstCatalogueId());
    const noViewer = await a.post(`/api/projects/${p.id}/placements`).send({ ...base, viewerId: 'ghost' });
    expect(noViewer.status).toBe(400);
    expect(noViewer.body.fields.viewerId).toMatch(/not in this plan/);
    const noItem = await a.post(`/api/projects/${p.id}/placements`).send({ ...base, catalogueItemId: 99999 });
    expect(noItem.body.fields.catalogueItemId).toMatch(/does not exist/);
  });
});

describe('the demo project', () => {
  // At the recognise criterion (20′ of an adult's height) the junction's half dome recognises an
  // adult only to about 6 m, so the junction is partly covered too (it was "covered" at the old 3′).
  it('leaves gaps worth fixing: the junction and the dock apron are both only partly covered', async () => {
    const a = await as('installerA');
    const list = await a.get('/api/projects?q=demo');
    const id = list.body.projects.find((p: { name: string }) => p.name === 'Cold store aisles and dock (demo)').id;
    const project = (await a.get(`/api/projects/${id}`)).body.project;
    const catalogue = (await a.get('/api/catalogue')).body.items;
    const ev = evaluateProject({ scene: project.scene, placements: project.placements, catalogue });
    expect(ev.placements.map((p) => p.problem)).toEqual([null, null]);
    const byId = Object.fromEntries(ev.zones.map((z) => [z.zoneId, z.fraction]));
    expect(byId['z-junction']).toBeGreaterThan(0.6);
    expect(byId['z-junction']).toBeLessThan(0.9);
    expect(byId['z-dock']).toBeGreaterThan(0.5);
    expect(byId['z-dock']).toBeLessThan(0.9);
  });
});
