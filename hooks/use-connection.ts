/** Whether the app has a connection, and how many changes wait to reach the server. */
import { onlineManager, useMutationState } from '@tanstack/react-query';
import { useCallback, useSyncExternalStore } from 'react';
import { isOfflineWrite, subscribeSetAside, writesOfOtherAccounts } from './device-accounts';
import { useSession } from './use-session';

const subscribe = (onChange: () => void) => onlineManager.subscribe(onChange);
const isOnline = () => onlineManager.isOnline();

/** TanStack Query's view of the connection (hooks/offline.ts `trackConnection` feeds it on the web). */
export function useIsOnline(): boolean {
  return useSyncExternalStore(subscribe, isOnline, isOnline);
}

/** The signed-in person's writes not yet answered by the server: queued offline (paused) or on their way. */
export function useWaitingWrites(): { waiting: number; paused: number } {
  const states = useMutationState({
    filters: { status: 'pending', predicate: isOfflineWrite },
    select: (m) => m.state.isPaused,
  });
  return { waiting: states.length, paused: states.filter(Boolean).length };
}

/** Changes made on this device by other accounts, set aside until their owner signs in here again. */
export function useWritesOfOtherAccounts(): number {
  const me = useSession().user?.id ?? null;
  const count = useCallback(() => writesOfOtherAccounts(me), [me]);
  return useSyncExternalStore(subscribeSetAside, count, count);
}
