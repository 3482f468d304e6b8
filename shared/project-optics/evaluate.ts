/**
 * Evaluates a project's placements with the optics engine: one function used by the plan, the
 * placement editor and (later) the PDF sheet, so every number comes from the same place.
 * Nothing here re-implements a formula; it only assembles engine inputs from a project.
 */
import {
  OpticsInputError,
  convexImage,
  coverage,
  fieldOfView,
  focalLength,
  perceivedDistance,
  poseFromAim,
  recognisableRange,
  rimSqueeze,
  sphereRadiusM,
  type CoverageResult,
  type Mirror,
  type MultiPolygon,
  type Pose,
  type Vec3,
  type Wall,
} from '../optics';
import type { CatalogueItemDto, MirrorSpec, PlacementDto, Scene, SceneViewer, ZoneTarget } from '../schemas';
import { DEFAULT_MIN_ANGLE_RAD, targetHeightM } from './targets';
import { mountProblem } from './mounting';

/** Reference object distances (m) at which the sheet and editor compare true and apparent distance. */
export const REFERENCE_DISTANCES_M = [3, 10, 20] as const;
/** Coverage is never drawn beyond this horizontal distance from the mirror, whatever the range. */
export const MAX_DRAWN_RANGE_M = 60;

export interface PlacementNumbers {
  focalLengthM: number;
  radiusM: number;
  eyeDistanceM: number;
  fieldOfView: { horizontalRad: number; verticalRad: number };
  references: { objectDistanceM: number; magnification: number; trueDistanceM: number; sizeCueDistanceM: number; ratio: number }[];
  /** Recognisable range (m, mirror to person) for each target kind, at the project's smallest angle. */
  rangeM: { adult: number; child: number };
  rimSqueeze: number;
}

export interface EvaluatedPlacement {
  placementId: number;
  mirror: Mirror | null;
  pose: Pose | null;
  eyeM: Vec3 | null;
  viewer: SceneViewer | null;
  numbers: PlacementNumbers | null;
  /** Coverage on the floor, clipped by walls and by the adult recognisable range. */
  coverage: CoverageResult | null;
  /** Why there are no numbers, as a sentence (no viewer, impossible optics, a wall through the mirror…). */
  problem: { field: string; message: string; snapM?: [number, number] | null } | null;
}

export interface EvaluatedZone {
  zoneId: string;
  /** Share of the zone seen, 0..1; NaN only together with `problem`. */
  fraction: number;
  coveredM2: number;
  /** The union of every placement's region for this zone's target (what is seen), for drawing the gap. */
  covered: MultiPolygon;
  /** Why the share could not be computed (a boolean operation failed), as a sentence; else null. */
  problem: string | null;
}

export interface ProjectEvaluation {
  placements: EvaluatedPlacement[];
  zones: EvaluatedZone[];
}

export function mirrorOfSpec(spec: MirrorSpec): Mirror {
  return spec.shape === 'dome'
    ? { shape: 'dome', portion: spec.portion, diameterM: spec.diameterM }
    : spec.shape === 'rect'
      ? { shape: 'rect', widthM: spec.widthM, heightM: spec.heightM, radiusM: spec.radiusM }
      : { shape: 'round', diameterM: spec.diameterM, radiusM: spec.radiusM };
}

export function mirrorOfPlacement(p: Pick<PlacementDto, 'catalogueItemId' | 'customMirror'>, catalogue: readonly CatalogueItemDto[]): Mirror | null {
  if (p.customMirror) return mirrorOfSpec(p.customMirror);
  const item = catalogue.find((c) => c.id === p.catalogueItemId);
  return item ? mirrorOfSpec(item.mirror) : null;
}

export const wallsOfScene = (scene: Scene): Wall[] => scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM }));

function numbersFor(mirror: Mirror, eyeDistanceM: number, minAngleRad: number): PlacementNumbers {
  const radiusM = sphereRadiusM(mirror);
  const range = (t: ZoneTarget) => recognisableRange({ radiusM, eyeDistanceM, targetSizeM: targetHeightM(t), minAngleRad }).rangeM;
  return {
    focalLengthM: focalLength(radiusM),
    radiusM,
    eyeDistanceM,
    fieldOfView: fieldOfView({ mirror, eyeDistanceM }),
    references: REFERENCE_DISTANCES_M.map((d) => {
      const img = convexImage({ radiusM, objectDistanceM: d });
      const pd = perceivedDistance({ radiusM, eyeDistanceM, objectDistanceM: d });
      return { objectDistanceM: d, magnification: img.magnification, trueDistanceM: pd.trueDistanceM, sizeCueDistanceM: pd.sizeCueDistanceM, ratio: pd.ratio };
    }),
    rangeM: { adult: range({ kind: 'adult' }), child: range({ kind: 'child' }) },
    rimSqueeze: rimSqueeze({ mirror, eyeDistanceM }),
  };
}

function problemOf(e: unknown): { field: string; message: string } {
  if (e instanceof OpticsInputError) return { field: e.field, message: e.message };
  return { field: '_', message: 'These values cannot be computed; check the mirror, its position and its viewer.' };
}

interface EvaluatePlacementInput {
  placement: Pick<PlacementDto, 'id' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'>;
  scene: Scene;
  catalogue: readonly CatalogueItemDto[];
  walls: Wall[];
  minAngleRad: number;
  /** Horizontal clip distance; defaults to the adult recognisable range. */
  maxRangeM?: number;
}

export function evaluatePlacement(input: EvaluatePlacementInput): EvaluatedPlacement {
  const { placement: p, scene } = input;
  const out: EvaluatedPlacement = { placementId: p.id, mirror: null, pose: null, eyeM: null, viewer: null, numbers: null, coverage: null, problem: null };
  out.mirror = mirrorOfPlacement(p, input.catalogue);
  if (!out.mirror) return { ...out, problem: { field: 'catalogueItemId', message: 'Pick a mirror from the catalogue or describe a custom one.' } };
  const viewer = scene.viewers.find((v) => v.id === p.viewerId) ?? null;
  out.viewer = viewer;
  try {
    out.pose = poseFromAim({ vertexM: [p.positionM[0], p.positionM[1], p.heightM], azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad });
    // A wall through the mirror's body makes every figure meaningless; say what to change instead.
    const mount = mountProblem({ mirror: out.mirror, placement: p, scene });
    if (mount) return { ...out, problem: mount };
    if (!viewer) return { ...out, problem: { field: 'viewerId', message: 'Choose the viewer this mirror serves to see its numbers and coverage.' } };
    out.eyeM = [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM];
    const v = out.pose.vertexM;
    const eyeDistanceM = Math.hypot(out.eyeM[0] - v[0], out.eyeM[1] - v[1], out.eyeM[2] - v[2]);
    out.numbers = numbersFor(out.mirror, eyeDistanceM, input.minAngleRad);
    const maxRangeM = Math.min(MAX_DRAWN_RANGE_M, input.maxRangeM ?? out.numbers.rangeM.adult);
    out.coverage = maxRangeM > 0.05 ? coverage({ mirror: out.mirror, pose: out.pose, eyeM: out.eyeM, maxRangeM, walls: input.walls }) : { region: [], areaM2: 0 };
  } catch (e) {
    out.problem = problemOf(e);
    out.coverage = null;
  }
  return out;
}
