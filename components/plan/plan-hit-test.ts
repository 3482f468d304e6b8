/**
 * What lies under a point on the plan, in screen pixels: the aim handle of the selected mirror
 * first, then the nearest mirror or viewer marker, then a wall, then the topmost zone. Pure, so
 * it is tested without a renderer.
 */
import type { PlacementDto, Scene } from '@/shared/schemas';
import { alongAzimuth } from './plan-geometry';
import { pointInPolygon, pointSegmentDistance } from '@/shared/geometry/polygon';
import { AIM_HANDLE_PX, MARKER_RADIUS_PX, toPlan, toScreen, type PairM, type PlanView } from './plan-view';
import type { PlanSelection } from './plan-types';

/** Finger-sized pick radius (the 48 px target rule, halved). */
export const PICK_PX = 24;
/** How close to a wall's line a tap must be to pick the wall. */
export const WALL_PICK_PX = 10;

export interface HitContext {
  scene: Scene;
  placements: readonly PlacementDto[];
  selection: PlanSelection;
  canEdit: boolean;
}

export interface Hit {
  hit: PlanSelection;
  /** True when the point is on the selected mirror's aim handle. */
  aim?: boolean;
}

export function hitTest(ctx: HitContext, view: PlanView, pt: PairM): Hit {
  const sel = ctx.selection;
  if (sel?.kind === 'placement' && ctx.canEdit) {
    const pl = ctx.placements.find((x) => x.id === sel.id);
    if (pl) {
      const end = alongAzimuth(toScreen(view, pl.positionM), pl.azimuthRad, AIM_HANDLE_PX);
      if (Math.hypot(end[0] - pt[0], end[1] - pt[1]) <= PICK_PX) return { hit: sel, aim: true };
    }
  }
  let best: { d: number; hit: PlanSelection } | null = null;
  for (const pl of ctx.placements) {
    const s = toScreen(view, pl.positionM);
    const d = Math.hypot(s[0] - pt[0], s[1] - pt[1]);
    if (d <= Math.max(PICK_PX, MARKER_RADIUS_PX + 6) && (!best || d < best.d)) best = { d, hit: { kind: 'placement', id: pl.id } };
  }
  for (const vw of ctx.scene.viewers) {
    const s = toScreen(view, vw.positionM);
    const d = Math.hypot(s[0] - pt[0], s[1] - pt[1]);
    if (d <= PICK_PX && (!best || d < best.d)) best = { d, hit: { kind: 'viewer', id: vw.id } };
  }
  if (best) return { hit: best.hit };
  let wall: { d: number; id: string } | null = null;
  for (const w of ctx.scene.walls) {
    const d = pointSegmentDistance(pt, toScreen(view, w.aM), toScreen(view, w.bM));
    if (d <= WALL_PICK_PX && (!wall || d < wall.d)) wall = { d, id: w.id };
  }
  if (wall) return { hit: { kind: 'wall', id: wall.id } };
  const planPt = toPlan(view, pt[0], pt[1]);
  const zone = [...ctx.scene.zones].reverse().find((z) => pointInPolygon([z.polygonM], planPt));
  return { hit: zone ? { kind: 'zone', id: zone.id } : null };
}

/** A point of the selected zone or wall that can be dragged: a zone's corner or a wall's end. */
export type SceneHandle = { kind: 'zone-corner'; id: string; index: number } | { kind: 'wall-end'; id: string; end: 'a' | 'b' };

/** Where the selected zone's corners or wall's ends are, in plan metres (drawn as squares, dragged to reshape). */
export function sceneHandles(scene: Scene, selection: PlanSelection): { handle: SceneHandle; atM: PairM }[] {
  if (selection?.kind === 'zone') {
    const zone = scene.zones.find((z) => z.id === selection.id);
    return zone ? zone.polygonM.map((atM, index) => ({ handle: { kind: 'zone-corner', id: zone.id, index }, atM })) : [];
  }
  if (selection?.kind === 'wall') {
    const wall = scene.walls.find((w) => w.id === selection.id);
    return wall
      ? [
          { handle: { kind: 'wall-end', id: wall.id, end: 'a' }, atM: wall.aM },
          { handle: { kind: 'wall-end', id: wall.id, end: 'b' }, atM: wall.bM },
        ]
      : [];
  }
  return [];
}

/** The selected zone's corner or wall's end under the point (the nearest within reach), for an editor only. */
export function handleAt(ctx: HitContext, view: PlanView, pt: PairM): { handle: SceneHandle; atM: PairM } | null {
  if (!ctx.canEdit) return null;
  let best: { d: number; h: { handle: SceneHandle; atM: PairM } } | null = null;
  for (const h of sceneHandles(ctx.scene, ctx.selection)) {
    const s = toScreen(view, h.atM);
    const d = Math.hypot(s[0] - pt[0], s[1] - pt[1]);
    if (d <= PICK_PX && (!best || d < best.d)) best = { d, h };
  }
  return best?.h ?? null;
}
