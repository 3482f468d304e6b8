/**
 * The reviewer's queue. Wide: a table sortable by waiting time, site and installer; ↑/↓ (and
 * Home/End) move between rows with a visible ring, Enter opens the job. Phone: a list of cards.
 */
import { router } from 'expo-router';
import { useRef, useState, type ElementRef } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { AppText } from '@/components/ui';
import { openOnEnterOrSpace } from '@/components/ui/link-keys';
import { focusRing, layout, palette, radii, shadow, spacing } from '@/constants/theme';
import { useFocusVisible } from '@/hooks/use-focus-visible';
import { PROJECT_STATE_LABELS, projectStates, type ProjectState } from '@/shared/schemas';
import {
  DEFAULT_QUEUE_SORT,
  nextSort,
  sortQueue,
  waitedMs,
  waitingText,
  type QueueJob,
  type QueueSort,
  type QueueSortKey,
} from './review-queue-order';
import { StateBadge, STATE_TONES } from './state-badge';

const openJob = (id: number) => router.push(`/projects/${id}`);

/** How many jobs are in each state, as a row of counts (read out as a list). */
export function StateCounts({ counts }: { counts: Record<ProjectState, number> }) {
  return (
    <View role="list" aria-label="Jobs by state" style={styles.counts} testID="queue-counts">
      {projectStates.map((s) => (
        <View key={s} role="listitem" style={[styles.count, countTone[STATE_TONES[s]]]} testID={`queue-count-${s}`}>
          <AppText variant="heading">{String(counts[s])}</AppText>
          <AppText variant="small">{PROJECT_STATE_LABELS[s]}</AppText>
        </View>
      ))}
    </View>
  );
}

export interface ReviewQueueProps {
  jobs: readonly QueueJob[];
  nowMs: number;
}

const COLUMNS: { key: QueueSortKey; label: string; style: object }[] = [
  { key: 'waiting', label: 'Waiting', style: { width: 150 } },
  { key: 'site', label: 'Site', style: { flex: 2, minWidth: 200 } },
  { key: 'installer', label: 'Installer', style: { flex: 1, minWidth: 140 } },
];

export function ReviewQueueTable({ jobs, nowMs }: ReviewQueueProps) {
  const [sort, setSort] = useState<QueueSort>(DEFAULT_QUEUE_SORT);
  const rows = sortQueue(jobs, sort, nowMs);
  const rowRefs = useRef<(ElementRef<typeof Pressable> | null)[]>([]);
  const focusRow = (i: number) => (rowRefs.current[Math.max(0, Math.min(rows.length - 1, i))] as unknown as HTMLElement | null)?.focus?.();
  const indexOfFocused = () => rowRefs.current.findIndex((r) => (r as unknown) === globalThis.document?.activeElement);
  return (
    <View role="table" aria-label="Jobs waiting for review" aria-rowcount={rows.length + 1} style={styles.table} testID="queue-table">
      <View role="row" style={[styles.row, styles.headRow]}>
        {COLUMNS.map((c) => (
          <View key={c.key} role="columnheader" aria-sort={sort.key === c.key ? sort.direction : 'none'} style={c.style}>
            <SortButton column={c.key} label={c.label} sort={sort} onPress={() => setSort(nextSort(sort, c.key))} />
          </View>
        ))}
        <View role="columnheader" style={styles.stateCol}>
          <AppText variant="caps" tone="muted">
            Sent to
          </AppText>
        </View>
      </View>
      <View
        role="rowgroup"
        onKeyDown={(e) => {
          const i = indexOfFocused();
          if (i < 0) return;
          const target =
            e.key === 'ArrowDown' ? i + 1 : e.key === 'ArrowUp' ? i - 1 : e.key === 'Home' ? 0 : e.key === 'End' ? rows.length - 1 : null;
          if (target === null) return;
          e.preventDefault();
          focusRow(target);
        }}
      >
        {rows.map((job, i) => (
          <QueueRow
            key={job.id}
            job={job}
            nowMs={nowMs}
            // One row in the tab order (the first); the arrows move within the table.
            tabbable={i === 0}
            rowRef={(r) => {
              rowRefs.current[i] = r;
            }}
          />
        ))}
      </View>
    </View>
  );
}

function SortButton({ column, label, sort, onPress }: { column: QueueSortKey; label: string; sort: QueueSort; onPress: () => void }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const active = sort.key === column;
  const arrow = active ? (sort.direction === 'ascending' ? ' ▲' : ' ▼') : '';
  return (
    <Pressable
      role="button"
      testID={`queue-sort-${column}`}
      aria-label={`Sort by ${label.toLowerCase()}${active ? `, now ${sort.direction}` : ''}`}
      onPress={onPress}
      onFocus={onFocus}
      onBlur={onBlur}
      style={[styles.sortButton, focusVisible && focusRing]}
    >
      <AppText variant="caps" tone={active ? 'ink' : 'muted'}>
        {`${label}${arrow}`}
      </AppText>
    </Pressable>
  );
}

function QueueRow({
  job,
  nowMs,
  tabbable,
  rowRef,
}: {
  job: QueueJob;
  nowMs: number;
  tabbable: boolean;
  rowRef: (r: ElementRef<typeof Pressable> | null) => void;
}) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const site = job.site || job.customer || 'No site given';
  return (
    <Pressable
      ref={rowRef}
      role="row"
      tabIndex={tabbable ? 0 : -1}
      testID={`queue-row-${job.id}`}
      aria-label={`${job.name}, ${site}, by ${job.ownerName}, waiting ${waitingText(waitedMs(job, nowMs))}, sent to ${job.reviewerName ?? 'any reviewer'}`}
      onPress={() => openJob(job.id)}
      onFocus={onFocus}
      onBlur={onBlur}
      style={({ hovered }) => [styles.row, styles.bodyRow, hovered && styles.rowHover, focusVisible && styles.rowFocus]}
    >
      <View role="cell" style={COLUMNS[0].style}>
        <AppText variant="bodyStrong" testID={`queue-waiting-${job.id}`}>
          {waitingText(waitedMs(job, nowMs))}
        </AppText>
      </View>
      <View role="cell" style={COLUMNS[1].style}>
        <AppText variant="bodyStrong" numberOfLines={1}>
          {job.name}
        </AppText>
        <AppText variant="small" tone="muted" numberOfLines={1}>
          {site}
        </AppText>
      </View>
      <View role="cell" style={COLUMNS[2].style}>
        <AppText numberOfLines={1}>{job.ownerName}</AppText>
      </View>
      <View role="cell" style={styles.stateCol}>
        <AppText numberOfLines={1}>{job.reviewerName ?? 'Any reviewer'}</AppText>
        {job.openCommentCount > 0 ? (
          <AppText
            variant="small"
            tone="muted"
          >{`${job.openCommentCount} open ${job.openCommentCount === 1 ? 'comment' : 'comments'}`}</AppText>
        ) : null}
      </View>
    </Pressable>
  );
}

/** Phone: one card per job, longest waiting first. */
export function ReviewQueueList({ jobs, nowMs }: ReviewQueueProps) {
  const rows = sortQueue(jobs, DEFAULT_QUEUE_SORT, nowMs);
  return (
    <View role="list" aria-label="Jobs waiting for review" style={styles.list} testID="queue-list">
      {rows.map((job) => (
        <QueueCard key={job.id} job={job} nowMs={nowMs} />
      ))}
    </View>
  );
}

function QueueCard({ job, nowMs }: { job: QueueJob; nowMs: number }) {
  const { focusVisible, onFocus, onBlur } = useFocusVisible();
  const site = job.site || job.customer || 'No site given';
  return (
    <View role="listitem" onKeyDownCapture={openOnEnterOrSpace(() => openJob(job.id))}>
      <Pressable
        role="link"
        testID={`queue-row-${job.id}`}
        onPress={() => openJob(job.id)}
        onFocus={onFocus}
        onBlur={onBlur}
        style={({ pressed }) => [styles.card, pressed && styles.rowHover, focusVisible && focusRing]}
      >
        <View style={styles.cardTop}>
          <AppText variant="bodyStrong" style={styles.shrink} numberOfLines={2}>
            {job.name}
          </AppText>
          <StateBadge state={job.state} />
        </View>
        <AppText tone="muted" numberOfLines={2}>
          {site}
        </AppText>
        <AppText variant="small">{`${job.ownerName} · waiting ${waitingText(waitedMs(job, nowMs))}`}</AppText>
      </Pressable>
    </View>
  );
}

const countTone = StyleSheet.create({
  neutral: { backgroundColor: palette.card, borderColor: palette.rule },
  beacon: { backgroundColor: palette.beaconSoft, borderColor: palette.beaconPressed },
  go: { backgroundColor: palette.goSoft, borderColor: palette.go },
  stop: { backgroundColor: palette.stopSoft, borderColor: palette.stop },
  glass: { backgroundColor: palette.glassSoft, borderColor: palette.glass },
});

const styles = StyleSheet.create({
  counts: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  count: { minWidth: 140, flexGrow: 1, flexBasis: 140, padding: spacing.md, borderRadius: radii.md, borderWidth: 1 },
  table: {
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
    overflow: 'hidden',
    ...shadow,
  },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.lg, paddingHorizontal: spacing.lg },
  headRow: { paddingVertical: spacing.xs, backgroundColor: palette.chalk, borderBottomWidth: 2, borderBottomColor: palette.rule },
  bodyRow: { minHeight: layout.minTarget + 12, paddingVertical: spacing.sm, borderBottomWidth: 1, borderBottomColor: palette.ruleSoft },
  rowHover: { backgroundColor: palette.glassSoft },
  // Inside a table the outline would be clipped by the rounded frame; an inset ring stays visible.
  rowFocus: { backgroundColor: palette.glassSoft, boxShadow: `inset 0 0 0 3px ${palette.glass}` } as object,
  stateCol: { width: 220, gap: spacing.xxs },
  sortButton: {
    minHeight: layout.minTarget - 8,
    justifyContent: 'center',
    alignSelf: 'flex-start',
    paddingHorizontal: spacing.xs,
    borderRadius: radii.sm,
  },
  list: { gap: spacing.md },
  card: {
    gap: spacing.xs,
    padding: spacing.lg,
    backgroundColor: palette.card,
    borderRadius: radii.lg,
    borderWidth: 1,
    borderColor: palette.ruleSoft,
  },
  cardTop: { flexDirection: 'row', gap: spacing.sm, alignItems: 'center', flexWrap: 'wrap' },
  shrink: { flexShrink: 1 },
});
