/**
 * A date column read by plain SQL (knex builders, `execute('all', false)`) comes back as each
 * database keeps it: SQLite as milliseconds since 1970 (a number, or a numeric string from some
 * drivers), PostgreSQL as a Date. The ORM converts for entities; rows read without it use this.
 */
export type DbDate = number | string | Date;

export function fromDbDate(value: DbDate): Date {
  if (typeof value === 'string' && /^\d+$/.test(value)) return new Date(Number(value));
  return new Date(value);
}
