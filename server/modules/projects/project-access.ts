/**
 * The one place that decides which records a signed-in person may reach. Organisations are walls:
 * every query for projects, sheets and catalogue items goes through these filters.
 *
 * Projects: an installer sees their own; a reviewer and an admin see their organisation's. Only the
 * owning installer changes a project. A project you cannot see is "not found", so ids of other
 * people's work are not confirmed to exist.
 *
 * Catalogue: an organisation's own items plus the shared demo set (no organisation), which is
 * read-only for everyone.
 */
import { sql, type FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import { idParam, type Role } from '../../../shared/schemas';
import { HttpError, notFound } from '../../http-error';
import { parseOr400 } from '../../middleware/validate';
import { User } from '../users/user.entity';
import type { MirrorModel } from '../catalogue/mirror-model.entity';
import { Project } from './project.entity';
import { runCompiled } from '../../compiled-query';

export function visibleProjects(user: User): FilterQuery<Project> {
  return visibleProjectsBy(user.role, user.id, user.organization.id);
}

/** The same rule from a role and two ids (the project list passes stand-ins here; server/compiled-query.ts). */
export function visibleProjectsBy(role: Role, userId: number, organizationId: number): FilterQuery<Project> {
  if (role === 'installer') return { owner: userId, organization: organizationId };
  return { organization: organizationId };
}

/** Relations a route may want loaded with the project; each joined one costs about 0.5 ms of CPU. */
export type ProjectRelation = 'owner' | 'organization' | 'reviewer';

/**
 * The project with the id in the path, if this person may read it; otherwise 404 (400 for a
 * malformed id). `populate` names the relations loaded with it (all three by default); the rule is
 * the same whatever is loaded.
 */
export async function findVisibleProject(
  em: EntityManager,
  user: User,
  rawId: unknown,
  populate: readonly ProjectRelation[] = ['owner', 'organization', 'reviewer'],
): Promise<Project> {
  const id = parseOr400(idParam, rawId, 'The address');
  const project = await em.findOne(Project, { $and: [{ id }, visibleProjects(user)] }, { populate: [...populate] });
  if (!project) throw notFound('That project');
  return project;
}

/**
 * The project with the id in the path, for an answer that only reads it (GET one project): the
 * same rule as `findVisibleProject`, its SQL kept per access kind (server/compiled-query.ts), the
 * row mapped into the request's entity manager (`em.map`) with the owner and reviewer as far as a
 * read answer names them (id and name). The ORM's findOne with both joined cost about 1.5 ms of
 * CPU; this about 0.25 ms. Routes that change the project use `findVisibleProject`.
 */
/** A project's columns as stored, with the two names joined in. */
type ReadRow = Record<string, unknown> & { owner_id: number; reviewer_id: number | null; owner_name: string; reviewer_name: string | null };

export async function readVisibleProject(em: EntityManager, user: User, rawId: unknown): Promise<Project> {
  const id = parseOr400(idParam, rawId, 'The address');
  const access = user.role === 'installer' ? 'own' : 'organization';
  const [row] = await runCompiled<ReadRow>(
    em,
    `project:read:${access}`,
    { id, userId: user.id, organizationId: user.organization.id },
    (slot) =>
      em
        .createQueryBuilder(Project, 'p')
        .select(['p.*', sql.ref('o.name').as('owner_name'), sql.ref('r.name').as('reviewer_name')])
        .join('p.owner', 'o')
        .leftJoin('p.reviewer', 'r')
        .where({ $and: [{ id: slot('id') }, visibleProjectsBy(user.role, slot('userId') as number, slot('organizationId') as number)] }),
  );
  if (!row) throw notFound('That project');
  const { owner_name: ownerName, reviewer_name: reviewerName, ...columns } = row;
  em.map(User, { id: columns.owner_id, name: ownerName });
  if (columns.reviewer_id != null) em.map(User, { id: columns.reviewer_id, name: reviewerName });
  return em.map(Project, columns);
}

export function assertCanEdit(user: User, project: Project): void {
  if (!canEdit(user, project)) {
    throw new HttpError(403, 'You can read this project but not change it; only the installer who owns it can.');
  }
}

export const canEdit = (user: User, project: Project) =>
  user.role === 'installer' && project.owner.id === user.id && project.organization.id === user.organization.id;

/** Catalogue items an organisation may read (and reference from a placement): its own and the shared demo set. */
export function visibleCatalogue(organizationId: number): FilterQuery<MirrorModel> {
  return { $or: [{ organization: organizationId }, { organization: null }] };
}
