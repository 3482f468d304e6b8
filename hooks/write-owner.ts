/**
 * Every write that may wait for a connection records who made it: its `onMutate` answers
 * `{ ownerId }`, which TanStack Query keeps as the mutation's context and persists with it, so the
 * owner survives a reload. hooks/device-accounts.ts sends a waiting write only for its owner.
 */
import type { QueryClient } from '@tanstack/react-query';
import type { UserDto } from '@/shared/schemas';
import { sessionKeys } from './session-query';

export interface WriteOwner {
  ownerId: number;
}

/** The id of the person signed in as this client last heard, or null. */
export function signedInId(qc: QueryClient): number | null {
  return qc.getQueryData<UserDto | null>(sessionKeys.me())?.id ?? null;
}

/** What a waiting write's `onMutate` returns: the person it belongs to (none when nobody is signed in). */
export function ownerTag(qc: QueryClient): WriteOwner | undefined {
  const id = signedInId(qc);
  return id === null ? undefined : { ownerId: id };
}

/** The person a write belongs to, if it was made by this build or a later one. */
export function ownerOf(m: { state: { context?: unknown } }): number | undefined {
  const context = m.state.context as Partial<WriteOwner> | undefined;
  return typeof context?.ownerId === 'number' ? context.ownerId : undefined;
}
