/**
 * The review loop: transitions (send, approve, return), comments, the audit trail and the people a
 * job can be sent to. A transition answers with the project, which replaces the cached one; a 409
 * puts the server's current project in the cache so the screen shows what is true.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { ApiError } from '@/shared/api-client';
import type { CommentPin, ProjectDto } from '@/shared/schemas';
import { api } from './api';
import { projectKeys } from './use-projects';
import { sheetKeys } from './use-sheet';

/** Comments and events change when someone else acts; a short stale time plus focus refetch keeps them current. */
export const REVIEW_STALE_MS = 10_000;
/** The people one can send to change rarely. */
export const REVIEWERS_STALE_MS = 5 * 60_000;

export const reviewKeys = {
  all: ['review'] as const,
  comments: (projectId: number) => [...reviewKeys.all, 'comments', projectId] as const,
  events: (projectId: number) => [...reviewKeys.all, 'events', projectId] as const,
  reviewers: () => [...reviewKeys.all, 'reviewers'] as const,
};

export function useCommentsQuery(projectId: number) {
  return useQuery({
    queryKey: reviewKeys.comments(projectId),
    queryFn: async () => (await api.comments.list(projectId)).comments,
    staleTime: REVIEW_STALE_MS,
  });
}

export function useEventsQuery(projectId: number) {
  return useQuery({
    queryKey: reviewKeys.events(projectId),
    queryFn: async () => (await api.projects.events(projectId)).events,
    staleTime: REVIEW_STALE_MS,
  });
}

export function useReviewersQuery(enabled: boolean) {
  return useQuery({
    queryKey: reviewKeys.reviewers(),
    queryFn: async () => (await api.reviewers.list()).reviewers,
    staleTime: REVIEWERS_STALE_MS,
    enabled,
  });
}

/** After any review step: the job, the lists (queue and project list), its trail, comments and sheet status. */
function refreshAfter(qc: QueryClient, projectId: number, project?: ProjectDto) {
  // A comment changes the job's open-comment count without answering with the job: fetch it again.
  if (project) qc.setQueryData(projectKeys.detail(projectId), project);
  else void qc.invalidateQueries({ queryKey: projectKeys.detail(projectId) });
  void qc.invalidateQueries({ queryKey: [...projectKeys.all, 'list'] });
  void qc.invalidateQueries({ queryKey: reviewKeys.events(projectId) });
  void qc.invalidateQueries({ queryKey: reviewKeys.comments(projectId) });
  void qc.invalidateQueries({ queryKey: sheetKeys.status(projectId) });
}

export type Transition = { action: 'send'; reviewerId: number | null } | { action: 'approve' } | { action: 'return'; reason: string };

/** Send, approve or return, with the version this screen holds (read when the request runs). */
export function useTransitionMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (t: Transition) => {
      const version = qc.getQueryData<ProjectDto>(projectKeys.detail(projectId))?.version;
      if (version === undefined) throw new Error('The job is not loaded yet; wait a moment and try again.');
      if (t.action === 'send') return api.projects.send(projectId, { version, reviewerId: t.reviewerId });
      if (t.action === 'approve') return api.projects.approve(projectId, { version });
      return api.projects.return(projectId, { version, reason: t.reason });
    },
    onSuccess: ({ project }) => refreshAfter(qc, projectId, project),
    onError: (err) => {
      if (err instanceof ApiError && err.status === 409 && err.current) refreshAfter(qc, projectId, err.current as ProjectDto);
    },
  });
}

export function useAddCommentMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { body: string; pin?: CommentPin; parentId?: number | null }) => api.comments.create(projectId, body),
    onSuccess: () => refreshAfter(qc, projectId),
  });
}

export function useResolveCommentMutation(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ commentId, resolved }: { commentId: number; resolved: boolean }) =>
      api.comments.patch(projectId, commentId, { resolved }),
    onSuccess: () => refreshAfter(qc, projectId),
  });
}
