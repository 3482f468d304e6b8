/** The review part of the job screen: state, the steps this person may take, comments, and the trail. */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppText, Button, Notice } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';
import {
  useAddCommentMutation,
  useEventsQuery,
  useResolveCommentMutation,
  useReviewersQuery,
  useTransitionMutation,
} from '@/hooks/use-review';
import { useSession } from '@/hooks/use-session';
import { describeError } from '@/shared/errors';
import type { PlacementDto, ProjectDto } from '@/shared/schemas';
import { CommentForm, type CommentFormProps } from './comment-form';
import { CommentList } from './comment-list';
import type { CommentThread } from './comment-threads';
import { ReviewActions } from './review-actions';
import { reviewActionsFor } from './review-rules';
import { ReviewSummary } from './review-summary';
import { ReviewTimeline } from './review-timeline';

export interface ReviewPanelProps {
  project: ProjectDto;
  placements: readonly PlacementDto[];
  threads: readonly CommentThread[];
  commentsError: unknown;
  wide: boolean;
  comment: Omit<CommentFormProps, 'onSubmit'> & { onPosted: () => void };
}

export function ReviewPanel({ project, placements, threads, commentsError, wide, comment }: ReviewPanelProps) {
  const { user } = useSession();
  const actions = user ? reviewActionsFor(user, project) : [];
  const transition = useTransitionMutation(project.id);
  const addComment = useAddCommentMutation(project.id);
  const resolve = useResolveCommentMutation(project.id);
  const reviewers = useReviewersQuery(actions.includes('send') || actions.includes('reassign'));
  const [showTrail, setShowTrail] = useState(wide);
  const { onPosted, ...commentForm } = comment;

  return (
    <View style={styles.panel} testID="review-panel" role="region" aria-label="Review">
      <AppText variant="caps" role="heading" aria-level={2}>
        Review
      </AppText>
      <ReviewSummary job={project} />
      <ReviewActions
        actions={actions}
        reviewers={reviewers.data ?? []}
        currentReviewerId={project.reviewerId}
        busy={transition.isPending}
        error={transition.error}
        showKeys={wide}
        onSend={(reviewerId) => transition.mutateAsync({ action: 'send', reviewerId })}
        onApprove={() => transition.mutateAsync({ action: 'approve' })}
        onReturn={(reason) => transition.mutateAsync({ action: 'return', reason })}
      />

      <AppText variant="caps" role="heading" aria-level={3}>
        {`Comments${threads.length ? ` (${threads.filter((t) => !t.root.resolved).length} open)` : ''}`}
      </AppText>
      {commentsError ? <Notice tone="stop">{describeError(commentsError)}</Notice> : null}
      <CommentList
        threads={threads}
        placements={placements}
        canResolve={actions.includes('resolve')}
        canReply
        onReply={(parentId, body) => addComment.mutateAsync({ body, parentId })}
        onResolve={(commentId, resolved) => resolve.mutateAsync({ commentId, resolved })}
      />
      <CommentForm
        {...commentForm}
        onSubmit={async (body, pin) => {
          await addComment.mutateAsync({ body, pin });
          onPosted();
        }}
      />

      <View style={styles.trailHead}>
        <AppText variant="caps" role="heading" aria-level={3}>
          What happened
        </AppText>
        <Button
          label={showTrail ? 'Hide' : 'Show'}
          variant="quiet"
          testID="timeline-toggle"
          accessibilityLabel={showTrail ? 'Hide what happened to this job' : 'Show what happened to this job'}
          onPress={() => setShowTrail((s) => !s)}
        />
      </View>
      {showTrail ? <Trail projectId={project.id} /> : null}
    </View>
  );
}

function Trail({ projectId }: { projectId: number }) {
  const events = useEventsQuery(projectId);
  if (events.error) return <Notice tone="stop">{describeError(events.error)}</Notice>;
  if (!events.data) return <AppText tone="muted">Loading what happened…</AppText>;
  return <ReviewTimeline events={events.data} />;
}

const styles = StyleSheet.create({
  panel: {
    gap: spacing.md,
    padding: spacing.md,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.rule,
    backgroundColor: palette.card,
  },
  trailHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
});
