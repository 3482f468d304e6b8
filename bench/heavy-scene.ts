/**
 * A fictional, deliberately heavy site (demo data, no real place): a 200 m square hall cut by short
 * walls, round zones, viewers and mirrors, in the counts asked for. Used by the bench to choose the
 * scene limits, by app tests at the limits, and by the server test that checks a heavy sheet never
 * stalls other requests. No server imports here: the app's type-check includes this file.
 */
import type { CreatePlacementBody, Scene } from '../shared/schemas';

export interface HeavyCounts {
  walls: number;
  zones: number;
  cornersPerZone: number;
  viewers: number;
  mirrors: number;
}

const DEG = Math.PI / 180;
const HALL_M = 200;

/** A grid of `n` cells over the hall: the centre of cell `i`. */
function cell(i: number, n: number): [number, number] {
  const side = Math.ceil(Math.sqrt(n));
  const step = HALL_M / side;
  return [-HALL_M / 2 + step * ((i % side) + 0.5), -HALL_M / 2 + step * (Math.floor(i / side) + 0.5)];
}

export function heavyScene(c: HeavyCounts): Scene {
  const walls = Array.from({ length: c.walls }, (_, i) => {
    const [x, y] = cell(i, c.walls);
    const along = i % 2 === 0;
    return {
      id: `w${i}`,
      kind: (i % 3 === 0 ? 'racking' : 'wall') as 'wall' | 'racking',
      aM: [x, y] as [number, number],
      bM: (along ? [x + 1.5, y] : [x, y + 1.5]) as [number, number],
      heightM: 3,
    };
  });
  const zones = Array.from({ length: c.zones }, (_, i) => {
    const [x, y] = cell(i, c.zones);
    const polygonM = Array.from({ length: c.cornersPerZone }, (_, k): [number, number] => {
      const a = (2 * Math.PI * k) / c.cornersPerZone;
      // Round to 1 mm as the API would store it; radius 4 m keeps neighbouring corners apart.
      return [Math.round((x + 4 * Math.cos(a)) * 1000) / 1000, Math.round((y + 4 * Math.sin(a)) * 1000) / 1000];
    });
    return { id: `z${i}`, name: `Zone ${i + 1} (demo)`, polygonM, target: { kind: 'adult' as const } };
  });
  const viewers = Array.from({ length: c.viewers }, (_, i) => {
    const [x, y] = cell(i, c.viewers);
    return { id: `v${i}`, name: `Viewer ${i + 1} (demo)`, positionM: [x + 2, y - 3] as [number, number], eyeHeightM: 1.6 };
  });
  return { walls, zones, viewers };
}

export function heavyPlacements(c: HeavyCounts, catalogueItemId: number): CreatePlacementBody[] {
  // Mirrors hang between the walls' grid cells (half a cell from every wall), never inside one.
  const wallStep = HALL_M / Math.ceil(Math.sqrt(Math.max(1, c.walls)));
  const between = (m: number) => -HALL_M / 2 + wallStep * Math.round((m + HALL_M / 2) / wallStep);
  return Array.from({ length: c.mirrors }, (_, i) => {
    const v = i % Math.max(1, c.viewers);
    const [vx, vy] = cell(v, c.viewers);
    const [x, y] = [between(vx + 2) - 2, between(vy + 3) - 3];
    return {
      label: `H${String(i + 1).padStart(3, '0')}`,
      catalogueItemId,
      positionM: [x + 2, y + 3],
      heightM: 2.8,
      azimuthRad: (-90 + (i % 7) * 10) * DEG,
      tiltDownRad: 25 * DEG,
      viewerId: c.viewers > 0 ? `v${v}` : null,
    };
  });
}
