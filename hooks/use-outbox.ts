/** Demo mode keeps the mail the server "sent"; the admin reads it here (invitation links included). */
import { useQuery } from '@tanstack/react-query';
import { api } from './api';

export const OUTBOX_STALE_MS = 5_000;
/** Mail arrives a moment after an invite is sent; poll gently while the screen is open. */
export const OUTBOX_REFETCH_MS = 10_000;

export const outboxKeys = {
  all: ['outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
};

export function useOutboxQuery() {
  return useQuery({
    queryKey: outboxKeys.list(),
    queryFn: () => api.outbox.list(),
    staleTime: OUTBOX_STALE_MS,
    refetchInterval: OUTBOX_REFETCH_MS,
  });
}
