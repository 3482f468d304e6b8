/**
 * PostgreSQL's driver with one change: a `p.float()` property is `double precision` (8 bytes, as
 * SQLite's REAL is), not PostgreSQL's 4-byte `real`. With `real`, a mirror's position read back
 * differs from the one saved after the 7th digit, and the content hash of an approved job would
 * move by itself on PostgreSQL only.
 */
import type { Configuration } from '@mikro-orm/core';
import { AbstractSqlDriver } from '@mikro-orm/knex';
import { PostgreSqlConnection, PostgreSqlPlatform } from '@mikro-orm/postgresql';

export class WideFloatPostgreSqlPlatform extends PostgreSqlPlatform {
  override getFloatDeclarationSQL(): string {
    return 'double precision';
  }
}

export class SightfanPostgreSqlDriver extends AbstractSqlDriver<PostgreSqlConnection, WideFloatPostgreSqlPlatform> {
  constructor(config: Configuration) {
    super(config, new WideFloatPostgreSqlPlatform(), PostgreSqlConnection, ['knex', 'pg']);
  }
}
