/**
 * The plan's gestures as a pure state machine: a press starts a gesture (pan, pinch, move a mirror
 * or viewer, turn the aim handle), moves update it, the release ends it. Each step returns the
 * effects to apply — a new view, a drag, a selection, a tap on the plan — and the hook that owns
 * the responder applies them, throttling moves to one per animation frame. Pure, so every rule
 * (tap slop, what a tap selects, a read-only plan) is tested without a renderer.
 */
import type { PlacementDto, Scene } from '@/shared/schemas';
import { azimuthBetween } from './plan-geometry';
import { handleAt, hitTest, type SceneHandle } from './plan-hit-test';
import { moveWallEnd, moveZoneCorner } from './scene-edits';
import { panBy, toPlan, toScreen, zoomAt, type PairM, type PlanView } from './plan-view';
import type { PlanSelection, PlanTool } from './plan-types';

/** Movement under this many pixels is a tap, not a drag. */
export const TAP_SLOP_PX = 6;

export type PlanDrag =
  | { kind: 'placement-move'; id: number; positionM: PairM; done: boolean }
  | { kind: 'placement-aim'; id: number; azimuthRad: number; done: boolean }
  | { kind: 'viewer-move'; id: string; positionM: PairM; done: boolean }
  /** A zone corner or wall end dragged: the scene with it moved. */
  | { kind: 'scene-handle'; scene: Scene; done: boolean };

export type Gesture =
  | { mode: 'pan'; start: PairM; startView: PlanView; moved: boolean; tapSelection: PlanSelection | 'none' }
  | { mode: 'placement' | 'viewer'; id: number | string; grab: PairM; start: PairM; moved: boolean }
  | { mode: 'aim'; id: number; moved: boolean }
  | { mode: 'handle'; handle: SceneHandle; grab: PairM; start: PairM; moved: boolean }
  | { mode: 'pinch'; startDist: number; startView: PlanView; centre: PairM };

export type GestureEffect =
  | { kind: 'view'; view: PlanView }
  | { kind: 'drag'; drag: PlanDrag }
  | { kind: 'select'; selection: PlanSelection }
  | { kind: 'tap'; pointM: PairM };

export interface GestureContext {
  view: PlanView;
  scene: Scene;
  placements: readonly PlacementDto[];
  selection: PlanSelection;
  canEdit: boolean;
  tool: PlanTool;
  /** A comment's point is being chosen: the next tap anywhere gives a point, for any role. */
  pinning?: boolean;
}

export interface Step {
  gesture: Gesture | null;
  effects: GestureEffect[];
}

/** `points`: every finger (or the pointer) in canvas pixels; two or more make a pinch. */
export function startGesture(ctx: GestureContext, points: readonly PairM[]): Step {
  if (points.length >= 2) return { gesture: pinchFrom(ctx.view, points), effects: [] };
  const pt = points[0];
  const { hit, aim } = hitTest(ctx, ctx.view, pt);
  const selecting = !ctx.pinning && (ctx.tool === 'select' || !ctx.canEdit);
  if (ctx.pinning) return { gesture: { mode: 'pan', start: pt, startView: ctx.view, moved: false, tapSelection: 'none' }, effects: [] };
  if (!ctx.pinning && ctx.tool === 'select') {
    const h = handleAt(ctx, ctx.view, pt);
    if (h) {
      const s = toScreen(ctx.view, h.atM);
      return { gesture: { mode: 'handle', handle: h.handle, grab: [s[0] - pt[0], s[1] - pt[1]], start: pt, moved: false }, effects: [] };
    }
  }
  if (aim && hit?.kind === 'placement') return { gesture: { mode: 'aim', id: hit.id, moved: false }, effects: [] };
  if (selecting && (hit?.kind === 'placement' || hit?.kind === 'viewer')) {
    const at =
      hit.kind === 'placement'
        ? ctx.placements.find((x) => x.id === hit.id)?.positionM
        : ctx.scene.viewers.find((x) => x.id === hit.id)?.positionM;
    if (at) {
      const s = toScreen(ctx.view, at);
      return {
        gesture: { mode: hit.kind, id: hit.id, grab: [s[0] - pt[0], s[1] - pt[1]], start: pt, moved: false },
        effects: [{ kind: 'select', selection: hit }],
      };
    }
  }
  return { gesture: { mode: 'pan', start: pt, startView: ctx.view, moved: false, tapSelection: selecting ? hit : 'none' }, effects: [] };
}

export function moveGesture(ctx: GestureContext, g: Gesture, points: readonly PairM[]): Step {
  if (points.length >= 2 && g.mode !== 'pinch') return { gesture: pinchFrom(ctx.view, points), effects: [] };
  if (g.mode === 'pinch') {
    if (points.length < 2) return { gesture: g, effects: [] };
    const k = dist(points[0], points[1]) / g.startDist;
    return { gesture: g, effects: [{ kind: 'view', view: zoomAt(g.startView, k, g.centre[0], g.centre[1]) }] };
  }
  const pt = points[0];
  if (g.mode === 'pan') {
    if (!g.moved && dist(pt, g.start) < TAP_SLOP_PX) return { gesture: g, effects: [] };
    const next = { ...g, moved: true };
    return { gesture: next, effects: [{ kind: 'view', view: panBy(g.startView, pt[0] - g.start[0], pt[1] - g.start[1]) }] };
  }
  if (!ctx.canEdit) return { gesture: g, effects: [] };
  if (g.mode === 'aim') {
    const drag = aimDrag(ctx, g.id, pt, false);
    return { gesture: { ...g, moved: true }, effects: drag ? [{ kind: 'drag', drag }] : [] };
  }
  if (!g.moved && dist(pt, g.start) < TAP_SLOP_PX) return { gesture: g, effects: [] };
  if (g.mode === 'handle') return { gesture: { ...g, moved: true }, effects: [{ kind: 'drag', drag: handleDrag(ctx, g, pt, false) }] };
  return { gesture: { ...g, moved: true }, effects: [{ kind: 'drag', drag: moveDrag(ctx.view, g, pt, false) }] };
}

/** The release (or a cancelled gesture) at `pt`, the last known pointer position. */
export function endGesture(ctx: GestureContext, g: Gesture, pt: PairM): GestureEffect[] {
  if (g.mode === 'pinch') return [];
  if (g.mode === 'pan') {
    // Apply the final position so a release between frames is not lost.
    if (g.moved) return [{ kind: 'view', view: panBy(g.startView, pt[0] - g.start[0], pt[1] - g.start[1]) }];
    if (g.tapSelection !== 'none') return [{ kind: 'select', selection: g.tapSelection }];
    return ctx.canEdit || ctx.pinning ? [{ kind: 'tap', pointM: toPlan(ctx.view, pt[0], pt[1]) }] : [];
  }
  if (!g.moved || !ctx.canEdit) return [];
  if (g.mode === 'aim') {
    const drag = aimDrag(ctx, g.id, pt, true);
    return drag ? [{ kind: 'drag', drag }] : [];
  }
  if (g.mode === 'handle') return [{ kind: 'drag', drag: handleDrag(ctx, g, pt, true) }];
  return [{ kind: 'drag', drag: moveDrag(ctx.view, g, pt, true) }];
}

function pinchFrom(view: PlanView, points: readonly PairM[]): Gesture {
  const [a, b] = points;
  return { mode: 'pinch', startDist: Math.max(1, dist(a, b)), startView: view, centre: [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2] };
}

function aimDrag(ctx: GestureContext, id: number, pt: PairM, done: boolean): PlanDrag | null {
  const pl = ctx.placements.find((x) => x.id === id);
  return pl ? { kind: 'placement-aim', id, azimuthRad: azimuthBetween(toScreen(ctx.view, pl.positionM), pt), done } : null;
}

function moveDrag(view: PlanView, g: Extract<Gesture, { mode: 'placement' | 'viewer' }>, pt: PairM, done: boolean): PlanDrag {
  const positionM = toPlan(view, pt[0] + g.grab[0], pt[1] + g.grab[1]);
  return g.mode === 'placement'
    ? { kind: 'placement-move', id: g.id as number, positionM, done }
    : { kind: 'viewer-move', id: g.id as string, positionM, done };
}

/** Plans are measured to the millimetre at best (plan-edits.ts roundM). */
const mm = (m: number) => Math.round(m * 1000) / 1000;

function handleDrag(ctx: GestureContext, g: Extract<Gesture, { mode: 'handle' }>, pt: PairM, done: boolean): PlanDrag {
  const raw = toPlan(ctx.view, pt[0] + g.grab[0], pt[1] + g.grab[1]);
  const atM: PairM = [mm(raw[0]), mm(raw[1])];
  const h = g.handle;
  const scene = h.kind === 'zone-corner' ? moveZoneCorner(ctx.scene, h.id, h.index, atM) : moveWallEnd(ctx.scene, h.id, h.end, atM);
  return { kind: 'scene-handle', scene, done };
}

const dist = (a: PairM, b: PairM) => Math.hypot(a[0] - b[0], a[1] - b[1]);
