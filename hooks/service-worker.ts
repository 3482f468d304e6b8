/**
 * The web app's service worker (dist/sw.js, generated at build time by scripts/offline-build.ts):
 * registered in production web builds only, a few seconds after the page has loaded so its
 * precache never competes with the first screen for a slow connection. Development builds
 * unregister any worker a production build left on the same origin (it would serve the old app).
 */
import { useSyncExternalStore } from 'react';
import { Platform } from 'react-native';

/** How long after the load event the worker is registered (it then downloads the whole app once). */
export const REGISTER_AFTER_LOAD_MS = 10_000;

export type UpdateListener = () => void;

/** Registers /sw.js; `onUpdated` runs when a newer worker takes over this page (a new build was served). */
export function registerServiceWorker(onUpdated: UpdateListener): () => void {
  if (Platform.OS !== 'web' || typeof window === 'undefined' || !('serviceWorker' in navigator)) return () => undefined;
  const sw = navigator.serviceWorker;
  if (process.env.NODE_ENV !== 'production') {
    void sw.getRegistrations().then((all) => Promise.all(all.map((r) => r.unregister())));
    return () => undefined;
  }
  // A page that had no worker gets its first one without that being an update.
  const hadController = Boolean(sw.controller);
  const changed = () => {
    if (hadController) onUpdated();
  };
  sw.addEventListener('controllerchange', changed);
  let timer: ReturnType<typeof setTimeout> | undefined;
  const register = () => {
    timer = setTimeout(() => {
      sw.register('/sw.js', { scope: '/' }).catch(() => {
        // No worker (blocked, insecure origin): the app still works online.
      });
    }, REGISTER_AFTER_LOAD_MS);
  };
  if (document.readyState === 'complete') register();
  else window.addEventListener('load', register, { once: true });
  return () => {
    if (timer !== undefined) clearTimeout(timer);
    window.removeEventListener('load', register);
    sw.removeEventListener('controllerchange', changed);
  };
}

/** Whether a newer build has taken over this page since it opened (the app shell then offers a reload). */
let updated = false;
const listeners = new Set<() => void>();

export function markAppUpdated(): void {
  updated = true;
  for (const l of listeners) l();
}

export function useAppUpdated(): boolean {
  return useSyncExternalStore(
    (l) => {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    () => updated,
    () => false,
  );
}
