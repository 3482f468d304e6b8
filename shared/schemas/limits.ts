/** Plain numbers the schemas enforce, kept free of zod so screens can import them without it. */

/** Ranges a placement's mounting values must stay in; the editor's steppers use the same. */
export const PLACEMENT_LIMITS = {
  heightM: { min: 0.2, max: 30 },
  azimuthRad: { min: -4 * Math.PI, max: 4 * Math.PI },
  tiltDownRad: { min: -Math.PI / 2, max: Math.PI / 2 },
} as const;

/**
 * How much one project may hold. No real site comes near these (a large distribution centre's
 * plan is a few hundred walls and a dozen mirrors); they exist so that the worst project the API
 * accepts still evaluates and prints within a few seconds (`npm run bench` measures it: the heavy
 * project at these limits). The API refuses more with a sentence, and the plan's tools say so before
 * sending. Mirrors are counted per project (each is a placement row).
 */
export const SCENE_LIMITS = {
  walls: 1000,
  zones: 100,
  cornersPerZone: 200,
  /** All zones' corners together: 100 zones of 200 corners each would be 20,000. */
  zoneCorners: 5000,
  viewers: 100,
  mirrors: 30,
} as const;

/**
 * How much one vehicle may hold (its body, the installer's own ground fields and test cylinders);
 * with `SCENE_LIMITS.mirrors` these bound a vehicle job's scoring (`npm run bench`).
 */
export const VEHICLE_LIMITS = {
  bodyBoxes: 12,
  groundFields: 50,
  cornersPerField: 200,
  targets: 50,
} as const;

/** "1,000" — limits are printed in messages the way people write them. */
export const limitText = (n: number) => n.toLocaleString('en');

/** The sentences both the API and the plan's tools use when a limit is reached. */
export const LIMIT_MESSAGES = {
  walls: `At most ${limitText(SCENE_LIMITS.walls)} walls, racking runs and doorways per project; split a larger site into several projects.`,
  zones: `At most ${limitText(SCENE_LIMITS.zones)} zones per project; split a larger site into several projects.`,
  cornersPerZone: `A zone may have at most ${limitText(SCENE_LIMITS.cornersPerZone)} corners; draw its outline with fewer points.`,
  zoneCorners: `All zones together may have at most ${limitText(SCENE_LIMITS.zoneCorners)} corners; simplify some outlines or split the site into several projects.`,
  viewers: `At most ${limitText(SCENE_LIMITS.viewers)} viewers per project; split a larger site into several projects.`,
  mirrors: `At most ${limitText(SCENE_LIMITS.mirrors)} mirrors per project; split a larger site into several projects.`,
} as const;

export type LimitedThing = 'wall' | 'zone' | 'zoneCorner' | 'viewer' | 'mirror';

/**
 * What the plan's tools check before adding one more thing: the sentence to show instead of sending a
 * change the API would refuse, or null when there is room. `sketchCorners`: the corners of the zone being drawn.
 */
export function limitProblem(
  thing: LimitedThing,
  scene: { walls: readonly unknown[]; zones: readonly { polygonM: readonly unknown[] }[]; viewers: readonly unknown[] },
  mirrors: number,
  sketchCorners = 0,
): string | null {
  switch (thing) {
    case 'wall':
      return scene.walls.length >= SCENE_LIMITS.walls ? LIMIT_MESSAGES.walls : null;
    case 'viewer':
      return scene.viewers.length >= SCENE_LIMITS.viewers ? LIMIT_MESSAGES.viewers : null;
    case 'mirror':
      return mirrors >= SCENE_LIMITS.mirrors ? LIMIT_MESSAGES.mirrors : null;
    case 'zone':
      return scene.zones.length >= SCENE_LIMITS.zones ? LIMIT_MESSAGES.zones : null;
    case 'zoneCorner': {
      if (sketchCorners >= SCENE_LIMITS.cornersPerZone) return LIMIT_MESSAGES.cornersPerZone;
      const used = scene.zones.reduce((sum, z) => sum + z.polygonM.length, 0);
      return used + sketchCorners >= SCENE_LIMITS.zoneCorners ? LIMIT_MESSAGES.zoneCorners : null;
    }
  }
}
