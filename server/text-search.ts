import type { EntityManager } from '@mikro-orm/knex';
import { PostgreSqlPlatform } from '@mikro-orm/postgresql';

/**
 * A filter for "contains this text, whatever the case": SQLite's LIKE already ignores the case of
 * ASCII letters, PostgreSQL's does not (its ILIKE does, and SQLite has no ILIKE).
 */
export function containsText(em: EntityManager, text: string): { $like: string } | { $ilike: string } {
  const pattern = `%${text}%`;
  return em.getPlatform() instanceof PostgreSqlPlatform ? { $ilike: pattern } : { $like: pattern };
}
