/** The admin's view of the people in their organisation. */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InviteBody, PatchUserBody, UserDto } from '@/shared/schemas';
import { api } from './api';
import { outboxKeys } from './use-outbox';
import { sessionKeys } from './use-session';

/** Other admins may invite or disable people too; half a minute keeps the table honest without chatter. */
export const USERS_STALE_MS = 30_000;

export const userKeys = {
  all: ['users'] as const,
  list: () => [...userKeys.all, 'list'] as const,
};

export function useUsersQuery(options: { enabled?: boolean } = {}) {
  // Only an admin is answered; anyone else who reaches the screen (a typed URL, before the layout's
  // redirect) asks nothing, so no expected 403 is left in their browser.
  const user = useQueryClient().getQueryData<UserDto | null>(sessionKeys.me());
  return useQuery({
    queryKey: userKeys.list(),
    queryFn: async () => (await api.users.list()).users,
    staleTime: USERS_STALE_MS,
    enabled: (options.enabled ?? true) && user?.role === 'admin',
  });
}

export function useInviteUserMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: InviteBody) => api.users.invite(body),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      // The invitation e-mail lands in the demo outbox.
      void queryClient.invalidateQueries({ queryKey: outboxKeys.all });
    },
  });
}

export function useUpdateUserMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: number; body: PatchUserBody }) => api.users.update(id, body),
    onSuccess: ({ user }) => {
      queryClient.setQueryData<UserDto[]>(userKeys.list(), (old) => old?.map((u) => (u.id === user.id ? user : u)));
      void queryClient.invalidateQueries({ queryKey: userKeys.all });
      // An admin changing their own role changes what they may see.
      const me = queryClient.getQueryData<UserDto | null>(sessionKeys.me());
      if (me && me.id === user.id) queryClient.setQueryData(sessionKeys.me(), user);
    },
  });
}

export function useReinviteUserMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.users.reinvite(id),
    // The new invitation e-mail lands in the outbox.
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: outboxKeys.all }),
  });
}
