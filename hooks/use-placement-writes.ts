/**
 * The one write path for a project's placements, shared by the plan and the placement editor.
 *
 * Unsaved edits live here, per placement, on top of the cached project: the plan draws them and
 * the editor shows them, so both always show the same mirror. Saves go through one mutation scope
 * (hooks/use-projects.ts `placementScope`), so they run in order, each with the version the one
 * before produced. A save sends the unsaved fields; on success only the fields still holding what
 * was sent stop being unsaved (typing during a save stays unsaved and is saved next).
 *
 * A 409 (someone else saved first) never drops anything: the person's values stay, the saved
 * values are kept beside them, and nothing more is sent for that mirror until the person chooses
 * "keep mine" (saved over the new version) or "use theirs" (the unsaved edits are dropped).
 */
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { CreatePlacementBody, PlacementDto, ProjectDto } from '@/shared/schemas';
import {
  conflictKeys,
  forgetConflict,
  useAddPlacementMutation,
  useRemovePlacementMutation,
  useUpdatePlacementMutation,
  type EditableFields,
  type PlacementEdits,
  type StoredConflict,
} from './use-projects';

export type { EditableFields, PlacementEdits };

/** Long enough to let a person finish typing "2 ft 3 in", short enough that leaving rarely loses a save. */
export const AUTOSAVE_MS = 900;

export interface PlacementConflict {
  /** The server's sentence: someone else changed this mirror, so this change was not saved. */
  message: string;
  /** The person's unsaved values for the fields they edited. */
  mine: PlacementEdits;
  /** The saved values of the same fields. */
  theirs: PlacementEdits;
}

export interface PlacementProblem {
  message: string;
  /** The server's sentence per field ("heightM": …). */
  fields: Record<string, string>;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);
const keysOf = (e: PlacementEdits) => Object.keys(e) as (keyof EditableFields)[];

function pick(from: PlacementDto, keys: readonly (keyof EditableFields)[]): PlacementEdits {
  const out: PlacementEdits = {};
  for (const k of keys) Object.assign(out, { [k]: from[k] });
  return out;
}

/** `edits` without the fields for which `settled` holds; the same object when none do. */
function without(edits: PlacementEdits, settled: (k: keyof EditableFields) => boolean): PlacementEdits {
  const out: PlacementEdits = {};
  let dropped = false;
  for (const k of keysOf(edits)) {
    if (settled(k)) dropped = true;
    else Object.assign(out, { [k]: edits[k] });
  }
  return dropped ? out : edits;
}

type ById<T> = Readonly<Record<number, T>>;
const setIn = <T>(m: ById<T>, id: number, v: T | undefined): ById<T> => {
  const { [id]: _old, ...rest } = m;
  return v === undefined ? rest : { ...rest, [id]: v };
};

export function usePlacementWrites(project: ProjectDto) {
  const qc = useQueryClient();
  const update = useUpdatePlacementMutation(project.id);
  const add = useAddPlacementMutation(project.id);
  const remove = useRemovePlacementMutation(project.id);

  // Refs are read synchronously by saves; the state copies drive rendering.
  const localRef = useRef<ById<PlacementEdits>>({});
  const conflictRef = useRef<ById<PlacementConflict>>({});
  const [local, setLocalState] = useState<ById<PlacementEdits>>({});
  const [conflicts, setConflictsState] = useState<ById<PlacementConflict>>({});
  const [problems, setProblems] = useState<ById<PlacementProblem>>({});
  const [inFlight, setInFlight] = useState(0);
  const timers = useRef(new Map<number, ReturnType<typeof setTimeout>>());

  const setLocal = useCallback((id: number, edits: PlacementEdits | undefined) => {
    localRef.current = setIn(localRef.current, id, edits && keysOf(edits).length ? edits : undefined);
    setLocalState(localRef.current);
  }, []);
  const setConflict = useCallback((id: number, c: PlacementConflict | undefined) => {
    conflictRef.current = setIn(conflictRef.current, id, c);
    setConflictsState(conflictRef.current);
  }, []);

  const cancelTimer = (id: number) => {
    const t = timers.current.get(id);
    if (t !== undefined) clearTimeout(t);
    timers.current.delete(id);
  };

  /** Sends this placement's unsaved fields, unless a conflict is waiting for the person's choice. */
  // The edits of the last save queued per mirror and not yet answered: a second save of exactly
  // the same values (a blur, then "Save now", while offline) would only queue a duplicate.
  const queuedRef = useRef(new Map<number, PlacementEdits>());

  const save = useCallback(
    (id: number) => {
      cancelTimer(id);
      const sent = localRef.current[id];
      if (!sent || conflictRef.current[id]) return;
      const queued = queuedRef.current.get(id);
      if (queued && same(queued, sent)) return;
      queuedRef.current.set(id, sent);
      setProblems((p) => setIn(p, id, undefined));
      setInFlight((n) => n + 1);
      // The promise, not mutate()'s callbacks: TanStack Query calls those only for an observer's
      // latest mutation, and saves queued one after another (offline, or a slow answer) all count.
      update
        .mutateAsync({ projectId: project.id, placementId: id, edits: sent })
        .then(
          () => {
            const now = localRef.current[id];
            if (now)
              setLocal(
                id,
                without(now, (k) => k in sent && same(now[k], sent[k])),
              );
          },
          (err: unknown) => {
            if (err instanceof ApiError && err.status === 409 && err.current) {
              const mine = localRef.current[id] ?? sent;
              setConflict(id, { message: err.message, mine, theirs: pick(err.current as PlacementDto, keysOf(mine)) });
              return;
            }
            setProblems((p) => setIn(p, id, { message: describeError(err), fields: err instanceof ApiError ? err.fields : {} }));
          },
        )
        .finally(() => {
          if (queuedRef.current.get(id) === sent) queuedRef.current.delete(id);
          setInFlight((n) => n - 1);
        });
    },
    [update, setLocal, setConflict, project.id],
  );

  // A change sent while this editor was not there to hear the answer (queued offline, the page
  // reloaded since) may have been refused: its conflict waits in the cache; take it up here.
  const stored = useQuery<StoredConflict[]>({
    queryKey: conflictKeys.project(project.id),
    queryFn: () => qc.getQueryData<StoredConflict[]>(conflictKeys.project(project.id)) ?? [],
    enabled: false,
  }).data;
  useEffect(() => {
    for (const c of stored ?? []) {
      if (conflictRef.current[c.placementId]) continue;
      const mine = { ...c.mine, ...localRef.current[c.placementId] };
      setLocal(c.placementId, mine);
      setConflict(c.placementId, { message: c.message, mine, theirs: pick(c.theirs, keysOf(mine)) });
    }
  }, [stored, setLocal, setConflict]);

  /**
   * Records an edit at once (the plan and the editor show it); saves it after `autosaveMs` of
   * quiet, or at once when 0 (a drag on the plan ends in one save).
   */
  const change = useCallback(
    (id: number, patch: PlacementEdits, autosaveMs = 0) => {
      setLocal(id, { ...localRef.current[id], ...patch });
      const conflict = conflictRef.current[id];
      if (conflict) setConflict(id, { ...conflict, mine: localRef.current[id] ?? {} });
      setProblems((p) => {
        const old = p[id];
        if (!old) return p;
        const fields = Object.fromEntries(
          Object.entries(old.fields).filter(([f]) => !Object.keys(patch).some((k) => f === k || f.startsWith(`${k}.`))),
        );
        return setIn(p, id, Object.keys(fields).length ? { message: old.message, fields } : undefined);
      });
      cancelTimer(id);
      if (autosaveMs > 0)
        timers.current.set(
          id,
          setTimeout(() => save(id), autosaveMs),
        );
      else save(id);
    },
    [save, setLocal, setConflict],
  );

  const keepMine = useCallback(
    (id: number) => {
      // The cache already holds their version (the 409 brought it): saving now writes over it knowingly.
      forgetConflict(qc, project.id, id);
      setConflict(id, undefined);
      save(id);
    },
    [save, setConflict, qc, project.id],
  );

  const useTheirs = useCallback(
    (id: number) => {
      cancelTimer(id);
      forgetConflict(qc, project.id, id);
      setConflict(id, undefined);
      setLocal(id, undefined);
    },
    [setConflict, setLocal, qc, project.id],
  );

  /** Adds a placement after the writes already queued; rejects with the server's error. */
  const create = useCallback(
    async (body: CreatePlacementBody): Promise<PlacementDto> => (await add.mutateAsync({ projectId: project.id, body })).placement,
    [add, project.id],
  );

  /** Removes a placement after the writes already queued; its unsaved edits go with it. Rejects with the server's error. */
  const removePlacement = useCallback(
    async (id: number): Promise<void> => {
      cancelTimer(id);
      await remove.mutateAsync({ projectId: project.id, placementId: id });
      forgetConflict(qc, project.id, id);
      setLocal(id, undefined);
      setConflict(id, undefined);
    },
    [remove, setLocal, setConflict, qc, project.id],
  );

  // Leaving the plan saves what is still waiting for its autosave rather than dropping it.
  const saveRef = useRef(save);
  useLayoutEffect(() => {
    saveRef.current = save;
  });
  useEffect(
    () => () => {
      for (const id of [...timers.current.keys()]) saveRef.current(id);
    },
    [],
  );

  /** The saved placements with the unsaved edits on top: what the plan draws and the editor shows. */
  const placements = useMemo(
    () => project.placements.map((p) => (local[p.id] ? { ...p, ...local[p.id] } : p)),
    [project.placements, local],
  );

  return {
    placements,
    unsaved: local,
    conflicts,
    problems,
    change,
    save,
    keepMine,
    useTheirs,
    create,
    remove: removePlacement,
    removing: remove.isPending,
    saving: inFlight > 0 || add.isPending || remove.isPending,
  };
}

export type PlacementWrites = ReturnType<typeof usePlacementWrites>;
