/**
 * The review loop's routes (contract: shared/schemas/review.ts): send, approve and return a job,
 * its comments and its read-only audit trail, and the reviewers a job can be sent to.
 *
 * Order of checks: signed in (401) → the project is visible (404) → the role may act (403) → the
 * body (400) → the state allows it (409) → the version is current (409). Every transition writes
 * its event (and its notices) in the same transaction as the change.
 */
import { Router } from 'express';
import { LockMode } from '@mikro-orm/core';
import type { EntityManager } from '@mikro-orm/knex';
import {
  PROJECT_STATE_LABELS,
  approveProjectBody,
  createCommentBody,
  idParam,
  patchCommentBody,
  returnProjectBody,
  sendProjectBody,
  type CommentDto,
  type ProjectState,
} from '../../../shared/schemas';
import { requestEm } from '../../middleware/request-context';
import { HttpError, notFound } from '../../http-error';
import { requireUser } from '../../middleware/auth';
import { parseOr400 } from '../../middleware/validate';
import { Placement } from '../projects/placement.entity';
import { findVisibleProject, canEdit } from '../projects/project-access';
import { toProjectDto } from '../projects/project.dto';
import type { Project } from '../projects/project.entity';
import type { SheetWork } from '../../workers/sheet-pool';
import { currentContent, issueRevision } from '../sheets/sheet-service';
import { User } from '../users/user.entity';
import { recordEvent, toEventDto } from './audit';
import { ProjectComment } from './comment.entity';
import { queueApprovedNotice, queueReturnedNotice, queueSentNotice, roleWords } from './notices';
import { ProjectEvent } from './project-event.entity';
import { openCommentCount } from './review-service';

const stateWords = (s: ProjectState) => PROJECT_STATE_LABELS[s].toLowerCase();

function notFrom(project: Project, action: string, allowed: string): HttpError {
  return new HttpError(
    409,
    `This job cannot be ${action} now: it is ${stateWords(project.state as ProjectState)}; only a job ${allowed} can be. Reload it to see where it stands.`,
  );
}

const mayReview = (user: User) => user.role === 'reviewer' || user.role === 'admin';

export function toCommentDto(c: ProjectComment): CommentDto {
  return {
    id: c.id,
    projectId: c.project.id,
    parentId: c.parent?.id ?? null,
    authorId: c.author.id,
    authorName: c.author.name,
    authorRole: c.author.role,
    body: c.body,
    pin: c.pin,
    isReturnReason: c.isReturnReason,
    resolved: c.resolved,
    createdAt: c.createdAt.toISOString(),
  };
}

/** Reviewers and admins of the organisation a job can go to (never the job's own installer). */
function reviewersOf(em: EntityManager, organizationId: number) {
  return em.find(
    User,
    { organization: organizationId, role: { $in: ['reviewer', 'admin'] }, disabled: false },
    { orderBy: { name: 'asc', id: 'asc' } },
  );
}

export function reviewRoutes(deps: { work: SheetWork; publicUrl: (host: string) => string }): Router {
  const { work } = deps;
  const r = Router();
  r.use(requireUser);

  async function projectResponse(em: EntityManager, user: User, project: Project) {
    const placements = await em.find(Placement, { project: project.id }, { orderBy: { id: 'asc' } });
    return { project: toProjectDto(project, placements, canEdit(user, project), await openCommentCount(em, project.id)) };
  }

  r.post('/:id/send', async (req, res) => {
    const user = req.user!;
    const baseUrl = deps.publicUrl(req.get('host') ?? 'localhost');
    const em = requestEm();
    const out = await em.transactional(async (tx) => {
      const project = await findVisibleProject(tx, user, req.params.id);
      const reassigning = user.role === 'admin';
      if (user.role === 'reviewer' || (user.role === 'installer' && !canEdit(user, project))) {
        throw new HttpError(403, 'Only the installer who owns this job sends it for review; an administrator can reassign it.');
      }
      const body = parseOr400(sendProjectBody, req.body, 'The request');
      let reviewer: User | null = null;
      if (body.reviewerId != null) {
        reviewer = await tx.findOne(User, { id: body.reviewerId, organization: project.organization.id, disabled: false });
        const sentence =
          !reviewer || !mayReview(reviewer)
            ? 'Choose a reviewer or administrator of your organisation.'
            : reviewer.id === project.owner.id
              ? 'The installer who owns the job cannot review it; choose someone else.'
              : null;
        if (sentence) throw new HttpError(400, sentence, { reviewerId: sentence });
      }
      if (reassigning ? project.state !== 'with_reviewer' : project.state !== 'drawing_up' && project.state !== 'returned') {
        throw reassigning
          ? notFrom(project, 'reassigned', 'waiting for a reviewer')
          : notFrom(project, 'sent for review', 'being drawn up or returned');
      }
      await tx.lock(project, LockMode.OPTIMISTIC, body.version);
      project.reviewer = reviewer;
      const who = reviewer ? reviewer.name : 'any reviewer of the organisation';
      if (reassigning) {
        recordEvent(tx, {
          projectId: project.id,
          kind: 'reassigned',
          actor: user,
          summary: `Reassigned to ${who}.`,
          detail: { reviewerId: reviewer?.id ?? null, reviewerName: reviewer?.name ?? null },
        });
      } else {
        project.state = 'with_reviewer';
        project.sentAt = new Date();
        recordEvent(tx, {
          projectId: project.id,
          kind: 'sent',
          actor: user,
          summary: `Sent to ${who} for review.`,
          detail: { reviewerId: reviewer?.id ?? null, reviewerName: reviewer?.name ?? null },
        });
      }
      const recipients = reviewer ? [reviewer] : (await reviewersOf(tx, project.organization.id)).filter((u) => u.role === 'reviewer');
      queueSentNotice(tx, project, user, recipients, baseUrl);
      await tx.flush();
      return projectResponse(tx, user, project);
    });
    res.json(out);
  });

  /** Checks role, body, state and version before the (possibly slow) revision is issued; again inside the transaction. */
  function checkReviewable(user: User, project: Project, version: number, action: string): void {
    if (!mayReview(user))
      throw new HttpError(403, `Only a reviewer or an administrator can ${action} a job; an installer can never approve their own.`);
    if (project.owner.id === user.id) throw new HttpError(403, `You cannot ${action} a job you drew up yourself.`);
    if (project.state !== 'with_reviewer') throw notFrom(project, action === 'approve' ? 'approved' : 'returned', 'waiting for a reviewer');
    void version;
  }

  r.post('/:id/approve', async (req, res) => {
    const user = req.user!;
    const baseUrl = deps.publicUrl(req.get('host') ?? 'localhost');
    const em = requestEm();
    const project = await findVisibleProject(em, user, req.params.id);
    if (!mayReview(user))
      throw new HttpError(403, 'Only a reviewer or an administrator can approve a job; an installer can never approve their own.');
    const body = parseOr400(approveProjectBody, req.body, 'The request');
    checkReviewable(user, project, body.version, 'approve');
    await em.lock(project, LockMode.OPTIMISTIC, body.version);
    // Approving issues a revision if none holds the current content (the worker pool; outside the transaction).
    const sheet = await currentContent(em, project, work);
    const { revision, created } = await issueRevision(em, sheet, user);
    const out = await requestEm().transactional(async (tx) => {
      const found = await findVisibleProject(tx, user, req.params.id);
      // The transaction starts from the request's identity map, which holds this project as it was
      // before the (slow) sheet work: read it again, so a change made meanwhile fails the version check.
      const fresh = (await tx.refresh(found)) ?? found;
      checkReviewable(user, fresh, body.version, 'approve');
      await tx.lock(fresh, LockMode.OPTIMISTIC, body.version);
      if (created) {
        recordEvent(tx, {
          projectId: fresh.id,
          kind: 'sheet_issued',
          actor: user,
          summary: `Issued sheet revision ${revision.number}.`,
          detail: { revision: revision.number, contentHash: revision.contentHash },
        });
      }
      const approvedAt = new Date(Math.floor(Date.now() / 1000) * 1000);
      tx.assign(fresh, {
        state: 'approved',
        approvedBy: user.id,
        approvedByName: user.name,
        approvedByRole: user.role,
        approvedAt,
        approvedRevision: revision.number,
        approvedHash: revision.contentHash,
      });
      recordEvent(tx, {
        projectId: fresh.id,
        kind: 'approved',
        actor: user,
        summary: `Approved revision ${revision.number} (${roleWords(user.role)}).`,
        detail: { revision: revision.number, contentHash: revision.contentHash, reviewerName: user.name, reviewerRole: user.role },
      });
      queueApprovedNotice(tx, fresh, user, revision.number, revision.contentHash, baseUrl);
      await tx.flush();
      return projectResponse(tx, user, fresh);
    });
    res.json(out);
  });

  r.post('/:id/return', async (req, res) => {
    const user = req.user!;
    const baseUrl = deps.publicUrl(req.get('host') ?? 'localhost');
    const out = await requestEm().transactional(async (tx) => {
      const project = await findVisibleProject(tx, user, req.params.id);
      if (!mayReview(user)) throw new HttpError(403, 'Only a reviewer or an administrator can return a job.');
      const body = parseOr400(returnProjectBody, req.body, 'The request');
      checkReviewable(user, project, body.version, 'return');
      if (body.pin?.kind === 'placement') await checkPin(tx, project, body.pin.placementId, 'reason');
      await tx.lock(project, LockMode.OPTIMISTIC, body.version);
      project.state = 'returned';
      const reason = tx.create(ProjectComment, {
        project,
        author: user,
        body: body.reason,
        pin: body.pin ?? { kind: 'job' },
        isReturnReason: true,
      });
      await tx.flush();
      recordEvent(tx, {
        projectId: project.id,
        kind: 'returned',
        actor: user,
        summary: 'Returned to the installer with reasons.',
        detail: { reason: body.reason, commentId: reason.id },
      });
      // The reasons: this one, and every open thread a reviewer or admin started.
      const open = await tx.find(
        ProjectComment,
        { project: project.id, parent: null, resolved: false, author: { role: { $in: ['reviewer', 'admin'] } } },
        { orderBy: { id: 'asc' } },
      );
      queueReturnedNotice(
        tx,
        project,
        user,
        open.map((c) => c.body),
        baseUrl,
      );
      await tx.flush();
      return projectResponse(tx, user, project);
    });
    res.json(out);
  });

  async function checkPin(em: EntityManager, project: Project, placementId: number, field: string): Promise<void> {
    if (!(await em.count(Placement, { id: placementId, project: project.id }))) {
      const sentence = 'That mirror is not in this job; pin the comment to one of its mirrors, a point on the plan, or the job.';
      throw new HttpError(400, sentence, { [field === 'reason' ? 'pin' : 'pin']: sentence });
    }
  }

  r.get('/:id/comments', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const comments = await em.find(ProjectComment, { project: project.id }, { orderBy: { id: 'asc' }, populate: ['author'] });
    res.json({ comments: comments.map(toCommentDto) });
  });

  r.post('/:id/comments', async (req, res) => {
    const user = req.user!;
    const out = await requestEm().transactional(async (tx) => {
      // Whoever may see the job may comment: its installer, the organisation's reviewers and admins.
      const project = await findVisibleProject(tx, user, req.params.id);
      const body = parseOr400(createCommentBody, req.body, 'The comment');
      let parent: ProjectComment | null = null;
      if (body.parentId != null) {
        parent = await tx.findOne(ProjectComment, { id: body.parentId, project: project.id });
        const sentence = !parent
          ? 'That comment is not in this job.'
          : parent.parent
            ? 'Replies go one level deep: answer the thread’s first comment.'
            : null;
        if (sentence) throw new HttpError(400, sentence, { parentId: sentence });
      }
      if (body.pin.kind === 'placement') await checkPin(tx, project, body.pin.placementId, 'pin');
      const comment = tx.create(ProjectComment, { project, parent, author: user, body: body.body, pin: body.pin });
      await tx.flush();
      recordEvent(tx, {
        projectId: project.id,
        kind: 'commented',
        actor: user,
        summary: parent ? 'Replied to a comment.' : 'Commented.',
        detail: { commentId: comment.id, parentId: parent?.id ?? null, pin: body.pin.kind },
      });
      await tx.flush();
      await tx.populate(comment, ['author']);
      return { comment: toCommentDto(comment) };
    });
    res.status(201).json(out);
  });

  r.patch('/:id/comments/:commentId', async (req, res) => {
    const user = req.user!;
    const out = await requestEm().transactional(async (tx) => {
      const project = await findVisibleProject(tx, user, req.params.id);
      if (!canEdit(user, project)) throw new HttpError(403, 'Only the installer who owns this job marks its comments resolved.');
      const commentId = parseOr400(idParam, req.params.commentId, 'The address');
      const body = parseOr400(patchCommentBody, req.body, 'The change');
      const comment = await tx.findOne(ProjectComment, { id: commentId, project: project.id }, { populate: ['author'] });
      if (!comment) throw notFound('That comment');
      if (comment.parent) {
        throw new HttpError(400, 'A thread is resolved as a whole: mark its first comment.', {
          resolved: 'Mark the thread’s first comment.',
        });
      }
      if (comment.resolved !== body.resolved) {
        comment.resolved = body.resolved;
        recordEvent(tx, {
          projectId: project.id,
          kind: 'comment_resolved',
          actor: user,
          summary: body.resolved ? 'Marked a comment resolved.' : 'Opened a resolved comment again.',
          detail: { commentId: comment.id, resolved: body.resolved ? 1 : 0 },
        });
      }
      await tx.flush();
      return { comment: toCommentDto(comment) };
    });
    res.json(out);
  });

  /** The audit trail, oldest first. Read-only: no route changes or deletes an event. */
  r.get('/:id/events', async (req, res) => {
    const em = requestEm();
    const project = await findVisibleProject(em, req.user!, req.params.id);
    const events = await em.find(ProjectEvent, { projectId: project.id }, { orderBy: { id: 'asc' } });
    res.json({ events: events.map(toEventDto) });
  });

  return r;
}

/** `GET /api/reviewers`: whom a job can be sent to. */
export function reviewersRoutes(): Router {
  const r = Router();
  r.use(requireUser);
  r.get('/', async (req, res) => {
    const em = requestEm();
    const people = await reviewersOf(em, req.user!.organization.id);
    res.json({ reviewers: people.map((u) => ({ id: u.id, name: u.name, role: u.role })) });
  });
  return r;
}
