/**
 * "Aim at this zone": the azimuth and tilt that let one mirror cover the most of one zone, found by
 * the engine's sizing search (`rankOptions`, shared/optics/rank.ts) with this mirror, its mount
 * point and its viewer as the only choices. The search runs twice: the engine's default fan of aims
 * about the zone (12 azimuths × 3 tilts) plus the present aim, then a finer grid about the best of
 * those. Both are bounded, so the search takes a known number of traces.
 */
import { defaultAims, rankOptions, rankOrder, OpticsInputError, type Aim, type Mirror, type RankedOption, type RankInput } from '../optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '../schemas';
import { PLACEMENT_LIMITS } from '../schemas';
import { criteriaOf, criterionAngleRad, zoneCriterion } from './criteria';
import { mirrorOfPlacement, mirrorOfSpec, wallsOfScene } from './evaluate';
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

/** The zone's share as the plan shows it. One evaluator per search: its cache keeps the mirrors that did not move. */
function zoneShare(
  evaluator: ProjectEvaluator,
  scene: Scene,
  placements: readonly PlacementInput[],
  catalogue: readonly CatalogueItemDto[],
  zoneId: string,
): number {
  // Only this zone is evaluated: with many zones, their unions cost far more than the mirrors.
  const only = { ...scene, zones: scene.zones.filter((z) => z.id === zoneId) };
  const zone = evaluator.evaluate({ scene: only, placements, catalogue }).zones.find((z) => z.zoneId === zoneId);
  return zone && Number.isFinite(zone.fraction) ? zone.fraction : 0;
}

interface ZoneSearchInput {
  scene: Scene;
  placements: readonly PlacementDto[];
  catalogue: readonly CatalogueItemDto[];
  placementId: number;
  zoneId: string;
}

interface SearchSetup {
  p: PlacementDto;
  zone: Scene['zones'][number];
  mirror: Mirror | null;
  base: Pick<RankInput, 'mountPoints' | 'eyeM' | 'zone' | 'target' | 'walls'>;
  firstAims: Aim[];
}

/** What both searches need: this mirror's mount, its viewer's eye, the zone and its target. */
function searchSetup(input: ZoneSearchInput, needMirror: boolean): SearchSetup | { problem: string } {
  const { scene, placements, catalogue } = input;
  const p = placements.find((x) => x.id === input.placementId);
  const zone = scene.zones.find((z) => z.id === input.zoneId);
  if (!p || !zone) return { problem: 'Choose a mirror and a zone to aim it at.' };
  const mirror = mirrorOfPlacement(p, catalogue);
  if (needMirror && !mirror) return { problem: 'Pick a mirror from the catalogue or describe a custom one before aiming it.' };
  const viewer = scene.viewers.find((v) => v.id === p.viewerId);
  if (!viewer) return { problem: 'Choose the viewer this mirror serves before aiming it: the aim depends on where they look from.' };
  const vertexM: [number, number, number] = [p.positionM[0], p.positionM[1], p.heightM];
  const base = {
    mountPoints: [{ id: 'here', vertexM }],
    eyeM: [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM] as [number, number, number],
    zone: [zone.polygonM],
    target: { sizeM: targetHeightM(zone.target), minAngleRad: criterionAngleRad(criteriaOf(scene), zoneCriterion(zone)) },
    walls: wallsOfScene(scene),
  };
  const present: Aim = { azimuthRad: p.azimuthRad, tiltDownRad: p.tiltDownRad };
  // The default fan about the zone, plus a close grid about the present aim: a mirror hung on a
  // face can often turn only a few degrees before its rim meets the wall, and those aims would
  // fall between the fan's spokes (aims that put the mirror into a wall are skipped by the search).
  const firstAims = [...defaultAims(vertexM, [zone.polygonM]), ...gridAbout(present)];
  return { p, zone, mirror, base, firstAims };
}

export function aimAtZone(input: ZoneSearchInput): AimAtZoneResult {
  const { scene, placements, catalogue } = input;
  const setup = searchSetup(input, true);
  if ('problem' in setup) return { problem: setup.problem };
  const { p, zone, mirror, base, firstAims } = setup;
  const search = (aims: readonly Aim[]) =>
    rankOptions({ ...base, catalogue: [{ id: 'this-mirror', mirror: mirror!, cost: 0 }], aims, limit: 1 })[0];

  try {
    const coarse = search(firstAims);
    if (!coarse || coarse.fraction <= 0)
      return {
        problem: `No aim lets this mirror show any of ${zone.name} to its viewer from where it is mounted; move the mirror or the viewer.`,
      };
    const fine = search(gridAbout(coarse.aim));
    const best = tidy(fine && fine.fraction > coarse.fraction ? fine.aim : coarse.aim);
    const evaluator = new ProjectEvaluator();
    const shareBefore = zoneShare(evaluator, scene, placements, catalogue, zone.id);
    const shareAfter = zoneShare(
      evaluator,
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

/** One catalogue mirror for this mount and zone, at its best aim. */
export interface SizingChoice {
  item: CatalogueItemDto;
  aim: Aim;
  /** The zone's share seen (all mirrors together, as the plan would show it) with this mirror here. */
  shareAfter: number;
  /** Farthest distance from the mirror at which the zone's target meets the zone's criterion, metres. */
  rangeM: number;
}

export type SizeForZoneResult = { shareBefore: number; choices: SizingChoice[] } | { problem: string };

/** How many mirrors "compare mirrors" lists. */
export const SIZING_CHOICES = 3;

/**
 * "Which mirror here?": the catalogue's active mirrors ranked for this mount, viewer and zone in
 * the engine's sizing order (`rankOrder`: share of the zone, then range, then price), each at its
 * own best aim (the same two passes as `aimAtZone`), with the zone's share as the plan would show it.
 */
export function sizeForZone(input: ZoneSearchInput & { limit?: number }): SizeForZoneResult {
  const steps = sizeForZoneSteps(input);
  let step = steps.next();
  while (!step.done) step = steps.next();
  return step.value;
}

/**
 * `sizeForZone` one mirror at a time: each `next()` searches one catalogue mirror and yields how
 * many are done, so a screen can let the page breathe (and show progress) between mirrors; the
 * generator's return value is the result.
 */
export function* sizeForZoneSteps(
  input: ZoneSearchInput & { limit?: number },
): Generator<{ done: number; of: number }, SizeForZoneResult, void> {
  const { scene, placements, catalogue } = input;
  const limit = input.limit ?? SIZING_CHOICES;
  const setup = searchSetup(input, false);
  if ('problem' in setup) return { problem: setup.problem };
  const { p, zone, base, firstAims } = setup;
  const active = catalogue.filter((c) => c.active);
  if (active.length === 0) return { problem: 'The catalogue has no mirrors to choose from; ask an admin to add some.' };
  const items = active.map((c) => ({ id: String(c.id), mirror: mirrorOfSpec(c.mirror), cost: c.unitPriceMinor }));
  try {
    // Each mirror at its own best aim: one bounded search per mirror (the first pass, then the
    // finer grid about its best), then the mirrors in the search's own order.
    const best: RankedOption[] = [];
    for (const [i, item] of items.entries()) {
      const coarse = rankOptions({ ...base, catalogue: [item], aims: firstAims, limit: 1 })[0];
      if (coarse && coarse.fraction > 0) {
        const fine = rankOptions({ ...base, catalogue: [item], aims: gridAbout(coarse.aim), limit: 1 })[0];
        best.push(fine && fine.fraction > coarse.fraction ? fine : coarse);
      }
      yield { done: i + 1, of: items.length };
    }
    best.sort((a, b) =>
      rankOrder({ fraction: a.fraction, rangeKey: a.rangeM, cost: a.cost }, { fraction: b.fraction, rangeKey: b.rangeM, cost: b.cost }),
    );
    if (best.length === 0)
      return {
        problem: `No mirror in the catalogue shows any of ${zone.name} to this viewer from where this mirror hangs; move it or the viewer.`,
      };
    const evaluator = new ProjectEvaluator();
    const shareBefore = zoneShare(evaluator, scene, placements, catalogue, zone.id);
    const choices = best.slice(0, limit).map((o): SizingChoice => {
      const aim = tidy(o.aim);
      const item = active.find((c) => String(c.id) === o.item.id)!;
      const moved = placements.map((x) => (x.id === p.id ? { ...x, ...aim, catalogueItemId: item.id, customMirror: null } : x));
      return { item, aim, rangeM: o.rangeM, shareAfter: zoneShare(evaluator, scene, moved, catalogue, zone.id) };
    });
    return { shareBefore, choices };
  } catch (e) {
    if (e instanceof OpticsInputError) return { problem: e.message };
    throw e;
  }
}
