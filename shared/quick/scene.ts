/**
 * The quick question as a project's scene and a placement: what "Save as a job" sends, and what
 * the screen evaluates to show one option's full numbers.
 */
import type { Pair } from '../geometry/polygon';
import type { CreatePlacementBody, Scene, SceneWall, ZoneTarget } from '../schemas';
import type { QuickQuestion } from './question';

export const QUICK_IDS = { zone: 'blind-spot', viewer: 'viewer' } as const;

/** A small car's height, about 1.4 m (from memory); the zone's custom target for "a vehicle". */
export const VEHICLE_TARGET_HEIGHT_M = 1.4;
/** Heights given to the hiding walls: a storey's wall, and pallet racking (common practice, round figures). */
export const QUICK_WALL_HEIGHT_M = { wall: 3, racking: 5 } as const;

export function zoneTargetOf(who: QuickQuestion['who']): ZoneTarget {
  return who === 'vehicle' ? { kind: 'custom', heightM: VEHICLE_TARGET_HEIGHT_M } : { kind: who };
}

/** The area that must be seen, anticlockwise. */
export function quickZoneRing(q: QuickQuestion): Pair[] {
  const w = q.openingWidthM;
  const d = q.depthM;
  return [
    [0, -d],
    [w, -d],
    [w, 0],
    [0, 0],
  ];
}

export function quickEye(q: QuickQuestion): [number, number, number] {
  return [-q.viewerBackM, q.passageWidthM / 2, q.eyeHeightM];
}

export function quickMirrorPosition(q: QuickQuestion): Pair {
  return [q.mirrorAlongM, q.passageWidthM];
}

export function quickWalls(q: QuickQuestion): SceneWall[] {
  const w = q.openingWidthM;
  const d = q.depthM;
  // The passage wall runs back a metre past the viewer, so the viewer is beside it, not at its end.
  const back = -(q.viewerBackM + 1);
  const kind = q.spot === 'aisle' ? 'racking' : 'wall';
  const heightM = QUICK_WALL_HEIGHT_M[kind];
  const wall = (id: string, aM: Pair, bM: Pair): SceneWall => ({ id, kind, aM, bM, heightM });
  switch (q.spot) {
    case 'corner':
      return [wall('passage', [back, 0], [0, 0]), wall('near-side', [0, 0], [0, -d])];
    case 'aisle':
      return [wall('passage', [back, 0], [0, 0]), wall('near-side', [0, 0], [0, -d]), wall('far-side', [w, 0], [w, -d])];
    case 'doorway':
      return [wall('passage', [back, 0], [0, 0]), wall('beyond-door', [w, 0], [w + 1, 0])];
  }
}

const SPOT_NAMES: Record<QuickQuestion['spot'], string> = { corner: 'Blind corner', aisle: 'Aisle', doorway: 'Doorway' };

export function quickScene(q: QuickQuestion): Scene {
  const [ex, ey, ez] = quickEye(q);
  return {
    walls: quickWalls(q),
    zones: [
      {
        id: QUICK_IDS.zone,
        name: `${SPOT_NAMES[q.spot]} (quick sizing)`,
        polygonM: quickZoneRing(q),
        target: zoneTargetOf(q.who),
        criterion: 'recognise',
      },
    ],
    viewers: [{ id: QUICK_IDS.viewer, name: 'Viewer', positionM: [ex, ey], eyeHeightM: ez }],
  };
}

/** The mirror a ranked option places, as the placements API takes it. */
export function quickPlacementBody(
  q: QuickQuestion,
  option: { catalogueItemId: number; heightM: number; azimuthRad: number; tiltDownRad: number },
  label = 'M1',
): CreatePlacementBody {
  return {
    label,
    catalogueItemId: option.catalogueItemId,
    positionM: quickMirrorPosition(q),
    heightM: option.heightM,
    // Keep the aim within one turn either way, as a person would set it.
    azimuthRad: Math.atan2(Math.sin(option.azimuthRad), Math.cos(option.azimuthRad)),
    tiltDownRad: option.tiltDownRad,
    viewerId: QUICK_IDS.viewer,
  };
}

export function quickProjectName(q: QuickQuestion, when: Date): string {
  return `${SPOT_NAMES[q.spot]} ${when.toISOString().slice(0, 16).replace('T', ' ')}`;
}

/**
 * The aim as a person sets it on the far wall: how far the mirror's face turns from square to
 * the wall, and toward which end of the passage. Square on the far wall faces −y (azimuth −90°).
 */
export function aimOnWall(azimuthRad: number): { turnRad: number; toward: 'viewer' | 'opening' | 'square' } {
  const d = Math.atan2(Math.sin(azimuthRad + Math.PI / 2), Math.cos(azimuthRad + Math.PI / 2));
  const turnRad = Math.abs(d);
  // Turning toward −x faces the viewer's end of the passage; toward +x, the opening's far side.
  if (turnRad < 1e-9) return { turnRad: 0, toward: 'square' };
  return { turnRad, toward: d < 0 ? 'viewer' : 'opening' };
}
