import { QueryClient } from '@tanstack/react-query';
import { ApiError } from '@/shared/api-client';

/** How many times a failed read is retried when the network, not the server, said no. */
const NETWORK_RETRIES = 2;

/**
 * A 4xx will not change by asking again (401 means signed out, 403 means not allowed), so only
 * network failures (status 0) and 5xx are retried.
 */
export function shouldRetry(failureCount: number, error: unknown): boolean {
  if (error instanceof ApiError && error.status > 0 && error.status < 500) return false;
  return failureCount < NETWORK_RETRIES;
}

/**
 * A week without opening the app and the data kept on the device is dropped (a job may have moved
 * on a lot). Answers stay in memory as long, or the device cache (hooks/offline.ts), which is
 * written from memory, would lose a job a few minutes after it was last on screen.
 */
export const DEVICE_CACHE_MAX_AGE_MS = 7 * 24 * 60 * 60 * 1000;

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, refetchOnWindowFocus: true, gcTime: DEVICE_CACHE_MAX_AGE_MS },
      mutations: { retry: false },
    },
  });
}
