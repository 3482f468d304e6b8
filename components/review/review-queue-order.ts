/** The reviewer's queue: which jobs it holds, how they are counted and how they sort. Pure. */
import { projectStates, type ProjectState, type ProjectSummaryDto, type ReviewFieldsDto } from '@/shared/schemas';

export type QueueJob = Pick<ProjectSummaryDto, 'id' | 'name' | 'customer' | 'site' | 'ownerName' | 'updatedAt'> &
  Pick<ReviewFieldsDto, 'state' | 'sentAt' | 'reviewerId' | 'reviewerName' | 'openCommentCount'>;

export type QueueSortKey = 'waiting' | 'site' | 'installer';
export type SortDirection = 'ascending' | 'descending';
export interface QueueSort {
  key: QueueSortKey;
  direction: SortDirection;
}

/** Longest waiting first: the order a reviewer works in unless they choose another. */
export const DEFAULT_QUEUE_SORT: QueueSort = { key: 'waiting', direction: 'descending' };

export function countByState(jobs: readonly Pick<QueueJob, 'state'>[]): Record<ProjectState, number> {
  const counts = Object.fromEntries(projectStates.map((s) => [s, 0])) as Record<ProjectState, number>;
  for (const job of jobs) counts[job.state] += 1;
  return counts;
}

/** Milliseconds since the job was sent; a job with no sending time has waited 0. */
export function waitedMs(job: Pick<QueueJob, 'sentAt'>, nowMs: number): number {
  const sent = job.sentAt ? Date.parse(job.sentAt) : Number.NaN;
  return Number.isFinite(sent) ? Math.max(0, nowMs - sent) : 0;
}

const siteOf = (job: QueueJob) => (job.site || job.customer || job.name).trim();
const collator = new Intl.Collator(undefined, { sensitivity: 'base', numeric: true });

/**
 * A new array in the chosen order. Ties keep a stable, meaningful order: longest waiting, then
 * name, then id, so the same data always gives the same rows.
 */
export function sortQueue(jobs: readonly QueueJob[], sort: QueueSort, nowMs: number): QueueJob[] {
  const sign = sort.direction === 'ascending' ? 1 : -1;
  const primary = (a: QueueJob, b: QueueJob): number => {
    if (sort.key === 'waiting') return waitedMs(a, nowMs) - waitedMs(b, nowMs);
    if (sort.key === 'site') return collator.compare(siteOf(a), siteOf(b));
    return collator.compare(a.ownerName, b.ownerName);
  };
  return [...jobs].sort(
    (a, b) => sign * primary(a, b) || waitedMs(b, nowMs) - waitedMs(a, nowMs) || collator.compare(a.name, b.name) || a.id - b.id,
  );
}

/** Clicking a column: the same column flips its direction; another column starts at its natural one. */
export function nextSort(current: QueueSort, key: QueueSortKey): QueueSort {
  if (current.key === key) return { key, direction: current.direction === 'ascending' ? 'descending' : 'ascending' };
  return { key, direction: key === 'waiting' ? 'descending' : 'ascending' };
}

/** "3 h 20 min", "2 days 4 h", "under a minute": how long a job has waited, in words. */
export function waitingText(ms: number): string {
  const minutes = Math.floor(ms / 60_000);
  if (minutes < 1) return 'under a minute';
  if (minutes < 60) return `${minutes} min`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return minutes % 60 ? `${hours} h ${minutes % 60} min` : `${hours} h`;
  const days = Math.floor(hours / 24);
  const rest = hours % 24;
  return `${days} ${days === 1 ? 'day' : 'days'}${rest ? ` ${rest} h` : ''}`;
}
