/**
 * What the app keeps on the device so it works with no signal (the web build; a service worker
 * keeps the app itself, see scripts/service-worker.ts).
 *
 * - Data: TanStack Query's cache is persisted (`@tanstack/react-query-persist-client` with the
 *   async storage persister over `localStorage`) for the signed-in person, the catalogue, the jobs
 *   (list and each opened job with its mirrors) and any refused change waiting for a choice.
 * - Changes: a write made offline is a paused mutation; paused mutations are persisted with the
 *   cache, and every write has mutation defaults here, so one waiting when the page is reloaded
 *   still runs (its variables carry everything it needs) when the connection returns.
 * - The connection: TanStack Query's `onlineManager`, started from `navigator.onLine` (it
 *   otherwise assumes online until the first event, and a page opened offline would try to fetch).
 */
import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import { defaultShouldDehydrateQuery, onlineManager, type Query, type QueryClient } from '@tanstack/react-query';
import type { Persister } from '@tanstack/react-query-persist-client';
import { Platform } from 'react-native';
import { guardWaitingWrites, isOfflineWrite } from './device-accounts';
import { deviceStorage, type SyncStorage } from './device-storage';
import { DEVICE_CACHE_MAX_AGE_MS } from './query-client';
import { quickSaveKey, quickSaveOptions } from './quick-save-write';
import { projectMutationKeys, projectWriteOptions } from './use-projects';

/** localStorage key of the kept cache. */
export const DEVICE_CACHE_KEY = 'sightfan-device-cache';
/** Raise when the shape of a kept answer changes: a kept cache of another version is dropped. */
export const DEVICE_CACHE_VERSION = 'sightfan-1';

/** The query roots kept on the device ('session' only for the person, not invitations). */
const KEPT_ROOTS: ReadonlySet<unknown> = new Set(['session', 'catalogue', 'projects', 'offline']);

export function keptOnDevice(query: Query): boolean {
  const [root, part] = query.queryKey;
  if (!KEPT_ROOTS.has(root)) return false;
  // "Nobody signed in" is never kept: written just before a sign-in's answer, it would send the
  // next load to the sign-in screen (and lose the address it was opened at) though the server
  // knows the person. Without a kept answer the app asks the server, as it always did.
  if (root === 'session' && (part !== 'me' || query.state.data === null)) return false;
  return defaultShouldDehydrateQuery(query);
}

export { isOfflineWrite, OFFLINE_WRITE_KEYS } from './device-accounts';

/**
 * Gives every write its function and cache updates by key, so a persisted one can run after a
 * reload, and lets waiting writes go only for the person who made them (hooks/device-accounts.ts).
 */
export function registerOfflineWrites(qc: QueryClient): void {
  guardWaitingWrites(qc);
  const writes = projectWriteOptions(qc);
  qc.setMutationDefaults(projectMutationKeys.updateProject, writes.updateProject);
  qc.setMutationDefaults(projectMutationKeys.addPlacement, writes.addPlacement);
  qc.setMutationDefaults(projectMutationKeys.updatePlacement, writes.updatePlacement);
  qc.setMutationDefaults(projectMutationKeys.removePlacement, writes.removePlacement);
  qc.setMutationDefaults(quickSaveKey, quickSaveOptions(qc));
}

let devicePersister: Persister | null | undefined;

/** The persister over this device's storage, or null where there is none (native, storage blocked). */
export function getDevicePersister(storage: SyncStorage | null = deviceStorage()): Persister | null {
  if (devicePersister !== undefined) return devicePersister;
  devicePersister = storage ? createAsyncStoragePersister({ storage, key: DEVICE_CACHE_KEY, throttleTime: 500 }) : null;
  return devicePersister;
}

/**
 * Drops the signed-in person's waiting writes and the kept cache: on sign-out when the person
 * chose to discard them. (Keeping them sets them aside instead: `switchAccount`.) Writes set aside
 * for other accounts stay.
 */
export async function forgetDeviceData(qc: QueryClient): Promise<void> {
  dropWaitingWrites(qc);
  await getDevicePersister()?.removeClient();
}

/** Drops the signed-in person's waiting writes (the cache holds no one else's). */
export function dropWaitingWrites(qc: QueryClient): void {
  const mutations = qc.getMutationCache();
  for (const m of mutations.getAll()) if (isOfflineWrite(m) && m.state.status === 'pending') mutations.remove(m);
}

let tracking = false;

/** Starts TanStack Query's connection state from the browser's and follows its online/offline events. */
export function trackConnection(): void {
  if (tracking || Platform.OS !== 'web' || typeof window === 'undefined') return;
  tracking = true;
  onlineManager.setEventListener((setOnline) => {
    const on = () => setOnline(true);
    const off = () => setOnline(false);
    window.addEventListener('online', on);
    window.addEventListener('offline', off);
    setOnline(navigator.onLine !== false);
    return () => {
      window.removeEventListener('online', on);
      window.removeEventListener('offline', off);
    };
  });
}

/** The options `PersistQueryClientProvider` is given: what is kept, for how long, under which version. */
export function deviceCacheOptions(persister: Persister) {
  return {
    persister,
    maxAge: DEVICE_CACHE_MAX_AGE_MS,
    buster: DEVICE_CACHE_VERSION,
    dehydrateOptions: { shouldDehydrateQuery: keptOnDevice },
  };
}

/**
 * Once the kept cache is back: send the changes that waited in it (now, or when the connection
 * returns), then mark every kept answer stale so each screen asks the server again while showing
 * what was kept. Kept answers carry the time they were fetched; without this a list kept seconds
 * ago counts as fresh and a job sent for review elsewhere would not show in the queue. Writes go
 * first: a job fetched before a waiting write runs would give it a newer version and hide a conflict.
 */
export async function afterRestore(client: QueryClient): Promise<void> {
  await client.resumePausedMutations();
  await client.invalidateQueries();
}
