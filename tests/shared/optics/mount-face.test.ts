import * as fc from 'fast-check';
import { coverage, poseFromAim, vertexOnFace, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { placeMirror } from '../../../shared/optics/mirror';
import { bodyReach, wallsThroughMirror } from '../../../shared/optics/mount';
import { robustIntersection } from '../../../shared/geometry/robust-boolean';
import { multiPolygonArea } from '../../../shared/geometry/polygon';

const deg = Math.PI / 180;
const round600: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 1.2 };
const halfDome: Mirror = { shape: 'dome', portion: 'half', diameterM: 0.61 };
const panel: Mirror = { shape: 'rect', widthM: 0.6, heightM: 0.8, radiusM: 1.6 };
/** A wall along x at y = 0; a mirror hangs on its −y face (normal −y). */
const WALL: Wall = { aM: [-30, 0], bM: [30, 0], heightM: 8 };
const FACE = { normal: [0, -1] as [number, number] };

/** Sagitta s = R − √(R² − a²) (docs/sources.md, "Geometry of a spherical mirror"). */
const sagitta = (R: number, a: number) => R - Math.sqrt(R * R - a * a);

describe('a mirror hung on a face', () => {
  it('stands a round mirror square to the wall off it by its sagitta, so its rim lies on the face', () => {
    const hung = vertexOnFace({ mirror: round600, onFaceM: [0, 0, 3], azimuthRad: -90 * deg, tiltDownRad: 0, face: FACE })!;
    expect(hung.standOffM).toBeCloseTo(sagitta(1.2, 0.3), 9);
    expect(hung.vertexM[1]).toBeCloseTo(-sagitta(1.2, 0.3), 9);
  });

  it.each([15, 40, 70])(
    'stands a round mirror turned %i° from square off by s·cos θ + a·sin θ (its rim circle’s rearmost point)',
    (turn) => {
      // The rim circle (radius a) lies s behind the vertex; turned θ from square, its rearmost point is
      // s·cos θ behind the vertex along the wall's normal, plus a·sin θ (plane geometry, from the figure).
      const hung = vertexOnFace({ mirror: round600, onFaceM: [0, 0, 3], azimuthRad: (-90 + turn) * deg, tiltDownRad: 0, face: FACE })!;
      const s = sagitta(1.2, 0.3);
      expect(hung.standOffM).toBeCloseTo(s * Math.cos(turn * deg) + 0.3 * Math.sin(turn * deg), 9);
    },
  );

  it('lays a half dome at its 45° mounting tilt flat on the wall: its sphere centre on the face, R·sin 45° behind the vertex', () => {
    const hung = vertexOnFace({ mirror: halfDome, onFaceM: [0, 0, 2.9], azimuthRad: -90 * deg, tiltDownRad: 45 * deg, face: FACE })!;
    expect(hung.standOffM).toBeCloseTo(0.305 * Math.SQRT1_2, 9);
  });

  it('refuses an aim that would face the mirror into the wall or along it, and a stand-off past the given limit', () => {
    expect(vertexOnFace({ mirror: round600, onFaceM: [0, 0, 3], azimuthRad: 90 * deg, tiltDownRad: 0.2, face: FACE })).toBeNull();
    expect(vertexOnFace({ mirror: round600, onFaceM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.2, face: FACE })).toBeNull();
    // Turned 70°: 0.30 m off the face (above), more than a 0.25 m arm allows.
    expect(
      vertexOnFace({ mirror: round600, onFaceM: [0, 0, 3], azimuthRad: -20 * deg, tiltDownRad: 0, face: { ...FACE, maxStandOffM: 0.25 } }),
    ).toBeNull();
  });

  const mirror = fc.oneof(
    fc
      .record({ d: fc.double({ min: 0.1, max: 1.2, noNaN: true }), k: fc.double({ min: 1.05, max: 6, noNaN: true }) })
      .map(({ d, k }): Mirror => ({ shape: 'round', diameterM: d, radiusM: (k * d) / 2 })),
    fc.constant(panel),
    fc.constant(halfDome),
    fc.constant<Mirror>({ shape: 'dome', portion: 'quarter', diameterM: 0.61 }),
  );
  const aim = fc.record({
    azimuthRad: fc.double({ min: -170 * deg, max: -10 * deg, noNaN: true }),
    tiltDownRad: fc.double({ min: 0, max: 45 * deg, noNaN: true }),
  });

  it('puts the back of any mirror on the face and the rest in front of it, so the wall never passes through it', () => {
    fc.assert(
      fc.property(mirror, aim, (m, a) => {
        const hung = vertexOnFace({ mirror: m, onFaceM: [0, 0, 3], ...a, face: FACE })!;
        const pose = poseFromAim({ vertexM: hung.vertexM, ...a });
        // The rearmost point of the body (toward +y, into the wall) is on the face, to 1 µm.
        expect(Math.abs(bodyReach(placeMirror(m, pose), [0, 1, 0]))).toBeLessThan(1e-6);
        expect(wallsThroughMirror({ mirror: m, pose, walls: [WALL] })).toEqual([]);
      }),
      { numRuns: 200 },
    );
  });

  it('sees the same floor in front of the wall with the wall it hangs on as without it', () => {
    // Neither leg's sightlines cross the face: eye → mirror and mirror → floor both stay in front of it.
    const eye = fc.record({
      x: fc.double({ min: -8, max: 8, noNaN: true }),
      y: fc.double({ min: -8, max: -0.5, noNaN: true }),
      z: fc.double({ min: 0.5, max: 2.5, noNaN: true }),
    });
    fc.assert(
      fc.property(mirror, aim, eye, (m, a, e) => {
        const hung = vertexOnFace({ mirror: m, onFaceM: [0, 0, 3], ...a, face: FACE })!;
        const pose = poseFromAim({ vertexM: hung.vertexM, ...a });
        const eyeM: Vec3 = [e.x, e.y, e.z];
        let without;
        try {
          without = coverage({ mirror: m, pose, eyeM, maxRangeM: 15, rimSamples: 64 });
        } catch {
          return; // the eye behind this mirror: no coverage to compare
        }
        const withWall = coverage({ mirror: m, pose, eyeM, maxRangeM: 15, rimSamples: 64, walls: [WALL] });
        const front = [
          [
            [-40, -40],
            [40, -40],
            [40, 0],
            [-40, 0],
            [-40, -40],
          ] as [number, number][],
        ];
        const a1 = multiPolygonArea(robustIntersection(without.region, front));
        const a2 = multiPolygonArea(robustIntersection(withWall.region, front));
        // Equal to the booleans' grid (0.1 mm) over the region's outline.
        expect(Math.abs(a1 - a2)).toBeLessThan(1e-3 + 1e-3 * a1);
      }),
      { numRuns: 60 },
    );
  });
});
