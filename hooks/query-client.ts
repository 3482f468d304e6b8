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

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: { retry: shouldRetry, refetchOnWindowFocus: true },
      mutations: { retry: false },
    },
  });
}
