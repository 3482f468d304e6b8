import fc from 'fast-check';
import { createPlacementBody, createProjectBody } from '../../../shared/schemas';
import { mirrorOfSpec, mountProblem } from '../../../shared/project-optics';
import { polygonArea } from '../../../shared/geometry/polygon';
import {
  QUICK_FIELDS,
  QUICK_LIMITS,
  quickPlacementBody,
  quickProblems,
  quickProjectName,
  quickScene,
  spotKinds,
  whoKinds,
  type QuickQuestion,
} from '../../../shared/quick';
import { demoCatalogueDtos } from '../../../server/seeders/demo-catalogue';

const inRange = (f: keyof typeof QUICK_LIMITS) => fc.double({ min: QUICK_LIMITS[f].min, max: QUICK_LIMITS[f].max, noNaN: true });

/** Every question the screen accepts: each measured value anywhere in its range, every spot and target. */
const question: fc.Arbitrary<QuickQuestion> = fc.record({
  spot: fc.constantFrom(...spotKinds),
  who: fc.constantFrom(...whoKinds),
  passageWidthM: inRange('passageWidthM'),
  openingWidthM: inRange('openingWidthM'),
  depthM: inRange('depthM'),
  viewerBackM: inRange('viewerBackM'),
  eyeHeightM: inRange('eyeHeightM'),
  mirrorAlongM: inRange('mirrorAlongM'),
  mirrorHeightM: inRange('mirrorHeightM'),
});
const aim = fc.record({
  azimuthRad: fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
  tiltDownRad: fc.double({ min: 0, max: (25 * Math.PI) / 180, noNaN: true }),
});
const catalogue = demoCatalogueDtos();

describe('the quick question as a job', () => {
  it('gives a scene the project API accepts for every accepted question', () => {
    fc.assert(
      fc.property(question, (q) => {
        const parsed = createProjectBody.safeParse({ name: quickProjectName(q, new Date(0)), scene: quickScene(q) });
        expect(parsed.error?.issues).toBeUndefined();
      }),
      { numRuns: 400 },
    );
  });

  it('gives a placement the placements API accepts, with no wall through any catalogue mirror at any aim', () => {
    fc.assert(
      fc.property(question, aim, fc.constantFrom(...catalogue), (q, a, item) => {
        const body = quickPlacementBody(q, { catalogueItemId: item.id, heightM: q.mirrorHeightM, ...a });
        const parsed = createPlacementBody.safeParse(body);
        expect(parsed.error?.issues).toBeUndefined();
        const placement = { ...body, viewerId: body.viewerId ?? null };
        expect(mountProblem({ mirror: mirrorOfSpec(item.mirror), placement, scene: quickScene(q) })).toBeNull();
      }),
      { numRuns: 300 },
    );
  });

  it('makes the zone exactly the opening’s width by the depth to see', () => {
    fc.assert(
      fc.property(question, (q) => {
        const ring = quickScene(q).zones[0].polygonM;
        expect(polygonArea([ring])).toBeCloseTo(q.openingWidthM * q.depthM, 6);
      }),
    );
  });

  it('keeps the viewer on the near side of the hiding wall, so the spot really is out of sight', () => {
    fc.assert(
      fc.property(question, (q) => {
        const viewer = quickScene(q).viewers[0];
        expect(viewer.positionM[0]).toBeLessThan(0);
        expect(viewer.positionM[1]).toBeGreaterThan(0);
      }),
    );
  });

  it('names every field that is missing or out of range in a sentence, and none when all are in range', () => {
    fc.assert(
      fc.property(question, (q) => {
        expect(quickProblems(q)).toEqual({});
      }),
    );
    const problems = quickProblems({ passageWidthM: 0.2, depthM: null });
    expect(problems.passageWidthM).toBe('The passage width must be between 1 m and 30 m.');
    expect(problems.depthM).toBe('Enter the depth to see.');
    expect(Object.keys(problems).sort()).toEqual([...QUICK_FIELDS].sort());
  });
});
