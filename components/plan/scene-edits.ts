/**
 * Every change the plan makes to a project's scene (walls, zones, viewers, the criteria), as pure
 * functions: each takes a scene and returns a new one, never changing the one it was given (the
 * engine caches its wall index per walls array, footgun 15), and returns the same scene when the
 * id names nothing. The plan's tools decide *what* to change; these say *how*; usePlanEdits saves.
 */
import type { CriteriaSettings, CriterionKind, Scene, SceneViewer, SceneWall, SceneZone } from '@/shared/schemas';
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
