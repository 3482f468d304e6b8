/**
 * Edits made on the plan: the live draft while a finger drags, the local change kept visible while
 * it saves (and after a failed save, with a retry), and the saves themselves. Saves go one at a
 * time per target so each carries the version the previous one produced.
 */
import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useMemo, useRef, useState } from 'react';
import { ApiError } from '@/shared/api-client';
import { describeError } from '@/shared/errors';
import type { CreatePlacementBody, PatchPlacementBody, PlacementDto, ProjectDto, Scene } from '@/shared/schemas';
import { projectKeys, useAddPlacementMutation, useRemovePlacementMutation, useUpdatePlacementMutation, useUpdateProjectMutation } from './use-projects';

export type PlacementPatch = Partial<Pick<PlacementDto, 'positionM' | 'azimuthRad' | 'heightM' | 'tiltDownRad' | 'viewerId' | 'label'>>;

export type LiveDraft = { kind: 'placement'; id: number; patch: PlacementPatch } | { kind: 'viewer'; id: string; positionM: [number, number] } | null;

export interface PlanSaveProblem {
  message: string;
  /** Present when trying the same change again makes sense (not after a 409). */
  retry: (() => void) | null;
}

export const CHANGED_ELSEWHERE = 'This project was changed elsewhere (another tab or device); the plan now shows the saved version. Make your change again if it is still needed.';

const isConflict = (e: unknown) => e instanceof ApiError && e.status === 409;

export function usePlanEdits(project: ProjectDto) {
  const qc = useQueryClient();
  const key = projectKeys.detail(project.id);
  const updateProject = useUpdateProjectMutation(project.id);
  const addPlacement = useAddPlacementMutation(project.id);
  const updatePlacement = useUpdatePlacementMutation(project.id);
  const removePlacement = useRemovePlacementMutation(project.id);

  const [live, setLive] = useState<LiveDraft>(null);
  const [localPlacements, setLocalPlacements] = useState<Record<number, PlacementPatch>>({});
  // Read synchronously when merging edits; the state copy drives rendering.
  const localRef = useRef<Record<number, PlacementPatch>>({});
  const [localScene, setLocalScene] = useState<Scene | null>(null);
  const [problem, setProblem] = useState<PlanSaveProblem | null>(null);
  const [pending, setPending] = useState(0);
  const queue = useRef<Promise<unknown>>(Promise.resolve());

  const cached = () => qc.getQueryData<ProjectDto>(key);
  /** One save after another: the next reads the version the previous one returned. */
  const enqueue = useCallback(<T,>(run: () => Promise<T>): Promise<T> => {
    setPending((n) => n + 1);
    const next = queue.current.catch(() => undefined).then(run);
    queue.current = next;
    return next.finally(() => setPending((n) => n - 1));
  }, []);

  const onConflict = useCallback(() => {
    setProblem({ message: CHANGED_ELSEWHERE, retry: null });
    void qc.invalidateQueries({ queryKey: key });
  }, [qc, project.id]);

  const scene = localScene ?? project.scene;

  const saveScene = useCallback(
    (next: Scene) => {
      setLocalScene(next);
      setProblem(null);
      return enqueue(async () => {
        const version = cached()?.version ?? project.version;
        try {
          await updateProject.mutateAsync({ version, scene: next });
          setLocalScene((current) => (current === next ? null : current));
          return true;
        } catch (e) {
          if (isConflict(e)) {
            setLocalScene(null);
            onConflict();
          } else setProblem({ message: describeError(e), retry: () => void saveScene(next) });
          return false;
        }
      });
    },
    [enqueue, onConflict, project.version],
  );

  const savePlacement = useCallback(
    (id: number, patch: PlacementPatch) => {
      const merged: PlacementPatch = { ...localRef.current[id], ...patch };
      localRef.current = { ...localRef.current, [id]: merged };
      setLocalPlacements(localRef.current);
      setProblem(null);
      return enqueue(async () => {
        const version = cached()?.placements.find((p) => p.id === id)?.version;
        if (version === undefined) return false;
        const body: PatchPlacementBody = { version, ...merged };
        try {
          await updatePlacement.mutateAsync({ placementId: id, body });
          if (localRef.current[id] === merged) {
            const { [id]: _saved, ...rest } = localRef.current;
            localRef.current = rest;
            setLocalPlacements(rest);
          }
          return true;
        } catch (e) {
          if (isConflict(e)) {
            const { [id]: _dropped, ...rest } = localRef.current;
            localRef.current = rest;
            setLocalPlacements(rest);
            onConflict();
          } else setProblem({ message: describeError(e), retry: () => void savePlacement(id, merged) });
          return false;
        }
      });
    },
    [enqueue, onConflict],
  );

  const createPlacement = useCallback(
    (body: CreatePlacementBody): Promise<PlacementDto | null> => {
      setProblem(null);
      return enqueue(async () => {
        try {
          return (await addPlacement.mutateAsync(body)).placement;
        } catch (e) {
          setProblem({ message: describeError(e), retry: () => void createPlacement(body) });
          return null;
        }
      });
    },
    [enqueue],
  );

  const deletePlacement = useCallback(
    (id: number): Promise<boolean> => {
      setProblem(null);
      return enqueue(async () => {
        try {
          await removePlacement.mutateAsync(id);
          return true;
        } catch (e) {
          setProblem({ message: describeError(e), retry: () => void deletePlacement(id) });
          return false;
        }
      });
    },
    [enqueue],
  );

  /** Server placements with the saved-locally changes and the live drag on top. */
  const placements = useMemo(
    () =>
      project.placements.map((p) => {
        const local = localPlacements[p.id];
        const drag = live?.kind === 'placement' && live.id === p.id ? live.patch : undefined;
        return local || drag ? { ...p, ...local, ...drag } : p;
      }),
    [project.placements, localPlacements, live],
  );

  const liveScene = useMemo(() => {
    if (live?.kind !== 'viewer') return scene;
    return { ...scene, viewers: scene.viewers.map((v) => (v.id === live.id ? { ...v, positionM: live.positionM } : v)) };
  }, [scene, live]);

  return {
    scene: liveScene,
    /** The scene without the live drag: what a scene edit starts from. */
    baseScene: scene,
    placements,
    live,
    setLive,
    saveScene,
    savePlacement,
    createPlacement,
    deletePlacement,
    problem,
    dismissProblem: () => setProblem(null),
    saving: pending > 0,
    unsaved: localScene !== null || Object.keys(localPlacements).length > 0,
  };
}
