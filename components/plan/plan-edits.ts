/** Small pure helpers for edits made on the plan: new ids, defaults for a new mirror, rounding. */
import type { PlacementPatch } from '@/hooks/use-plan-edits';
import type { CatalogueItemDto, CreatePlacementBody, SceneViewer, SceneWall } from '@/shared/schemas';
import type { PairM } from './plan-view';

/** Plans are measured to the millimetre at best; more digits only add noise to saved data. */
export const roundM = (m: number) => Math.round(m * 1000) / 1000;

/** Angles are kept to 0.1 mrad (about 0.006°), far finer than a mirror can be set by hand. */
export const roundRad = (r: number) => Math.round(r * 1e4) / 1e4;

/** A mirror dragged to a point or turned to an aim, as the patch that is saved (rounded as above). */
export function placementDragPatch(d: { positionM: readonly [number, number] } | { azimuthRad: number }): PlacementPatch {
  return 'positionM' in d ? { positionM: [roundM(d.positionM[0]), roundM(d.positionM[1])] } : { azimuthRad: roundRad(d.azimuthRad) };
}

/** Scene ids: letters, digits and dashes (the schema's rule), unique enough within one project. */
export function newSceneId(prefix: string): string {
  return `${prefix}-${Date.now().toString(36)}${Math.floor(Math.random() * 36 ** 4).toString(36)}`;
}

/** Default heights by kind: a partition wall 2.5 m, pallet racking 6 m, a doorway 2.1 m (round working figures). */
export const WALL_HEIGHT_M: Record<SceneWall['kind'], number> = { wall: 2.5, racking: 6, door: 2.1 };

/** A new mirror's mount: 3.0 m up, tilted 15° down (0.26 rad), a common starting point to adjust from. */
export const NEW_MIRROR = { heightM: 3.0, tiltDownRad: 0.26 } as const;

/** The catalogue item a new mirror starts with: a round 600 mm if there is one, else the first active item. */
export function defaultCatalogueItem(catalogue: readonly CatalogueItemDto[]): CatalogueItemDto | undefined {
  const active = catalogue.filter((c) => c.active);
  const pool = active.length > 0 ? active : catalogue;
  return pool.find((c) => c.mirror.shape === 'round' && Math.abs(c.mirror.diameterM - 0.6) < 0.0005) ?? pool[0];
}

export function nearestViewer(pointM: PairM, viewers: readonly SceneViewer[]): SceneViewer | undefined {
  let best: { d: number; v: SceneViewer } | undefined;
  for (const v of viewers) {
    const d = Math.hypot(v.positionM[0] - pointM[0], v.positionM[1] - pointM[1]);
    if (!best || d < best.d) best = { d, v };
  }
  return best?.v;
}

/** The body for a mirror placed by a tap: aimed at the nearest viewer, so it shows them something at once. */
export function newMirrorBody(
  pointM: PairM,
  catalogue: readonly CatalogueItemDto[],
  viewers: readonly SceneViewer[],
  existing: number,
): CreatePlacementBody | null {
  const item = defaultCatalogueItem(catalogue);
  if (!item) return null;
  const viewer = nearestViewer(pointM, viewers);
  const azimuthRad = viewer ? roundRad(Math.atan2(viewer.positionM[1] - pointM[1], viewer.positionM[0] - pointM[0])) : 0;
  return {
    label: `M${existing + 1}`,
    catalogueItemId: item.id,
    positionM: pointM,
    heightM: NEW_MIRROR.heightM,
    azimuthRad,
    tiltDownRad: NEW_MIRROR.tiltDownRad,
    viewerId: viewer?.id ?? null,
  };
}
