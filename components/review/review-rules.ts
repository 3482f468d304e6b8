/**
 * Who may take which review step, as the screens show it. The server decides (403 otherwise); this
 * only hides buttons that would be refused, from the same rules as shared/schemas/review.ts.
 */
import type { ProjectState, Role } from '@/shared/schemas';

export type ReviewAction = 'send' | 'reassign' | 'approve' | 'return' | 'resolve';

export interface ReviewViewer {
  id: number;
  role: Role;
}

export interface ReviewSubject {
  ownerId: number;
  state: ProjectState;
}

/** The steps this person may take on this job now, in the order the screen lists them. */
export function reviewActionsFor(viewer: ReviewViewer, job: ReviewSubject): ReviewAction[] {
  const owns = viewer.role === 'installer' && viewer.id === job.ownerId;
  const actions: ReviewAction[] = [];
  if (owns && (job.state === 'drawing_up' || job.state === 'returned')) actions.push('send');
  // Nobody approves their own job, whatever their role.
  const reviews = (viewer.role === 'reviewer' || viewer.role === 'admin') && viewer.id !== job.ownerId;
  if (reviews && job.state === 'with_reviewer') actions.push('approve', 'return');
  if (viewer.role === 'admin' && job.state === 'with_reviewer') actions.push('reassign');
  if (owns) actions.push('resolve');
  return actions;
}
