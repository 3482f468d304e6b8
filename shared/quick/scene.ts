/**
 * The quick question as a project's scene and a placement: what "Save as a job" sends, and what
 * the screen evaluates to show one option's full numbers.
 */
import type { Pair } from '../geometry/polygon';
import { MIRROR_SIZES, type CreatePlacementBody, type Scene, type SceneWall, type ZoneTarget } from '../schemas';
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

/**
 * Where the mirror hangs: the point of the far wall's face at the mirror's place along it. The
 * vertex of a ranked option stands off that face by as much as its body needs (its back on the
 * wall), so each option carries its own `positionM`.
 */
export function quickMirrorPosition(q: QuickQuestion): Pair {
  return [q.mirrorAlongM, q.passageWidthM];
}

/** The far wall's face looks back across the passage (toward −y): a mirror on it faces the passage. */
export const QUICK_FAR_WALL_NORMAL: Pair = [0, -1];

/**
 * How far the far wall runs past the mirror's place either way: half the diagonal of the largest
 * panel the catalogue accepts, so any catalogue mirror at any aim hangs wholly on it.
 */
export const QUICK_FAR_WALL_MARGIN_M = Math.hypot(MIRROR_SIZES.width.maxM, MIRROR_SIZES.height.maxM) / 2;

export function quickWalls(q: QuickQuestion): SceneWall[] {
  const w = q.openingWidthM;
  const d = q.depthM;
  // The passage wall runs back a metre past the viewer, so the viewer is beside it, not at its end.
  const back = -(q.viewerBackM + 1);
  const kind = q.spot === 'aisle' ? 'racking' : 'wall';
  const heightM = QUICK_WALL_HEIGHT_M[kind];
  const wall = (id: string, aM: Pair, bM: Pair, h: number = heightM): SceneWall => ({ id, kind, aM, bM, heightM: h });
  // The passage's far side, which the mirror hangs on: as far back as the passage wall and a metre
  // past the opening, as a person draws a passage, and on past the mirror wherever it hangs.
  const far = wall(
    'far-side-of-passage',
    [Math.min(back, q.mirrorAlongM - QUICK_FAR_WALL_MARGIN_M), q.passageWidthM],
    [Math.max(w + 1, q.mirrorAlongM + QUICK_FAR_WALL_MARGIN_M), q.passageWidthM],
    // Tall enough that the largest mirror at the mounting height hangs on it, not above it; whole metres.
    Math.max(heightM, Math.ceil(q.mirrorHeightM + QUICK_FAR_WALL_MARGIN_M)),
  );
  switch (q.spot) {
    case 'corner':
      return [wall('passage', [back, 0], [0, 0]), wall('near-side', [0, 0], [0, -d]), far];
    case 'aisle':
      return [wall('passage', [back, 0], [0, 0]), wall('near-side', [0, 0], [0, -d]), wall('far-side', [w, 0], [w, -d]), far];
    case 'doorway':
      return [wall('passage', [back, 0], [0, 0]), wall('beyond-door', [w, 0], [w + 1, 0]), far];
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

/** The mirror a ranked option places, as the placements API takes it: at the option's own vertex (its back on the far wall). */
export function quickPlacementBody(
  option: { catalogueItemId: number; positionM: Pair; heightM: number; azimuthRad: number; tiltDownRad: number },
  label = 'M1',
): CreatePlacementBody {
  return {
    label,
    catalogueItemId: option.catalogueItemId,
    positionM: [option.positionM[0], option.positionM[1]],
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
