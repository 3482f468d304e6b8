/**
 * The plan's undo and redo: the edits of usePlanEdits, recorded as steps (components/plan/plan-history.ts)
 * and turned around through the same saves. Nothing here writes on its own: a scene step is saved
 * by `saveScene` (a 409 shows the saved plan and its sentence), a mirror change by the placement
 * write path (a 409 opens the mirror's conflict notice), a mirror's add and remove by
 * `createPlacement` / `deletePlacement`. A step that fails stays where it was, so undo can be tried again.
 */
import { useCallback, useLayoutEffect, useRef, useState } from 'react';
import {
  emptyHistory,
  fieldsBefore,
  placementBody,
  recordStep,
  recordTyping,
  renumberPlacement,
  takeRedo,
  takeUndo,
  type PlanHistory,
  type PlanStep,
} from '@/components/plan/plan-history';
import type { CreatePlacementBody, PlacementDto, Scene } from '@/shared/schemas';
import type { PlacementPatch } from './use-plan-edits';

/** Said when the plan was changed elsewhere since the step to undo: undoing it would overwrite that. */
export const HISTORY_STALE = 'The plan was changed elsewhere since this step, so it cannot be undone; the history starts again here.';

export interface PlanHistoryDeps {
  baseScene: Scene;
  placements: readonly PlacementDto[];
  saveScene: (next: Scene) => Promise<boolean>;
  savePlacement: (id: number, patch: PlacementPatch) => void;
  /** The placement write path's own change (saved after `autosaveMs` of quiet): what the mirror editor types into. */
  changePlacement: (id: number, patch: PlacementPatch, autosaveMs: number) => void;
  /** The placement write path's own remove, which rejects with the server's error (the editor shows it). */
  removePlacement: (id: number) => Promise<void>;
  createPlacement: (body: CreatePlacementBody) => Promise<PlacementDto | null>;
  deletePlacement: (id: number) => Promise<boolean>;
}

type StepOutcome = { outcome: 'done'; renumber?: [number, number] } | { outcome: 'failed' } | { outcome: 'stale' };

const sameJson = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

export function usePlanHistory(deps: PlanHistoryDeps) {
  const [history, setHistoryState] = useState<PlanHistory>(emptyHistory);
  const [problem, setProblem] = useState<string | null>(null);
  const [running, setRunning] = useState(false);
  // Read synchronously by the saves below (two quick edits must both be recorded).
  const ref = useRef<PlanHistory>(emptyHistory);
  const depsRef = useRef(deps);
  useLayoutEffect(() => {
    depsRef.current = deps;
  });
  const setHistory = useCallback((h: PlanHistory) => {
    ref.current = h;
    setHistoryState(h);
  }, []);
  const record = useCallback((step: PlanStep) => setHistory(recordStep(ref.current, step)), [setHistory]);

  const saveScene = useCallback(
    (next: Scene) => {
      const before = depsRef.current.baseScene;
      if (next === before) return Promise.resolve(true);
      record({ kind: 'scene', before, after: next });
      setProblem(null);
      return depsRef.current.saveScene(next);
    },
    [record],
  );

  const savePlacement = useCallback(
    (id: number, patch: PlacementPatch) => {
      const p = depsRef.current.placements.find((x) => x.id === id);
      if (p) record({ kind: 'placement-change', id, before: fieldsBefore(p, patch), after: patch });
      setProblem(null);
      depsRef.current.savePlacement(id, patch);
    },
    [record],
  );

  /** A keystroke in the mirror editor: one run of typing on a mirror is one step. */
  const typePlacement = useCallback(
    (id: number, patch: PlacementPatch, autosaveMs = 0) => {
      const p = depsRef.current.placements.find((x) => x.id === id);
      if (p) setHistory(recordTyping(ref.current, id, fieldsBefore(p, patch), patch, Date.now()));
      setProblem(null);
      depsRef.current.changePlacement(id, patch, autosaveMs);
    },
    [setHistory],
  );

  /** The editor's "remove" (after its confirmation): recorded once the server has removed the mirror. */
  const removeFromEditor = useCallback(
    async (id: number) => {
      const p = depsRef.current.placements.find((x) => x.id === id);
      await depsRef.current.removePlacement(id);
      if (p) record({ kind: 'placement-remove', id, body: placementBody(p) });
    },
    [record],
  );

  const createPlacement = useCallback(
    async (body: CreatePlacementBody) => {
      const created = await depsRef.current.createPlacement(body);
      if (created) record({ kind: 'placement-add', id: created.id, body: placementBody(created) });
      return created;
    },
    [record],
  );

  const deletePlacement = useCallback(
    async (id: number) => {
      const p = depsRef.current.placements.find((x) => x.id === id);
      const done = await depsRef.current.deletePlacement(id);
      if (done && p) record({ kind: 'placement-remove', id, body: placementBody(p) });
      return done;
    },
    [record],
  );

  /** Runs one step through the write paths: 'done' (with a new id for a mirror brought back), 'failed' (the save's own notice says why) or 'stale'. */
  const run = useCallback(async (step: PlanStep): Promise<StepOutcome> => {
    const d = depsRef.current;
    switch (step.kind) {
      case 'scene':
        if (!sameJson(d.baseScene, step.before)) return { outcome: 'stale' };
        return (await d.saveScene(step.after)) ? { outcome: 'done' } : { outcome: 'failed' };
      case 'placement-change':
        if (!d.placements.some((p) => p.id === step.id)) return { outcome: 'stale' };
        d.savePlacement(step.id, step.after);
        return { outcome: 'done' };
      case 'placement-remove':
        return (await d.deletePlacement(step.id)) ? { outcome: 'done' } : { outcome: 'failed' };
      case 'placement-add': {
        const created = await d.createPlacement(step.body);
        return created ? { outcome: 'done', renumber: [step.id, created.id] } : { outcome: 'failed' };
      }
    }
  }, []);

  const go = useCallback(
    async (take: typeof takeUndo) => {
      if (running) return;
      const next = take(ref.current);
      if (!next) return;
      setProblem(null);
      setRunning(true);
      const was = ref.current;
      setHistory(next.history);
      try {
        const result = await run(next.run);
        if (result.outcome === 'stale') {
          setProblem(HISTORY_STALE);
          setHistory(emptyHistory);
        } else if (result.outcome === 'failed') {
          // Put the step back, unless other edits were recorded meanwhile (then they come first).
          if (ref.current === next.history) setHistory(was);
        } else if (result.renumber) setHistory(renumberPlacement(ref.current, ...result.renumber));
      } finally {
        setRunning(false);
      }
    },
    [run, running, setHistory],
  );

  return {
    saveScene,
    savePlacement,
    typePlacement,
    removeFromEditor,
    createPlacement,
    deletePlacement,
    undo: useCallback(() => void go(takeUndo), [go]),
    redo: useCallback(() => void go(takeRedo), [go]),
    canUndo: history.past.length > 0 && !running,
    canRedo: history.future.length > 0 && !running,
    /** A sentence when a step could not be undone because the plan changed elsewhere. */
    problem,
    dismissProblem: () => setProblem(null),
  };
}

export type PlanHistoryState = ReturnType<typeof usePlanHistory>;
