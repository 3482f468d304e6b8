import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { spacing } from '@/constants/theme';
import type { ReviewFieldsDto } from '@/shared/schemas';
import { roleWord } from './comment-list';
import { eventTime } from './review-timeline';
import { StateBadge } from './state-badge';

/** One sentence on where the job stands in review, next to its state badge. */
export function reviewSentence(job: ReviewFieldsDto): string {
  switch (job.state) {
    case 'drawing_up':
      return 'The installer is still drawing this job up; it has not been sent for review.';
    case 'with_reviewer':
      return job.reviewerName ? `Sent to ${job.reviewerName} for review.` : 'Sent for review to any reviewer of the organisation.';
    case 'returned':
      return 'Returned to the installer with reasons; it goes back for review once fixed and sent again.';
    case 'approved': {
      const a = job.approval;
      return a
        ? `Approved by ${a.reviewerName} (${roleWord(a.reviewerRole)}) on ${eventTime(a.approvedAt)}: revision ${a.revision}, content hash ${a.contentHash.slice(0, 12)}…`
        : 'Approved.';
    }
  }
}

export function ReviewSummary({ job }: { job: ReviewFieldsDto }) {
  return (
    <View style={styles.column} testID="review-summary">
      <StateBadge state={job.state} testID="review-state" />
      <AppText testID="review-sentence">{reviewSentence(job)}</AppText>
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.xs },
});
