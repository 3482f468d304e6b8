/**
 * The review loop's contract: a job's state, the transitions between states, comments and the
 * read-only audit trail. The server validates with these; the app takes its types from them.
 *
 * States (our own names):
 *   drawing_up    — the installer is preparing the job (every new job starts here)
 *   with_reviewer — sent; waiting for a reviewer of the organisation
 *   approved      — a reviewer approved one revision of the engineering content
 *   returned      — a reviewer sent it back with at least one reason; the installer fixes and resends
 *
 * Transitions (each `POST /api/projects/:id/<action>` with `{version}`, stale version → 409):
 *   send     installer who owns it, from drawing_up or returned      → with_reviewer
 *   approve  reviewer or admin (never the job's own installer), from with_reviewer → approved
 *   return   reviewer or admin, from with_reviewer (reason required)  → returned
 *   withdraw (automatic, no route) any change to the engineering content of an approved job
 *            → drawing_up, with an `approval_withdrawn` event
 *   reassign admin, while with_reviewer: `POST …/send` by an admin only changes `reviewerId`
 *
 * The project's `version` counts every change to the job, its mirrors included, so a reviewer can
 * never approve content they have not loaded.
 */
import { z } from 'zod';
import { optionalTextRule } from './rules';
import { zodText } from './zod-rules';

export const projectStates = ['drawing_up', 'with_reviewer', 'approved', 'returned'] as const;
export type ProjectState = (typeof projectStates)[number];
export const projectState = z.enum(projectStates);

/** Words shown for each state (screens, e-mails, the sheet). */
export const PROJECT_STATE_LABELS: Record<ProjectState, string> = {
  drawing_up: 'Being drawn up',
  with_reviewer: 'Waiting for a reviewer',
  approved: 'Approved',
  returned: 'Returned to the installer',
};

export const reviewRules = {
  reason: { ...optionalTextRule('reason', 2000, 'multi'), required: 'Say what must change before this job can be approved.' },
  comment: { ...optionalTextRule('comment', 2000, 'multi'), required: 'Write the comment first.' },
} as const;

const version = z.number({ message: 'The request must say which version of the job it acts on.' }).int();

/** `POST /api/projects/:id/send` — installer: optional reviewer; admin: reassigns the reviewer. */
export const sendProjectBody = z.object({ version, reviewerId: z.number().int().positive().nullable().optional() }).strict();
export type SendProjectBody = z.input<typeof sendProjectBody>;

/** `POST /api/projects/:id/approve` */
export const approveProjectBody = z.object({ version }).strict();
export type ApproveProjectBody = z.input<typeof approveProjectBody>;

/** `POST /api/projects/:id/return` — at least one reason; it may be pinned like any comment (default: the job). */
export const returnProjectBody = z
  .object({ version, reason: zodText(reviewRules.reason), pin: z.lazy(() => commentPin).optional() })
  .strict();
export type ReturnProjectBody = z.input<typeof returnProjectBody>;

/** Where a comment is pinned: the job as a whole, one mirror, or a point on the plan (metres). */
export const commentPin = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('job') }).strict(),
  z.object({ kind: z.literal('placement'), placementId: z.number().int().positive() }).strict(),
  z.object({ kind: z.literal('point'), pointM: z.tuple([z.number().finite(), z.number().finite()]) }).strict(),
]);
export type CommentPin = z.infer<typeof commentPin>;

/** `POST /api/projects/:id/comments` — a new thread (no parentId) or a reply (parentId). */
export const createCommentBody = z
  .object({
    body: zodText(reviewRules.comment),
    pin: commentPin.default({ kind: 'job' }),
    parentId: z.number().int().positive().nullable().default(null),
  })
  .strict();
export type CreateCommentBody = z.input<typeof createCommentBody>;

/** `PATCH /api/projects/:id/comments/:commentId` — the installer marks a thread resolved or open. */
export const patchCommentBody = z.object({ resolved: z.boolean({ message: 'Resolved must be true or false.' }) }).strict();
export type PatchCommentBody = z.input<typeof patchCommentBody>;

export const commentDto = z.object({
  id: z.number(),
  projectId: z.number(),
  parentId: z.number().nullable(),
  authorId: z.number(),
  authorName: z.string(),
  authorRole: z.string(),
  body: z.string(),
  pin: commentPin,
  /** true for a return's reason (kept as a comment so it can be pinned, answered and resolved). */
  isReturnReason: z.boolean(),
  resolved: z.boolean(),
  createdAt: z.string(),
});
export type CommentDto = z.infer<typeof commentDto>;

export const projectEventKinds = [
  'created',
  'changed',
  'placement_added',
  'placement_changed',
  'placement_removed',
  'sent',
  'reassigned',
  'commented',
  'comment_resolved',
  'approved',
  'returned',
  'approval_withdrawn',
  'sheet_issued',
  'sheet_emailed',
] as const;
export type ProjectEventKind = (typeof projectEventKinds)[number];

/** One audit event: append-only; `changes` lists before → after for the fields that matter. */
export const projectEventDto = z.object({
  id: z.number(),
  projectId: z.number(),
  kind: z.enum(projectEventKinds),
  actorId: z.number().nullable(),
  actorName: z.string(),
  at: z.string(),
  /** A sentence for the timeline ("Sent to Rosa Demo for review."). */
  summary: z.string(),
  changes: z.array(z.object({ field: z.string(), before: z.string(), after: z.string() })),
  /** Extra facts by kind: the reviewer, the revision number and content hash, the e-mail address. */
  detail: z.record(z.string(), z.union([z.string(), z.number(), z.null()])),
});
export type ProjectEventDto = z.infer<typeof projectEventDto>;

/** The approval a job carries (null unless approved). */
export const approvalDto = z.object({
  reviewerId: z.number(),
  reviewerName: z.string(),
  reviewerRole: z.string(),
  approvedAt: z.string(),
  revision: z.number(),
  contentHash: z.string(),
});
export type ApprovalDto = z.infer<typeof approvalDto>;

/** Added to the project DTOs (summary and full). */
export const reviewFieldsDto = z.object({
  state: projectState,
  /** The reviewer it was sent to, if one was named. */
  reviewerId: z.number().nullable(),
  reviewerName: z.string().nullable(),
  /** When it was last sent (for the reviewer's queue: waiting time). */
  sentAt: z.string().nullable(),
  approval: approvalDto.nullable(),
  openCommentCount: z.number(),
});
export type ReviewFieldsDto = z.infer<typeof reviewFieldsDto>;

/** `GET /api/reviewers`: the people of the caller's organisation a job can be sent to (reviewers and admins). */
export const reviewerDto = z.object({ id: z.number(), name: z.string(), role: z.string() });
export type ReviewerDto = z.infer<typeof reviewerDto>;
export const reviewersResponse = z.object({ reviewers: z.array(reviewerDto) });
export type ReviewersResponse = z.infer<typeof reviewersResponse>;

export const commentsResponse = z.object({ comments: z.array(commentDto) });
export type CommentsResponse = z.infer<typeof commentsResponse>;
export const commentResponse = z.object({ comment: commentDto });
export type CommentResponse = z.infer<typeof commentResponse>;

/** `GET /api/projects/:id/events`: oldest first. */
export const projectEventsResponse = z.object({ events: z.array(projectEventDto) });
export type ProjectEventsResponse = z.infer<typeof projectEventsResponse>;
