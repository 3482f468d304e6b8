/**
 * Ranking the catalogue for a quick question: the engine's sizing search (`rankOptions`) over the
 * catalogue's active mirrors at the mirror's place and height, × the engine's default aims.
 */
import { rankOptions, type CatalogueItem, type MultiPolygon, type Pair, type RankInput } from '../optics';
import { DEFAULT_CRITERIA_RAD, type CatalogueItemDto } from '../schemas';
import { HANGS_WITHIN_M, MAX_DRAWN_RANGE_M, mirrorOfSpec, targetHeightM } from '../project-optics';
import { QUICK_FAR_WALL_NORMAL, quickMirrorPosition, quickScene } from './scene';
import type { QuickQuestion } from './question';

export interface QuickOption {
  item: CatalogueItemDto;
  /** The mirror's vertex on the plan: on the far wall's face, stood off it by as much as its body needs. */
  positionM: Pair;
  heightM: number;
  azimuthRad: number;
  tiltDownRad: number;
  /** Share of the area seen large enough to recognise the target (0..1). */
  fraction: number;
  /** Recognisable range for the target, metres from the mirror. */
  rangeM: number;
  region: MultiPolygon;
}

/**
 * The engine's input for a quick question (exported so tests can search the same options): the
 * scene "Save as a job" saves — its walls (the far wall included), zone and viewer — with one
 * mount point on the far wall's face, where each mirror hangs with its back on the wall.
 */
export function quickRankInput(q: QuickQuestion, catalogue: readonly CatalogueItemDto[], limit: number): RankInput {
  const items: CatalogueItem[] = catalogue
    .filter((c) => c.active)
    .map((c) => ({ id: String(c.id), name: c.name, mirror: mirrorOfSpec(c.mirror), cost: c.unitPriceMinor }));
  const scene = quickScene(q);
  const [mx, my] = quickMirrorPosition(q);
  const zone = scene.zones[0].polygonM;
  const viewer = scene.viewers[0];
  // Beyond the farthest corner of the area, a longer range helps nothing: it ranks as equal.
  const farthest = Math.max(...zone.map(([x, y]) => Math.hypot(x - mx, y - my)));
  return {
    catalogue: items,
    // One height: trying more (±0.3 m) tripled the search past the screen's time budget. The mirror
    // stands off the wall no further than the engine still counts as hanging on it.
    mountPoints: [
      { id: 'mirror', vertexM: [mx, my, q.mirrorHeightM], face: { normal: QUICK_FAR_WALL_NORMAL, maxStandOffM: HANGS_WITHIN_M } },
    ],
    eyeM: [viewer.positionM[0], viewer.positionM[1], viewer.eyeHeightM],
    zone: [zone],
    target: {
      sizeM: targetHeightM(scene.zones[0].target),
      minAngleRad: DEFAULT_CRITERIA_RAD.recogniseRad,
      requiredRangeM: farthest,
    },
    maxRangeM: MAX_DRAWN_RANGE_M,
    walls: scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM })),
    limit,
  };
}

/**
 * Best first: share of the area seen, then recognisable range (up to what the area needs), then
 * price. Each mirror appears once, at its best aim: the search is asked for twice as many
 * options, since a mirror's neighbouring aims often rank next to each other.
 */
export function rankQuick(q: QuickQuestion, catalogue: readonly CatalogueItemDto[], limit = 5): QuickOption[] {
  const byId = new Map(catalogue.map((c) => [String(c.id), c]));
  const seen = new Set<string>();
  const out: QuickOption[] = [];
  for (const o of rankOptions(quickRankInput(q, catalogue, 2 * limit))) {
    if (seen.has(o.item.id) || out.length >= limit) continue;
    seen.add(o.item.id);
    out.push({
      item: byId.get(o.item.id) as CatalogueItemDto,
      positionM: [o.pose.vertexM[0], o.pose.vertexM[1]],
      heightM: o.mountPoint.vertexM[2],
      azimuthRad: o.aim.azimuthRad,
      tiltDownRad: o.aim.tiltDownRad,
      fraction: o.fraction,
      rangeM: o.rangeM,
      region: o.region,
    });
  }
  return out;
}
