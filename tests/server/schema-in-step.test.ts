/**
 * Both databases' migrations keep up with the entities: on each, the schema generator finds
 * nothing that the migrations left out. A change to an entity without a migration for SQLite and
 * one for PostgreSQL fails here.
 *
 * SQLite: MikroORM's SQLite comparator always proposes to rebuild some tables (it cannot read back
 * every detail SQLite keeps), so the check is that a migrated database gets exactly the proposal a
 * database made straight from the entities gets. PostgreSQL: the proposal is empty.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openORM, initORM, type Orm } from '../../server/db';
import { migrationsList } from '../../server/migrations';
import { pgMigrationsList } from '../../server/migrations-pg';
import { startPostgres, type PostgresCluster } from './postgres-cluster';

let dir: string;
let pg: PostgresCluster;
const opened: Orm[] = [];
beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-schema-'));
  pg = await startPostgres();
});
afterAll(async () => {
  await Promise.all(opened.map((o) => o.close(true)));
  pg?.stop();
  fs.rmSync(dir, { recursive: true, force: true });
});

const keep = (orm: Orm) => (opened.push(orm), orm);
const proposal = async (orm: Orm) => (await orm.schema.getUpdateSchemaSQL({ wrap: false })).trim();
const last = (list: { name: string }[]) => list[list.length - 1].name;

describe('SQLite', () => {
  it('has nothing to change after its migrations beyond what it proposes for a database made from the entities', async () => {
    const fresh = keep(await openORM(path.join(dir, 'fresh.sqlite')));
    await fresh.schema.createSchema();
    const migrated = keep(await initORM(path.join(dir, 'migrated.sqlite')));
    expect(await proposal(migrated)).toBe(await proposal(fresh));
  });

  it("notices a migration left out: one step short of the last, the last migration's column is proposed", async () => {
    const fresh = keep(await openORM(path.join(dir, 'fresh2.sqlite')));
    await fresh.schema.createSchema();
    const short = keep(await openORM(path.join(dir, 'short.sqlite')));
    await short.getMigrator().up({ to: migrationsList[migrationsList.length - 2].name });
    const extra = await proposal(short);
    expect(extra).not.toBe(await proposal(fresh));
    // The last migration creates stored_file (uploads); name the new last change here when adding one.
    expect(extra).toContain('create table `stored_file`');
  });
});

describe('PostgreSQL', () => {
  it('has nothing to change after its migrations', async () => {
    pg.createDatabase('in_step');
    const migrated = keep(await initORM({ kind: 'postgresql', url: pg.url('in_step') }));
    expect(await proposal(migrated)).toBe('');
  });

  it("notices a migration left out: one step short of the last, the last migration's column is proposed", async () => {
    pg.createDatabase('short');
    const short = keep(await openORM({ kind: 'postgresql', url: pg.url('short') }));
    await short.getMigrator().up({ to: pgMigrationsList[pgMigrationsList.length - 2].name });
    expect(await proposal(short)).toContain('create table "stored_file"');
  });

  it('keeps the audit log append-only, as SQLite does', async () => {
    pg.createDatabase('append_only');
    const orm = keep(await initORM({ kind: 'postgresql', url: pg.url('append_only') }));
    const sql = orm.em.getConnection();
    await sql.execute(
      `insert into project_event (project_id, kind, actor_name, at, summary, changes, detail) values (1, 'created', 'Inst', now(), 'Created.', '[]', '{}')`,
    );
    await expect(sql.execute(`update project_event set summary = 'Rewritten.'`)).rejects.toThrow(/append-only/);
    await expect(sql.execute('delete from project_event')).rejects.toThrow(/append-only/);
  });
});

describe('the two migration sets', () => {
  it('give every SQLite migration after PostgreSQL’s starting point a PostgreSQL twin of the same name, in order', () => {
    const sqliteNames = migrationsList.map((m) => m.name);
    const start = sqliteNames.indexOf(pgMigrationsList[0].name);
    expect(start).toBeGreaterThanOrEqual(0);
    expect(pgMigrationsList.map((m) => m.name)).toEqual(sqliteNames.slice(start));
    expect(last(pgMigrationsList)).toBe(last(migrationsList));
  });
});
