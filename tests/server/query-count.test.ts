/**
 * What a signed-in read costs in SQL statements, counted on SQLite through the knex the ORM uses.
 * The budgets are the request path's own (DEVELOPERS.md, "What a request costs"): they pin that
 * the project list and one project cost the same few statements however many projects, mirrors
 * and comment threads there are (no query per row), and that a signed-in read writes nothing.
 * Timing is never checked here (`BENCH_ONLY=load npm run bench` measures it).
 */
import { Organization } from '../../server/modules/users/organization.entity';
import { Placement } from '../../server/modules/projects/placement.entity';
import { Project } from '../../server/modules/projects/project.entity';
import { ProjectComment } from '../../server/modules/review/comment.entity';
import { User } from '../../server/modules/users/user.entity';
import { EMAIL, startHarness, type Harness } from './harness';

let h: Harness;
const statements: string[] = [];
const record = (q: { sql: string }) => void statements.push(q.sql);

beforeAll(async () => {
  h = await startHarness();
  // The outbox polls the database on its own timer; stopped so only the request's statements count.
  h.outbox.stop();
  h.orm.em.getConnection().getKnex().on('query', record);
});
afterAll(async () => {
  h.orm.em.getConnection().getKnex().off('query', record);
  await h.close();
});

/** The SQL statements one request ran, with its answer. */
async function countedGet(agent: Awaited<ReturnType<Harness['signedIn']>>, url: string) {
  statements.length = 0;
  const res = await agent.get(url);
  return { res, sql: [...statements] };
}

/** Adds `n` projects owned by the installer, each with `mirrors` mirrors and `threads` open comment threads (one reply each). */
async function addProjects(email: string, n: number, mirrors: number, threads: number): Promise<number[]> {
  const em = h.orm.em.fork();
  const owner = await em.findOneOrFail(User, { email });
  const organization = await em.findOneOrFail(Organization, owner.organization.id);
  const projects: Project[] = [];
  for (let i = 0; i < n; i++) {
    const project = em.create(Project, { owner, organization, name: `Counted job ${i} (test)` });
    projects.push(project);
    for (let m = 0; m < mirrors; m++)
      em.create(Placement, { project, label: `M${m}`, xM: m, yM: 0, heightM: 2.5, azimuthRad: 0, tiltDownRad: 0.3 });
    for (let t = 0; t < threads; t++) {
      const thread = em.create(ProjectComment, { project, author: owner, body: `Thread ${t}` });
      em.create(ProjectComment, { project, author: owner, body: 'A reply', parent: thread });
    }
  }
  await em.flush();
  return projects.map((p) => p.id);
}

const writes = (sql: string[]) => sql.filter((s) => /^\s*(insert|update|delete)\b/i.test(s));

describe('what a signed-in read costs in SQL statements', () => {
  it('lists projects in three statements (session, user, the list with its counts) for the demo projects and again with 25 more, each with mirrors and threads', async () => {
    const agent = await h.signedIn(EMAIL.installer);
    const before = await countedGet(agent, '/api/projects');
    expect(before.res.status).toBe(200);
    await addProjects(EMAIL.installer, 25, 3, 2);
    const after = await countedGet(agent, '/api/projects');
    expect(after.res.body.projects.length).toBe(before.res.body.projects.length + 25);
    expect(before.sql).toHaveLength(3);
    expect(after.sql).toHaveLength(3);
  });

  it("counts each listed project's mirrors and open threads (not replies, not resolved threads) in the one list statement", async () => {
    const [id] = await addProjects(EMAIL.installer, 1, 4, 3);
    const em = h.orm.em.fork();
    const threads = await em.find(ProjectComment, { project: id, parent: null }, { orderBy: { id: 'asc' } });
    threads[0].resolved = true;
    await em.flush();
    const agent = await h.signedIn(EMAIL.installer);
    const { res } = await countedGet(agent, '/api/projects?sort=name');
    const row = res.body.projects.find((p: { id: number }) => p.id === id);
    expect(row).toMatchObject({ placementCount: 4, openCommentCount: 2 });
  });

  it('reads one project in the same number of statements with 1 mirror or 30', async () => {
    const [few, many] = [...(await addProjects(EMAIL.installer, 1, 1, 1)), ...(await addProjects(EMAIL.installer, 1, 30, 5))];
    const agent = await h.signedIn(EMAIL.installer);
    const small = await countedGet(agent, `/api/projects/${few}`);
    const large = await countedGet(agent, `/api/projects/${many}`);
    expect(large.res.body.project.placements).toHaveLength(30);
    expect(large.sql).toHaveLength(small.sql.length);
    expect(small.sql.length).toBeLessThanOrEqual(5);
  });

  it('writes nothing, not even the session, when a signed-in person reads the list twice', async () => {
    const agent = await h.signedIn(EMAIL.reviewer);
    const first = await countedGet(agent, '/api/projects');
    const second = await countedGet(agent, '/api/projects');
    expect(writes(first.sql)).toEqual([]);
    expect(writes(second.sql)).toEqual([]);
  });

  it('never reads the password hash to answer a signed-in request that does not need it', async () => {
    const agent = await h.signedIn(EMAIL.installer);
    const { sql } = await countedGet(agent, '/api/projects');
    expect(sql.filter((s) => /password_hash|`u0`\.\*/.test(s))).toEqual([]);
  });
});
