import '@testing-library/jest-dom';
import { fireEvent, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import * as fc from 'fast-check';
import { router } from 'expo-router';
import { ReviewQueueTable, StateCounts } from '@/components/review/review-queue';
import { ReviewQueuePanel } from '@/components/review/review-queue-panel';
import { renderWithQuery } from './render';
import { countByState, DEFAULT_QUEUE_SORT, nextSort, sortQueue, waitedMs, type QueueJob } from '@/components/review/review-queue-order';
import { projectStates } from '@/shared/schemas';

import { api } from '@/hooks/api';
import { useIsWide } from '@/hooks/use-breakpoint';

jest.mock('expo-router', () => ({ router: { push: jest.fn() } }));
jest.mock('@/hooks/api', () => ({ api: { projects: { list: jest.fn() } } }));
jest.mock('@/hooks/use-breakpoint', () => ({ useIsWide: jest.fn() }));

const NOW = Date.parse('2026-12-02T12:00:00.000Z');
const hoursAgo = (h: number) => new Date(NOW - h * 3_600_000).toISOString();

/** Invented demo jobs: names, sites and people are made up. */
function job(id: number, over: Partial<QueueJob>): QueueJob {
  return {
    id,
    name: `Demo job ${id}`,
    customer: '',
    site: '',
    ownerName: 'Nobody',
    updatedAt: hoursAgo(0),
    state: 'with_reviewer',
    sentAt: hoursAgo(1),
    reviewerId: null,
    reviewerName: null,
    openCommentCount: 0,
    ...over,
  };
}

const JOBS: QueueJob[] = [
  job(1, { site: 'Bay 4 corner', ownerName: 'Tomasz Demo', sentAt: hoursAgo(2) }),
  job(2, { site: 'Aisle 12', ownerName: 'Ama Demo', sentAt: hoursAgo(30) }),
  job(3, { site: 'Dock door 7', ownerName: 'Keiko Demo', sentAt: hoursAgo(5) }),
];

const rowIds = () =>
  within(screen.getByTestId('queue-table'))
    .getAllByRole('row')
    .slice(1)
    .map((r) => r.getAttribute('data-testid'));

beforeEach(() => jest.clearAllMocks());

describe('the reviewer’s queue', () => {
  it('lists the longest-waiting job first by default', () => {
    render(<ReviewQueueTable jobs={JOBS} nowMs={NOW} />);
    expect(rowIds()).toEqual(['queue-row-2', 'queue-row-3', 'queue-row-1']);
    expect(screen.getByTestId('queue-waiting-2')).toHaveTextContent('1 day 6 h');
  });

  it('sorts by site A to Z, then Z to A on a second click, and says so in aria-sort', async () => {
    const user = userEvent.setup();
    render(<ReviewQueueTable jobs={JOBS} nowMs={NOW} />);
    await user.click(screen.getByTestId('queue-sort-site'));
    expect(rowIds()).toEqual(['queue-row-2', 'queue-row-1', 'queue-row-3']);
    expect(screen.getByTestId('queue-sort-site').closest('[role="columnheader"]')).toHaveAttribute('aria-sort', 'ascending');
    await user.click(screen.getByTestId('queue-sort-site'));
    expect(rowIds()).toEqual(['queue-row-3', 'queue-row-1', 'queue-row-2']);
  });

  it('sorts by installer name', async () => {
    const user = userEvent.setup();
    render(<ReviewQueueTable jobs={JOBS} nowMs={NOW} />);
    await user.click(screen.getByTestId('queue-sort-installer'));
    expect(rowIds()).toEqual(['queue-row-2', 'queue-row-3', 'queue-row-1']);
  });

  it('moves the focus with the arrow keys and opens the focused job with Enter', async () => {
    const user = userEvent.setup();
    render(<ReviewQueueTable jobs={JOBS} nowMs={NOW} />);
    await user.tab(); // the first sort button
    await user.tab();
    await user.tab();
    await user.tab(); // the first row: the only row in the tab order
    expect(screen.getByTestId('queue-row-2')).toHaveFocus();
    fireEvent.keyDown(screen.getByTestId('queue-row-2'), { key: 'ArrowDown' });
    expect(screen.getByTestId('queue-row-3')).toHaveFocus();
    fireEvent.keyDown(screen.getByTestId('queue-row-3'), { key: 'End' });
    expect(screen.getByTestId('queue-row-1')).toHaveFocus();
    fireEvent.keyDown(screen.getByTestId('queue-row-1'), { key: 'ArrowDown' });
    expect(screen.getByTestId('queue-row-1')).toHaveFocus();
    await user.keyboard('{Enter}');
    expect(router.push).toHaveBeenCalledWith('/projects/1');
  });

  it('counts the jobs in every state, including states with none', () => {
    const counts = countByState([job(1, { state: 'approved' }), job(2, { state: 'approved' }), job(3, { state: 'returned' })]);
    render(<StateCounts counts={counts} />);
    expect(screen.getByTestId('queue-count-approved')).toHaveTextContent('2');
    expect(screen.getByTestId('queue-count-returned')).toHaveTextContent('1');
    expect(screen.getByTestId('queue-count-with_reviewer')).toHaveTextContent('0');
    expect(screen.getByTestId('queue-count-drawing_up')).toHaveTextContent('0');
  });

  it('keeps every job and orders it by the chosen key, for any jobs and any sort', () => {
    const iso = fc.integer({ min: 0, max: 4_000_000_000_000 }).map((ms) => new Date(ms).toISOString());
    const arbJob = fc.record({
      id: fc.nat(),
      name: fc.string(),
      customer: fc.string(),
      site: fc.string(),
      ownerName: fc.string(),
      updatedAt: iso,
      state: fc.constantFrom(...projectStates),
      sentAt: fc.option(iso, { nil: null }),
      reviewerId: fc.constant(null),
      reviewerName: fc.constant(null),
      openCommentCount: fc.nat(),
    });
    const arbSort = fc.record({
      key: fc.constantFrom('waiting' as const, 'site' as const, 'installer' as const),
      direction: fc.constantFrom('ascending' as const, 'descending' as const),
    });
    fc.assert(
      fc.property(fc.array(arbJob, { maxLength: 30 }), arbSort, fc.integer({ min: 0, max: 4_000_000_000_000 }), (jobs, sort, now) => {
        const sorted = sortQueue(jobs, sort, now);
        expect(sorted).toHaveLength(jobs.length);
        expect(new Set(sorted)).toEqual(new Set(jobs));
        if (sort.key === 'waiting') {
          for (let i = 1; i < sorted.length; i++) {
            const d = waitedMs(sorted[i], now) - waitedMs(sorted[i - 1], now);
            expect(sort.direction === 'ascending' ? d >= 0 : d <= 0).toBe(true);
          }
        }
      }),
    );
  });

  it('starts a new column at its natural direction and flips the same column', () => {
    expect(nextSort(DEFAULT_QUEUE_SORT, 'site')).toEqual({ key: 'site', direction: 'ascending' });
    expect(nextSort({ key: 'site', direction: 'ascending' }, 'site')).toEqual({ key: 'site', direction: 'descending' });
    expect(nextSort({ key: 'site', direction: 'ascending' }, 'waiting')).toEqual({ key: 'waiting', direction: 'descending' });
  });
});

describe('the reviews screen', () => {
  const summary = (id: number, state: QueueJob['state']) => ({
    ...job(id, { state }),
    kind: 'site' as const,
    ownerId: 1,
    placementCount: 1,
    version: 1,
    createdAt: hoursAgo(40),
    approval: null,
  });

  beforeEach(() => {
    jest.mocked(api.projects.list).mockResolvedValue({
      projects: [summary(1, 'with_reviewer'), summary(2, 'approved'), summary(3, 'drawing_up'), summary(4, 'with_reviewer')],
    });
  });

  it('lists only the jobs waiting for review and counts every state, as a table when wide', async () => {
    jest.mocked(useIsWide).mockReturnValue(true);
    renderWithQuery(<ReviewQueuePanel />);
    await screen.findByTestId('queue-table');
    expect(rowIds().sort()).toEqual(['queue-row-1', 'queue-row-4']);
    expect(screen.getByTestId('queue-count-approved')).toHaveTextContent('1');
    expect(screen.getByTestId('queue-count-with_reviewer')).toHaveTextContent('2');
  });

  it('shows the same jobs as a list on a phone', async () => {
    jest.mocked(useIsWide).mockReturnValue(false);
    renderWithQuery(<ReviewQueuePanel />);
    const list = await screen.findByTestId('queue-list');
    expect(within(list).getAllByRole('link')).toHaveLength(2);
    expect(screen.queryByTestId('queue-table')).not.toBeInTheDocument();
  });
});
