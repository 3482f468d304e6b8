import { signedPieces, intersectionAreaWithPieces } from '../geometry/clip-area';
import { polygonArea, type MultiPolygon, type Polygon } from '../geometry/polygon';
import { distance, type Vec3 } from '../geometry/vec3';
import { coverage, fanRegion, prepareCoverage } from './coverage';
import { OpticsInputError, requirePoint, requirePositive } from './errors';
import { checkMirror, domeMountTiltRad, sphereRadiusM, type Mirror } from './mirror';
import { vertexOnFace, wallsThroughMirror, type MountFace } from './mount';
import { recognisableRange } from './paraxial';
import { poseFromAim, type Pose } from './pose';
import type { Wall } from './walls';
import { checkZone, zoneCoverage } from './zones';
import { FLOOR_SLACK } from '../geometry/tolerance';

export type CatalogueItem = { id: string; name?: string; mirror: Mirror; cost: number };
/**
 * Where a mirror may go: its vertex, or, with `face`, the point of a wall face it hangs on (plan
 * x, y and the mounting height). A mirror on a face is moved out from it for each aim until its
 * back sits on the face ({@link vertexOnFace}); aims that would face it into the wall are skipped.
 */
export type MountPoint = { id: string; vertexM: Vec3; face?: MountFace };
export type Aim = { azimuthRad: number; tiltDownRad: number };
/** What must be recognisable: a target of `sizeM` subtending at least `minAngleRad`. */
export type Target = { sizeM: number; minAngleRad: number; requiredRangeM?: number };

export type RankInput = {
  catalogue: readonly CatalogueItem[];
  mountPoints: readonly MountPoint[];
  eyeM: Vec3;
  zone: Polygon;
  target: Target;
  /** Aims to try at every mount point; by default 12 azimuths × 3 tilts about the zone. */
  aims?: readonly Aim[];
  planeHeightM?: number;
  /** Upper limit on the coverage range, metres; the recognisable range also limits it. */
  maxRangeM?: number;
  walls?: readonly Wall[];
  /** How many options to return (default 10). */
  limit?: number;
  /** Rays per outline in the screening pass (default 64); returned options use 256. */
  screenRimSamples?: number;
  /** Coverage fractions within one step rank as equal and are separated by range, then cost (default 0.01). */
  coverageStep?: number;
  /**
   * How much the exact (256-ray) wall-free fraction may exceed the screening (fewer-ray) one,
   * as a fraction of the zone (default {@link SCREEN_TOLERANCE}). Added to every screening
   * score so that it stays an upper bound on the exact score with walls.
   */
  screenTolerance?: number;
};

/**
 * Largest expected excess of the exact wall-free fraction over the 64-ray screening fraction.
 * Measured: at most 0.0054 of the zone over 5,796 random candidates (round, rectangular and
 * half-dome mirrors, zones of 0.25–42 m², ranges 3–23 m); the default allows about 4× that.
 */
export const SCREEN_TOLERANCE = 0.02;

export type RankedOption = {
  item: CatalogueItem;
  mountPoint: MountPoint;
  aim: Aim;
  pose: Pose;
  /** Fraction of the zone covered within the recognisable range (0..1). */
  fraction: number;
  coveredM2: number;
  /** Paraxial recognisable range for the target, metres from the mirror. */
  rangeM: number;
  cost: number;
  region: MultiPolygon;
};

/** Default aims: 12 azimuths from −55° to +55° about the direction to the zone, × tilts 5°, 15°, 25° down. */
export function defaultAims(mount: Vec3, zone: Polygon): Aim[] {
  const ring = zone[0];
  let cx = 0;
  let cy = 0;
  for (const p of ring) {
    cx += p[0];
    cy += p[1];
  }
  cx /= ring.length;
  cy /= ring.length;
  const az0 = Math.atan2(cy - mount[1], cx - mount[0]);
  const aims: Aim[] = [];
  for (let i = 0; i < 12; i++) {
    for (const t of [5, 15, 25]) {
      aims.push({ azimuthRad: az0 + ((-55 + 10 * i) * Math.PI) / 180, tiltDownRad: (t * Math.PI) / 180 });
    }
  }
  return aims;
}

type Candidate = {
  item: CatalogueItem;
  mount: MountPoint;
  /** The mirror's vertex for this aim (the mount point's, or moved out from its face). */
  vertexM: Vec3;
  aim: Aim;
  rangeM: number;
  rangeKey: number;
  fraction: number;
};

/**
 * Sizing search: every catalogue item × mount point × aim is traced and scored on the zone.
 * The coverage of each candidate is limited to its recognisable range (paraxial, eye at the
 * distance from eye to vertex), so "covered" means "seen large enough to recognise the target".
 * Ranking, best first: coverage fraction in steps of `coverageStep`, then recognisable range
 * (capped at `requiredRangeM` when given: beyond what is needed counts equal), then lower cost,
 * then the exact fraction. Domes are tried at their mounting tilt only.
 *
 * Method (branch and bound): a screening pass with `screenRimSamples` rays and no walls scores
 * all candidates by clipping the traced region against a triangulation of the zone. Walls only
 * remove coverage, so that score plus `screenTolerance` (for the coarser outline) is an upper
 * bound on the exact score with walls. Candidates are then recomputed exactly (256 rays,
 * walls, polygon-clipping) in order of their bound until the next bound ranks below the
 * `limit`-th best exact option: no candidate left out could have entered the list. A zone
 * hidden behind racking therefore costs more exact traces, never a wrong first answer.
 * Candidates whose eye is behind the mirror are skipped, and so are candidates whose mirror body
 * would pass through a wall or rack at that aim (the rule `wallsThroughMirror` states; a mirror
 * cannot hang inside a wall, so such an aim is no answer however much it would show). A mount
 * point with a `face` hangs each mirror on that face at each aim (see {@link vertexOnFace}: its
 * back on the face, the vertex stood off it), so the face itself never refuses an aim that looks
 * out of it; the options' poses carry the vertex used.
 */
export function rankOptions(input: RankInput): RankedOption[] {
  const zone = checkZone(input.zone);
  const zoneArea = polygonArea(zone);
  const eyeM = requirePoint('eyeM', input.eyeM, 'eye position');
  const size = requirePositive('target.sizeM', input.target?.sizeM, 'target size');
  const minAngle = requirePositive('target.minAngleRad', input.target?.minAngleRad, 'smallest recognisable angle');
  const required =
    input.target.requiredRangeM === undefined
      ? Infinity
      : requirePositive('target.requiredRangeM', input.target.requiredRangeM, 'required range');
  const cap = input.maxRangeM === undefined ? Infinity : requirePositive('maxRangeM', input.maxRangeM, 'range');
  const limit = input.limit ?? 10;
  const step = input.coverageStep ?? 0.01;
  const screenSamples = input.screenRimSamples ?? 64;
  const tolerance = input.screenTolerance ?? SCREEN_TOLERANCE;
  if (!(tolerance >= 0 && tolerance <= 1)) {
    throw new OpticsInputError('screenTolerance', 'The screening tolerance must be a share of the zone between 0 and 1.');
  }
  if (!Array.isArray(input.catalogue) || input.catalogue.length === 0) {
    throw new OpticsInputError('catalogue', 'Add at least one mirror to choose from.');
  }
  if (!Array.isArray(input.mountPoints) || input.mountPoints.length === 0) {
    throw new OpticsInputError('mountPoints', 'Add at least one place where a mirror could be mounted.');
  }
  input.catalogue.forEach((c, i) => {
    checkMirror(c.mirror, `catalogue[${i}].mirror`);
    if (typeof c.cost !== 'number' || !Number.isFinite(c.cost) || c.cost < 0) {
      throw new OpticsInputError(`catalogue[${i}].cost`, 'Give each catalogue item a cost of zero or more.');
    }
  });
  input.mountPoints.forEach((m, i) => requirePoint(`mountPoints[${i}].vertexM`, m.vertexM, 'mount point'));
  const pieces = signedPieces(zone);
  const walls = input.walls ?? [];

  const candidates: Candidate[] = [];
  for (const item of input.catalogue) {
    const R = sphereRadiusM(item.mirror);
    for (const mount of input.mountPoints) {
      for (const aim of aimsFor(item.mirror, mount.vertexM, zone, input.aims)) {
        let fraction = 0;
        let vertexM = mount.vertexM;
        let rangeM = 0;
        try {
          if (mount.face) {
            const onFace = vertexOnFace({ mirror: item.mirror, onFaceM: mount.vertexM, ...aim, face: mount.face });
            if (!onFace) continue;
            vertexM = onFace.vertexM;
          }
          const D = distance(eyeM, vertexM);
          if (!(D > 0)) continue;
          rangeM = recognisableRange({ radiusM: R, eyeDistanceM: D, targetSizeM: size, minAngleRad: minAngle }).rangeM;
          const reach = Math.min(cap, rangeM);
          if (!(reach > 0)) continue;
          const pose = poseFromAim({ vertexM, ...aim });
          if (walls.length > 0 && wallsThroughMirror({ mirror: item.mirror, pose, walls }).length > 0) continue;
          const prepared = prepareCoverage({
            mirror: item.mirror,
            pose,
            eyeM,
            planeHeightM: input.planeHeightM,
            maxRangeM: reach,
            rimSamples: screenSamples,
          });
          fraction = intersectionAreaWithPieces(fanRegion(prepared), pieces) / zoneArea;
        } catch (e) {
          if (e instanceof OpticsInputError) continue;
          throw e;
        }
        candidates.push({ item, mount, vertexM, aim, rangeM, rangeKey: Math.min(rangeM, required), fraction });
      }
    }
  }
  const byKey = (
    a: { fraction: number; rangeKey: number; item: CatalogueItem },
    b: { fraction: number; rangeKey: number; item: CatalogueItem },
  ): number => rankOrder({ fraction: a.fraction, rangeKey: a.rangeKey, cost: a.item.cost }, { ...b, cost: b.item.cost }, step);
  // Upper bounds, best first.
  const bounds = candidates.map((c) => ({ ...c, fraction: Math.min(1, c.fraction + tolerance) }));
  bounds.sort(byKey);

  const exact: (Candidate & { coveredM2: number; region: MultiPolygon; pose: Pose })[] = [];
  for (const c of bounds) {
    // The list is sorted best first; once `limit` exact options beat this bound, no later one can enter.
    if (exact.length >= limit && byKey(c, exact[limit - 1]) > 0) break;
    const pose = poseFromAim({ vertexM: c.vertexM, ...c.aim });
    const cov = coverage({
      mirror: c.item.mirror,
      pose,
      eyeM,
      planeHeightM: input.planeHeightM,
      maxRangeM: Math.min(cap, c.rangeM),
      walls: input.walls,
    });
    const z = zoneCoverage({ zone, regions: [cov.region] });
    insertSorted(exact, { ...c, fraction: z.fraction, coveredM2: z.coveredM2, region: cov.region, pose }, byKey);
  }
  return exact.slice(0, limit).map((c) => ({
    item: c.item,
    mountPoint: c.mount,
    aim: c.aim,
    pose: c.pose,
    fraction: c.fraction,
    coveredM2: c.coveredM2,
    rangeM: c.rangeM,
    cost: c.item.cost,
    region: c.region,
  }));
}

function aimsFor(mirror: Mirror, mount: Vec3, zone: Polygon, aims: readonly Aim[] | undefined): readonly Aim[] {
  const list = aims ?? defaultAims(mount, zone);
  if (mirror.shape !== 'dome') return list;
  const tilt = domeMountTiltRad(mirror.portion);
  if (mirror.portion === 'full') return [{ azimuthRad: 0, tiltDownRad: tilt }];
  const seen = new Set<number>();
  const out: Aim[] = [];
  for (const a of list) {
    if (seen.has(a.azimuthRad)) continue;
    seen.add(a.azimuthRad);
    out.push({ azimuthRad: a.azimuthRad, tiltDownRad: tilt });
  }
  return out;
}

/** Inserts into a list sorted by `cmp` after any equal items (a stable insertion). */
function insertSorted<T>(list: T[], item: T, cmp: (a: T, b: T) => number): void {
  let i = list.length;
  while (i > 0 && cmp(list[i - 1], item) > 0) i--;
  list.splice(i, 0, item);
}

/** What ranks an option: its share of the zone, its range (capped at what is needed) and its cost. */
export interface RankFigures {
  fraction: number;
  rangeKey: number;
  cost: number;
}

/**
 * The sizing search's order, best first (negative when `a` ranks before `b`): share of the zone in
 * steps of `step`, then range, then lower cost, then the exact share.
 */
export function rankOrder(a: RankFigures, b: RankFigures, step = 0.01): number {
  const key = (c: RankFigures) => [Math.floor(c.fraction / step + FLOOR_SLACK), c.rangeKey, -c.cost, c.fraction];
  return compareKeys(key(b), key(a));
}

function compareKeys(a: number[], b: number[]): number {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i] < b[i] ? -1 : 1;
  return 0;
}
