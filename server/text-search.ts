import type { EntityManager } from '@mikro-orm/knex';
import { PostgreSqlPlatform } from '@mikro-orm/postgresql';

/** The LIKE pattern for "contains `text`". */
export const containsPattern = (text: string) => `%${text}%`;

/**
 * A filter for "matches this LIKE pattern, whatever the case": SQLite's LIKE already ignores the
 * case of ASCII letters, PostgreSQL's does not (its ILIKE does, and SQLite has no ILIKE). The
 * project list passes a stand-in for the pattern (server/compiled-query.ts).
 */
export function likePattern<P extends string | number>(em: EntityManager, pattern: P): { $like: P } | { $ilike: P } {
  return em.getPlatform() instanceof PostgreSqlPlatform ? { $ilike: pattern } : { $like: pattern };
}
