/**
 * The signed-in person. `/api/auth/session` answers `{ user: null }` when signed out, a normal state
 * and not an error (no failed request in the console): the root layout's guard shows the sign-in screen.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { AcceptInvitationBody, ChangePasswordBody, ForgotPasswordBody, SignInBody, UpdateMeBody, UserDto } from '@/shared/schemas';
import { api } from './api';
import { bringBackOwnWrites, setAsideOwnWrites, switchAccount } from './device-accounts';
import { dropWaitingWrites, getDevicePersister } from './offline';
import { fetchMe, sessionKeys } from './session-query';

export { sessionKeys } from './session-query';

/** The session changes only when this person acts, so a minute is plenty; focus refetch catches expiry. */
export const SESSION_STALE_MS = 60_000;
/** An invitation does not change while someone reads it. */
export const INVITATION_STALE_MS = 5 * 60_000;

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

/**
 * Writes the signed-in user and drops everything cached for whoever was signed in before; their
 * waiting writes are set aside on the device for them, and this person's own come back and are
 * sent (hooks/device-accounts.ts).
 */
function becomeSignedIn(queryClient: QueryClient, user: UserDto | null) {
  switchAccount(queryClient, user);
  if (user) void queryClient.resumePausedMutations();
}

export function useSignInMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => api.auth.signIn(body),
    onSuccess: ({ user }) => becomeSignedIn(queryClient, user),
  });
}

/** What happens to the person's own changes still waiting for a connection when they sign out. */
export type WaitingOnSignOut = 'keep' | 'discard';

/**
 * Signing out: `keep` sets the person's waiting changes aside on the device until they sign in
 * again; `discard` drops them. Either way nothing of theirs stays in the kept cache for the next
 * person. The sign-out button asks which before this runs when changes wait.
 */
export function useSignOutMutation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (_waiting: WaitingOnSignOut) => api.auth.signOut(),
    // At once, even offline (the sign-out itself then waits for a connection, and the changes
    // must not be sent before it): kept changes are set aside for this person, others dropped.
    onMutate: (waiting) => (waiting === 'keep' ? setAsideOwnWrites(queryClient) : dropWaitingWrites(queryClient)),
    onError: (_err, waiting) => {
      if (waiting === 'keep') bringBackOwnWrites(queryClient);
    },
    onSuccess: async () => {
      becomeSignedIn(queryClient, null);
      await getDevicePersister()?.removeClient();
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
