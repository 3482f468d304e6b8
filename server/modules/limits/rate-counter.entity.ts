import { defineEntity } from '@mikro-orm/core';

/**
 * One counter of a rate limit (sign-in attempts, reset e-mails): shared by every instance through
 * the database. Rows are written only by `DbRateLimiter`'s atomic upsert, never through the unit of
 * work. `expiresAtMs` is epoch milliseconds (bigint: PostgreSQL's integer stops in 2038).
 */
export class RateCounter {
  key!: string;
  points!: number;
  expiresAtMs!: number;

  static readonly schema = defineEntity({
    class: RateCounter,
    tableName: 'rate_limit',
    properties: (p) => ({
      key: p.string().length(255).primary(),
      points: p.integer(),
      expiresAtMs: p.bigint('number').index(),
    }),
  });
}
