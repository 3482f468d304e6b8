/**
 * The project list's SQL is written once per shape and run with each request's values
 * (server/compiled-query.ts). These tests pin that the kept statement answers exactly what the
 * query builder answers when it is built afresh with the real values, for every kind of person,
 * order and search text, and that the stand-in mechanism refuses a query it cannot keep.
 */
import * as fc from 'fast-check';
import type { EntityManager } from '@mikro-orm/knex';
import { runCompiled } from '../../server/compiled-query';
import {
  projectSummaries,
  summaryQuery,
  toSummary,
  type ProjectListSort,
  type SummaryRow,
} from '../../server/modules/projects/project-list';
import { Organization } from '../../server/modules/users/organization.entity';
import { Project } from '../../server/modules/projects/project.entity';
import { Placement } from '../../server/modules/projects/placement.entity';
import { canEdit, findVisibleProject, readVisibleProject } from '../../server/modules/projects/project-access';
import { toProjectDto } from '../../server/modules/projects/project.dto';
import { placementsOfProject } from '../../server/modules/projects/projects.routes';
import { openCommentCount, openCommentCounts } from '../../server/modules/review/review-service';
import { User } from '../../server/modules/users/user.entity';
import { EMAIL, startHarness, TEST_DATABASE, type Harness } from './harness';
import { initORM } from '../../server/db';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Database } from 'sqlite3';

let h: Harness;
const people: User[] = [];
/** Names with LIKE's wildcards, quotes, a backslash, accents and a right-to-left script. */
const NAMES = [
  'Dock 3 (test)',
  'Dock_3 (test)',
  '50% rebuild (test)',
  "O'Neill yard (test)",
  'Back\\slash (test)',
  'Café Ëlise (test)',
  'مستودع (test)',
  'DOCK three (test)',
];

beforeAll(async () => {
  h = await startHarness();
  h.outbox.stop();
  await h.addUser('second.installer@test.example', 'installer');
  await h.addUser('other.org.admin@test.example', 'admin', 'Other Organisation (test)');
  await h.addUser('other.org.installer@test.example', 'installer', 'Other Organisation (test)');
  const em = h.orm.em.fork();
  for (const email of [
    EMAIL.installer,
    EMAIL.reviewer,
    EMAIL.admin,
    'second.installer@test.example',
    'other.org.admin@test.example',
    'other.org.installer@test.example',
  ])
    people.push(await em.findOneOrFail(User, { email }, { populate: ['organization'] }));
  // Each installer gets every name, as name, customer or site in turn, so searches match in every column.
  for (const owner of people.filter((p) => p.role === 'installer')) {
    const organization = await em.findOneOrFail(Organization, owner.organization.id);
    NAMES.forEach((name, i) => {
      const [n, c, s] =
        i % 3 === 0
          ? [name, 'Plain customer', 'Plain site']
          : i % 3 === 1
            ? ['Plain job', name, 'Plain site']
            : ['Plain job', 'Plain customer', name];
      em.create(Project, { owner, organization, name: n, customer: c, site: s });
    });
  }
  await em.flush();
});
afterAll(() => h.close());

/** The same list, its query built afresh with the real values and run through the query builder. */
async function builtAfresh(em: EntityManager, user: User, search: string | undefined, sort: ProjectListSort) {
  const values: Record<string, number | string> = { userId: user.id, organizationId: user.organization.id };
  if (search !== undefined) values.search = search;
  const rows = await summaryQuery(em, user.role, (name) => values[name], search !== undefined, sort).execute<SummaryRow[]>('all', false);
  return rows.map(toSummary);
}

const searchText = fc.oneof(
  fc.constantFrom(...NAMES, 'dock', '_', '%', "'", '\\', 'é', 'test', 'no such job anywhere'),
  fc.string({ maxLength: 12 }),
  fc.string({ unit: 'grapheme', maxLength: 6 }),
);

describe('the project list run from its kept statement', () => {
  it('answers what the query builder answers with the real values, for every person, order and search', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.integer({ min: 0, max: 5 }),
        fc.constantFrom<ProjectListSort>('updated', 'name', 'customer'),
        fc.option(searchText, { nil: undefined }),
        async (who, sort, search) => {
          const em = h.orm.em.fork();
          const user = people[who];
          expect(await projectSummaries(em, user, search, sort)).toEqual(await builtAfresh(em, user, search, sort));
        },
      ),
      { numRuns: 150 },
    );
  });

  it('keeps people to their own rule when one shape is run for several of them in a row', async () => {
    const em = h.orm.em.fork();
    const seen = new Map<number, number[]>();
    for (const user of people)
      seen.set(
        user.id,
        (await projectSummaries(em, user, undefined, 'name')).map((p) => p.id),
      );
    const owned = await em.find(Project, {}, { fields: ['id', 'owner', 'organization'] });
    for (const user of people) {
      const expected = owned
        .filter((p) => p.organization.id === user.organization.id && (user.role !== 'installer' || p.owner.id === user.id))
        .map((p) => p.id)
        .sort((a, b) => a - b);
      expect([...seen.get(user.id)!].sort((a, b) => a - b)).toEqual(expected);
      expect(expected.length).toBeGreaterThan(0);
    }
  });
});

describe('searching the list', () => {
  /** ASCII letters folded, everything else as typed: SQLite's lower() folds only ASCII (common practice for its default build). */
  const fold = (t: string) => t.replace(/[A-Z]/g, (c) => c.toLowerCase());
  it.each(['_', '%', 'Dock_3', '50%', "O'Neill", 'back\\slash', 'dock', 'ock 3', 'PLAIN JOB'])(
    'finds exactly the jobs whose name, customer or site contains %p, wildcards and quotes taken as typed',
    async (text) => {
      const em = h.orm.em.fork();
      const owner = people[0];
      const all = await em.find(Project, { owner: owner.id }, { fields: ['name', 'customer', 'site'] });
      const expected = all
        .filter((p) => [p.name, p.customer, p.site].some((v) => fold(v).includes(fold(text))))
        .map((p) => p.id)
        .sort((a, b) => a - b);
      const found = (await projectSummaries(em, owner, text, 'name')).map((p) => p.id).sort((a, b) => a - b);
      expect(found).toEqual(expected);
      if (text !== '_' && text !== '%') expect(found.length).toBeGreaterThan(0);
    },
  );
});

describe('one project read from its kept statements', () => {
  it('answers, for every person and every project, what the ORM’s own reads answer (the same project or the same "not found")', async () => {
    const ids = (await h.orm.em.fork().find(Project, {}, { fields: ['id'] })).map((p) => p.id);
    let read = 0;
    for (const viewer of people)
      for (const id of ids) {
        const fast = h.orm.em.fork();
        const ormOwn = h.orm.em.fork();
        const viaKept = await readVisibleProject(
          fast,
          await fast.findOneOrFail(User, viewer.id, { populate: ['organization'] }),
          String(id),
        ).then(
          async (p) => toProjectDto(p, await placementsOfProject(fast, p), canEdit(viewer, p), await openCommentCount(fast, p.id)),
          (e: unknown) => (e as Error).message,
        );
        const viaOrm = await findVisibleProject(ormOwn, viewer, String(id), ['owner', 'reviewer']).then(
          async (p) =>
            toProjectDto(
              p,
              await ormOwn.find(Placement, { project: p.id }, { orderBy: { id: 'asc' } }),
              canEdit(viewer, p),
              (await openCommentCounts(ormOwn, [p.id])).get(p.id) ?? 0,
            ),
          (e: unknown) => (e as Error).message,
        );
        expect(viaKept).toEqual(viaOrm);
        if (typeof viaOrm !== 'string') read++;
      }
    // Every person reads some projects and is refused others: both branches were compared.
    expect(read).toBeGreaterThan(people.length);
    expect(read).toBeLessThan(people.length * ids.length);
  });
});

describe('kept statements and closing the database', () => {
  (TEST_DATABASE === 'sqlite' ? it : it.skip)(
    'let the ORM close its SQLite connection after they ran (no statement left open)',
    async () => {
      const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-kept-close-'));
      const orm = await initORM(path.join(dir, 'close.sqlite'));
      try {
        await runCompiled(orm.em, 'session:get', { sid: 'nobody' }, (slot) =>
          orm.em.getKnex()('session').select('data').where('sid', slot('sid')).limit(1),
        );
        const client = orm.em.getKnex().client as { acquireConnection(): Promise<Database>; releaseConnection(c: Database): void };
        const db = await client.acquireConnection();
        client.releaseConnection(db);
        let closed: Error | null | undefined;
        const close = db.close.bind(db);
        db.close = ((cb?: (err: Error | null) => void) => close((err) => ((closed = err), cb?.(err)))) as Database['close'];
        await orm.close(true);
        expect(closed).toBeNull();
      } finally {
        fs.rmSync(dir, { recursive: true, force: true });
      }
    },
  );
});

describe('what the kept statement refuses', () => {
  it('refuses a query that makes a pattern out of a stand-in (the value would not reach the statement unchanged)', async () => {
    const em = h.orm.em.fork();
    await expect(
      runCompiled(em, 'test:pattern-from-slot', { name: 'dock' }, (slot) =>
        em
          .createQueryBuilder(Project, 'p')
          .select('p.id')
          .where({ name: { $like: `%${slot('name')}%` } }),
      ),
    ).rejects.toThrow(/made a new value out of it/);
  });

  it('refuses a query that asks for a slot it was given no value for', async () => {
    const em = h.orm.em.fork();
    await expect(
      runCompiled(em, 'test:missing-slot', {}, (slot) =>
        em
          .createQueryBuilder(Project, 'p')
          .select('p.id')
          .where({ id: slot('id') }),
      ),
    ).rejects.toThrow(/has no value/);
  });

  it('runs one shape with new values each time, not the first call’s', async () => {
    const em = h.orm.em.fork();
    const ids = (await em.find(Project, {}, { fields: ['id'], orderBy: { id: 'asc' }, limit: 3 })).map((p) => p.id);
    const byId = (id: number) =>
      runCompiled<{ id: number }>(em, 'test:by-id', { id }, (slot) =>
        em
          .createQueryBuilder(Project, 'p')
          .select('p.id')
          .where({ id: slot('id') }),
      );
    for (const id of ids) expect((await byId(id)).map((r) => r.id)).toEqual([id]);
  });
});
