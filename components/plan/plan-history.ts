/**
 * Undo and redo for the plan, as pure functions over a bounded history of steps. A step says what
 * changed in a form that can be turned around (`inverseStep`): a scene save holds the scene before
 * and after; a mirror change holds the changed fields before and after; adding and removing a mirror
 * hold the mirror's values. The plan runs a step through the same write paths as any edit
 * (hooks/use-plan-history.ts), so a 409 during undo meets the one conflict flow.
 *
 * A removed mirror comes back with a new id (the server gives ids); `renumberPlacement` then points
 * every step that named the old id at the new one, so the steps before and after still apply.
 */
import type { CreatePlacementBody, PlacementDto, Scene } from '@/shared/schemas';
import type { PlacementEdits } from '@/hooks/use-placement-writes';

export type PlanStep =
  | { kind: 'scene'; before: Scene; after: Scene }
  | {
      kind: 'placement-change';
      id: number;
      before: PlacementEdits;
      after: PlacementEdits;
      /** When typed in the mirror editor: the time of the last keystroke (ms), so a run of typing is one step. */
      typedAt?: number;
    }
  | { kind: 'placement-add'; id: number; body: CreatePlacementBody }
  | { kind: 'placement-remove'; id: number; body: CreatePlacementBody };

export interface PlanHistory {
  /** Steps done, oldest first; undo takes the last. */
  readonly past: readonly PlanStep[];
  /** Steps undone, most recently undone last; redo takes the last. */
  readonly future: readonly PlanStep[];
}

/** How many steps a session keeps: enough for a long sitting, bounded so memory stays small. */
export const HISTORY_LIMIT = 100;

export const emptyHistory: PlanHistory = { past: [], future: [] };

/** The step that undoes `step`: before and after swapped, an add turned into a remove and back. */
export function inverseStep(step: PlanStep): PlanStep {
  switch (step.kind) {
    case 'scene':
      return { kind: 'scene', before: step.after, after: step.before };
    case 'placement-change':
      return { kind: 'placement-change', id: step.id, before: step.after, after: step.before };
    case 'placement-add':
      return { kind: 'placement-remove', id: step.id, body: step.body };
    case 'placement-remove':
      return { kind: 'placement-add', id: step.id, body: step.body };
  }
}

/** A new edit: it joins the past (the oldest falls off beyond `limit`) and the redo list is dropped. */
export function recordStep(history: PlanHistory, step: PlanStep, limit = HISTORY_LIMIT): PlanHistory {
  const past = [...history.past, step];
  return { past: past.length > limit ? past.slice(past.length - limit) : past, future: [] };
}

/**
 * Typing in the mirror editor sends a change per keystroke; one run of typing (keystrokes on the same
 * mirror, each within `TYPING_RUN_MS` of the last, nothing else recorded between) is one step, so
 * undo puts back the value from before the run, not one character.
 */
export const TYPING_RUN_MS = 2000;

/** Records a keystroke's change: `before` holds the changed fields as they were just before it. */
export function recordTyping(
  history: PlanHistory,
  id: number,
  before: PlacementEdits,
  after: PlacementEdits,
  atMs: number,
  runMs = TYPING_RUN_MS,
): PlanHistory {
  const last = history.past[history.past.length - 1];
  if (last?.kind === 'placement-change' && last.id === id && last.typedAt !== undefined && atMs - last.typedAt <= runMs) {
    // Fields already in the run keep their value from before the run.
    const merged: PlanStep = { ...last, before: { ...before, ...last.before }, after: { ...last.after, ...after }, typedAt: atMs };
    return { past: [...history.past.slice(0, -1), merged], future: [] };
  }
  return recordStep(history, { kind: 'placement-change', id, before, after, typedAt: atMs });
}

/** A step as it leaves the past: no longer open for more typing. */
function closed(step: PlanStep): PlanStep {
  if (step.kind !== 'placement-change' || step.typedAt === undefined) return step;
  const { typedAt: _typedAt, ...rest } = step;
  return rest;
}

/** The step to run to undo the last edit, and the history once it has run; null when nothing is left. */
export function takeUndo(history: PlanHistory): { run: PlanStep; history: PlanHistory } | null {
  const last = history.past[history.past.length - 1];
  if (!last) return null;
  return { run: inverseStep(last), history: { past: history.past.slice(0, -1), future: [...history.future, closed(last)] } };
}

/** The step to run to redo the last undone edit, and the history once it has run; null when nothing is left. */
export function takeRedo(history: PlanHistory): { run: PlanStep; history: PlanHistory } | null {
  const last = history.future[history.future.length - 1];
  if (!last) return null;
  return { run: last, history: { past: [...history.past, last], future: history.future.slice(0, -1) } };
}

const renumberStep = (step: PlanStep, from: number, to: number): PlanStep =>
  step.kind !== 'scene' && step.id === from ? { ...step, id: to } : step;

/** Every step that named mirror `from` names `to` instead (a removed mirror came back with a new id). */
export function renumberPlacement(history: PlanHistory, from: number, to: number): PlanHistory {
  if (from === to) return history;
  return { past: history.past.map((s) => renumberStep(s, from, to)), future: history.future.map((s) => renumberStep(s, from, to)) };
}

/** The values that bring a removed mirror back as it was (everything but its id, version and dates). */
export function placementBody(p: PlacementDto): CreatePlacementBody {
  return {
    label: p.label,
    catalogueItemId: p.catalogueItemId,
    customMirror: p.customMirror,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: p.azimuthRad,
    tiltDownRad: p.tiltDownRad,
    viewerId: p.viewerId,
    notes: p.notes,
    mirrorClass: p.mirrorClass ?? null,
    servesFieldIds: p.servesFieldIds ?? null,
  };
}

/** The fields `patch` changes, as they are on `p` now: what undoing the patch puts back. */
export function fieldsBefore(p: PlacementDto, patch: PlacementEdits): PlacementEdits {
  const out: PlacementEdits = {};
  for (const k of Object.keys(patch) as (keyof PlacementEdits)[]) Object.assign(out, { [k]: p[k] });
  return out;
}
