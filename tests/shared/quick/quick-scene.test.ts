import * as fc from 'fast-check';
import { createPlacementBody, createProjectBody } from '../../../shared/schemas';
import { poseFromAim, vertexOnFace } from '../../../shared/optics';
import { placeMirror } from '../../../shared/optics/mirror';
import { bodyReach, wallsThroughMirror } from '../../../shared/optics/mount';
import { mirrorOfSpec } from '../../../shared/project-optics';
import { polygonArea } from '../../../shared/geometry/polygon';
import {
  QUICK_FIELDS,
  QUICK_FAR_WALL_NORMAL,
  QUICK_LIMITS,
  quickMirrorPosition,
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
/** Aims facing out of the far wall (toward −y, the passage), from nearly along it one way to nearly along it the other. */
const aim = fc.record({
  azimuthRad: fc.double({ min: -Math.PI + 1e-3, max: -1e-3, noNaN: true }),
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

  it('hangs every catalogue mirror at every aim facing out of the far wall with its back on that wall, in a placement the API accepts', () => {
    fc.assert(
      fc.property(question, aim, fc.constantFrom(...catalogue), (q, a, item) => {
        const mirror = mirrorOfSpec(item.mirror);
        const [x, y] = quickMirrorPosition(q);
        const hung = vertexOnFace({ mirror, onFaceM: [x, y, q.mirrorHeightM], ...a, face: { normal: QUICK_FAR_WALL_NORMAL } });
        expect(hung).not.toBeNull();
        const positionM: [number, number] = [hung!.vertexM[0], hung!.vertexM[1]];
        const body = quickPlacementBody({ catalogueItemId: item.id, positionM, heightM: q.mirrorHeightM, ...a });
        expect(createPlacementBody.safeParse(body).error?.issues).toBeUndefined();
        const scene = quickScene(q);
        const walls = scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM }));
        const far = scene.walls.findIndex((w) => w.id === 'far-side-of-passage');
        const pose = poseFromAim({ vertexM: [...positionM, q.mirrorHeightM], ...a });
        // Its back on the far wall's face (to 0.1 mm), the rest of it in front: that wall never passes through it
        // (another wall may, in a narrow passage; the ranking skips those aims).
        const rearY = bodyReach(placeMirror(mirror, pose), [0, 1, 0]);
        expect(Math.abs(rearY - q.passageWidthM)).toBeLessThan(1e-4);
        expect(wallsThroughMirror({ mirror, pose, walls }).map((h) => h.wallIndex)).not.toContain(far);
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
