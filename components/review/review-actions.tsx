import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ChoiceChips } from '@/components/placement/choice-chips';
import { AppText, Button, Notice } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { describeError } from '@/shared/errors';
import type { ReviewerDto } from '@/shared/schemas';
import { ReturnForm } from './return-form';
import type { ReviewAction } from './review-rules';

/** The words for the keys, shown under the buttons on a wide screen and read by screen readers. */
export const REVIEW_KEYS_TEXT =
  'Keys: Tab reaches Approve and Return; Enter or Space presses. In the reason, Ctrl+Enter (⌘+Enter) returns the job and Esc closes the form.';

export interface ReviewActionsProps {
  actions: readonly ReviewAction[];
  reviewers: readonly ReviewerDto[];
  /** The reviewer it is sent to now (admin's reassign starts from it). */
  currentReviewerId: number | null;
  busy: boolean;
  error: unknown;
  showKeys: boolean;
  onSend: (reviewerId: number | null) => Promise<unknown>;
  onApprove: () => Promise<unknown>;
  onReturn: (reason: string) => Promise<unknown>;
}

const ANYONE = 'anyone';

/** Send (with an optional reviewer), approve and return: only the steps this person may take now. */
export function ReviewActions(p: ReviewActionsProps) {
  const [returning, setReturning] = useState(false);
  const [pick, setPick] = useState<string>(p.currentReviewerId ? String(p.currentReviewerId) : ANYONE);
  const has = (a: ReviewAction) => p.actions.includes(a);
  const chosenId = pick === ANYONE ? null : Number(pick);
  const choices = [
    { value: ANYONE, label: 'Any reviewer', testID: 'send-reviewer-any' },
    ...p.reviewers.map((r) => ({ value: String(r.id), label: r.name, testID: `send-reviewer-${r.id}` })),
  ];
  if (!has('send') && !has('approve') && !has('return') && !has('reassign')) return null;
  return (
    <View style={styles.column} testID="review-actions">
      {has('send') || has('reassign') ? (
        <View style={styles.column}>
          <AppText variant="label">{has('send') ? 'Send it to' : 'Waiting with'}</AppText>
          <ChoiceChips label="Reviewer" options={choices} value={pick} onChange={setPick} />
          <Button
            label={has('send') ? 'Send for review' : 'Reassign'}
            testID={has('send') ? 'review-send' : 'review-reassign'}
            busy={p.busy}
            onPress={() => void p.onSend(chosenId).catch(() => undefined)}
          />
        </View>
      ) : null}
      {has('approve') || has('return') ? (
        <View style={styles.row}>
          {has('approve') ? (
            <Button
              label="Approve"
              testID="review-approve"
              accessibilityLabel="Approve this job as it stands"
              busy={p.busy}
              onPress={() => void p.onApprove().catch(() => undefined)}
            />
          ) : null}
          {has('return') && !returning ? (
            <Button label="Return…" variant="secondary" testID="review-return" onPress={() => setReturning(true)} />
          ) : null}
        </View>
      ) : null}
      {returning ? (
        <View style={styles.column}>
          <ReturnForm
            onSubmit={async (reason) => {
              await p.onReturn(reason);
              setReturning(false);
            }}
            onCancel={() => setReturning(false)}
          />
          <Button label="Cancel" variant="quiet" testID="return-cancel" onPress={() => setReturning(false)} />
        </View>
      ) : null}
      {p.error ? (
        <Notice tone="stop" testID="review-error">
          {describeError(p.error)}
        </Notice>
      ) : null}
      {p.showKeys && (has('approve') || has('return')) ? (
        <AppText variant="small" tone="muted" testID="review-keys">
          {REVIEW_KEYS_TEXT}
        </AppText>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
