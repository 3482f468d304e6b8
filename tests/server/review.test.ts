/**
 * The review loop through the API: who may send, approve, return and comment; the version check;
 * the append-only audit trail; the approval on the sheet (read back with pdftotext); the withdrawal
 * rule; notices through the real fake SMTP server; the outside-address limit on sheet e-mails.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { CommentDto, ProjectDto, ProjectEventDto } from '../../shared/schemas';
import { ProjectEvent } from '../../server/modules/review/project-event.entity';
import { MailMessage } from '../../server/modules/mail/mail-message.entity';
import { catalogueItemBody, CROSSING_SCENE, crossingMirror, crossingProject, EMAIL, startHarness, type Harness } from './harness';
import { binary, issueSheet, pagesText } from './pdf-tools';

type Agent = ReturnType<typeof request.agent>;
type Who = 'anonymous' | 'installerA' | 'installerB' | 'reviewer' | 'admin';
const WHO: Who[] = ['anonymous', 'installerA', 'installerB', 'reviewer', 'admin'];
const INSTALLER_B = 'otto.other@sightfan-demo.example';
const SECOND_REVIEWER = 'rosa.reviewer@sightfan-demo.example';
const OUTSIDE_REVIEWER = 'olga.elsewhere@other-works.example';
const OUTSIDE_LIMIT = 2;

let h: Harness;
const agents = {} as Record<Who, Agent>;
let catalogueId: number;
let reviewerId: number;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-review-'));

beforeAll(async () => {
  h = await startHarness({ env: { SHEET_OUTSIDE_EMAILS_PER_HOUR: String(OUTSIDE_LIMIT) } });
  await h.addUser(INSTALLER_B, 'installer');
  await h.addUser(SECOND_REVIEWER, 'reviewer');
  await h.addUser(OUTSIDE_REVIEWER, 'reviewer', 'Other Works (test)');
  agents.anonymous = request.agent(h.app);
  agents.installerA = await h.signedIn(EMAIL.installer);
  agents.installerB = await h.signedIn(INSTALLER_B);
  agents.reviewer = await h.signedIn(EMAIL.reviewer);
  agents.admin = await h.signedIn(EMAIL.admin);
  catalogueId = (await agents.installerA.get('/api/catalog')).body.items[0].id;
  reviewerId = (await agents.reviewer.get('/api/auth/me')).body.user.id;
});
afterAll(async () => {
  await h.close();
  fs.rmSync(tmp, { recursive: true, force: true });
});

/** A job of installer A with one mirror, optionally sent (to the demo reviewer). */
async function job(name: string, opts: { sent?: boolean } = {}): Promise<{ project: ProjectDto; placementId: number }> {
  const a = agents.installerA;
  const created = await a.post('/api/projects').send(crossingProject(name));
  const id = created.body.project.id as number;
  const placement = await a.post(`/api/projects/${id}/placements`).send(crossingMirror(catalogueId));
  let project = (await a.get(`/api/projects/${id}`)).body.project as ProjectDto;
  if (opts.sent) project = (await a.post(`/api/projects/${id}/send`).send({ version: project.version, reviewerId })).body.project;
  return { project, placementId: placement.body.placement.id };
}

/** Waits for the fake SMTP server to hold a message to `to` with this subject (earlier tests' notices arrive too). */
async function mailTo(to: string, subject: string, timeoutMs = 20_000): Promise<{ subject: string; text: string }> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    await h.outbox.kick();
    const rows = await h.orm.em.fork().find(MailMessage, { subject });
    const hit = rows.find((r) => r.toAddresses.includes(to));
    if (hit) return hit;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no mail "${subject}" for ${to} within ${timeoutMs} ms`);
}

const get = async (id: number) => (await agents.installerA.get(`/api/projects/${id}`)).body.project as ProjectDto;
const events = async (id: number) => (await agents.installerA.get(`/api/projects/${id}/events`)).body.events as ProjectEventDto[];

/** The sheet as the app's Download gets it, page by page. */
async function sheetPages(agent: Agent, id: number): Promise<{ pages: string[]; revision: number; created: boolean }> {
  const { pdf, revision, created } = await issueSheet(agent, id);
  return { pages: pagesText(pdf, tmp), revision, created };
}

describe('the demo', () => {
  it('seeds one demo job waiting for the demo safety officer, with its trail, so the queue is not empty', async () => {
    // Read before the other tests add jobs of their own.
    const list = (await agents.reviewer.get('/api/projects')).body.projects as ProjectDto[];
    const waiting = list.filter((p) => p.state === 'with_reviewer');
    expect(waiting).toEqual([expect.objectContaining({ name: expect.stringContaining('(demo)'), reviewerId, placementCount: 1 })]);
    expect(Date.parse(waiting[0].sentAt!)).toBeLessThan(Date.now() - 3600_000);
    expect((await events(waiting[0].id)).map((e) => e.kind)).toEqual(['created', 'placement_added', 'sent']);
  });
});

describe('who may use each review route', () => {
  // 401 signed out; 404 for a job one cannot see; 403 for a role that may not act; 409 for a state that does not allow it.
  const cases: { route: string; expect: Record<Who, number>; run: (agent: Agent) => Promise<request.Response> }[] = [
    {
      route: 'POST send (job being drawn up)',
      expect: { anonymous: 401, installerA: 200, installerB: 404, reviewer: 403, admin: 409 },
      run: async (agent) => {
        const { project } = await job('Matrix send');
        return agent.post(`/api/projects/${project.id}/send`).send({ version: project.version });
      },
    },
    {
      route: 'POST send (admin reassigning a job waiting for review)',
      expect: { anonymous: 401, installerA: 409, installerB: 404, reviewer: 403, admin: 200 },
      run: async (agent) => {
        const { project } = await job('Matrix reassign', { sent: true });
        return agent.post(`/api/projects/${project.id}/send`).send({ version: project.version, reviewerId: null });
      },
    },
    {
      route: 'POST approve',
      expect: { anonymous: 401, installerA: 403, installerB: 404, reviewer: 200, admin: 200 },
      run: async (agent) => {
        const { project } = await job('Matrix approve', { sent: true });
        return agent.post(`/api/projects/${project.id}/approve`).send({ version: project.version });
      },
    },
    {
      route: 'POST return',
      expect: { anonymous: 401, installerA: 403, installerB: 404, reviewer: 200, admin: 200 },
      run: async (agent) => {
        const { project } = await job('Matrix return', { sent: true });
        return agent.post(`/api/projects/${project.id}/return`).send({ version: project.version, reason: 'Move M1 clear of the door.' });
      },
    },
    {
      route: 'GET comments',
      expect: { anonymous: 401, installerA: 200, installerB: 404, reviewer: 200, admin: 200 },
      run: async (agent) => agent.get(`/api/projects/${(await job('Matrix comments')).project.id}/comments`),
    },
    {
      route: 'POST comments',
      expect: { anonymous: 401, installerA: 201, installerB: 404, reviewer: 201, admin: 201 },
      run: async (agent) => agent.post(`/api/projects/${(await job('Matrix comment')).project.id}/comments`).send({ body: 'Looks fine.' }),
    },
    {
      route: 'PATCH comment (resolve)',
      expect: { anonymous: 401, installerA: 200, installerB: 404, reviewer: 403, admin: 403 },
      run: async (agent) => {
        const { project } = await job('Matrix resolve');
        const c = await agents.reviewer.post(`/api/projects/${project.id}/comments`).send({ body: 'Raise M1.' });
        return agent.patch(`/api/projects/${project.id}/comments/${c.body.comment.id}`).send({ resolved: true });
      },
    },
    {
      route: 'GET events',
      expect: { anonymous: 401, installerA: 200, installerB: 404, reviewer: 200, admin: 200 },
      run: async (agent) => agent.get(`/api/projects/${(await job('Matrix events')).project.id}/events`),
    },
    {
      route: 'GET reviewers',
      expect: { anonymous: 401, installerA: 200, installerB: 200, reviewer: 200, admin: 200 },
      run: (agent) => agent.get('/api/reviewers'),
    },
  ];
  for (const c of cases) {
    for (const who of WHO) {
      it(`answers ${c.route} for ${who} with ${c.expect[who]}`, async () => {
        const res = await c.run(agents[who]);
        expect(res.status).toBe(c.expect[who]);
        if (res.status >= 400) expect(typeof res.body.error).toBe('string');
      });
    }
  }
});

describe('transitions', () => {
  it('refuses an installer approving their own job with 403 and a sentence, and the job stays waiting', async () => {
    const { project } = await job('Own approval', { sent: true });
    const res = await agents.installerA.post(`/api/projects/${project.id}/approve`).send({ version: project.version });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/installer can never approve/);
    expect((await get(project.id)).state).toBe('with_reviewer');
  });

  it('answers 409 to an approval of a version the installer has changed since, and approves nothing', async () => {
    const { project, placementId } = await job('Stale approval', { sent: true });
    const placement = (await get(project.id)).placements[0];
    await agents.installerA
      .patch(`/api/projects/${project.id}/placements/${placementId}`)
      .send({ version: placement.version, heightM: 3.5 });
    const res = await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: project.version });
    expect(res.status).toBe(409);
    expect(res.body.current).toMatchObject({ id: project.id, state: 'with_reviewer', version: project.version + 1 });
    expect((await get(project.id)).approval).toBeNull();
  });

  it('answers 409 naming the state when a job being drawn up is approved', async () => {
    const { project } = await job('Not sent');
    const res = await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: project.version });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/being drawn up/);
  });

  it('refuses to send a job to someone who is not a reviewer or admin of the organisation, with a field sentence', async () => {
    const { project } = await job('Wrong reviewer');
    const ids = [
      (await agents.installerB.get('/api/auth/me')).body.user.id,
      (await agents.installerA.get('/api/auth/me')).body.user.id,
      (await h.signedIn(OUTSIDE_REVIEWER).then((a) => a.get('/api/auth/me'))).body.user.id,
    ];
    for (const id of ids) {
      const res = await agents.installerA.post(`/api/projects/${project.id}/send`).send({ version: project.version, reviewerId: id });
      expect(res.status).toBe(400);
      expect(res.body.fields.reviewerId).toMatch(/reviewer or administrator of your organisation/);
    }
    expect((await get(project.id)).state).toBe('drawing_up');
  });

  it('lists the reviewers and admins of the caller’s organisation only', async () => {
    const names = ((await agents.installerA.get('/api/reviewers')).body.reviewers as { name: string; role: string }[]).map((r) => r.role);
    expect(names.sort()).toEqual(['admin', 'reviewer', 'reviewer']);
  });

  it('needs a reason to return a job, and keeps the reason as a pinned comment the installer can resolve', async () => {
    const { project, placementId } = await job('Return with reason', { sent: true });
    const empty = await agents.reviewer.post(`/api/projects/${project.id}/return`).send({ version: project.version, reason: '' });
    expect(empty.status).toBe(400);
    expect(empty.body.fields.reason).toBeTruthy();
    const res = await agents.reviewer
      .post(`/api/projects/${project.id}/return`)
      .send({ version: project.version, reason: 'M1 sits in the forklift lane.', pin: { kind: 'placement', placementId } });
    expect(res.status).toBe(200);
    expect(res.body.project).toMatchObject({ state: 'returned', openCommentCount: 1 });
    const comments = (await agents.installerA.get(`/api/projects/${project.id}/comments`)).body.comments as CommentDto[];
    expect(comments).toEqual([
      expect.objectContaining({
        body: 'M1 sits in the forklift lane.',
        isReturnReason: true,
        resolved: false,
        pin: { kind: 'placement', placementId },
      }),
    ]);
    const resolved = await agents.installerA.patch(`/api/projects/${project.id}/comments/${comments[0].id}`).send({ resolved: true });
    expect(resolved.body.comment.resolved).toBe(true);
    expect((await get(project.id)).openCommentCount).toBe(0);
  });
});

describe('comments', () => {
  it('takes replies one level deep and refuses a reply to a reply', async () => {
    const { project } = await job('Threads');
    const top = (await agents.reviewer.post(`/api/projects/${project.id}/comments`).send({ body: 'Why this height?' })).body.comment;
    const reply = await agents.installerA
      .post(`/api/projects/${project.id}/comments`)
      .send({ body: 'Clearance for the mast.', parentId: top.id });
    expect(reply.status).toBe(201);
    expect(reply.body.comment.parentId).toBe(top.id);
    const deeper = await agents.reviewer
      .post(`/api/projects/${project.id}/comments`)
      .send({ body: 'OK.', parentId: reply.body.comment.id });
    expect(deeper.status).toBe(400);
    expect(deeper.body.fields.parentId).toMatch(/one level deep/);
  });

  it('refuses a pin on a mirror of another job', async () => {
    const other = await job('Other job');
    const { project } = await job('Pinned');
    const res = await agents.reviewer
      .post(`/api/projects/${project.id}/comments`)
      .send({ body: 'This one?', pin: { kind: 'placement', placementId: other.placementId } });
    expect(res.status).toBe(400);
    expect(res.body.fields.pin).toMatch(/not in this job/);
  });

  it('stores a comment exactly as typed, markup included, and refuses control characters', async () => {
    const { project } = await job('Plain text');
    const typed = '<b>Raise</b> M1 by *10 cm* & check';
    const res = await agents.reviewer.post(`/api/projects/${project.id}/comments`).send({ body: typed });
    expect(res.body.comment.body).toBe(typed);
    const bad = await agents.reviewer.post(`/api/projects/${project.id}/comments`).send({ body: 'bell\u0007' });
    expect(bad.status).toBe(400);
  });
});

describe('the audit trail', () => {
  it('records every step of a job in order, with before → after for a mirror change', async () => {
    const { project, placementId } = await job('Audited', { sent: true });
    const id = project.id;
    const r1 = await agents.reviewer.post(`/api/projects/${id}/return`).send({ version: project.version, reason: 'Tilt M1 more.' });
    const comment = (await agents.installerA.get(`/api/projects/${id}/comments`)).body.comments[0];
    await agents.installerA.patch(`/api/projects/${id}/comments/${comment.id}`).send({ resolved: true });
    const pl = (await get(id)).placements[0];
    await agents.installerA.patch(`/api/projects/${id}/placements/${placementId}`).send({ version: pl.version, tiltDownRad: 0.4 });
    const resent = await agents.installerA.post(`/api/projects/${id}/send`).send({ version: (await get(id)).version });
    expect(resent.status).toBe(200);
    expect(r1.status).toBe(200);
    const approved = await agents.reviewer.post(`/api/projects/${id}/approve`).send({ version: resent.body.project.version });
    expect(approved.status).toBe(200);

    const log = await events(id);
    expect(log.map((e) => e.kind)).toEqual([
      'created',
      'placement_added',
      'sent',
      'returned',
      'comment_resolved',
      'placement_changed',
      'sent',
      'sheet_issued',
      'approved',
    ]);
    const change = log.find((e) => e.kind === 'placement_changed')!;
    expect(change.changes).toEqual([{ field: 'tilt', before: '17°', after: '23°' }]); // 0.3 rad ≈ 17.2°, 0.4 rad ≈ 22.9° (from memory: 1 rad = 57.3°)
    expect(log.every((e) => e.actorName.length > 0 && !Number.isNaN(Date.parse(e.at)))).toBe(true);
  });

  it("records a change of the job's own fields and plan counts with before → after, and nothing for a units switch", async () => {
    const { project } = await job('Renamed job');
    const renamed = await agents.installerA.patch(`/api/projects/${project.id}`).send({
      version: project.version,
      name: 'Renamed job, bay 2',
      scene: { ...CROSSING_SCENE, walls: [...CROSSING_SCENE.walls, { id: 'w2', kind: 'wall', aM: [0, 9], bM: [10, 9], heightM: 4 }] },
    });
    expect(renamed.status).toBe(200);
    await agents.installerA.patch(`/api/projects/${project.id}`).send({ version: renamed.body.project.version, units: 'imperial' });
    const log = await events(project.id);
    expect(log.map((e) => e.kind)).toEqual(['created', 'placement_added', 'changed']);
    expect(log[2].changes).toEqual([
      { field: 'name', before: 'Renamed job', after: 'Renamed job, bay 2' },
      { field: 'walls', before: '1', after: '2' },
    ]);
  });

  it('records a reassignment by an admin and mails the new reviewer', async () => {
    const { project } = await job('Reassigned', { sent: true });
    const rosa = ((await agents.admin.get('/api/reviewers')).body.reviewers as { id: number; name: string }[]).find((r) =>
      r.name.startsWith('rosa.reviewer'),
    )!;
    const res = await agents.admin.post(`/api/projects/${project.id}/send`).send({ version: project.version, reviewerId: rosa.id });
    expect(res.body.project).toMatchObject({ state: 'with_reviewer', reviewerId: rosa.id, reviewerName: rosa.name });
    expect((await events(project.id)).at(-1)).toMatchObject({ kind: 'reassigned', detail: { reviewerId: rosa.id } });
    await mailTo(SECOND_REVIEWER, 'Job waiting for your review: Reassigned');
  });

  it('has no route that changes or deletes an event', async () => {
    const { project } = await job('Untouchable');
    const [first] = await events(project.id);
    for (const method of ['put', 'patch', 'delete'] as const) {
      for (const url of [`/api/projects/${project.id}/events`, `/api/projects/${project.id}/events/${first.id}`]) {
        const res = await agents.admin[method](url).send({ summary: 'rewritten' });
        expect(res.status).toBe(404);
      }
    }
    expect((await events(project.id))[0]).toEqual(first);
  });

  it('is refused by the database itself when a row would be changed or deleted', async () => {
    const { project } = await job('Triggers');
    const sql = h.orm.em.getConnection();
    await expect(sql.execute(`update project_event set summary = 'x' where project_id = ${project.id}`)).rejects.toThrow(/append-only/);
    await expect(sql.execute(`delete from project_event where project_id = ${project.id}`)).rejects.toThrow(/append-only/);
    expect((await events(project.id)).length).toBe(2);
  });

  it('keeps the log of a deleted job', async () => {
    const { project } = await job('Deleted later');
    expect((await agents.installerA.delete(`/api/projects/${project.id}`)).status).toBe(204);
    const rows: { n: number }[] = await h.orm.em
      .getConnection()
      .execute(`select count(*) as n from project_event where project_id = ${project.id}`);
    expect(Number(rows[0].n)).toBe(2);
  });
});

describe('approval on the sheet and its withdrawal', () => {
  it('prints who approved which revision, and after a change withdraws the approval and marks every page not approved', async () => {
    const { project, placementId } = await job('Approved sheet', { sent: true });
    const approved = await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: project.version });
    expect(approved.status).toBe(200);
    const approval = approved.body.project.approval;
    expect(approval).toMatchObject({ reviewerName: 'Rafael Lindqvist (demo safety officer)', reviewerRole: 'reviewer' });

    const good = await sheetPages(agents.installerA, project.id);
    expect(good.created).toBe(false);
    expect(good.revision).toBe(approval.revision);
    const first = good.pages[0];
    expect(first).toContain('Approved by Rafael Lindqvist (demo safety officer)');
    expect(first).toContain('Safety officer (reviewer)');
    expect(first).toContain(`${approval.approvedAt.slice(0, 10)} ${approval.approvedAt.slice(11, 16)} UTC`);
    expect(first).toContain(approval.contentHash);
    expect(good.pages.some((p) => p.includes('NOT APPROVED'))).toBe(false);

    const pl = (await get(project.id)).placements[0];
    const moved = await agents.installerA
      .patch(`/api/projects/${project.id}/placements/${placementId}`)
      .send({ version: pl.version, heightM: 3.3 });
    expect(moved.status).toBe(200);
    const after = await get(project.id);
    expect(after).toMatchObject({ state: 'drawing_up', approval: null });
    expect((await events(project.id)).at(-1)).toMatchObject({ kind: 'approval_withdrawn', detail: { revision: approval.revision } });

    const changed = await sheetPages(agents.installerA, project.id);
    expect(changed.revision).toBe(approval.revision + 1);
    expect(changed.pages.length).toBeGreaterThan(1);
    for (const page of changed.pages) expect(page).toMatch(/NOT APPROVED — no safety officer has approved this job/);
  });

  it('marks an older revision of an approved job on every page as differing from the approved one', async () => {
    const { project, placementId } = await job('Old revision', { sent: true });
    const early = await sheetPages(agents.installerA, project.id);
    // Back to drawing up through a return, changed, resent and approved: the early revision is not the approved one.
    const ret = await agents.reviewer.post(`/api/projects/${project.id}/return`).send({ version: project.version, reason: 'Lower M1.' });
    const pl = ret.body.project.placements[0];
    await agents.installerA.patch(`/api/projects/${project.id}/placements/${placementId}`).send({ version: pl.version, heightM: 2.8 });
    const sent = await agents.installerA.post(`/api/projects/${project.id}/send`).send({ version: (await get(project.id)).version });
    const ok = await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: sent.body.project.version });
    expect(ok.body.project.approval.revision).toBe(early.revision + 1);
    const pdf = await agents.installerA.get(`/api/projects/${project.id}/sheet.pdf?revision=${early.revision}`).buffer(true).parse(binary);
    const pages = pagesText(pdf.body as Buffer, tmp);
    for (const page of pages)
      expect(page).toContain(`NOT APPROVED — revision ${early.revision} differs from the approved revision ${early.revision + 1}`);
  });

  it('keeps the revision and the approval when the display units switch, and prints the approved sheet in the new units', async () => {
    const { project } = await job('Units switch', { sent: true });
    const approved = (await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: project.version })).body.project;
    const switched = await agents.installerA.patch(`/api/projects/${project.id}`).send({ version: approved.version, units: 'imperial' });
    expect(switched.status).toBe(200);
    expect(switched.body.project).toMatchObject({ state: 'approved', units: 'imperial', approval: approved.approval });
    const sheet = await sheetPages(agents.installerA, project.id);
    expect(sheet).toMatchObject({ created: false, revision: approved.approval.revision });
    expect(sheet.pages[0]).toContain('imperial');
    const status = (await agents.installerA.get(`/api/projects/${project.id}/sheet`)).body;
    expect(status.current).toMatchObject({ number: approved.approval.revision, changedSinceLast: false, approved: true });
    expect(sheet.pages.some((p) => p.includes('NOT APPROVED'))).toBe(false);
    expect((await events(project.id)).map((e) => e.kind)).not.toContain('approval_withdrawn');
  });
});

describe('a catalogue change and approved jobs', () => {
  it("withdraws an approved job's approval when its catalogue mirror's optics change, not when only the price does", async () => {
    const created = await agents.admin.post('/api/catalog').send(catalogueItemBody('REV-700', 'Review round 700 (test)'));
    const item = created.body.item;
    const { project, placementId } = await job('Catalogue mirror');
    const pl = (await get(project.id)).placements[0];
    await agents.installerA
      .patch(`/api/projects/${project.id}/placements/${placementId}`)
      .send({ version: pl.version, catalogueItemId: item.id });
    const sent = await agents.installerA.post(`/api/projects/${project.id}/send`).send({ version: (await get(project.id)).version });
    await agents.reviewer.post(`/api/projects/${project.id}/approve`).send({ version: sent.body.project.version });

    const priced = await agents.admin.patch(`/api/catalog/${item.id}`).send({ version: item.version, unitPriceMinor: 15900 });
    expect((await get(project.id)).state).toBe('approved');
    await agents.admin
      .patch(`/api/catalog/${item.id}`)
      .send({ version: priced.body.item.version, mirror: { shape: 'round', diameterM: 0.7, radiusM: 1.6 } });
    expect((await get(project.id)).state).toBe('drawing_up');
    expect((await events(project.id)).at(-1)).toMatchObject({ kind: 'approval_withdrawn', summary: expect.stringContaining('REV-700') });
  });
});

describe('notices', () => {
  it('mails every reviewer when a job is sent to no one in particular, with a link to the job', async () => {
    const { project } = await job('Notice to all');
    await agents.installerA.post(`/api/projects/${project.id}/send`).send({ version: project.version });
    for (const to of [EMAIL.reviewer, SECOND_REVIEWER]) {
      const mail = await mailTo(to, 'Job waiting for your review: Notice to all');
      expect(mail.text).toContain(`http://sightfan.test/projects/${project.id}`);
    }
  });

  it('mails the installer when the job is approved and when it is returned, with the reasons', async () => {
    const returned = await job('Notice returned', { sent: true });
    await agents.reviewer
      .post(`/api/projects/${returned.project.id}/return`)
      .send({ version: returned.project.version, reason: 'The mirror hides behind the column.' });
    const approved = await job('Notice approved', { sent: true });
    await agents.admin.post(`/api/projects/${approved.project.id}/approve`).send({ version: approved.project.version });
    const back = await mailTo(EMAIL.installer, 'Returned with reasons: Notice returned');
    expect(back.text).toContain('- The mirror hides behind the column.');
    expect(back.text).toContain(`http://sightfan.test/projects/${returned.project.id}`);
    const ok = await mailTo(EMAIL.installer, 'Approved: Notice approved');
    expect(ok.text).toContain('Ada Moreau (demo admin) (Administrator) approved revision');
    expect(ok.text).toContain(`http://sightfan.test/projects/${approved.project.id}`);
  });
});

describe('sheet e-mail outside the organisation', () => {
  it('limits outside addresses per person and hour with 429, says whether the sheet is approved, and lets colleagues through', async () => {
    const { project } = await job('Outside mail');
    // Sendings older than an hour do not count: one from two hours ago, written as the route would.
    const em = h.orm.em.fork();
    const me = (await agents.installerA.get('/api/auth/me')).body.user as { id: number; name: string };
    em.create(ProjectEvent, {
      projectId: project.id,
      kind: 'sheet_emailed',
      actorId: me.id,
      actorName: me.name,
      at: new Date(Date.now() - 2 * 3600_000),
      summary: 'E-mailed sheet revision 1 to early@purchasing-demo.example.',
      detail: { to: 'early@purchasing-demo.example', revision: 1, outside: 1, approved: 0 },
    });
    await em.flush();
    for (let i = 0; i < OUTSIDE_LIMIT; i++) {
      const res = await agents.installerA.post(`/api/projects/${project.id}/sheet/email`).send({ to: `buyer${i}@purchasing-demo.example` });
      expect(res.status).toBe(200);
      expect(res.body).toMatchObject({ approved: false, outsideOrganisation: true });
    }
    const over = await agents.installerA.post(`/api/projects/${project.id}/sheet/email`).send({ to: 'buyer9@purchasing-demo.example' });
    expect(over.status).toBe(429);
    expect(over.body.error).toMatch(/outside your organisation in the last hour/);
    const colleague = await agents.installerA.post(`/api/projects/${project.id}/sheet/email`).send({ to: EMAIL.reviewer });
    expect(colleague.status).toBe(200);
    expect(colleague.body.outsideOrganisation).toBe(false);
    const mailed = (await events(project.id)).filter((e) => e.kind === 'sheet_emailed');
    expect(mailed.map((e) => e.detail.to)).toEqual([
      'early@purchasing-demo.example',
      'buyer0@purchasing-demo.example',
      'buyer1@purchasing-demo.example',
      EMAIL.reviewer,
    ]);
  });
});
