/**
 * The migrations added for organisations and mail carry an existing database forward: rows made
 * before them keep working and land where they belong.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { MikroORM } from '@mikro-orm/sqlite';
import { ormOptions } from '../../server/orm-options';

let dir: string;
let orm: MikroORM;
beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sightfan-migrate-'));
  orm = await MikroORM.init(ormOptions(path.join(dir, 'old.sqlite')));
});
afterAll(async () => {
  await orm.close(true);
  fs.rmSync(dir, { recursive: true, force: true });
});

const now = "'2026-12-01 10:00:00'";

it('gives an admin-made catalogue item to the organisation that existed, keeps the demo set shared, and keeps invitations working', async () => {
  const migrator = orm.getMigrator();
  await migrator.up({ to: 'Migration20261202032324' });
  const sql = orm.em.getConnection();
  await sql.execute(`insert into organization (id, created_at, updated_at, name, demo) values (1, ${now}, ${now}, 'Old Works (test)', 0)`);
  await sql.execute(
    `insert into user (id, created_at, updated_at, organization_id, email, name, role, disabled, units) values (1, ${now}, ${now}, 1, 'old@works.test', 'Old', 'admin', 0, 'metric')`,
  );
  await sql.execute(
    `insert into invitation (id, created_at, updated_at, user_id, token_hash, expires_at) values (1, ${now}, ${now}, 1, '${'a'.repeat(64)}', '2027-01-01 00:00:00')`,
  );
  for (const [id, code, demo] of [
    [1, 'DEMO-1', 1],
    [2, 'OWN-1', 0],
  ] as const) {
    await sql.execute(
      `insert into mirror_model (id, created_at, updated_at, code, name, shape, diameter_m, radius_m, unit_price_minor, currency, demo) values (${id}, ${now}, ${now}, '${code}', 'm', 'round', 0.6, 0.8, 100, 'EUR', ${demo})`,
    );
  }

  await migrator.up();

  const items: { code: string; organization_id: number | null }[] = await sql.execute(
    'select code, organization_id from mirror_model order by id',
  );
  expect(items).toEqual([
    { code: 'DEMO-1', organization_id: null },
    { code: 'OWN-1', organization_id: 1 },
  ]);
  const [inv]: { purpose: string }[] = await sql.execute('select purpose from invitation');
  expect(inv.purpose).toBe('invite');
  // Codes are unique per owner now: the organisation may reuse the demo set's code, not its own.
  await sql.execute(
    `insert into mirror_model (created_at, updated_at, organization_id, code, name, shape, unit_price_minor, currency) values (${now}, ${now}, 1, 'DEMO-1', 'm', 'round', 1, 'EUR')`,
  );
  await expect(
    sql.execute(
      `insert into mirror_model (created_at, updated_at, organization_id, code, name, shape, unit_price_minor, currency) values (${now}, ${now}, 1, 'OWN-1', 'm', 'round', 1, 'EUR')`,
    ),
  ).rejects.toThrow(/UNIQUE/);
  expect(await sql.execute('select count(*) as n from outgoing_mail')).toEqual([{ n: 0 }]);
});

it('carries jobs forward into the review loop: every job is being drawn up, its mirrors and queued mail kept, the event log append-only', async () => {
  const old = await MikroORM.init(ormOptions(path.join(dir, 'before-review.sqlite')));
  try {
    const migrator = old.getMigrator();
    await migrator.up({ to: 'Migration20261202140000' });
    const sql = old.em.getConnection();
    await sql.execute(
      `insert into organization (id, created_at, updated_at, name, demo) values (1, ${now}, ${now}, 'Old Works (test)', 0)`,
    );
    await sql.execute(
      `insert into user (id, created_at, updated_at, organization_id, email, name, role, disabled, units) values (1, ${now}, ${now}, 1, 'inst@works.test', 'Inst', 'installer', 0, 'metric')`,
    );
    await sql.execute(
      `insert into project (id, created_at, updated_at, owner_id, organization_id, name, status, scene, version) values (7, ${now}, ${now}, 1, 1, 'Dock 2', 'draft', '{"walls":[],"zones":[],"viewers":[]}', 4)`,
    );
    await sql.execute(
      `insert into placement (created_at, updated_at, project_id, label, custom_mirror, x_m, y_m, height_m, azimuth_rad, tilt_down_rad) values (${now}, ${now}, 7, 'M1', '{"shape":"round","diameterM":0.6,"radiusM":0.8}', 1, 2, 3, 0, 0.2)`,
    );
    await sql.execute(
      `insert into outgoing_mail (created_at, updated_at, organization_id, kind, to_address, subject, text, attachments, next_attempt_at) values (${now}, ${now}, 1, 'sheet', 'buyer@works.test', 'Sheet', 'Hello', '[]', ${now})`,
    );

    await migrator.up();

    expect(await sql.execute('select id, name, state, version, reviewer_id, approved_hash from project')).toEqual([
      { id: 7, name: 'Dock 2', state: 'drawing_up', version: 4, reviewer_id: null, approved_hash: null },
    ]);
    expect(await sql.execute('select label from placement where project_id = 7')).toEqual([{ label: 'M1' }]);
    expect(await sql.execute('select kind, to_address from outgoing_mail')).toEqual([{ kind: 'sheet', to_address: 'buyer@works.test' }]);
    await sql.execute(
      `insert into project_event (project_id, kind, actor_id, actor_name, at, summary, changes, detail) values (7, 'created', 1, 'Inst', ${now}, 'Created.', '[]', '{}')`,
    );
    await expect(sql.execute(`update project_event set summary = 'Rewritten.'`)).rejects.toThrow(/append-only/);
    await expect(sql.execute('delete from project_event')).rejects.toThrow(/append-only/);
  } finally {
    await old.close(true);
  }
});
