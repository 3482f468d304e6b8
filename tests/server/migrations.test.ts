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
