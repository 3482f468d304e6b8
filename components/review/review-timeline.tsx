import { StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { palette, spacing } from '@/constants/theme';
import { shortDate } from '@/components/projects/relative-time';
import type { ProjectEventDto } from '@/shared/schemas';

/** "2 Dec 2026, 14:05": the date that cannot be misread, and the time of day. */
export function eventTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return '';
  const hm = new Intl.DateTimeFormat('en-GB', { hour: '2-digit', minute: '2-digit' }).format(d);
  return `${shortDate(iso)}, ${hm}`;
}

/** The job's audit trail, newest first: who did what and when, and before → after for changed fields. Read only. */
export function ReviewTimeline({ events }: { events: readonly ProjectEventDto[] }) {
  if (events.length === 0) {
    return (
      <AppText tone="muted" testID="timeline-empty">
        Nothing has been recorded for this job yet.
      </AppText>
    );
  }
  const newestFirst = [...events].sort((a, b) => b.at.localeCompare(a.at) || b.id - a.id);
  return (
    <View role="list" aria-label="What happened to this job" testID="review-timeline" style={styles.list}>
      {newestFirst.map((e) => (
        <View key={e.id} role="listitem" style={styles.item} testID={`timeline-event-${e.kind}`}>
          <View style={styles.dot} aria-hidden />
          <View style={styles.body}>
            <AppText variant="small" tone="muted">
              {`${eventTime(e.at)} · ${e.actorName}`}
            </AppText>
            <AppText>{e.summary}</AppText>
            {e.changes.map((c, i) => (
              <AppText key={`${c.field}-${i}`} variant="small" tone="muted">
                {`${c.field}: ${c.before || '—'} → ${c.after || '—'}`}
              </AppText>
            ))}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.md, borderLeftWidth: 2, borderLeftColor: palette.ruleSoft, marginLeft: spacing.xs, paddingLeft: spacing.md },
  item: { flexDirection: 'row', gap: spacing.sm },
  dot: { position: 'absolute', left: -spacing.md - 7, top: 6, width: 12, height: 12, borderRadius: 6, backgroundColor: palette.glass },
  body: { flexShrink: 1, gap: spacing.xxs },
});
