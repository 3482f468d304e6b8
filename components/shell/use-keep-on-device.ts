/**
 * Fetches, once a signed-in visit has settled and while online, what a person needs with no
 * signal: the catalogue (quick sizing) and their most recent jobs with their mirrors. The device
 * cache (hooks/offline.ts) keeps them; nothing is fetched that is still fresh.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useEffect } from 'react';
import { api } from '@/hooks/api';
import { CATALOGUE_STALE_MS, catalogueKeys } from '@/hooks/use-catalogue';
import { useIsOnline } from '@/hooks/use-connection';
import { PROJECT_STALE_MS, PROJECTS_STALE_MS, projectKeys } from '@/hooks/use-projects';
import type { UserDto } from '@/shared/schemas';

/** How many of the most recently changed jobs are kept whole (with their mirrors) on the device. */
export const RECENT_JOBS_KEPT = 10;
/** Waits this long after the screen opens, so the first screen's own requests go first. */
export const KEEP_AFTER_MS = 8000;

export function useKeepOnDevice(user: UserDto): void {
  const qc = useQueryClient();
  const online = useIsOnline();
  useEffect(() => {
    if (!online) return;
    let stopped = false;
    const timer = setTimeout(() => {
      void (async () => {
        try {
          await qc.prefetchQuery({
            queryKey: catalogueKeys.list(),
            queryFn: async () => (await api.catalogue.list()).items,
            staleTime: CATALOGUE_STALE_MS,
          });
          const jobs = await qc.fetchQuery({
            queryKey: projectKeys.list({ sort: 'updated' }),
            queryFn: async () => (await api.projects.list({ sort: 'updated' })).projects,
            staleTime: PROJECTS_STALE_MS,
          });
          for (const job of jobs.slice(0, RECENT_JOBS_KEPT)) {
            if (stopped) return;
            await qc.prefetchQuery({
              queryKey: projectKeys.detail(job.id),
              queryFn: async () => (await api.projects.get(job.id)).project,
              staleTime: PROJECT_STALE_MS,
            });
          }
        } catch {
          // Kept data is a convenience: a failure here changes nothing on screen.
        }
      })();
    }, KEEP_AFTER_MS);
    return () => {
      stopped = true;
      clearTimeout(timer);
    };
  }, [qc, online, user.id]);
}
