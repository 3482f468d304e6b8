/**
 * The plan's tools and the API must agree on the project limits: a tool says "no room" exactly when
 * the API would refuse the scene with one more thing in it.
 */
import * as fc from 'fast-check';
import { createProjectBody, limitProblem, LIMIT_MESSAGES, SCENE_LIMITS } from '../../../shared/schemas';
import { heavyScene } from '../../../bench/heavy-project';

const refusal = (scene: unknown): string[] => {
  const r = createProjectBody.safeParse({ name: 'Limits (demo)', scene });
  return r.success ? [] : r.error.issues.map((i) => i.message);
};

describe('the project limits, as the plan tools and the API see them', () => {
  it('lets a tool add a wall exactly when the API accepts the scene with that wall', () => {
    fc.assert(
      fc.property(fc.integer({ min: SCENE_LIMITS.walls - 3, max: SCENE_LIMITS.walls }), (walls) => {
        const scene = heavyScene({ walls, zones: 0, cornersPerZone: 3, viewers: 0, mirrors: 0 });
        const withOneMore = heavyScene({ walls: walls + 1, zones: 0, cornersPerZone: 3, viewers: 0, mirrors: 0 });
        const said = limitProblem('wall', scene, 0);
        expect(said === null).toBe(refusal(withOneMore).length === 0);
        if (said) expect(refusal(withOneMore)).toContain(said);
      }),
      { numRuns: 8 },
    );
  });

  it('stops a zone outline at the corner that would pass either corner limit, as the API would', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: Math.floor(SCENE_LIMITS.zoneCorners / SCENE_LIMITS.cornersPerZone) }),
        fc.integer({ min: 3, max: SCENE_LIMITS.cornersPerZone }),
        (zones, sketchCorners) => {
          const scene = heavyScene({ walls: 0, zones, cornersPerZone: SCENE_LIMITS.cornersPerZone, viewers: 0, mirrors: 0 });
          const said = limitProblem('zoneCorner', scene, 0, sketchCorners);
          // The zone the API would get if the tool took one more corner: a round outline of sketchCorners + 1 corners.
          const next = heavyScene({ walls: 0, zones: 1, cornersPerZone: sketchCorners + 1, viewers: 0, mirrors: 0 }).zones[0];
          const withIt = { ...scene, zones: [...scene.zones, { ...next, id: 'sketch' }] };
          const refused = refusal(withIt);
          expect(said === null).toBe(refused.length === 0);
          if (said) expect(refused).toContain(said);
        },
      ),
      { numRuns: 40 },
    );
  });

  it.each([
    ['viewer', { walls: 0, zones: 0, cornersPerZone: 3, viewers: SCENE_LIMITS.viewers, mirrors: 0 }, LIMIT_MESSAGES.viewers],
    ['zone', { walls: 0, zones: SCENE_LIMITS.zones, cornersPerZone: 3, viewers: 0, mirrors: 0 }, LIMIT_MESSAGES.zones],
  ] as const)('says the %s limit is reached when the plan already holds the most the API accepts', (thing, counts, message) => {
    const scene = heavyScene(counts);
    expect(refusal(scene)).toEqual([]);
    expect(limitProblem(thing, scene, 0)).toBe(message);
    const fewer = heavyScene({ ...counts, [`${thing}s`]: counts[`${thing}s`] - 1 });
    expect(limitProblem(thing, fewer, 0)).toBeNull();
  });

  it('says the mirror limit is reached at the limit and not one before', () => {
    const empty = { walls: [], zones: [], viewers: [] };
    expect(limitProblem('mirror', empty, SCENE_LIMITS.mirrors)).toBe(LIMIT_MESSAGES.mirrors);
    expect(limitProblem('mirror', empty, SCENE_LIMITS.mirrors - 1)).toBeNull();
  });
});
