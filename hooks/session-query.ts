/**
 * The signed-in person's query: its keys and how it asks the server. Apart from use-session.ts so
 * the offline writes (which record who made them, hooks/write-owner.ts) and the device's accounts
 * (hooks/device-accounts.ts) can read it without importing the session hooks.
 */
import { ApiError } from '@/shared/api-client';
import type { UserDto } from '@/shared/schemas';
import { api } from './api';

export const sessionKeys = {
  all: ['session'] as const,
  me: () => [...sessionKeys.all, 'me'] as const,
  invitation: (token: string) => [...sessionKeys.all, 'invitation', token] as const,
};

/** Who the server says is signed in with this browser's cookie; null for nobody (not an error). */
export async function fetchMe(): Promise<UserDto | null> {
  try {
    const { user } = await api.auth.session();
    return user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}
