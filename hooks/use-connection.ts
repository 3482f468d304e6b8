/** Whether the app has a connection, and how many changes wait to reach the server. */
import { onlineManager, useMutationState } from '@tanstack/react-query';
import { useSyncExternalStore } from 'react';
import { isOfflineWrite } from './offline';

const subscribe = (onChange: () => void) => onlineManager.subscribe(onChange);
const isOnline = () => onlineManager.isOnline();

/** TanStack Query's view of the connection (hooks/offline.ts `trackConnection` feeds it on the web). */
export function useIsOnline(): boolean {
  return useSyncExternalStore(subscribe, isOnline, isOnline);
}

/** Writes not yet answered by the server: queued offline (paused) or on their way. */
export function useWaitingWrites(): { waiting: number; paused: number } {
  const states = useMutationState({
    filters: { status: 'pending', predicate: isOfflineWrite },
    select: (m) => m.state.isPaused,
  });
  return { waiting: states.length, paused: states.filter(Boolean).length };
}
