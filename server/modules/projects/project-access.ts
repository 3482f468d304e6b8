import type { FilterQuery } from '@mikro-orm/core';
import type { User } from '../users/user.entity';
import { HttpError } from '../../http-error';
import type { Project } from './project.entity';

/**
 * Who sees which projects: an installer their own; a reviewer their organisation's; an admin all.
 * Only the owning installer changes a project. A project you cannot see is "not found", so ids
 * of other people's work are not confirmed to exist.
 */
export function visibleProjects(user: User): FilterQuery<Project> {
  if (user.role === 'admin') return {};
  if (user.role === 'reviewer') return { organization: user.organization.id };
  return { owner: user.id };
}

export function assertCanEdit(user: User, project: Project): void {
  if (project.owner.id !== user.id || user.role !== 'installer') {
    throw new HttpError(403, 'You can read this project but not change it; only the installer who owns it can.');
  }
}

export const canEdit = (user: User, project: Project) => user.role === 'installer' && project.owner.id === user.id;
