/** Demo mode keeps the mail the server "sent"; the admin reads it here (invitation links included). */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from './api';
import type { UserDto } from '@/shared/schemas';
import { sessionKeys } from './use-session';

export const OUTBOX_STALE_MS = 5_000;
/** Mail arrives a moment after an invite is sent; poll gently while the screen is open. */
export const OUTBOX_REFETCH_MS = 10_000;

export const outboxKeys = {
  all: ['outbox'] as const,
  list: () => [...outboxKeys.all, 'list'] as const,
};

export function useOutboxQuery() {
  // Only an admin is answered: anyone else asks nothing (see useUsersQuery).
  const user = useQueryClient().getQueryData<UserDto | null>(sessionKeys.me());
  return useQuery({
    queryKey: outboxKeys.list(),
    queryFn: () => api.outbox.list(),
    staleTime: OUTBOX_STALE_MS,
    refetchInterval: OUTBOX_REFETCH_MS,
    enabled: user?.role === 'admin',
  });
}

/** Fetches one attachment of an outbox message (a sheet PDF) and hands it to `save`, which opens it for the person. */
export function useOpenAttachmentMutation(save: (file: { blob: Blob; filename: string }) => void) {
  return useMutation({
    mutationFn: ({ messageId, index }: { messageId: number; index: number }) => api.outbox.attachment(messageId, index),
    onSuccess: (file) => save(file),
  });
}
