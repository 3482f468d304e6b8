/**
 * Edits made on the plan: the drag preview while a finger drags (drawn, not saved), the scene's saves (walls, zones,
 * viewers: one project PATCH at a time, each with the version the one before produced), and the
 * placements' writes through the one placement write path (use-placement-writes.ts), which the
 * placement editor shares.
 */
import { onlineManager, useQueryClient } from '@tanstack/react-query';
import { useCallback, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { CreatePlacementBody, PlacementDto, ProjectDto, Scene } from '@/shared/schemas';
import { usePlacementWrites } from './use-placement-writes';
import { projectKeys, useUpdateProjectMutation, type PlacementEdits } from './use-projects';

/** A change to a mirror from the plan: a drag's end, a nudge, an aim, another catalogue mirror, typing in the editor. */
export type PlacementPatch = PlacementEdits;

/** A drag in progress, drawn over the saved values until the finger lifts. */
export type DragPreview =
  | { kind: 'placement'; id: number; patch: PlacementPatch }
  | { kind: 'viewer'; id: string; positionM: [number, number] }
  /** A zone corner or a wall end being dragged: the whole scene as it would be. */
  | { kind: 'scene'; scene: Scene }
  | null;

export interface PlanSaveProblem {
  message: string;
  /** Present when trying the same change again makes sense (not after a 409). */
  retry: (() => void) | null;
}

/** Said after the server's conflict sentence when a plan (scene) change was refused. */
export const PLAN_SHOWS_SAVED = 'The plan now shows the saved version; make your change again if it is still needed.';

const isConflict = (e: unknown) => e instanceof ApiError && e.status === 409;

export function usePlanEdits(project: ProjectDto) {
  const qc = useQueryClient();
  const key = useMemo(() => projectKeys.detail(project.id), [project.id]);
  const updateProject = useUpdateProjectMutation(project.id);
  const writes = usePlacementWrites(project);

  const [dragPreview, setDragPreview] = useState<DragPreview>(null);
  const [localScene, setLocalScene] = useState<Scene | null>(null);
  const [problem, setProblem] = useState<PlanSaveProblem | null>(null);
  const [pending, setPending] = useState(0);
  const queue = useRef<Promise<unknown>>(Promise.resolve());

  /** One scene save after another: the next reads the version the previous one returned. */
  const enqueue = useCallback(<T>(run: () => Promise<T>): Promise<T> => {
    setPending((n) => n + 1);
    const next = queue.current.catch(() => undefined).then(run);
    queue.current = next;
    return next.finally(() => setPending((n) => n - 1));
  }, []);

  const scene = localScene ?? project.scene;
  const { change, create, remove } = writes;
  const { mutateAsync: patchProject } = updateProject;

  // "Try again" calls the save that failed; the saves are reached through this ref so that each
  // can offer itself as the retry without referring to itself while being defined.
  const retryable = useRef<{
    saveScene: (next: Scene) => Promise<boolean>;
    createPlacement: (body: CreatePlacementBody) => Promise<PlacementDto | null>;
    deletePlacement: (id: number) => Promise<boolean>;
  } | null>(null);

  /**
   * Offline, each save goes to the mutation queue at once (not behind the previous save's promise,
   * which waits for the connection): every one is then a paused write kept on the device, so a
   * reload loses none of them. The project's mutation scope still runs them one after another,
   * each reading the version the previous one returned.
   */
  const now = useCallback(<T>(run: () => Promise<T>): Promise<T> => {
    setPending((n) => n + 1);
    return run().finally(() => setPending((n) => n - 1));
  }, []);

  const saveScene = useCallback(
    (next: Scene) => {
      setLocalScene(next);
      setProblem(null);
      return (onlineManager.isOnline() ? enqueue : now)(async () => {
        try {
          // The version is read when the save runs, after the mirror writes queued before it.
          await patchProject({ projectId: project.id, body: { scene: next } });
          setLocalScene((current) => (current === next ? null : current));
          return true;
        } catch (e) {
          if (isConflict(e)) {
            setLocalScene(null);
            setProblem({ message: `${describeError(e)} ${PLAN_SHOWS_SAVED}`, retry: null });
            void qc.invalidateQueries({ queryKey: key });
          } else setProblem({ message: describeError(e), retry: () => void retryable.current?.saveScene(next) });
          return false;
        }
      });
    },
    [enqueue, now, patchProject, qc, key, project.id],
  );

  /** A placement change from the plan (the end of a drag): saved at once through the shared path. */
  const savePlacement = useCallback((id: number, patch: PlacementPatch) => change(id, patch), [change]);

  const createPlacement = useCallback(
    async (body: CreatePlacementBody): Promise<PlacementDto | null> => {
      setProblem(null);
      try {
        return await create(body);
      } catch (e) {
        setProblem({ message: describeError(e), retry: () => void retryable.current?.createPlacement(body) });
        return null;
      }
    },
    [create],
  );

  const deletePlacement = useCallback(
    async (id: number): Promise<boolean> => {
      setProblem(null);
      try {
        await remove(id);
        return true;
      } catch (e) {
        setProblem({ message: describeError(e), retry: () => void retryable.current?.deletePlacement(id) });
        return false;
      }
    },
    [remove],
  );
  useLayoutEffect(() => {
    retryable.current = { saveScene, createPlacement, deletePlacement };
  });

  /** Placements with the unsaved edits (shared with the editor) and the live drag on top. */
  const placements = useMemo(
    () => writes.placements.map((p) => (dragPreview?.kind === 'placement' && dragPreview.id === p.id ? { ...p, ...dragPreview.patch } : p)),
    [writes.placements, dragPreview],
  );

  const liveScene = useMemo(() => {
    if (dragPreview?.kind === 'scene') return dragPreview.scene;
    if (dragPreview?.kind !== 'viewer') return scene;
    return {
      ...scene,
      viewers: scene.viewers.map((v) => (v.id === dragPreview.id ? { ...v, positionM: dragPreview.positionM } : v)),
    };
  }, [scene, dragPreview]);

  return {
    scene: liveScene,
    /** The scene without the live drag: what a scene edit starts from. */
    baseScene: scene,
    placements,
    dragPreview,
    setDragPreview,
    saveScene,
    savePlacement,
    createPlacement,
    deletePlacement,
    /** The placement write path, for the editor (unsaved edits, conflicts, autosave). */
    writes,
    problem,
    dismissProblem: () => setProblem(null),
    saving: pending > 0 || writes.saving,
    unsaved: localScene !== null || Object.keys(writes.unsaved).length > 0,
  };
}
