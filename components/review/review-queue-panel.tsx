/** The reviews screen's content: counts per state, then the jobs waiting (table when wide, list on a phone). */
import { useEffect, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ReviewsEmpty } from '@/components/reviews/reviews-empty';
import { AppText, Button, CenteredMessage, Notice } from '@/components/ui';
import { spacing } from '@/constants/theme';
import { useIsWide } from '@/hooks/use-breakpoint';
import { useProjectsQuery } from '@/hooks/use-projects';
import { describeError } from '@/shared/errors';
import { countByState } from './review-queue-order';
import { ReviewQueueList, ReviewQueueTable, StateCounts } from './review-queue';

/** Waiting times are shown to the minute; this re-reads the clock once a minute. */
function useMinuteClock(): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 60_000);
    return () => clearInterval(t);
  }, []);
  return now;
}

export function ReviewQueuePanel() {
  const wide = useIsWide();
  const projects = useProjectsQuery();
  const nowMs = useMinuteClock();
  if (projects.error) {
    return (
      <Notice tone="stop" testID="queue-error">
        <AppText variant="bodyStrong" tone="stop">
          {describeError(projects.error)}
        </AppText>
        <Button label="Try again" testID="queue-retry" onPress={() => void projects.refetch()} />
      </Notice>
    );
  }
  if (!projects.data) return <CenteredMessage loading title="Loading the queue…" testID="queue-loading" />;
  const jobs = projects.data;
  const waiting = jobs.filter((j) => j.state === 'with_reviewer');
  return (
    <View style={styles.column}>
      <StateCounts counts={countByState(jobs)} />
      {waiting.length === 0 ? (
        <ReviewsEmpty />
      ) : wide ? (
        <>
          <AppText variant="small" tone="muted" testID="queue-keys">
            Keys: Tab into the table, ↑ and ↓ move between jobs (Home and End jump), Enter opens one.
          </AppText>
          <ReviewQueueTable jobs={waiting} nowMs={nowMs} />
        </>
      ) : (
        <ReviewQueueList jobs={waiting} nowMs={nowMs} />
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  column: { gap: spacing.lg },
});
