import type { EntityManager } from '@mikro-orm/knex';
import { PostgreSqlPlatform } from '@mikro-orm/postgresql';

/**
 * "Any of these columns contains this text, whatever the case of its ASCII letters", as a SQL
 * condition with one `?` per column for the text. A substring search (SQLite's `instr`,
 * PostgreSQL's `strpos`, both over `lower(…)`), not LIKE: a search for `50%` or `Dock_3` finds
 * those names and nothing else (in a LIKE pattern `%` and `_` are wildcards, and SQLite has no
 * default escape character). Columns are the code's own (`alias.column`), never a request's.
 */
export function containsAnyCondition(em: EntityManager, columns: readonly string[]): string {
  const position = em.getPlatform() instanceof PostgreSqlPlatform ? 'strpos' : 'instr';
  return `(${columns.map((c) => `${position}(lower(${c}), lower(?)) > 0`).join(' or ')})`;
}
