import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { FormFrame } from '@/components/forms/form-frame';
import { FormikTextField } from '@/components/forms/formik-text-field';
import { submitWithServerErrors, type FormStatus } from '@/components/forms/server-errors';
import { AppText, Badge, Button, Notice } from '@/components/ui';
import { palette, radii, spacing } from '@/constants/theme';
import { shortRoleLabels } from '@/constants/navigation';
import type { CommentDto, PlacementDto, Role } from '@/shared/schemas';
import { commentSchema, type CommentValues } from './comment-form';
import { pinText, type CommentThread } from './comment-threads';
import { eventTime } from './review-timeline';

export interface CommentListProps {
  threads: readonly CommentThread[];
  placements: readonly Pick<PlacementDto, 'id' | 'label'>[];
  /** Only the job's installer marks a thread resolved. */
  canResolve: boolean;
  canReply: boolean;
  onReply: (parentId: number, body: string) => Promise<unknown>;
  onResolve: (commentId: number, resolved: boolean) => Promise<unknown>;
}

/** Every thread with its replies; text is shown as text, never interpreted. Open threads first. */
export function CommentList({ threads, placements, canResolve, canReply, onReply, onResolve }: CommentListProps) {
  if (threads.length === 0) {
    return (
      <AppText tone="muted" testID="comments-empty">
        No comments yet.
      </AppText>
    );
  }
  const ordered = [...threads].sort((a, b) => Number(a.root.resolved) - Number(b.root.resolved) || a.number - b.number);
  return (
    <View role="list" aria-label="Comments" style={styles.list} testID="comment-list">
      {ordered.map((t) => (
        <Thread key={t.root.id} thread={t} placements={placements} {...{ canResolve, canReply, onReply, onResolve }} />
      ))}
    </View>
  );
}

function Thread({
  thread,
  placements,
  canResolve,
  canReply,
  onReply,
  onResolve,
}: Omit<CommentListProps, 'threads'> & { thread: CommentThread }) {
  const { root, replies, number } = thread;
  const [replying, setReplying] = useState(false);
  const [resolveError, setResolveError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const toggle = async () => {
    setBusy(true);
    setResolveError(null);
    try {
      await onResolve(root.id, !root.resolved);
    } catch (e) {
      setResolveError(e instanceof Error ? e.message : 'The comment could not be changed. Try again.');
    } finally {
      setBusy(false);
    }
  };
  return (
    <View role="listitem" style={[styles.thread, root.resolved && styles.resolved]} testID={`comment-thread-${number}`}>
      <View style={styles.head}>
        <View style={styles.number} aria-hidden>
          <AppText variant="label">{String(number)}</AppText>
        </View>
        <AppText variant="small" tone="muted" style={styles.pinText}>
          {pinText(root.pin, placements)}
        </AppText>
        {root.isReturnReason ? <Badge label="Reason for return" tone="stop" /> : null}
        {root.resolved ? <Badge label="Resolved" tone="go" testID={`comment-resolved-${number}`} /> : null}
      </View>
      <Entry comment={root} />
      {replies.map((r) => (
        <View key={r.id} style={styles.reply}>
          <Entry comment={r} />
        </View>
      ))}
      <View style={styles.actions}>
        {canReply && !replying ? (
          <Button label="Reply" variant="quiet" testID={`comment-reply-${number}`} onPress={() => setReplying(true)} />
        ) : null}
        {canResolve ? (
          <Button
            label={root.resolved ? 'Reopen' : 'Mark resolved'}
            variant="secondary"
            testID={`comment-resolve-${number}`}
            accessibilityLabel={`${root.resolved ? 'Reopen' : 'Mark resolved'}: comment ${number}`}
            busy={busy}
            onPress={() => void toggle()}
          />
        ) : null}
      </View>
      {resolveError ? <Notice tone="stop">{resolveError}</Notice> : null}
      {replying ? <ReplyForm number={number} onCancel={() => setReplying(false)} onSubmit={(body) => onReply(root.id, body)} /> : null}
    </View>
  );
}

/** The role in the words the rest of the app uses ("Reviewer"), whatever the DTO's string. */
export const roleWord = (role: string) => (role in shortRoleLabels ? shortRoleLabels[role as Role] : role);

function Entry({ comment }: { comment: CommentDto }) {
  return (
    <View style={styles.entry}>
      <AppText variant="small" tone="muted">
        {`${comment.authorName} · ${roleWord(comment.authorRole)} · ${eventTime(comment.createdAt)}`}
      </AppText>
      {/* Plain text: React escapes it; nothing is parsed as markup or links. */}
      <AppText selectable testID={`comment-body-${comment.id}`}>
        {comment.body}
      </AppText>
    </View>
  );
}

function ReplyForm({ number, onSubmit, onCancel }: { number: number; onSubmit: (body: string) => Promise<unknown>; onCancel: () => void }) {
  return (
    <Formik<CommentValues>
      initialValues={{ body: '' }}
      validationSchema={commentSchema}
      onSubmit={async (values, helpers) => {
        if (await submitWithServerErrors(helpers, ['body'], values, () => onSubmit(values.body.trim()))) onCancel();
      }}
    >
      {(form) => {
        const status = form.status as FormStatus | undefined;
        return (
          <FormFrame label={`Reply to comment ${number}`} onSubmit={form.handleSubmit} testID={`reply-form-${number}`}>
            <FormikTextField
              form={form}
              name="body"
              label="Your reply"
              testID={`reply-body-${number}`}
              multiline
              numberOfLines={2}
              autoFocus
            />
            {status?.formError ? <Notice tone="stop">{status.formError}</Notice> : null}
            <View style={styles.actions}>
              <Button label="Post reply" testID={`reply-submit-${number}`} busy={form.isSubmitting} onPress={() => form.handleSubmit()} />
              <Button label="Cancel" variant="quiet" testID={`reply-cancel-${number}`} onPress={onCancel} />
            </View>
          </FormFrame>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.md },
  thread: {
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radii.md,
    borderWidth: 1,
    borderColor: palette.rule,
    backgroundColor: palette.card,
  },
  resolved: { backgroundColor: palette.chalk, borderColor: palette.ruleSoft },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.sm },
  number: {
    width: 26,
    height: 26,
    borderRadius: 13,
    alignItems: 'center',
    justifyContent: 'center',
    backgroundColor: palette.beacon,
    borderWidth: 2,
    borderColor: palette.asphalt,
  },
  pinText: { flexShrink: 1 },
  entry: { gap: spacing.xxs },
  reply: { marginLeft: spacing.lg, paddingLeft: spacing.md, borderLeftWidth: 2, borderLeftColor: palette.ruleSoft },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
