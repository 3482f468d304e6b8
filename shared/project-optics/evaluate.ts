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
import type { CatalogueItemDto, CriteriaSettings, MirrorSpec, PlacementDto, Scene, SceneViewer, ZoneTarget } from '../schemas';
import { criterionAngleRad, type CriterionKind } from './criteria';
import { eyeOffAxisRad, floorSeenFigures, type FloorSeenFigures } from './figures';
import { mountProblem } from './mounting';
import { targetHeightM } from './targets';
import type { VehicleJobEvaluation } from './vehicle';

/** Reference object distances (m) at which the sheet and editor compare true and apparent distance. */
export const REFERENCE_DISTANCES_M = [3, 10, 20] as const;
/** Coverage is never drawn beyond this horizontal distance from the mirror, whatever the range. */
export const MAX_DRAWN_RANGE_M = 60;

export interface TargetRangesM {
  adult: number;
  child: number;
}

export interface PlacementNumbers {
  focalLengthM: number;
  radiusM: number;
  eyeDistanceM: number;
  /**
   * Field of view for an eye ON the mirror's axis at this eye distance: a property of the mirror,
   * not what this viewer sees (their eye is `eyeOffAxisRad` off the axis). Always label it "on axis".
   */
  onAxisFieldOfView: { horizontalRad: number; verticalRad: number };
  /** Angle between the mirror's axis and the direction from the mirror to this viewer's eye, radians. */
  eyeOffAxisRad: number;
  references: { objectDistanceM: number; magnification: number; trueDistanceM: number; sizeCueDistanceM: number; ratio: number }[];
  /** The project's two angles these ranges were computed with, radians. */
  criteria: CriteriaSettings;
  /** Farthest distance (m, mirror to person) at which each target is detected, and recognised (paraxial). */
  rangesM: Record<CriterionKind, TargetRangesM>;
  rimSqueeze: number;
  /**
   * The floor this viewer sees in the mirror, within the drawn range (the adult recognise range,
   * capped at MAX_DRAWN_RANGE_M) and with walls: spread around the mirror, nearest and farthest
   * point. Null when no floor is seen or coverage could not be traced.
   */
  floorSeen: FloorSeenFigures | null;
}

/** Range (m) to which a placement's own region is traced and drawn: the adult recognise range, capped. */
export const drawnRangeM = (n: Pick<PlacementNumbers, 'rangesM'>): number => Math.min(MAX_DRAWN_RANGE_M, n.rangesM.recognise.adult);

export interface EvaluatedPlacement {
  placementId: number;
  mirror: Mirror | null;
  pose: Pose | null;
  eyeM: Vec3 | null;
  viewer: SceneViewer | null;
  numbers: PlacementNumbers | null;
  /** Coverage on the floor, clipped by walls and by the adult recognise range (see drawnRangeM). */
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
  /** A vehicle job's fields, test cylinders and mounting sentences (absent for a site). */
  vehicle?: VehicleJobEvaluation;
}

export function mirrorOfSpec(spec: MirrorSpec): Mirror {
  return spec.shape === 'dome'
    ? { shape: 'dome', portion: spec.portion, diameterM: spec.diameterM }
    : spec.shape === 'rect'
      ? { shape: 'rect', widthM: spec.widthM, heightM: spec.heightM, radiusM: spec.radiusM }
      : { shape: 'round', diameterM: spec.diameterM, radiusM: spec.radiusM };
}

export function mirrorOfPlacement(
  p: Pick<PlacementDto, 'catalogueItemId' | 'customMirror'>,
  catalogue: readonly CatalogueItemDto[],
): Mirror | null {
  if (p.customMirror) return mirrorOfSpec(p.customMirror);
  const item = catalogue.find((c) => c.id === p.catalogueItemId);
  return item ? mirrorOfSpec(item.mirror) : null;
}

export const wallsOfScene = (scene: Scene): Wall[] => scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM }));

/** Farthest distance (m, mirror to person) at which target `t` meets criterion `kind` (paraxial). */
export function criterionRangeM(
  n: Pick<PlacementNumbers, 'radiusM' | 'eyeDistanceM' | 'criteria'>,
  t: ZoneTarget,
  kind: CriterionKind,
): number {
  const minAngleRad = criterionAngleRad(n.criteria, kind);
  return recognisableRange({ radiusM: n.radiusM, eyeDistanceM: n.eyeDistanceM, targetSizeM: targetHeightM(t), minAngleRad }).rangeM;
}

/** A mirror's numbers for one eye point (the site's viewer, or a vehicle driver's eyes). */
export function numbersFor(mirror: Mirror, pose: Pose, eyeM: Vec3, eyeDistanceM: number, criteria: CriteriaSettings): PlacementNumbers {
  const radiusM = sphereRadiusM(mirror);
  const base = { radiusM, eyeDistanceM, criteria };
  const ranges = (kind: CriterionKind): TargetRangesM => ({
    adult: criterionRangeM(base, { kind: 'adult' }, kind),
    child: criterionRangeM(base, { kind: 'child' }, kind),
  });
  return {
    focalLengthM: focalLength(radiusM),
    radiusM,
    eyeDistanceM,
    onAxisFieldOfView: fieldOfView({ mirror, eyeDistanceM }),
    eyeOffAxisRad: eyeOffAxisRad(pose, eyeM),
    references: REFERENCE_DISTANCES_M.map((d) => {
      const img = convexImage({ radiusM, objectDistanceM: d });
      const pd = perceivedDistance({ radiusM, eyeDistanceM, objectDistanceM: d });
      return {
        objectDistanceM: d,
        magnification: img.magnification,
        trueDistanceM: pd.trueDistanceM,
        sizeCueDistanceM: pd.sizeCueDistanceM,
        ratio: pd.ratio,
      };
    }),
    criteria,
    rangesM: { detect: ranges('detect'), recognise: ranges('recognise') },
    rimSqueeze: rimSqueeze({ mirror, eyeDistanceM }),
    floorSeen: null,
  };
}

function problemOf(e: unknown): { field: string; message: string } {
  if (e instanceof OpticsInputError) return { field: e.field, message: e.message };
  return { field: '_', message: 'These values cannot be computed; check the mirror, its position and its viewer.' };
}

interface EvaluatePlacementInput {
  placement: Pick<
    PlacementDto,
    'id' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'
  >;
  scene: Scene;
  catalogue: readonly CatalogueItemDto[];
  walls: Wall[];
  criteria: CriteriaSettings;
  /** Horizontal clip distance; defaults to the adult recognise range (drawnRangeM). */
  maxRangeM?: number;
}

export function evaluatePlacement(input: EvaluatePlacementInput): EvaluatedPlacement {
  const { placement: p, scene } = input;
  const out: EvaluatedPlacement = {
    placementId: p.id,
    mirror: null,
    pose: null,
    eyeM: null,
    viewer: null,
    numbers: null,
    coverage: null,
    problem: null,
  };
  out.mirror = mirrorOfPlacement(p, input.catalogue);
  if (!out.mirror)
    return { ...out, problem: { field: 'catalogueItemId', message: 'Pick a mirror from the catalogue or describe a custom one.' } };
  const viewer = scene.viewers.find((v) => v.id === p.viewerId) ?? null;
  out.viewer = viewer;
  try {
    out.pose = poseFromAim({ vertexM: [p.positionM[0], p.positionM[1], p.heightM], azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad });
    // A wall through the mirror's body makes every figure meaningless; say what to change instead.
    const mount = mountProblem({ mirror: out.mirror, placement: p, scene });
    if (mount) return { ...out, problem: mount };
    if (!viewer)
      return { ...out, problem: { field: 'viewerId', message: 'Choose the viewer this mirror serves to see its numbers and coverage.' } };
    out.eyeM = [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM];
    const v = out.pose.vertexM;
    const eyeDistanceM = Math.hypot(out.eyeM[0] - v[0], out.eyeM[1] - v[1], out.eyeM[2] - v[2]);
    out.numbers = numbersFor(out.mirror, out.pose, out.eyeM, eyeDistanceM, input.criteria);
    const maxRangeM = Math.min(MAX_DRAWN_RANGE_M, input.maxRangeM ?? drawnRangeM(out.numbers));
    out.coverage =
      maxRangeM > 0.05
        ? coverage({ mirror: out.mirror, pose: out.pose, eyeM: out.eyeM, maxRangeM, walls: input.walls })
        : { region: [], areaM2: 0 };
    out.numbers.floorSeen = floorSeenFigures(out.coverage.region, [v[0], v[1]]);
  } catch (e) {
    out.problem = problemOf(e);
    out.coverage = null;
  }
  return out;
}

/** "Adult detected to 98 m, recognised to 29 m": both adult ranges in one phrase, for short summaries. */
export function adultRangesText(n: Pick<PlacementNumbers, 'rangesM'>, dist: (m: number) => string): string {
  return `Adult detected to ${dist(n.rangesM.detect.adult)}, recognised to ${dist(n.rangesM.recognise.adult)}`;
}
