/**
 * A unique violation is turned into the registered sentence whichever database reports it. The
 * messages are the two databases' own wording (SQLite 3 and PostgreSQL 15, as they print them).
 */
import { namesColumn } from '../../server/write-conflicts';

const SQLITE = 'insert into `mirror_model` … - UNIQUE constraint failed: mirror_model.organization_id, mirror_model.code';
const POSTGRES =
  'update "mirror_model" set "code" = $1 … - duplicate key value violates unique constraint "mirror_model_organization_id_code_unique"';

it('finds the column in SQLite’s message and in PostgreSQL’s constraint name', () => {
  expect(namesColumn(SQLITE, 'mirror_model.code')).toBe(true);
  expect(namesColumn(POSTGRES, 'mirror_model.code')).toBe(true);
  expect(namesColumn('duplicate key value violates unique constraint "user_email_unique"', 'user.email')).toBe(true);
});

it('does not take another table’s or another column’s constraint for it', () => {
  expect(namesColumn(POSTGRES, 'user.code')).toBe(false);
  expect(namesColumn(POSTGRES, 'mirror_model.name')).toBe(false);
  expect(namesColumn('duplicate key value violates unique constraint "user_email_unique"', 'mirror_model.code')).toBe(false);
});
