/**
 * The signed-in person. `/api/auth/session` answers `{ user: null }` when signed out, a normal state
 * and not an error (no failed request in the console): the root layout's guard shows the sign-in screen.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { ApiError } from '@/shared/api-client';
import type { AcceptInvitationBody, ChangePasswordBody, ForgotPasswordBody, SignInBody, UpdateMeBody, UserDto } from '@/shared/schemas';
import { api } from './api';
import { forgetDeviceData } from './offline';

/** The session changes only when this person acts, so a minute is plenty; focus refetch catches expiry. */
export const SESSION_STALE_MS = 60_000;
/** An invitation does not change while someone reads it. */
export const INVITATION_STALE_MS = 5 * 60_000;

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
  invitation: (token: string) => [...sessionKeys.all, 'invitation', token] as const,
};

async function fetchMe(): Promise<UserDto | null> {
  try {
    const { user } = await api.auth.session();
    return user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export function useSession() {
  const query = useQuery({ queryKey: sessionKeys.me(), queryFn: fetchMe, staleTime: SESSION_STALE_MS });
  return {
    user: query.data ?? null,
    isPending: query.isPending,
    /** Nothing kept on this device and no connection to ask: the question waits for one. */
    waitingForConnection: query.isPending && query.fetchStatus === 'paused',
    /** Set only when the server could not be asked (offline, 5xx), never for "signed out". */
    error: query.isError ? query.error : null,
    refetch: query.refetch,
  };
}

/** Writes the signed-in user and drops everything cached for whoever was signed in before. */
function becomeSignedIn(queryClient: QueryClient, user: UserDto | null) {
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
  queryClient.setQueryData(sessionKeys.me(), user);
}

export function useSignInMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => api.auth.signIn(body),
    onSuccess: ({ user }) => becomeSignedIn(queryClient, user),
  });
}

export function useSignOutMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.auth.signOut(),
    onSuccess: async () => {
      // Nothing of this person's stays on the device: the kept cache and any change still waiting.
      await forgetDeviceData(queryClient);
      becomeSignedIn(queryClient, null);
    },
  });
}

export function useUpdateMeMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: UpdateMeBody) => api.auth.updateMe(body),
    onSuccess: ({ user }) => queryClient.setQueryData(sessionKeys.me(), user),
  });
}

export function useInvitationQuery(token: string | undefined) {
  return useQuery({
    queryKey: sessionKeys.invitation(token ?? ''),
    queryFn: async () => (await api.invitations.get(token ?? '')).invitation,
    enabled: Boolean(token),
    staleTime: INVITATION_STALE_MS,
  });
}

export function useAcceptInvitationMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => api.invitations.accept(body),
    onSuccess: ({ user }) => becomeSignedIn(queryClient, user),
  });
}

export function useChangePasswordMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ChangePasswordBody) => api.auth.changePassword(body),
    onSuccess: ({ user }) => queryClient.setQueryData(sessionKeys.me(), user),
  });
}

export function useForgotPasswordMutation() {
  return useMutation({ mutationFn: (body: ForgotPasswordBody) => api.auth.forgotPassword(body) });
}
