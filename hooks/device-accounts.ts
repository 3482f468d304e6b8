/**
 * Waiting writes belong to the person who made them (hooks/write-owner.ts records who), and one
 * device may be used by several people. The rules:
 *
 * - The mutation cache holds only the signed-in person's waiting writes. When someone else signs
 *   in (or nobody is signed in any more), the writes of everyone else leave it for the device's
 *   "set aside" store (localStorage, `SET_ASIDE_KEY`), by owner, with the kept jobs and refused
 *   changes they need, so they are neither sent nor shown as the new person's. That person's own
 *   writes set aside earlier come back into the cache and are sent.
 * - Before any waiting write is sent (TanStack Query resumes paused mutations through
 *   `MutationCache.resumePausedMutations` when the connection or the window's focus returns, and
 *   after a reload), the server is asked who is signed in with this browser's cookie; only that
 *   person's writes go. Another tab may have signed someone else in, or the session may have ended.
 * - A second person never sees the first one's jobs: switching accounts drops every kept answer
 *   but the session from the cache (and so from the device's kept copy).
 */
import { dehydrate, hydrate, type DehydratedState, type Mutation, type QueryClient, type QueryKey } from '@tanstack/react-query';
import { ApiError } from '@/shared/api-client';
import type { UserDto } from '@/shared/schemas';
import { deviceStorage } from './device-storage';
import { quickSaveKey } from './quick-save-write';
import { fetchMe, sessionKeys } from './session-query';
import { conflictKeys, projectKeys, projectMutationKeys } from './use-projects';
import { ownerOf, signedInId } from './write-owner';

/** The writes that wait for a connection (and count as "changes waiting"). */
export const OFFLINE_WRITE_KEYS: readonly (readonly string[])[] = [...Object.values(projectMutationKeys), quickSaveKey];

export function isOfflineWrite(m: Pick<Mutation<unknown, Error, unknown, unknown>, 'options'>): boolean {
  const key = m.options.mutationKey;
  return Boolean(key && OFFLINE_WRITE_KEYS.some((k) => k.length === key.length && k.every((part, i) => part === key[i])));
}

/** localStorage key of the writes (and the jobs they need) waiting for another account than the one signed in. */
export const SET_ASIDE_KEY = 'sightfan-waiting-for-their-account';

interface KeptAnswer {
  queryKey: QueryKey;
  data: unknown;
  updatedAt: number;
}
interface SetAside {
  writes: DehydratedState['mutations'];
  answers: KeptAnswer[];
}
/** By owner id ("unknown" for writes made before owners were recorded, with nobody signed in). */
type SetAsideStore = Record<string, SetAside>;

let memoryStore: SetAsideStore = {};
/** The last text read from storage and what it parsed to (read on every render of the connection line). */
let parsed: { raw: string | null; store: SetAsideStore } = { raw: null, store: {} };
const listeners = new Set<() => void>();

function readStore(): SetAsideStore {
  const storage = deviceStorage();
  if (!storage) return memoryStore;
  const raw = storage.getItem(SET_ASIDE_KEY);
  if (raw !== parsed.raw) {
    let store: SetAsideStore = {};
    try {
      store = raw ? (JSON.parse(raw) as SetAsideStore) : {};
    } catch {
      // Not ours to read (damaged): treat as empty rather than stop the app.
    }
    parsed = { raw, store };
  }
  return parsed.store;
}

function writeStore(next: SetAsideStore): void {
  const storage = deviceStorage();
  if (!storage) memoryStore = next;
  else if (Object.keys(next).length === 0) storage.removeItem(SET_ASIDE_KEY);
  else storage.setItem(SET_ASIDE_KEY, JSON.stringify(next));
  for (const l of listeners) l();
}

export function subscribeSetAside(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** How many writes wait on this device for accounts other than `me` (null: nobody signed in). */
export function writesOfOtherAccounts(me: number | null): number {
  return Object.entries(readStore())
    .filter(([owner]) => owner !== String(me))
    .reduce((n, [, s]) => n + s.writes.length, 0);
}

/** The same write, whether in the cache or set aside: its key, when it was made, and what it sends. */
function sameWrite(a: { mutationKey?: unknown; state: { submittedAt: number; variables: unknown } }, b: typeof a): boolean {
  return (
    JSON.stringify([a.mutationKey, a.state.submittedAt, a.state.variables]) ===
    JSON.stringify([b.mutationKey, b.state.submittedAt, b.state.variables])
  );
}

/** The project a write is about, if any (quick sizing's save makes a new one). */
function projectOf(variables: unknown): number | undefined {
  const id = (variables as { projectId?: unknown } | undefined)?.projectId;
  return typeof id === 'number' ? id : undefined;
}

function answerOf(qc: QueryClient, queryKey: QueryKey): KeptAnswer | undefined {
  const state = qc.getQueryState(queryKey);
  return state?.data === undefined ? undefined : { queryKey, data: state.data, updatedAt: state.dataUpdatedAt };
}

/**
 * Moves every waiting write not made by `incoming` out of the cache into the set-aside store, with
 * the kept jobs they will need to run (each write reads the version it was made on) and the
 * refused changes still waiting for `outgoing`'s choice. Writes already on their way are left be.
 */
function setAsideWritesNotOf(qc: QueryClient, incoming: number | null, outgoing: number | null): void {
  setAside(qc, (owner) => owner !== incoming, outgoing, outgoing !== null && outgoing !== incoming);
}

/**
 * Sets the signed-in person's own waiting writes aside for them (signing out and keeping them):
 * they stay on the device but are not sent until that person signs in here again.
 */
export function setAsideOwnWrites(qc: QueryClient): void {
  const me = signedInId(qc);
  if (me !== null) setAside(qc, (owner) => owner === me, me, true);
}

/** Brings the signed-in person's set-aside writes back (a sign-out that failed) and sends them. */
export function bringBackOwnWrites(qc: QueryClient): void {
  const me = signedInId(qc);
  if (me === null) return;
  bringBack(qc, me);
  void qc.resumePausedMutations();
}

function setAside(qc: QueryClient, leaves: (owner: number | null) => boolean, outgoing: number | null, withConflicts: boolean): void {
  const cache = qc.getMutationCache();
  const leaving = new Set(
    cache.getAll().filter((m) => isOfflineWrite(m) && m.state.status === 'pending' && m.state.isPaused && leaves(ownerOf(m) ?? outgoing)),
  );
  // Refused changes still waiting for the person's choice (a stored list that is not empty).
  const conflicts = withConflicts
    ? qc
        .getQueryCache()
        .findAll({ queryKey: conflictKeys.project(0).slice(0, 2) })
        .filter((q) => Array.isArray(q.state.data) && q.state.data.length > 0)
    : [];
  if (leaving.size === 0 && conflicts.length === 0) return;

  const { mutations } = dehydrate(qc, { shouldDehydrateMutation: (m) => leaving.has(m), shouldDehydrateQuery: () => false });
  const store = { ...readStore() };
  const entry = (owner: number | null): SetAside => {
    const key = owner === null ? 'unknown' : String(owner);
    store[key] = { writes: [...(store[key]?.writes ?? [])], answers: [...(store[key]?.answers ?? [])] };
    return store[key];
  };
  const keep = (target: SetAside, answer: KeptAnswer | undefined) => {
    if (!answer) return;
    const hash = JSON.stringify(answer.queryKey);
    target.answers = [...target.answers.filter((a) => JSON.stringify(a.queryKey) !== hash), answer];
  };
  for (const d of mutations) {
    const owner = ownerOf(d) ?? outgoing;
    const target = entry(owner);
    // Already set aside (the kept cache was saved a moment before the write left it, then reloaded).
    if (target.writes.some((w) => sameWrite(w, d))) continue;
    // A write made before owners were recorded belongs to whoever was signed in then.
    target.writes.push(owner === null || ownerOf(d) !== undefined ? d : { ...d, state: { ...d.state, context: { ownerId: owner } } });
    const projectId = projectOf(d.state.variables);
    if (projectId !== undefined) keep(target, answerOf(qc, projectKeys.detail(projectId)));
  }
  for (const q of conflicts) {
    const target = entry(outgoing);
    keep(target, answerOf(qc, q.queryKey));
    const projectId = q.queryKey[2];
    if (typeof projectId === 'number') keep(target, answerOf(qc, projectKeys.detail(projectId)));
  }
  for (const m of leaving) cache.remove(m);
  writeStore(store);
}

function keepAfterSignedOut(qc: QueryClient, refused: Mutation<unknown, unknown, unknown, unknown>): void {
  const owner = ownerOf(refused) ?? signedInId(qc);
  const { mutations } = dehydrate(qc, { shouldDehydrateMutation: (m) => m === refused, shouldDehydrateQuery: () => false });
  const store = { ...readStore() };
  const key = owner === null ? 'unknown' : String(owner);
  const target: SetAside = { writes: [...(store[key]?.writes ?? [])], answers: [...(store[key]?.answers ?? [])] };
  // As it was before it was sent: waiting.
  for (const d of mutations)
    target.writes.push({
      ...d,
      state: { ...d.state, status: 'pending', isPaused: true, error: null, failureCount: 0, failureReason: null },
    });
  const projectId = projectOf(refused.state.variables);
  const job = projectId === undefined ? undefined : answerOf(qc, projectKeys.detail(projectId));
  if (job) target.answers = [...target.answers.filter((a) => JSON.stringify(a.queryKey) !== JSON.stringify(job.queryKey)), job];
  store[key] = target;
  qc.getMutationCache().remove(refused);
  writeStore(store);
  switchAccount(qc, null, owner);
}

/** Puts `owner`'s set-aside jobs and writes back into the cache (the caller then resumes them). */
function bringBack(qc: QueryClient, owner: number): void {
  const store = readStore();
  const mine = store[String(owner)];
  if (!mine) return;
  for (const a of mine.answers) qc.setQueryData(a.queryKey, a.data, { updatedAt: a.updatedAt });
  const inCache = qc
    .getMutationCache()
    .getAll()
    .map((m) => ({ mutationKey: m.options.mutationKey, state: m.state }));
  hydrate(qc, { mutations: mine.writes.filter((w) => !inCache.some((m) => sameWrite(m, w))), queries: [] });
  const rest = { ...store };
  delete rest[String(owner)];
  writeStore(rest);
}

/** The account each client last acted for (to notice a session that changed under it). */
const actingFor = new WeakMap<QueryClient, number | null>();

/**
 * Makes `user` the signed-in person (null: nobody): everyone else's waiting writes are set aside,
 * every kept answer but the session is dropped (a second person never sees the first one's jobs),
 * and `user`'s own set-aside writes come back. `outgoing` is who the cache was acting for, when the
 * session answer has already been written. Call `resumePausedMutations()` after to send them.
 */
export function switchAccount(qc: QueryClient, user: UserDto | null, outgoing: number | null = signedInId(qc)): void {
  const incoming = user?.id ?? null;
  actingFor.set(qc, incoming);
  setAsideWritesNotOf(qc, incoming, outgoing);
  if (incoming === null || incoming !== outgoing) qc.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
  qc.setQueryData(sessionKeys.me(), user);
  if (incoming !== null) bringBack(qc, incoming);
}

/**
 * Sends waiting writes only for the person the server says is signed in (see the module's
 * comment), and switches the app to that person when it is someone else. Also notices a session
 * answer that names someone else (another tab signed in, or the session ended) and switches then.
 */
export function guardWaitingWrites(qc: QueryClient): void {
  const cache = qc.getMutationCache();
  if (guarded.has(cache)) return;
  guarded.add(cache);
  const resumeAll = cache.resumePausedMutations.bind(cache);
  let failedChecks = 0;
  // The one door paused mutations go through (QueryClient calls it when the connection or focus returns).
  cache.resumePausedMutations = async () => {
    if (!cache.getAll().some((m) => isOfflineWrite(m) && m.state.isPaused)) return resumeAll();
    const before = signedInId(qc);
    let user: UserDto | null;
    try {
      // Asked directly, not through the session query: a fetch of it paused offline would be
      // continued only after this returns (QueryClient resumes mutations first, then queries).
      user = await fetchMe();
      failedChecks = 0;
    } catch {
      // The server could not say (the first request after a reconnection often fails): send
      // nothing now and ask again shortly, then at the next reconnection or focus.
      if (++failedChecks <= CHECK_RETRIES) setTimeout(() => void qc.resumePausedMutations(), CHECK_RETRY_MS * failedChecks);
      return;
    }
    if ((user?.id ?? null) !== before || cache.getAll().some((m) => isOfflineWrite(m) && (ownerOf(m) ?? before) !== (user?.id ?? null)))
      switchAccount(qc, user, before);
    return resumeAll();
  };
  // A waiting write refused because nobody is signed in any more (the session ended between the
  // check and the send) is not lost: it goes back to its owner's set-aside writes, and the app to
  // the sign-in screen.
  const previousOnError = cache.config.onError;
  cache.config = {
    ...cache.config,
    onError: (error, variables, result, mutation, context) => {
      if (isOfflineWrite(mutation) && error instanceof ApiError && error.status === 401) keepAfterSignedOut(qc, mutation);
      return previousOnError?.(error, variables, result, mutation, context);
    },
  };
  qc.getQueryCache().subscribe((event) => {
    const q = event.query;
    if (q.queryKey[0] !== sessionKeys.all[0] || q.queryKey[1] !== 'me' || q.state.data === undefined) return;
    const id = (q.state.data as UserDto | null)?.id ?? null;
    if (!actingFor.has(qc)) actingFor.set(qc, id);
    else if (event.type === 'updated' && event.action.type === 'success' && id !== actingFor.get(qc)) {
      switchAccount(qc, q.state.data as UserDto | null, actingFor.get(qc) ?? null);
      if (id !== null) void qc.resumePausedMutations();
    }
  });
}
const guarded = new WeakSet<object>();
/** Asking who is signed in again after a failure: this many times, 1 s, 2 s, … apart (common practice: a short back-off). */
const CHECK_RETRIES = 6;
const CHECK_RETRY_MS = 1000;
