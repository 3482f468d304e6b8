/**
 * The cache-aware evaluation behind evaluateProject: each placement through the engine once per
 * distinct input, and each zone's covered share from the union of the placements' regions,
 * clipped at the range where that zone's target meets the zone's criterion (detect or
 * recognise). The union of all mirrors but the one being moved is kept, so a drag costs one
 * boolean operation a frame instead of thirty.
 */
import { zoneCoverage, type MultiPolygon } from '../optics';
import { robustUnion } from '../geometry/robust-boolean';
import type { CatalogueItemDto, CriteriaSettings, PlacementDto, Scene, SceneZone, ZoneTarget } from '../schemas';
import { criteriaOf, zoneCriterion, type CriterionKind } from './criteria';
import { evaluateVehicleJob } from './vehicle';
import {
  criterionRangeM,
  evaluatePlacement,
  wallsOfScene,
  type EvaluatedPlacement,
  type EvaluatedZone,
  type ProjectEvaluation,
} from './evaluate';

export type PlacementInput = Pick<
  PlacementDto,
  'id' | 'catalogueItemId' | 'customMirror' | 'positionM' | 'heightM' | 'azimuthRad' | 'tiltDownRad' | 'viewerId'
> &
  Partial<Pick<PlacementDto, 'label' | 'mirrorClass' | 'servesFieldIds'>>;

interface CacheEntry {
  /** Walls are what make a placement's evaluation expensive; viewers are part of each key instead. */
  walls: Scene['walls'];
  /** The same walls arrive as a new array after every save; compare their content then. */
  wallsJson: string;
  catalogue: readonly CatalogueItemDto[];
  criteria: CriteriaSettings;
  byKey: Map<string, EvaluatedPlacement>;
}

function placementKey(p: PlacementInput, scene: Scene, maxRangeM?: number): string {
  const viewer = scene.viewers.find((v) => v.id === p.viewerId) ?? null;
  return JSON.stringify([
    p.id,
    p.catalogueItemId,
    p.customMirror,
    p.positionM,
    p.heightM,
    p.azimuthRad,
    p.tiltDownRad,
    p.viewerId,
    viewer,
    maxRangeM ?? null,
  ]);
}

function targetKey(t: ZoneTarget, kind: CriterionKind): string {
  return `${kind}:${t.kind === 'custom' ? `custom:${t.heightM}` : t.kind}`;
}

const zoneKey = (z: SceneZone) => targetKey(z.target, zoneCriterion(z));
const sameCriteria = (a: CriteriaSettings, b: CriteriaSettings) => a.detectRad === b.detectRad && a.recogniseRad === b.recogniseRad;

interface UnionCache {
  parts: MultiPolygon[];
  /** Index of the one region left out of `rest` (the mirror being dragged), or -1. */
  restIdx: number;
  rest: MultiPolygon;
  merged: MultiPolygon;
}

function unionAll(regions: readonly MultiPolygon[]): MultiPolygon {
  const nonEmpty = regions.filter((r) => r.length > 0);
  if (nonEmpty.length === 0) return [];
  if (nonEmpty.length === 1) return nonEmpty[0];
  return robustUnion(nonEmpty[0], ...nonEmpty.slice(1));
}

/**
 * Evaluates a project's placements and zones, keeping each placement's result keyed by its inputs
 * so an evaluator reused between calls (the plan, while a mirror is dragged) recomputes only what
 * changed. New walls, catalogue or criteria angles empty the cache. A fresh evaluator is
 * evaluateProject.
 */
export class ProjectEvaluator {
  private cache: CacheEntry | null = null;
  private unions = new Map<string, UnionCache>();
  /**
   * Each zone's share as last worked out, with the outline and the union it was worked out from:
   * clipping a large zone against the mirrors' union is the costly part of an evaluation, and most
   * evaluations (another zone edited, a viewer renamed) leave both unchanged.
   */
  private shares = new Map<
    string,
    { polygon: SceneZone['polygonM']; polygonJson: string; covered: MultiPolygon; fraction: number; coveredM2: number }
  >();
  /** A vehicle job's last evaluation and what it was made from (scoring is one call; no finer cache). */
  private lastVehicle: { key: string; catalogue: readonly CatalogueItemDto[]; result: ProjectEvaluation } | null = null;

  /** Options: `fieldCriteria` also estimates detect / recognise shares per vehicle field (the sheet asks for it). */
  constructor(private readonly options: { fieldCriteria?: boolean } = {}) {}

  /** A vehicle job (the scene has a vehicle): through shared/vehicle's scoring, once per distinct input. */
  private evaluateVehicle(input: {
    scene: Scene;
    placements: readonly PlacementInput[];
    catalogue: readonly CatalogueItemDto[];
  }): ProjectEvaluation {
    const key = JSON.stringify([input.scene, input.placements]);
    if (this.lastVehicle && this.lastVehicle.key === key && this.lastVehicle.catalogue === input.catalogue) return this.lastVehicle.result;
    const placements = input.placements.map((p) => ({ ...p, label: p.label ?? `#${p.id}` }));
    const { placements: evaluated, vehicle } = evaluateVehicleJob({ ...input, placements, fieldCriteria: this.options.fieldCriteria });
    const result: ProjectEvaluation = { placements: evaluated, zones: [], vehicle };
    this.lastVehicle = { key, catalogue: input.catalogue, result };
    return result;
  }

  /**
   * The union of all regions for one target. While a single mirror moves, the others' union is
   * kept and only joined with the moving one: one boolean operation a frame instead of thirty.
   */
  private unionFor(key: string, regions: MultiPolygon[]): MultiPolygon {
    const prev = this.unions.get(key);
    if (prev && prev.parts.length === regions.length) {
      const changed = regions.flatMap((r, i) => (r !== prev.parts[i] ? [i] : []));
      if (changed.length === 0) return prev.merged;
      if (changed.length === 1) {
        const i = changed[0];
        const rest = i === prev.restIdx ? prev.rest : unionAll(regions.filter((_, j) => j !== i));
        const merged = unionAll([rest, regions[i]]);
        this.unions.set(key, { parts: regions, restIdx: i, rest, merged });
        return merged;
      }
    }
    const merged = unionAll(regions);
    this.unions.set(key, { parts: regions, restIdx: -1, rest: [], merged });
    return merged;
  }

  /**
   * Builds, ahead of a drag, the union of every region but placement `index`'s, so the drag's
   * first frame costs no more than the others. Called when a mirror is selected.
   */
  prepareDrag(index: number): void {
    for (const [key, u] of this.unions) {
      if (u.restIdx === index || index < 0 || index >= u.parts.length) continue;
      try {
        this.unions.set(key, { ...u, restIdx: index, rest: unionAll(u.parts.filter((_, j) => j !== index)) });
      } catch {
        // The drag will simply build it on its first frame.
      }
    }
  }

  evaluate(input: { scene: Scene; placements: readonly PlacementInput[]; catalogue: readonly CatalogueItemDto[] }): ProjectEvaluation {
    if (input.scene.vehicle) return this.evaluateVehicle(input);
    const criteria = criteriaOf(input.scene);
    if (this.cache && this.cache.walls !== input.scene.walls) {
      const json = JSON.stringify(input.scene.walls);
      if (json === this.cache.wallsJson) this.cache.walls = input.scene.walls;
      else this.cache = null;
    }
    if (!this.cache || this.cache.catalogue !== input.catalogue || !sameCriteria(this.cache.criteria, criteria)) {
      this.cache = {
        walls: input.scene.walls,
        wallsJson: JSON.stringify(input.scene.walls),
        catalogue: input.catalogue,
        criteria,
        byKey: new Map(),
      };
    }
    const cache = this.cache;
    const walls = wallsOfScene(input.scene);
    const base = { scene: input.scene, catalogue: input.catalogue, walls, criteria };
    const used = new Map<string, EvaluatedPlacement>();
    const one = (placement: PlacementInput, maxRangeM?: number): EvaluatedPlacement => {
      const key = placementKey(placement, input.scene, maxRangeM);
      const hit = cache.byKey.get(key) ?? evaluatePlacement({ ...base, placement, maxRangeM });
      used.set(key, hit);
      return hit;
    };

    const placements = input.placements.map((p) => one(p));
    // One region per placement, [] where it has none, so positions stay stable between frames.
    const regionsFor = new Map<string, MultiPolygon[]>();
    const regionsForZone = (z: SceneZone): MultiPolygon[] => {
      const key = zoneKey(z);
      const hit = regionsFor.get(key);
      if (hit) return hit;
      const kind = zoneCriterion(z);
      const regions = placements.map((ev, i): MultiPolygon => {
        if (!ev.numbers || !ev.coverage) return [];
        // Each placement's own region is traced to the adult recognise range (drawnRangeM).
        if (z.target.kind === 'adult' && kind === 'recognise') return ev.coverage.region;
        return one(input.placements[i], criterionRangeM(ev.numbers, z.target, kind)).coverage?.region ?? [];
      });
      regionsFor.set(key, regions);
      return regions;
    };

    const usedShares = new Set<string>();
    const zones = input.scene.zones.map((z): EvaluatedZone => {
      try {
        const covered = this.unionFor(zoneKey(z), regionsForZone(z));
        usedShares.add(z.id);
        const hit = this.shares.get(z.id);
        if (hit && hit.covered === covered && (hit.polygon === z.polygonM || hit.polygonJson === JSON.stringify(z.polygonM))) {
          hit.polygon = z.polygonM;
          return { zoneId: z.id, fraction: hit.fraction, coveredM2: hit.coveredM2, covered, problem: null };
        }
        // zoneCoverage unions its regions itself; handing it the one union already made is the same set.
        const { fraction, coveredM2 } = zoneCoverage({ zone: [z.polygonM], regions: [covered] });
        this.shares.set(z.id, { polygon: z.polygonM, polygonJson: JSON.stringify(z.polygonM), covered, fraction, coveredM2 });
        return { zoneId: z.id, fraction, coveredM2, covered, problem: null };
      } catch {
        // polygon-clipping can fail on near-degenerate input; say so rather than stop the plan.
        return {
          zoneId: z.id,
          fraction: Number.NaN,
          coveredM2: 0,
          covered: [],
          problem: 'The covered share of this zone could not be computed for these positions.',
        };
      }
    });
    // Keep only what this evaluation used, so a long drag does not grow the cache without bound.
    cache.byKey = used;
    for (const id of [...this.shares.keys()]) if (!usedShares.has(id)) this.shares.delete(id);
    return { placements, zones };
  }
}

/**
 * Every placement's numbers and coverage, and each zone's covered fraction; for a vehicle job,
 * each field's share and verdict, the test cylinders and the mounting sentences (`vehicle`). A zone counts the
 * union of all placements' regions, each clipped at the range where the zone's target meets the
 * zone's criterion (detect or recognise, at the angles in the scene's `criteria`).
 * Throws when a zone's share cannot be computed (a sheet must never show a blank share).
 */
export function evaluateProject(input: {
  scene: Scene;
  placements: readonly PlacementInput[];
  catalogue: readonly CatalogueItemDto[];
}): ProjectEvaluation {
  const evaluation = new ProjectEvaluator({ fieldCriteria: true }).evaluate(input);
  const failed = evaluation.zones.find((z) => z.problem);
  if (failed) throw new Error(`Zone ${failed.zoneId}: ${failed.problem}`);
  if (evaluation.vehicle?.problem) throw new Error(`Vehicle fields: ${evaluation.vehicle.problem}`);
  return evaluation;
}
