import { robustIntersection, robustUnion } from '../geometry/robust-boolean';
import { isSimpleRing, multiPolygonArea, polygonArea, type MultiPolygon, type Polygon } from '../geometry/polygon';
import { OpticsInputError } from './errors';

/**
 * Validates a zone drawn by a person: an outer ring and optional holes, each a simple polygon
 * (no crossing or touching edges, at least three corners, some area).
 */
export function checkZone(zone: Polygon, field = 'zone'): Polygon {
  if (!Array.isArray(zone) || zone.length === 0) {
    throw new OpticsInputError(field, 'Draw the zone as a closed outline with at least three corners.');
  }
  zone.forEach((ring, i) => {
    if (!Array.isArray(ring) || !isSimpleRing(ring)) {
      throw new OpticsInputError(
        i === 0 ? field : `${field}[${i}]`,
        i === 0
          ? 'The zone outline crosses or touches itself, or has fewer than three corners; redraw it as one simple outline.'
          : `Hole ${i} in the zone crosses or touches itself; redraw it as a simple outline.`,
      );
    }
  });
  return zone;
}

/**
 * How much of a zone the given regions cover together: coveredM2 = area(zone ∩ ∪ regions)
 * (boolean union and intersection by polygon-clipping, areas by the shoelace formula) and
 * fraction = coveredM2 / area(zone), between 0 and 1.
 */
export function zoneCoverage(input: { zone: Polygon; regions: readonly MultiPolygon[] }): { fraction: number; coveredM2: number } {
  const zone = checkZone(input.zone);
  const zoneArea = polygonArea(zone);
  if (!(zoneArea > 0)) throw new OpticsInputError('zone', 'The zone has no area; draw it with some width.');
  if (!Array.isArray(input.regions)) throw new OpticsInputError('regions', 'Give a list of coverage regions.');
  const regions = input.regions.filter((r) => r.length > 0);
  if (regions.length === 0) return { fraction: 0, coveredM2: 0 };
  const merged = regions.length === 1 ? regions[0] : robustUnion(regions[0], ...regions.slice(1));
  const covered = multiPolygonArea(robustIntersection(zone, merged));
  const coveredM2 = Math.min(covered, zoneArea);
  return { fraction: coveredM2 / zoneArea, coveredM2 };
}
