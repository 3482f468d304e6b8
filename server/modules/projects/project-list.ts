/**
 * The project list in one SQL statement: the summary columns only (never the scene or the notes,
 * which are most of a row's bytes), the owner's and reviewer's names by join, and the mirror and
 * open-thread counts as correlated subqueries, so the cost does not grow with the number of
 * projects (no N+1) and nothing is turned into entities only to be turned into JSON again.
 *
 * The access rule is the same filter every other project query uses (`visibleProjectsBy`), given to
 * the ORM's query builder, which writes each database's own SQL once per shape of the list.
 */
import { sql, type FilterQuery } from '@mikro-orm/core';
import type { EntityManager, QueryBuilder } from '@mikro-orm/knex';
import { runCompiled } from '../../compiled-query';
import { containsAnyCondition } from '../../text-search';
import type { ProjectState, ProjectSummaryDto } from '../../../shared/schemas';
import { fromDbDate, type DbDate } from '../../db-date';
import type { User } from '../users/user.entity';
import { ProjectComment } from '../review/comment.entity';
import { Placement } from './placement.entity';
import { Project } from './project.entity';
import { visibleProjectsBy } from './project-access';

export type ProjectListSort = 'updated' | 'name' | 'customer';

const iso = (d: DbDate) => fromDbDate(d).toISOString();
const isoOrNull = (d: DbDate | null) => (d == null ? null : iso(d));

export interface SummaryRow {
  id: number;
  name: string;
  customer: string;
  site: string;
  kind: ProjectSummaryDto['kind'];
  state: ProjectState;
  version: number;
  created_at: DbDate;
  updated_at: DbDate;
  sent_at: DbDate | null;
  owner_id: number;
  owner_name: string;
  reviewer_id: number | null;
  reviewer_name: string | null;
  approved_by_id: number | null;
  approved_by_name: string | null;
  approved_by_role: string | null;
  approved_at: DbDate | null;
  approved_revision: number | null;
  approved_hash: string | null;
  /** PostgreSQL's count(*) is a bigint, which arrives as a string. */
  placement_count: number | string;
  open_comment_count: number | string;
}

/** The same fields `toProjectSummaryDto` gives for a loaded project, from one row. */
export function toSummary(r: SummaryRow): ProjectSummaryDto {
  const approved = r.state === 'approved' && r.approved_at != null && r.approved_revision != null && r.approved_hash;
  return {
    state: r.state,
    reviewerId: r.reviewer_id ?? null,
    reviewerName: r.reviewer_id == null ? null : r.reviewer_name,
    sentAt: isoOrNull(r.sent_at),
    approval: approved
      ? {
          reviewerId: r.approved_by_id ?? 0,
          reviewerName: r.approved_by_name ?? '',
          reviewerRole: r.approved_by_role ?? '',
          approvedAt: iso(r.approved_at!),
          revision: r.approved_revision!,
          contentHash: r.approved_hash!,
        }
      : null,
    openCommentCount: Number(r.open_comment_count),
    id: r.id,
    name: r.name,
    customer: r.customer,
    site: r.site,
    kind: r.kind,
    ownerId: r.owner_id,
    ownerName: r.owner_name,
    placementCount: Number(r.placement_count),
    version: r.version,
    createdAt: iso(r.created_at),
    updatedAt: iso(r.updated_at),
  };
}

/**
 * The projects `user` may see whose name, customer or site contains `search` (all when it is
 * undefined), in the chosen order, as summaries. The SQL is written once per shape (the access
 * rule's kind, searching or not, the order) and run with this request's ids and pattern
 * (server/compiled-query.ts).
 */
export async function projectSummaries(
  em: EntityManager,
  user: User,
  search: string | undefined,
  sort: ProjectListSort,
): Promise<ProjectSummaryDto[]> {
  const access = user.role === 'installer' ? 'own' : 'organization';
  const values = {
    userId: user.id,
    organizationId: user.organization.id,
    ...(search === undefined ? {} : { search }),
  };
  const rows = await runCompiled<SummaryRow>(
    em,
    `project-list:${access}:${search === undefined ? 'all' : 'search'}:${sort}`,
    values,
    (slot) => summaryQuery(em, user.role, slot, search !== undefined, sort),
  );
  return rows.map(toSummary);
}

/** The list's query, for the slots' stand-ins (exported for the test that compares it built afresh with the kept statement). */
export function summaryQuery(
  em: EntityManager,
  role: User['role'],
  slot: (name: string) => number | string,
  searching: boolean,
  sort: ProjectListSort,
): QueryBuilder<Project> {
  const placements = em
    .createQueryBuilder(Placement, 'pl')
    .count()
    .where({ project: sql.ref('p.id') })
    .as('placement_count');
  const openThreads = em
    .createQueryBuilder(ProjectComment, 'c')
    .count()
    .where({ project: sql.ref('p.id'), parent: null, resolved: false })
    .as('open_comment_count');
  const orderBy =
    sort === 'name'
      ? { name: 'asc' as const }
      : sort === 'customer'
        ? { customer: 'asc' as const, name: 'asc' as const }
        : { updatedAt: 'desc' as const };
  const access: FilterQuery<Project> = visibleProjectsBy(role, slot('userId') as number, slot('organizationId') as number);
  const qb = em
    .createQueryBuilder(Project, 'p')
    .select([
      'p.id',
      'p.name',
      'p.customer',
      'p.site',
      'p.kind',
      'p.state',
      'p.version',
      'p.createdAt',
      'p.updatedAt',
      'p.sentAt',
      // Named by column: with the joins below, 'p.owner' would come back as the join's `o__id`.
      sql.ref('p.owner_id').as('owner_id'),
      sql.ref('p.reviewer_id').as('reviewer_id'),
      'p.approvedBy',
      'p.approvedByName',
      'p.approvedByRole',
      'p.approvedAt',
      'p.approvedRevision',
      'p.approvedHash',
      sql.ref('o.name').as('owner_name'),
      sql.ref('r.name').as('reviewer_name'),
      placements,
      openThreads,
    ])
    .join('p.owner', 'o')
    .leftJoin('p.reviewer', 'r')
    .where({ $and: [access] });
  if (searching) {
    const text = slot('search');
    qb.andWhere(containsAnyCondition(em, ['p.name', 'p.customer', 'p.site']), [text, text, text]);
  }
  return qb.orderBy({ ...orderBy, id: 'asc' });
}
