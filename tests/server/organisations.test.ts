/**
 * Organisations are walls. A second organisation, made here, with its own admin, reviewer and
 * installer, must not reach the demo organisation's projects, sheets, users or catalogue, and the
 * shared demo catalogue is read-only for both.
 */
import type TestAgent from 'supertest/lib/agent';
import { EMAIL, startHarness, type Harness } from './harness';

const OTHER = 'Northgate Logistics (test organisation)';
const outsider = {
  admin: 'olga.admin@northgate.test',
  reviewer: 'omar.reviewer@northgate.test',
  installer: 'oona.installer@northgate.test',
} as const;
type Role = keyof typeof outsider;

let h: Harness;
const agents = {} as Record<Role, TestAgent>;
let demoAdmin: TestAgent;
let demoProjectId: number;
let demoUserId: number;
let demoOwnItemId: number;
let sharedItemId: number;

const mirror = { shape: 'round', diameterM: 0.6, radiusM: 0.8 };
const item = (code: string) => ({ code, name: `Test mirror ${code}`, mirror, unitPriceMinor: 100, currency: 'EUR' });

beforeAll(async () => {
  h = await startHarness();
  for (const role of Object.keys(outsider) as Role[]) {
    await h.addUser(outsider[role], role, OTHER);
    agents[role] = await h.signedIn(outsider[role]);
  }
  demoAdmin = await h.signedIn(EMAIL.admin);
  const installer = await h.signedIn(EMAIL.installer);
  demoProjectId = (await installer.get('/api/projects')).body.projects[0].id;
  demoUserId = (await installer.get('/api/auth/me')).body.user.id;
  demoOwnItemId = (await demoAdmin.post('/api/catalogue').send(item('HL-OWN-1'))).body.item.id;
  sharedItemId = ((await demoAdmin.get('/api/catalogue')).body.items as { id: number; demo: boolean }[]).find((i) => i.demo)!.id;
});
afterAll(async () => {
  await h.close();
});

const roles = Object.keys(outsider) as Role[];

describe('projects and sheets of another organisation', () => {
  const reads: [string, (a: TestAgent) => Promise<{ status: number }>][] = [
    ['reads the project', (a) => a.get(`/api/projects/${demoProjectId}`)],
    ['changes the project', (a) => a.patch(`/api/projects/${demoProjectId}`).send({ version: 1, name: 'Taken over' })],
    ['deletes the project', (a) => a.delete(`/api/projects/${demoProjectId}`)],
    ['adds a mirror to the project', (a) => a.post(`/api/projects/${demoProjectId}/placements`).send({})],
    ['reads the sheet status', (a) => a.get(`/api/projects/${demoProjectId}/sheet`)],
    ['downloads the sheet', (a) => a.get(`/api/projects/${demoProjectId}/sheet.pdf`)],
    ['e-mails the sheet', (a) => a.post(`/api/projects/${demoProjectId}/sheet/email`).send({ to: 'buyer@northgate.test' })],
  ];
  const matrix = roles.flatMap((role) => reads.map(([what, run]) => [role, what, run] as const));

  it.each(matrix)('answers 404 when an outside %s %s', async (role, _what, run) => {
    expect((await run(agents[role])).status).toBe(404);
  });

  it.each(roles)('leaves the demo project out of an outside %s’s list', async (role) => {
    const ids = ((await agents[role].get('/api/projects')).body.projects as { id: number }[]).map((p) => p.id);
    expect(ids).not.toContain(demoProjectId);
  });

  it('still lets the demo admin read the demo project', async () => {
    expect((await demoAdmin.get(`/api/projects/${demoProjectId}`)).status).toBe(200);
  });
});

describe('users of another organisation', () => {
  it('does not let an outside admin change a demo user', async () => {
    expect((await agents.admin.patch(`/api/users/${demoUserId}`).send({ role: 'admin' })).status).toBe(404);
  });

  it('lists only the outside admin’s own people', async () => {
    const emails = ((await agents.admin.get('/api/users')).body.users as { email: string }[]).map((u) => u.email).sort();
    expect(emails).toEqual(Object.values(outsider).sort());
  });
});

describe('the catalogue', () => {
  it('shows an organisation its own items and the shared demo set, not another organisation’s items', async () => {
    const items = (await agents.installer.get('/api/catalogue')).body.items as { id: number; demo: boolean }[];
    expect(items.map((i) => i.id)).toContain(sharedItemId);
    expect(items.map((i) => i.id)).not.toContain(demoOwnItemId);
  });

  it('answers 404 when an outside admin edits another organisation’s item', async () => {
    expect((await agents.admin.patch(`/api/catalogue/${demoOwnItemId}`).send({ version: 1, unitPriceMinor: 1 })).status).toBe(404);
  });

  it.each([
    ['the demo admin', () => demoAdmin],
    ['an outside admin', () => agents.admin],
  ])('keeps the shared demo set read-only for %s', async (_who, agent) => {
    const res = await agent().patch(`/api/catalogue/${sharedItemId}`).send({ version: 1, unitPriceMinor: 1 });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/read-only/);
  });

  it('lets each organisation use the same code in its own catalogue', async () => {
    expect((await agents.admin.post('/api/catalogue').send(item('HL-OWN-1'))).status).toBe(201);
  });

  it('refuses a placement that points at another organisation’s catalogue item', async () => {
    const project = (await agents.installer.post('/api/projects').send({ name: 'Northgate dock (test)' })).body.project;
    const res = await agents.installer.post(`/api/projects/${project.id}/placements`).send({
      label: 'M1',
      catalogueItemId: demoOwnItemId,
      customMirror: null,
      positionM: [0, 0],
      heightM: 2.5,
      azimuthRad: 0,
      tiltDownRad: 0.2,
      viewerId: null,
      notes: '',
    });
    expect(res.status).toBe(400);
    expect(res.body.fields.catalogueItemId).toMatch(/does not exist/);
  });
});
