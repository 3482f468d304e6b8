/**
 * "Aim at this zone": the azimuth and tilt that let one mirror cover the most of one zone, found by
 * the engine's sizing search (`rankOptions`, shared/optics/rank.ts) with this mirror, its mount
 * point and its viewer as the only choices. The search runs twice: the engine's default fan of aims
 * about the zone (12 azimuths × 3 tilts) plus the present aim, then a finer grid about the best of
 * those. Both are bounded, so the search takes a known number of traces.
 */
import { defaultAims, rankOptions, OpticsInputError, type Aim } from '../optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '../schemas';
import { PLACEMENT_LIMITS } from '../schemas';
import { criteriaOf, criterionAngleRad, zoneCriterion } from './criteria';
import { mirrorOfPlacement, wallsOfScene } from './evaluate';
import { ProjectEvaluator, type PlacementInput } from './evaluator';
import { targetHeightM } from './targets';

/** The finer pass: 5 azimuths 2.5° apart × 5 tilts 2.5° apart about the best coarse aim (half the coarse spacing and less). */
const FINE_STEP_RAD = (2.5 * Math.PI) / 180;
const FINE_OFFSETS = [-2, -1, 0, 1, 2];

/** Most aims one "aim at this zone" traces: 36 default + 25 about the present aim + 25 fine. */
export const AIM_CANDIDATES_MAX = 36 + 2 * FINE_OFFSETS.length ** 2;

/** 5 × 5 aims 2.5° apart about `aim` (the centre included). */
function gridAbout(aim: Aim): Aim[] {
  return FINE_OFFSETS.flatMap((da) =>
    FINE_OFFSETS.map((dt) => ({ azimuthRad: aim.azimuthRad + da * FINE_STEP_RAD, tiltDownRad: aim.tiltDownRad + dt * FINE_STEP_RAD })),
  );
}

export type AimAtZoneResult =
  | {
      aim: Aim;
      /** The zone's share seen (all mirrors together, as the plan shows it), 0..1, before and after. */
      shareBefore: number;
      shareAfter: number;
    }
  | { problem: string };

/** Angles as the plan stores them: 0.1 mrad, the azimuth brought into (−π, π]. */
function tidy(aim: Aim): Aim {
  let az = Math.atan2(Math.sin(aim.azimuthRad), Math.cos(aim.azimuthRad));
  if (az <= -Math.PI) az += 2 * Math.PI;
  const tilt = Math.min(PLACEMENT_LIMITS.tiltDownRad.max, Math.max(PLACEMENT_LIMITS.tiltDownRad.min, aim.tiltDownRad));
  return { azimuthRad: Math.round(az * 1e4) / 1e4, tiltDownRad: Math.round(tilt * 1e4) / 1e4 };
}

function zoneShare(scene: Scene, placements: readonly PlacementInput[], catalogue: readonly CatalogueItemDto[], zoneId: string): number {
  const zone = new ProjectEvaluator().evaluate({ scene, placements, catalogue }).zones.find((z) => z.zoneId === zoneId);
  return zone && Number.isFinite(zone.fraction) ? zone.fraction : 0;
}

export function aimAtZone(input: {
  scene: Scene;
  placements: readonly PlacementDto[];
  catalogue: readonly CatalogueItemDto[];
  placementId: number;
  zoneId: string;
}): AimAtZoneResult {
  const { scene, placements, catalogue } = input;
  const p = placements.find((x) => x.id === input.placementId);
  const zone = scene.zones.find((z) => z.id === input.zoneId);
  if (!p || !zone) return { problem: 'Choose a mirror and a zone to aim it at.' };
  const mirror = mirrorOfPlacement(p, catalogue);
  if (!mirror) return { problem: 'Pick a mirror from the catalogue or describe a custom one before aiming it.' };
  const viewer = scene.viewers.find((v) => v.id === p.viewerId);
  if (!viewer) return { problem: 'Choose the viewer this mirror serves before aiming it: the aim depends on where they look from.' };

  const vertexM: [number, number, number] = [p.positionM[0], p.positionM[1], p.heightM];
  const search = (aims: readonly Aim[]) =>
    rankOptions({
      catalogue: [{ id: 'this-mirror', mirror, cost: 0 }],
      mountPoints: [{ id: 'here', vertexM }],
      eyeM: [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM],
      zone: [zone.polygonM],
      target: { sizeM: targetHeightM(zone.target), minAngleRad: criterionAngleRad(criteriaOf(scene), zoneCriterion(zone)) },
      walls: wallsOfScene(scene),
      aims,
      limit: 1,
    })[0];

  try {
    const present: Aim = { azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad };
    // The default fan about the zone, plus a close grid about the present aim: a mirror hung on a
    // face can often turn only a few degrees before its rim meets the wall, and those aims would
    // fall between the fan's spokes (aims that put the mirror into a wall are skipped by the search).
    const coarse = search([...defaultAims(vertexM, [zone.polygonM]), ...gridAbout(present)]);
    if (!coarse || coarse.fraction <= 0)
      return {
        problem: `No aim lets this mirror show any of ${zone.name} to its viewer from where it is mounted; move the mirror or the viewer.`,
      };
    const fine = search(gridAbout(coarse.aim));
    const best = tidy(fine && fine.fraction > coarse.fraction ? fine.aim : coarse.aim);
    const shareBefore = zoneShare(scene, placements, catalogue, zone.id);
    const shareAfter = zoneShare(
      scene,
      placements.map((x) => (x.id === p.id ? { ...x, ...best } : x)),
      catalogue,
      zone.id,
    );
    return { aim: best, shareBefore, shareAfter };
  } catch (e) {
    if (e instanceof OpticsInputError) return { problem: e.message };
    throw e;
  }
}
