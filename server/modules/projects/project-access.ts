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
import type { FilterQuery } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import { idParam, type Role } from '../../../shared/schemas';
import { HttpError, notFound } from '../../http-error';
import { parseOr400 } from '../../middleware/validate';
import type { User } from '../users/user.entity';
import type { MirrorModel } from '../catalogue/mirror-model.entity';
import { Project } from './project.entity';

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
