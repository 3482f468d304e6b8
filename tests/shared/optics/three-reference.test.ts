import { execFileSync } from 'child_process';
import * as path from 'path';
import * as fc from 'fast-check';
import { distanceToBoundary } from '../../../shared/geometry/polygon';
import {
  coverage,
  OpticsInputError,
  pointInMultiPolygon,
  poseFromAim,
  visibleInMirror,
  type Mirror,
  type MultiPolygon,
  type Pose,
  type Vec3,
} from '../../../shared/optics';
import { PLACEMENT_LIMITS } from '../../../shared/schemas/limits';

/**
 * three.js (SphereGeometry, Ray.intersectSphere, Vector3.reflect, Ray.intersectPlane) serves as
 * an independent ray tracer: three-reference.mjs lays its own grid over each mirror, traces
 * eye → grid vertex → reflection → plane, and returns the plane points hit within range. It is
 * given only the mirror's shape, pose, the eye, the plane and the range — never the engine's
 * outline or region. three.js ships as ES modules only, so it runs in a child Node process.
 */
const unit = fc.double({ min: 0, max: 1, noNaN: true, maxExcluded: true });
const mirrorArb: fc.Arbitrary<Mirror> = fc.oneof(
  fc
    .record({ d: fc.double({ min: 0.1, max: 1.5, noNaN: true }), q: unit })
    .map(({ d, q }) => ({ shape: 'round' as const, diameterM: d, radiusM: d / (2 * (0.05 + 0.94 * q)) })),
  fc
    .record({ w: fc.double({ min: 0.1, max: 1.2, noNaN: true }), h: fc.double({ min: 0.1, max: 1, noNaN: true }), q: unit })
    .map(({ w, h, q }) => ({ shape: 'rect' as const, widthM: w, heightM: h, radiusM: Math.hypot(w, h) / (2 * (0.05 + 0.94 * q)) })),
  fc
    .record({
      portion: fc.constantFrom('full' as const, 'half' as const, 'quarter' as const),
      diameterM: fc.double({ min: 0.2, max: 1.5, noNaN: true }),
    })
    .map((m) => ({ shape: 'dome' as const, ...m })),
);

type Placement = { mirror: Mirror; pose: Pose; eyeM: Vec3; planeHeightM: number; maxRangeM: number };
type RefCase = {
  mirror: Mirror;
  vertex: Vec3;
  axis: Vec3;
  eye: Vec3;
  planeHeight: number;
  maxRange: number;
  rings: number;
  segments: number;
};
type RefResult = { hits: [number, number, number, number, number, number][]; tiledArea: number };

/** Floor points within this distance of the region's edge are not judged: see coverage-space.test.ts. */
const EDGE_MARGIN_M = 0.02;

const placements: Placement[] = [];
const regions: MultiPolygon[] = [];
const areas: number[] = [];
fc.assert(
  fc.property(
    mirrorArb,
    fc.double({ min: 1, max: 8, noNaN: true }),
    fc.double({ min: PLACEMENT_LIMITS.azimuthRad.min, max: PLACEMENT_LIMITS.azimuthRad.max, noNaN: true }),
    fc.double({ min: PLACEMENT_LIMITS.tiltDownRad.min, max: PLACEMENT_LIMITS.tiltDownRad.max, noNaN: true }),
    fc.double({ min: 0.2, max: 12, noNaN: true }),
    fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
    fc.double({ min: 0.3, max: 6, noNaN: true }),
    fc.oneof(fc.constant(0), fc.double({ min: 0, max: 0.9, noNaN: true })),
    fc.double({ min: 3, max: 25, noNaN: true }),
    (mirror, heightM, az, tilt, eyeDist, eyeAngle, eyeZ, planeHeightM, maxRangeM) => {
      if (placements.length >= 70) return;
      const pose = poseFromAim({ vertexM: [0, 0, heightM], azimuthRad: az, tiltDownRad: tilt });
      const eyeM: Vec3 = [eyeDist * Math.cos(eyeAngle), eyeDist * Math.sin(eyeAngle), eyeZ];
      let res;
      try {
        res = coverage({ mirror, pose, eyeM, planeHeightM, maxRangeM });
      } catch (e) {
        if (e instanceof OpticsInputError) return; // eye behind the mirror, or the plane cuts it
        throw e;
      }
      // Keep mostly placements that see something, and a few that see nothing.
      if (res.areaM2 === 0 && placements.length % 5 !== 0) return;
      placements.push({ mirror, pose, eyeM, planeHeightM, maxRangeM });
      regions.push(res.region);
      areas.push(res.areaM2);
    },
  ),
  { numRuns: 2000, seed: 20261202 },
);
const cases: RefCase[] = placements.map((p) => ({
  mirror: p.mirror,
  vertex: p.pose.vertexM,
  axis: p.pose.axis,
  eye: p.eyeM,
  planeHeight: p.planeHeightM,
  maxRange: p.maxRangeM,
  rings: 60,
  segments: 120,
}));
const refs = JSON.parse(
  execFileSync(process.execPath, [path.join(__dirname, 'three-reference.mjs')], {
    input: JSON.stringify(cases),
    maxBuffer: 1 << 28,
  }).toString('utf8'),
) as RefResult[];

describe('the coverage region agrees with three.js tracing its own rays over the mirror', () => {
  it('covers at least 60 random placements, most of which see some of the plane', () => {
    expect(placements.length).toBeGreaterThanOrEqual(60);
    expect(refs).toHaveLength(placements.length);
    expect(refs.filter((r) => r.hits.length > 100).length).toBeGreaterThan(30);
  });

  it('finds every plane point the reference rays hit inside the region (away from its edge)', () => {
    let judged = 0;
    const outside: { caseIndex: number; point: [number, number]; edgeM: number }[] = [];
    refs.forEach((ref, i) => {
      const v = placements[i].pose.vertexM;
      for (const [x, y] of ref.hits) {
        if (placements[i].maxRangeM - Math.hypot(x - v[0], y - v[1]) < EDGE_MARGIN_M) continue;
        if (pointInMultiPolygon(regions[i], [x, y])) {
          judged++;
          continue;
        }
        const edgeM = distanceToBoundary(regions[i], [x, y]);
        if (edgeM < EDGE_MARGIN_M) continue;
        judged++;
        outside.push({ caseIndex: i, point: [x, y], edgeM });
      }
    });
    expect(judged).toBeGreaterThan(50_000);
    expect(outside.slice(0, 5)).toEqual([]);
  });

  it('sees nothing where the reference rays hit nothing', () => {
    refs.forEach((ref, i) => {
      if (ref.hits.length === 0) expect(areas[i]).toBeLessThan(0.05);
    });
  });

  it('has an area no smaller than the plane tiled by the reference grid cells', () => {
    let compared = 0;
    refs.forEach((ref, i) => {
      if (ref.tiledArea < 1) return;
      compared++;
      // The tiles are quadrilaterals through traced points, inside the seen part up to their
      // chords (2 % allowed for those). They leave out the seen area near the range circle and
      // the outline, where a cell straddles the edge, so they bound the area from below only.
      expect(areas[i]).toBeGreaterThan(0.98 * ref.tiledArea);
    });
    expect(compared).toBeGreaterThan(20);
  });

  it('finds the same reflection point with the exact point test as the reference rays (1e-6 m)', () => {
    let compared = 0;
    refs.forEach((ref, i) => {
      const p = placements[i];
      // A spread of this case's hits: every 97th.
      for (let k = 0; k < ref.hits.length; k += 97) {
        const [x, y, hx, hy, hz, onEdge] = ref.hits[k];
        if (onEdge) continue; // a grid vertex on the rim is on the mirror or not by rounding
        const vis = visibleInMirror({ mirror: p.mirror, pose: p.pose, eyeM: p.eyeM, pointM: [x, y, p.planeHeightM] });
        expect(vis.reflectionPointM).toBeDefined();
        const r = vis.reflectionPointM as Vec3;
        expect(Math.hypot(r[0] - hx, r[1] - hy, r[2] - hz)).toBeLessThan(1e-6);
        compared++;
      }
    });
    expect(compared).toBeGreaterThan(500);
  });
});
