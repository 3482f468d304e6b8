/**
 * Scenes anywhere in the space the API accepts: every wall, zone, viewer and criteria setting that
 * the zod schemas take (items the schema refuses are filtered out, not avoided), with ids unique
 * across the scene. Used by the plan's pure-function tests.
 */
import * as fc from 'fast-check';
import { CRITERION_LIMITS_RAD, criteriaSettings, scene as sceneSchema, viewer, wall, wallKinds, zone, type Scene } from '@/shared/schemas';

const coord = fc.double({ min: -2000, max: 2000, noNaN: true });
export const anyPointM = fc.tuple(coord, coord);
export const anySceneId = fc.stringMatching(/^[A-Za-z0-9_-]{1,40}$/);
const anyName = fc.string({ minLength: 1, maxLength: 60 });

const accepted =
  <T>(schema: { safeParse: (v: unknown) => { success: boolean } }) =>
  (v: T) =>
    schema.safeParse(v).success;

export const anyWall = (id: string) =>
  fc
    .record({
      id: fc.constant(id),
      kind: fc.constantFrom(...wallKinds),
      aM: anyPointM,
      bM: anyPointM,
      heightM: fc.double({ min: 1e-3, max: 60, noNaN: true }),
    })
    .filter(accepted(wall));

export const anyZone = (id: string) =>
  fc
    .record(
      {
        id: fc.constant(id),
        name: anyName,
        polygonM: fc.array(anyPointM, { minLength: 3, maxLength: 12 }),
        target: fc.oneof(
          fc.constant({ kind: 'adult' as const }),
          fc.constant({ kind: 'child' as const }),
          fc.record({ kind: fc.constant('custom' as const), heightM: fc.double({ min: 0.01, max: 10, noNaN: true }) }),
        ),
        criterion: fc.constantFrom('detect' as const, 'recognise' as const),
      },
      { requiredKeys: ['id', 'name', 'polygonM', 'target'] },
    )
    .filter(accepted(zone));

export const anyViewer = (id: string) =>
  fc
    .record({ id: fc.constant(id), name: anyName, positionM: anyPointM, eyeHeightM: fc.double({ min: 0.3, max: 6, noNaN: true }) })
    .filter(accepted(viewer));

const anyAngle = fc.double({ min: CRITERION_LIMITS_RAD.min, max: CRITERION_LIMITS_RAD.max, noNaN: true });
export const anyCriteria = fc.record({ detectRad: anyAngle, recogniseRad: anyAngle }).filter(accepted(criteriaSettings));

/** A scene the API accepts, with up to `max` items of each kind. */
export const anyScene = (max = 6): fc.Arbitrary<Scene> =>
  fc
    .tuple(fc.nat(max), fc.nat(max), fc.nat(max))
    .chain(([w, z, v]) =>
      fc.uniqueArray(anySceneId, { minLength: w + z + v, maxLength: w + z + v }).chain((ids) =>
        fc.record(
          {
            walls: fc.tuple(...ids.slice(0, w).map(anyWall)),
            zones: fc.tuple(...ids.slice(w, w + z).map(anyZone)),
            viewers: fc.tuple(...ids.slice(w + z).map(anyViewer)),
            criteria: anyCriteria,
          },
          { requiredKeys: ['walls', 'zones', 'viewers'] },
        ),
      ),
    )
    .filter(accepted(sceneSchema)) as fc.Arbitrary<Scene>;

/** Freezes a value and everything in it, so a test can catch an edit made in place. */
export function deepFreeze<T>(value: T): T {
  if (value && typeof value === 'object') {
    for (const v of Object.values(value)) deepFreeze(v);
    Object.freeze(value);
  }
  return value;
}

/** A deep copy of plain data (arrays, objects, numbers and strings; -0 stays -0). */
export function deepCopy<T>(value: T): T {
  if (Array.isArray(value)) return value.map(deepCopy) as T;
  if (value && typeof value === 'object') return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, deepCopy(v)])) as T;
  return value;
}
