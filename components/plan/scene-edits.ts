/**
 * Every change the plan makes to a project's scene (walls, zones, viewers, the criteria), as pure
 * functions: each takes a scene and returns a new one, never changing the one it was given (the
 * engine caches its wall index per walls array, footgun 15), and returns the same scene when the
 * id names nothing. The plan's tools decide *what* to change; these say *how*; usePlanEdits saves.
 */
import { scene as sceneSchema } from '@/shared/schemas';
import type { CriteriaSettings, CriterionKind, Scene, SceneViewer, SceneWall, SceneZone, ZoneTarget } from '@/shared/schemas';
import type { PairM } from './plan-view';

/** The scene items a person can select and remove on the plan (mirrors are placements, not scene). */
export type SceneItemKind = 'wall' | 'zone' | 'viewer';

export function addWall(scene: Scene, wall: SceneWall): Scene {
  return { ...scene, walls: [...scene.walls, wall] };
}

export function addZone(scene: Scene, zone: SceneZone): Scene {
  return { ...scene, zones: [...scene.zones, zone] };
}

export function addViewer(scene: Scene, viewer: SceneViewer): Scene {
  return { ...scene, viewers: [...scene.viewers, viewer] };
}

/** Takes out the wall, zone or viewer with this id; the other kinds' arrays stay the same objects. */
export function removeSceneItem(scene: Scene, kind: SceneItemKind, id: string): Scene {
  switch (kind) {
    case 'wall':
      return scene.walls.some((w) => w.id === id) ? { ...scene, walls: scene.walls.filter((w) => w.id !== id) } : scene;
    case 'zone':
      return scene.zones.some((z) => z.id === id) ? { ...scene, zones: scene.zones.filter((z) => z.id !== id) } : scene;
    case 'viewer':
      return scene.viewers.some((v) => v.id === id) ? { ...scene, viewers: scene.viewers.filter((v) => v.id !== id) } : scene;
  }
}

function updateViewer(scene: Scene, id: string, patch: Partial<Pick<SceneViewer, 'positionM' | 'eyeHeightM'>>): Scene {
  if (!scene.viewers.some((v) => v.id === id)) return scene;
  return { ...scene, viewers: scene.viewers.map((v) => (v.id === id ? { ...v, ...patch } : v)) };
}

export function moveViewer(scene: Scene, id: string, positionM: PairM): Scene {
  return updateViewer(scene, id, { positionM });
}

export function setViewerEyeHeight(scene: Scene, id: string, eyeHeightM: number): Scene {
  return updateViewer(scene, id, { eyeHeightM });
}

/** Whether the zone's target must be detected or recognised (absent = recognise, see criteria.ts). */
export function setZoneCriterion(scene: Scene, id: string, criterion: CriterionKind): Scene {
  if (!scene.zones.some((z) => z.id === id)) return scene;
  return { ...scene, zones: scene.zones.map((z) => (z.id === id ? { ...z, criterion } : z)) };
}

/** The project's two angles; undefined leaves `criteria` out of the scene, which means the defaults. */
export function setCriteria(scene: Scene, criteria: CriteriaSettings | undefined): Scene {
  if (criteria) return { ...scene, criteria };
  const rest: Scene = { ...scene };
  delete rest.criteria;
  return rest;
}

function updateZone(scene: Scene, id: string, change: (z: SceneZone) => SceneZone): Scene {
  if (!scene.zones.some((z) => z.id === id)) return scene;
  return { ...scene, zones: scene.zones.map((z) => (z.id === id ? change(z) : z)) };
}

function updateWall(scene: Scene, id: string, change: (w: SceneWall) => SceneWall): Scene {
  if (!scene.walls.some((w) => w.id === id)) return scene;
  // A new walls array every time: the engine's wall index is cached per array (footgun 15).
  return { ...scene, walls: scene.walls.map((w) => (w.id === id ? change(w) : w)) };
}

export function renameZone(scene: Scene, id: string, name: string): Scene {
  return updateZone(scene, id, (z) => ({ ...z, name }));
}

/** Who must be seen in the zone: a standing adult, a child, or a custom height. */
export function setZoneTarget(scene: Scene, id: string, target: ZoneTarget): Scene {
  return updateZone(scene, id, (z) => ({ ...z, target }));
}

/** Moves corner `index` of the zone's outline; an index outside the outline changes nothing. */
export function moveZoneCorner(scene: Scene, id: string, index: number, pointM: PairM): Scene {
  const zone = scene.zones.find((z) => z.id === id);
  if (!zone || !Number.isInteger(index) || index < 0 || index >= zone.polygonM.length) return scene;
  return updateZone(scene, id, (z) => ({ ...z, polygonM: z.polygonM.map((p, i) => (i === index ? pointM : p)) }));
}

/** Puts a new corner on the edge that starts at corner `afterIndex` (the last edge closes the outline). */
export function insertZoneCorner(scene: Scene, id: string, afterIndex: number, pointM: PairM): Scene {
  const zone = scene.zones.find((z) => z.id === id);
  if (!zone || !Number.isInteger(afterIndex) || afterIndex < 0 || afterIndex >= zone.polygonM.length) return scene;
  const polygonM = [...zone.polygonM.slice(0, afterIndex + 1), pointM, ...zone.polygonM.slice(afterIndex + 1)];
  return updateZone(scene, id, (z) => ({ ...z, polygonM }));
}

/** The fewest corners a zone keeps: an outline needs three (the schema's rule). */
export const MIN_ZONE_CORNERS = 3;

/** Takes out corner `index`; a zone with three corners keeps them (removing one would leave no outline). */
export function removeZoneCorner(scene: Scene, id: string, index: number): Scene {
  const zone = scene.zones.find((z) => z.id === id);
  if (!zone || zone.polygonM.length <= MIN_ZONE_CORNERS || !Number.isInteger(index) || index < 0 || index >= zone.polygonM.length)
    return scene;
  return updateZone(scene, id, (z) => ({ ...z, polygonM: z.polygonM.filter((_, i) => i !== index) }));
}

export function renameViewer(scene: Scene, id: string, name: string): Scene {
  if (!scene.viewers.some((v) => v.id === id)) return scene;
  return { ...scene, viewers: scene.viewers.map((v) => (v.id === id ? { ...v, name } : v)) };
}

/** Moves one end of a wall or a run of racking: `a` or `b`, as drawn. */
export function moveWallEnd(scene: Scene, id: string, end: 'a' | 'b', pointM: PairM): Scene {
  return updateWall(scene, id, (w) => (end === 'a' ? { ...w, aM: pointM } : { ...w, bM: pointM }));
}

export function setWallHeight(scene: Scene, id: string, heightM: number): Scene {
  return updateWall(scene, id, (w) => ({ ...w, heightM }));
}

export function setWallKind(scene: Scene, id: string, kind: SceneWall['kind']): Scene {
  return updateWall(scene, id, (w) => ({ ...w, kind }));
}

/**
 * Why the API would refuse this scene, as the schema's own sentence (a corner dragged across the
 * outline, a wall's ends on top of each other, an empty name), or null when it would accept it.
 * The plan asks before saving, so a refused edit is never sent.
 */
export function sceneProblem(scene: Scene): string | null {
  const parsed = sceneSchema.safeParse(scene);
  return parsed.success ? null : (parsed.error.issues[0]?.message ?? 'The plan cannot be saved like this.');
}
