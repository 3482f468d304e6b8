/**
 * Vehicle jobs through the API: the vehicle lives in the project's scene, a vehicle mirror is a
 * placement with its class and the fields it serves, access is as for sites, and the demo truck's
 * class V field is short until its close-proximity mirror is tilted down.
 */
import request from 'supertest';
import { evaluateVehicleJob, vehicleJobFields } from '../../shared/project-optics';
import { vehiclePreset, type ProjectDto } from '../../shared/schemas';
import { DEMO_TRUCK, DEMO_TRUCK_CLOSE_MIRROR } from '../../server/seeders/demo-vehicles';
import { EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
const OTHER_INSTALLER = 'otto.other@sightfan-demo.example';
beforeAll(async () => {
  h = await startHarness();
  await h.addUser(OTHER_INSTALLER, 'installer');
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
const as = (who: Who) => (who === 'anonymous' ? Promise.resolve(request.agent(h.app)) : h.signedIn(emailOf[who]));

const truckJob = (name = 'Van 3 mirrors') => ({
  name,
  kind: 'vehicle',
  customer: 'Brightwater Couriers (test)',
  scene: { vehicle: vehiclePreset('rigid-truck', 'left'), ruleSet: 'eu-retrofit' },
});
/** A class V mirror over the passenger (right) door of the left-hand-drive preset truck, outside the cab (cab half-width 1.175 m). */
const closeMirror = (overrides: Record<string, unknown> = {}) => ({
  label: 'V1',
  customMirror: { shape: 'rect', widthM: 0.24, heightM: 0.2, radiusM: 0.3 },
  positionM: [-0.2, -1.325],
  heightM: 2.7,
  azimuthRad: (140 * Math.PI) / 180,
  tiltDownRad: (45 * Math.PI) / 180,
  mirrorClass: 'V',
  servesFieldIds: ['un-v-right'],
  ...overrides,
});

describe('creating a vehicle job', () => {
  it('keeps the vehicle and its rules in the scene and gives back a project of kind vehicle', async () => {
    const a = await as('installerA');
    const res = await a.post('/api/projects').send(truckJob());
    expect(res.status).toBe(201);
    const p = res.body.project as ProjectDto;
    expect(p.kind).toBe('vehicle');
    expect(p.scene.ruleSet).toBe('eu-retrofit');
    expect(p.scene.vehicle).toEqual(vehiclePreset('rigid-truck', 'left'));
  });

  it('refuses a vehicle job without a vehicle, and a site job with one, each with a sentence', async () => {
    const a = await as('installerA');
    const bare = await a.post('/api/projects').send({ name: 'No vehicle', kind: 'vehicle' });
    expect(bare.status).toBe(400);
    expect(bare.body.fields['scene.vehicle']).toBe(
      'A vehicle job needs its vehicle: choose a kind of vehicle and adjust its measurements.',
    );
    const site = await a.post('/api/projects').send({ ...truckJob('Site with a truck'), kind: 'site' });
    expect(site.status).toBe(400);
    expect(site.body.fields['scene.vehicle']).toBe('A site job has no vehicle; start a vehicle job for a vehicle.');
  });

  it('refuses walls or viewers beside a vehicle, and impossible measurements, naming the field', async () => {
    const a = await as('installerA');
    const walls = await a.post('/api/projects').send({
      ...truckJob(),
      scene: { ...truckJob().scene, viewers: [{ id: 'v1', name: 'Driver', positionM: [0, 0], eyeHeightM: 2 }] },
    });
    expect(walls.status).toBe(400);
    expect(walls.body.fields['scene.vehicle']).toMatch(/no walls, zones or viewers/);
    const wideCab = await a
      .post('/api/projects')
      .send({ ...truckJob(), scene: { vehicle: { ...vehiclePreset('rigid-truck', 'left'), cabWidthM: 2.8 } } });
    expect(wideCab.status).toBe(400);
    expect(wideCab.body.fields['scene.vehicle.cabWidthM']).toBe('The cab cannot be wider than the vehicle.');
    const noRule = await a.post('/api/projects').send({ ...truckJob(), scene: { ...truckJob().scene, ruleSet: 'house-rules' } });
    expect(noRule.status).toBe(400);
    expect(noRule.body.fields['scene.ruleSet']).toMatch(/^Choose the rules to score against/);
  });
});

describe('changing a vehicle job', () => {
  let id: number;
  let version: number;
  beforeAll(async () => {
    const p = (await (await as('installerA')).post('/api/projects').send(truckJob('Change me'))).body.project as ProjectDto;
    id = p.id;
    version = p.version;
  });

  it('will not turn a vehicle job into a site, or drop its vehicle', async () => {
    const a = await as('installerA');
    const kind = await a.patch(`/api/projects/${id}`).send({ version, kind: 'site' });
    expect(kind.status).toBe(400);
    expect(kind.body.fields.kind).toBe('A project’s kind cannot change; start a new project for a site or a vehicle.');
    const dropped = await a.patch(`/api/projects/${id}`).send({ version, scene: { walls: [], zones: [], viewers: [] } });
    expect(dropped.status).toBe(400);
    expect(dropped.body.fields['scene.vehicle']).toBe(
      'A vehicle job needs its vehicle: choose a kind of vehicle and adjust its measurements.',
    );
    expect((await a.get(`/api/projects/${id}`)).body.project.version).toBe(version);
  });

  it('saves a changed vehicle (another rule set, right-hand drive)', async () => {
    const a = await as('installerA');
    const res = await a
      .patch(`/api/projects/${id}`)
      .send({ version, scene: { vehicle: vehiclePreset('rigid-truck', 'right'), ruleSet: 'un-r46' } });
    expect(res.status).toBe(200);
    expect(res.body.project.scene.vehicle.driverSide).toBe('right');
    expect(res.body.project.scene.ruleSet).toBe('un-r46');
    version = res.body.project.version;
  });
});

describe('mirrors on a vehicle', () => {
  let id: number;
  beforeAll(async () => {
    id = (await (await as('installerA')).post('/api/projects').send(truckJob('Mirrors'))).body.project.id;
  });

  it('keeps a mirror’s class and the fields it serves', async () => {
    const res = await (await as('installerA')).post(`/api/projects/${id}/placements`).send(closeMirror());
    expect(res.status).toBe(201);
    expect(res.body.placement).toMatchObject({ mirrorClass: 'V', servesFieldIds: ['un-v-right'], viewerId: null });
  });

  it('refuses a mirror inside the cab, naming the cab', async () => {
    const res = await (await as('installerA')).post(`/api/projects/${id}/placements`).send(closeMirror({ positionM: [-1, 0] }));
    expect(res.status).toBe(400);
    expect(res.body.fields.positionM).toBe('Mirror V1 sits inside “Cab”; place it on the outside of the body.');
  });

  it('refuses a field the vehicle does not have under its rules, and a class on a site’s mirror', async () => {
    const a = await as('installerA');
    // Class V is on the passenger side: the right of a left-hand-drive truck, so there is no "un-v-left".
    const wrongSide = await a.post(`/api/projects/${id}/placements`).send(closeMirror({ servesFieldIds: ['un-v-left'] }));
    expect(wrongSide.status).toBe(400);
    expect(wrongSide.body.fields.servesFieldIds).toBe('This vehicle has no field “un-v-left” under its rules; choose among its fields.');
    const site = (await a.post('/api/projects').send({ name: 'A site' })).body.project.id;
    const onSite = await a.post(`/api/projects/${site}/placements`).send(closeMirror({ servesFieldIds: null }));
    expect(onSite.status).toBe(400);
    expect(onSite.body.fields.mirrorClass).toBe('Only a mirror on a vehicle has a class; leave it empty on a site.');
  });

  it('refuses a viewer on a vehicle’s mirror: the driver’s eyes come from the vehicle', async () => {
    const res = await (await as('installerA')).post(`/api/projects/${id}/placements`).send(closeMirror({ viewerId: 'v1' }));
    expect(res.status).toBe(400);
    expect(res.body.fields.viewerId).toBe('That viewer is not in this plan; add the viewer first or pick another.');
  });
});

describe('who may do what with a vehicle job', () => {
  let projectId: number;
  let placementId: number;
  beforeAll(async () => {
    const a = await as('installerA');
    projectId = (await a.post('/api/projects').send(truckJob('Matrix truck'))).body.project.id;
    placementId = (await a.post(`/api/projects/${projectId}/placements`).send(closeMirror())).body.placement.id;
  });
  const current = async (path: string) => (await (await as('installerA')).get(path)).body;

  const cases: [string, Who, number][] = [
    ['POST project', 'anonymous', 401],
    ['POST project', 'reviewer', 403],
    ['POST project', 'admin', 403],
    ['POST project', 'installerB', 201],
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
    ['PATCH placement', 'installerB', 404],
    ['PATCH placement', 'reviewer', 403],
    ['PATCH placement', 'admin', 403],
    ['PATCH placement', 'installerA', 200],
    ['DELETE placement', 'installerB', 404],
    ['DELETE placement', 'reviewer', 403],
    ['DELETE project', 'installerB', 404],
    ['DELETE project', 'reviewer', 403],
    ['DELETE project', 'admin', 403],
  ];

  it.each(cases)('%s as %s answers %i', async (action, who, status) => {
    const agent = await as(who);
    const base = `/api/projects/${projectId}`;
    let res: request.Response;
    switch (action) {
      case 'POST project':
        res = await agent.post('/api/projects').send(truckJob(`Truck by ${who}`));
        break;
      case 'GET project':
        res = await agent.get(base);
        break;
      case 'PATCH project':
        res = await agent.patch(base).send({ version: (await current(base)).project.version, notes: `by ${who}` });
        break;
      case 'POST placement':
        res = await agent.post(`${base}/placements`).send(closeMirror());
        break;
      case 'PATCH placement': {
        const p = (await current(base)).project.placements.find((x: { id: number }) => x.id === placementId);
        res = await agent.patch(`${base}/placements/${placementId}`).send({ version: p.version, tiltDownRad: 0.7 });
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
});

describe('the demo truck', () => {
  let truck: ProjectDto;
  beforeAll(async () => {
    const a = await as('installerA');
    const list = (await a.get('/api/projects')).body.projects as { id: number; name: string }[];
    truck = (await a.get(`/api/projects/${list.find((p) => p.name === DEMO_TRUCK.name)!.id}`)).body.project;
  });
  const classV = (p: ProjectDto) => {
    const ev = evaluateVehicleJob({ scene: p.scene, placements: p.placements, catalogue: [] });
    return ev.vehicle.fields.find((f) => f.field.code === 'un-v')!;
  };

  it('is a vehicle job of the demo installer, labelled demo', async () => {
    const me = (await (await as('installerA')).get('/api/auth/me')).body.user;
    expect(truck).toMatchObject({ kind: 'vehicle', ownerId: me.id });
    expect(truck.name).toMatch(/\(demo\)$/);
    expect(truck.scene.vehicle).toMatchObject({ kind: 'rigid-truck', driverSide: 'right' });
  });

  it('leaves its class V field short of the 85 % retrofit rule', () => {
    const v = classV(truck);
    expect(v.field.requiredShare).toBe(0.85); // Directive 2007/38/EC, docs/vehicle-sources.md [P]
    expect(v.share).toBeLessThan(0.85);
    expect(v.verdict).toBe('short');
  });

  it('passes once its close-proximity mirror is tilted from 30° to 45° down (same place, same aim)', async () => {
    // The pose was found with the engine: at 140° aim from the mirror (az −140° here, the passenger
    // side on the left), tilts of 40°–50° show over 98 % of the field, 30° about 78 %.
    const a = await as('installerA');
    const mirror = truck.placements.find((p) => p.label === DEMO_TRUCK_CLOSE_MIRROR.label)!;
    expect(mirror.tiltDownRad).toBeCloseTo((30 * Math.PI) / 180, 9);
    const copy = (await a.post('/api/projects').send({ name: 'Truck 14 refit', kind: 'vehicle', scene: truck.scene })).body.project;
    for (const p of truck.placements) {
      const { id: _i, projectId: _p, version: _v, updatedAt: _u, ...body } = p;
      await a.post(`/api/projects/${copy.id}/placements`).send(body);
    }
    const before = (await a.get(`/api/projects/${copy.id}`)).body.project as ProjectDto;
    const moved = before.placements.find((p) => p.label === DEMO_TRUCK_CLOSE_MIRROR.label)!;
    const res = await a
      .patch(`/api/projects/${copy.id}/placements/${moved.id}`)
      .send({ version: moved.version, tiltDownRad: (45 * Math.PI) / 180 });
    expect(res.status).toBe(200);
    const after = classV((await a.get(`/api/projects/${copy.id}`)).body.project);
    expect(after.share).toBeGreaterThanOrEqual(0.85);
    expect(after.verdict).toBe('pass');
  });

  it('turns short into pass exactly where the class V share crosses 85 %, and class IV where it crosses 95 %', () => {
    const mirror = truck.placements.find((p) => p.label === DEMO_TRUCK_CLOSE_MIRROR.label)!;
    const ivMirror = truck.placements.find((p) => p.mirrorClass === 'IV' && p.positionM[1] > 0)!;
    const seen = { V: new Set<string>(), IV: new Set<string>() };
    // Tilts 30°…40° sweep the class V share from about 78 % to 99 %; yawing the class IV mirror
    // away from the field sweeps its share down through 95 %.
    for (let k = 0; k <= 10; k++) {
      const placements = truck.placements.map((p) =>
        p.id === mirror.id
          ? { ...p, tiltDownRad: ((30 + k) * Math.PI) / 180 }
          : p.id === ivMirror.id
            ? { ...p, azimuthRad: p.azimuthRad - (k * 1.5 * Math.PI) / 180 }
            : p,
      );
      const ev = evaluateVehicleJob({ scene: truck.scene, placements, catalogue: [] });
      for (const [code, cls, mark] of [
        ['un-v', 'V', 0.85],
        ['un-iv', 'IV', 0.95],
      ] as const) {
        const f = ev.vehicle.fields.find((x) => x.field.code === code && x.field.side === 'left')!;
        expect(f.field.requiredShare).toBe(mark);
        expect(f.verdict).toBe(f.share >= mark ? 'pass' : 'short');
        seen[cls].add(f.verdict);
      }
    }
    expect([...seen.V].sort()).toEqual(['pass', 'short']);
    expect([...seen.IV].sort()).toEqual(['pass', 'short']);
  });

  it('has every rule-set field of the truck in the evaluation, in order', () => {
    const ev = evaluateVehicleJob({ scene: truck.scene, placements: truck.placements, catalogue: [] });
    expect(ev.vehicle.fields.map((f) => f.field.id)).toEqual(vehicleJobFields(truck.scene).map((f) => f.id));
  });
});
