import { coverage, domeMountTiltRad, fanRays, poseFromAim, type Mirror, type Vec3, type Wall } from '../../../shared/optics';
import { multiPolygonArea, ringLength, type MultiPolygon } from '../../../shared/geometry/polygon';
import { robustIntersection } from '../../../shared/geometry/robust-boolean';
import { agreement } from './helpers';

function perimeterM(mp: MultiPolygon): number {
  let sum = 0;
  for (const poly of mp) {
    for (const ring of poly) {
      const n = ringLength(ring);
      for (let i = 0; i < n; i++) sum += Math.hypot(ring[(i + 1) % n][0] - ring[i][0], ring[(i + 1) % n][1] - ring[i][1]);
    }
  }
  return sum;
}

const round: Mirror = { shape: 'round', diameterM: 0.8, radiusM: 1.6 };
const rect: Mirror = { shape: 'rect', widthM: 0.6, heightM: 0.4, radiusM: 1.0 };

describe('coverage polygon and exact point test agree', () => {
  it.each([
    [
      'a round aisle mirror seen from the side',
      round,
      poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 }),
      [5, 3, 1.6] as Vec3,
    ],
    [
      'a rectangular blind-spot mirror',
      rect,
      poseFromAim({ vertexM: [0, 0, 2], azimuthRad: 2.2, tiltDownRad: 0.5 }),
      [-1.5, 1.2, 1.9] as Vec3,
    ],
    [
      'a full dome under a ceiling',
      { shape: 'dome', portion: 'full', diameterM: 1 } as Mirror,
      poseFromAim({ vertexM: [0, 0, 3.5], azimuthRad: 0, tiltDownRad: domeMountTiltRad('full') }),
      [3, 1, 1.7] as Vec3,
    ],
    [
      'a half dome on a wall',
      { shape: 'dome', portion: 'half', diameterM: 0.9 } as Mirror,
      poseFromAim({ vertexM: [0, 0, 3.2], azimuthRad: 1, tiltDownRad: domeMountTiltRad('half') }),
      [2, 4, 1.6] as Vec3,
    ],
    [
      'a quarter dome in a corner',
      { shape: 'dome', portion: 'quarter', diameterM: 0.8 } as Mirror,
      poseFromAim({ vertexM: [0, 0, 3.2], azimuthRad: Math.PI / 4, tiltDownRad: domeMountTiltRad('quarter') }),
      [4, 1.5, 1.6] as Vec3,
    ],
  ])('for %s, on random floor points away from the edge', (_label, mirror, pose, eyeM) => {
    const maxRangeM = 14;
    const { region, areaM2 } = coverage({ mirror, pose, eyeM, maxRangeM });
    expect(areaM2).toBeGreaterThan(1);
    const a = agreement({ region, mirror, pose, eyeM, maxRangeM, halfBoxM: 15, n: 3000, marginM: 0.02, seed: 7 });
    expect(a.inside).toBeGreaterThan(50);
    expect(a.disagree).toBe(0);
    // Measured bound of the outline's chord error with 256 rays: disagreements stay within 2 cm of the edge.
    expect(a.worstM).toBeLessThan(0.02);
  });

  it('agrees on a raised plane (a child’s head height)', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 });
    const eyeM: Vec3 = [5, 3, 1.6];
    const { region } = coverage({ mirror: round, pose, eyeM, maxRangeM: 12, planeHeightM: 1.1 });
    const a = agreement({
      region,
      mirror: round,
      pose,
      eyeM,
      maxRangeM: 12,
      planeHeightM: 1.1,
      halfBoxM: 13,
      n: 2000,
      marginM: 0.02,
      seed: 3,
    });
    expect(a.inside).toBeGreaterThan(30);
    expect(a.disagree).toBe(0);
  });
});

describe('walls', () => {
  const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 });
  const eyeM: Vec3 = [5, 3, 1.6];
  const walls: Wall[] = [
    { aM: [4, -3], bM: [6, -4], heightM: 2.0 },
    { aM: [8, -1], bM: [9, 2], heightM: 1.2 },
    { aM: [2.5, 1.0], bM: [3.0, 2.5], heightM: 2.15 }, // between the eye and the mirror
    { aM: [3, -6], bM: [10, -6], heightM: 3.5 }, // taller than the mirror: its shadow runs out of range
  ];

  it('remove floor from the region', () => {
    const open = coverage({ mirror: round, pose, eyeM, maxRangeM: 14 }).areaM2;
    const walled = coverage({ mirror: round, pose, eyeM, maxRangeM: 14, walls }).areaM2;
    expect(walled).toBeLessThan(open - 5);
  });

  it('shadows agree with the exact point test, on both legs of the sightline', () => {
    const { region } = coverage({ mirror: round, pose, eyeM, maxRangeM: 14, walls });
    const a = agreement({ region, mirror: round, pose, eyeM, maxRangeM: 14, walls, halfBoxM: 15, n: 6000, marginM: 0.02, seed: 11 });
    expect(a.inside).toBeGreaterThan(100);
    expect(a.disagree).toBe(0);
    // Measured bound of the shadow approximation (straight edges between exact top-edge points).
    expect(a.worstM).toBeLessThan(0.02);
  });

  it('a wall lower than the plane hides nothing', () => {
    const low: Wall[] = [{ aM: [4, -3], bM: [6, -4], heightM: 0.5 }];
    const a = coverage({ mirror: round, pose, eyeM, maxRangeM: 14, planeHeightM: 1 }).areaM2;
    const b = coverage({ mirror: round, pose, eyeM, maxRangeM: 14, planeHeightM: 1, walls: low }).areaM2;
    expect(b).toBeCloseTo(a, 9);
  });

  it('a wall the mirror is mounted on does not hide the mirror', () => {
    const mounted: Wall[] = [{ aM: [-0.05, -3], bM: [-0.05, 3], heightM: 4 }];
    const p = poseFromAim({ vertexM: [0.1, 0, 3], azimuthRad: 0, tiltDownRad: 0.35 });
    const a = coverage({ mirror: round, pose: p, eyeM: [5, 2, 1.6], maxRangeM: 14 }).areaM2;
    const b = coverage({ mirror: round, pose: p, eyeM: [5, 2, 1.6], maxRangeM: 14, walls: mounted }).areaM2;
    expect(b).toBeCloseTo(a, 6);
  });
});

describe('coverage region shape', () => {
  it('is symmetric when the mirror and eye are symmetric about a vertical plane', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.3 });
    const { region } = coverage({ mirror: rect, pose, eyeM: [4, 0, 1.6], maxRangeM: 10 });
    const mirrored = region.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x, -y] as [number, number]).reverse()));
    // The region and its mirror image cover the same floor: their symmetric difference is no
    // more than the polygon's own error band (3 mm tracing + 1 mm simplification) along its edge.
    const both = multiPolygonArea(robustIntersection(region, mirrored));
    const xorM2 = multiPolygonArea(region) + multiPolygonArea(mirrored) - 2 * both;
    expect(multiPolygonArea(region)).toBeGreaterThan(5);
    expect(xorM2).toBeLessThan(perimeterM(region) * 0.008);
    const a = agreement({
      region: mirrored,
      mirror: rect,
      pose,
      eyeM: [4, 0, 1.6],
      maxRangeM: 10,
      halfBoxM: 11,
      n: 2000,
      marginM: 0.01,
      seed: 5,
    });
    expect(a.disagree).toBe(0);
  });

  it('gives mirror-image regions for mirror-image placements (eye and aim reflected about a vertical plane)', () => {
    const eyeM: Vec3 = [4, 1.2, 1.6];
    const a = coverage({
      mirror: rect,
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.4, tiltDownRad: 0.3 }),
      eyeM,
      maxRangeM: 10,
    }).region;
    const b = coverage({
      mirror: rect,
      pose: poseFromAim({ vertexM: [0, 0, 3], azimuthRad: -0.4, tiltDownRad: 0.3 }),
      eyeM: [4, -1.2, 1.6],
      maxRangeM: 10,
    }).region;
    const aMirrored = a.map((poly) => poly.map((ring) => ring.map(([x, y]) => [x, -y] as [number, number]).reverse()));
    const both = multiPolygonArea(robustIntersection(aMirrored, b));
    const xorM2 = multiPolygonArea(aMirrored) + multiPolygonArea(b) - 2 * both;
    expect(multiPolygonArea(b)).toBeGreaterThan(5);
    expect(xorM2).toBeLessThan(perimeterM(b) * 0.008);
  });

  it('exposes the fan rays it traced, starting on the mirror and ending on the plane or at the range', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.3 });
    const rays = fanRays({ mirror: round, pose, eyeM: [4, 0, 1.6], maxRangeM: 10, samples: 16 });
    expect(rays).toHaveLength(16);
    for (const r of rays) {
      if (r.meetsPlane) expect(Math.abs(r.toM[2])).toBeLessThan(1e-12);
      else expect(Math.hypot(r.toM[0] - r.fromM[0], r.toM[1] - r.fromM[1])).toBeCloseTo(10, 9);
    }
  });
});

describe('many walls', () => {
  it('agree with the exact point test for 120 random racks around a mirror', () => {
    const r = (() => {
      let a = 2024;
      return () => {
        a = (a * 1103515245 + 12345) % 2147483648;
        return a / 2147483648;
      };
    })();
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.3, tiltDownRad: 0.35 });
    const eyeM: Vec3 = [5, 3, 1.6];
    const walls: Wall[] = [];
    while (walls.length < 120) {
      const x = -16 + 32 * r();
      const y = -16 + 32 * r();
      const a = r() * Math.PI;
      const len = 0.5 + 2.5 * r();
      if (Math.hypot(x, y) < 1.5 || Math.hypot(x - eyeM[0], y - eyeM[1]) < 1) continue;
      walls.push({ aM: [x, y], bM: [x + len * Math.cos(a), y + len * Math.sin(a)], heightM: 0.8 + 2.4 * r() });
    }
    const { region } = coverage({ mirror: round, pose, eyeM, maxRangeM: 14, walls });
    const a = agreement({ region, mirror: round, pose, eyeM, maxRangeM: 14, walls, halfBoxM: 15, n: 5000, marginM: 0.02, seed: 13 });
    expect(a.inside).toBeGreaterThan(20);
    expect(a.disagree).toBe(0);
  });
});
