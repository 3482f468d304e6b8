import { GRID_M } from '../../../shared/geometry/robust-boolean';
import {
  coverage,
  defaultAims,
  OpticsInputError,
  poseFromAim,
  rankOptions,
  recognisableRange,
  sphereRadiusM,
  zoneCoverage,
  ARCMIN_RAD,
  type CatalogueItem,
  type Polygon,
  type Vec3,
  type Wall,
} from '../../../shared/optics';
import { wallsThroughMirror } from '../../../shared/optics/mount';
import * as fc from 'fast-check';
import { circleRing } from '../../../shared/geometry/polygon';

describe('zone coverage', () => {
  const zone: Polygon = [
    [
      [0, 0],
      [4, 0],
      [4, 2],
      [0, 2],
    ],
  ];

  it('counts overlapping regions once (union)', () => {
    const left = [
      [
        [
          [-1, -1],
          [3, -1],
          [3, 3],
          [-1, 3],
        ],
      ],
    ] as Polygon[];
    const right = [
      [
        [
          [1, -1],
          [5, -1],
          [5, 3],
          [1, 3],
        ],
      ],
    ] as Polygon[];
    const both = zoneCoverage({ zone, regions: [left, right] });
    expect(both.fraction).toBeCloseTo(1, 12);
    expect(both.coveredM2).toBeCloseTo(8, 12);
    expect(zoneCoverage({ zone, regions: [left] }).coveredM2).toBeCloseTo(6, 12);
  });

  it('gives zero for no regions', () => {
    expect(zoneCoverage({ zone, regions: [] })).toEqual({ fraction: 0, coveredM2: 0 });
  });

  it('scores a traced mirror region against a zone', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.35 });
    const { region, areaM2 } = coverage({
      mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 },
      pose,
      eyeM: [5, 3, 1.6],
      maxRangeM: 12,
    });
    const huge: Polygon = [circleRing([0, 0], 13, 512)];
    // The zone step runs on the booleans' 0.1 mm grid: each vertex moves at most half a step per
    // axis, so the area moves at most perimeter × GRID_M.
    let perimeter = 0;
    for (const poly of region)
      for (const ring of poly)
        for (let k = 0; k + 1 < ring.length; k++) perimeter += Math.hypot(ring[k + 1][0] - ring[k][0], ring[k + 1][1] - ring[k][1]);
    expect(Math.abs(zoneCoverage({ zone: huge, regions: [region] }).coveredM2 - areaM2)).toBeLessThanOrEqual(perimeter * GRID_M);
  });
});

describe('ranking mirror options for a zone', () => {
  const zone: Polygon = [
    [
      [3, -6],
      [9, -6],
      [9, -2],
      [3, -2],
    ],
  ];
  const eyeM: Vec3 = [6, 2, 1.6];
  const mountPoints = [
    { id: 'corner', vertexM: [0, 0, 3] as Vec3 },
    { id: 'column', vertexM: [10, 0, 3] as Vec3 },
  ];
  const catalogue: CatalogueItem[] = [
    { id: 'r400', mirror: { shape: 'round', diameterM: 0.4, radiusM: 0.8 }, cost: 80 },
    { id: 'r800', mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, cost: 210 },
    { id: 'r800-twin', mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, cost: 190 },
  ];
  // Target: a person, 1.7 m, at the Snellen-letter angle of 5′ (common practice; docs/sources.md, "Human factors").
  const target = { sizeM: 1.7, minAngleRad: 5 * ARCMIN_RAD };

  it('returns options best first with exact, consistent numbers', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, limit: 5 });
    expect(ranked.length).toBe(5);
    for (let k = 1; k < ranked.length; k++) {
      expect(Math.floor(ranked[k].fraction / 0.01 + 1e-9)).toBeLessThanOrEqual(Math.floor(ranked[k - 1].fraction / 0.01 + 1e-9));
    }
    const best = ranked[0];
    const check = coverage({ mirror: best.item.mirror, pose: best.pose, eyeM, maxRangeM: best.rangeM });
    expect(zoneCoverage({ zone, regions: [check.region] }).fraction).toBeCloseTo(best.fraction, 9);
    expect(best.fraction).toBeGreaterThan(0.3);
  });

  it('prefers the cheaper of two identical mirrors', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, limit: 20 });
    const twin = ranked.findIndex((o) => o.item.id === 'r800-twin');
    const dear = ranked.findIndex(
      (o) =>
        o.item.id === 'r800' &&
        o.mountPoint.id === ranked[twin].mountPoint.id &&
        o.aim.azimuthRad === ranked[twin].aim.azimuthRad &&
        o.aim.tiltDownRad === ranked[twin].aim.tiltDownRad,
    );
    expect(twin).toBeGreaterThanOrEqual(0);
    if (dear >= 0) expect(twin).toBeLessThan(dear);
  });

  it('refuses an empty catalogue with a sentence', () => {
    expect(() => rankOptions({ catalogue: [], mountPoints, eyeM, zone, target })).toThrow(OpticsInputError);
  });
});

describe('ranking against a brute-force search with walls', () => {
  // A 6 m × 8 m zone with a 5 m rack along its south side. The mount south of the rack sees the
  // whole zone when walls are ignored, but the rack hides the mirror from the driver and the
  // zone from the mirror; the mount 6 m north of the zone sees its north part only (range 8 m).
  const zone: Polygon = [
    [
      [0, 0],
      [8, 0],
      [8, 6],
      [0, 6],
    ],
  ];
  const eyeM: Vec3 = [4, 10, 1.6];
  const walls: Wall[] = [{ aM: [-2, -0.5], bM: [10, -0.5], heightM: 5 }];
  const mountPoints = [
    { id: 'behind-rack', vertexM: [4, -1, 3] as Vec3 },
    { id: 'north', vertexM: [4, 12, 3] as Vec3 },
  ];
  const catalogue: CatalogueItem[] = [0.4, 0.5, 0.6, 0.7, 0.8].map((d) => ({
    id: `r${Math.round(d * 1000)}`,
    mirror: { shape: 'round', diameterM: d, radiusM: 2 * d },
    cost: 200 * d,
  }));
  // Target: a person, 1.7 m, at 5′ (common practice).
  const target = { sizeM: 1.7, minAngleRad: 5 * ARCMIN_RAD };
  const maxRangeM = 8;
  const step = 0.01;

  /** Every option traced exactly with walls, ranked by the documented key. */
  function bruteForce(): { item: string; mount: string; fraction: number; rangeM: number; cost: number }[] {
    const all: { item: string; mount: string; fraction: number; rangeM: number; cost: number }[] = [];
    for (const item of catalogue) {
      for (const mount of mountPoints) {
        const D = Math.hypot(eyeM[0] - mount.vertexM[0], eyeM[1] - mount.vertexM[1], eyeM[2] - mount.vertexM[2]);
        const rangeM = recognisableRange({
          radiusM: sphereRadiusM(item.mirror),
          eyeDistanceM: D,
          targetSizeM: target.sizeM,
          minAngleRad: target.minAngleRad,
        }).rangeM;
        for (const aim of defaultAims(mount.vertexM, zone)) {
          const pose = poseFromAim({ vertexM: mount.vertexM, ...aim });
          let region;
          try {
            region = coverage({ mirror: item.mirror, pose, eyeM, maxRangeM: Math.min(maxRangeM, rangeM), walls }).region;
          } catch (e) {
            if (e instanceof OpticsInputError) continue; // eye behind the mirror: not an option
            throw e;
          }
          all.push({
            item: item.id,
            mount: mount.id,
            fraction: zoneCoverage({ zone, regions: [region] }).fraction,
            rangeM,
            cost: item.cost,
          });
        }
      }
    }
    const key = (o: { fraction: number; rangeM: number; cost: number }) => [
      Math.floor(o.fraction / step + 1e-9),
      o.rangeM,
      -o.cost,
      o.fraction,
    ];
    return all.sort((a, b) => {
      const ka = key(a);
      const kb = key(b);
      for (let i = 0; i < ka.length; i++) if (ka[i] !== kb[i]) return kb[i] - ka[i];
      return 0;
    });
  }

  let brute: ReturnType<typeof bruteForce> = [];
  beforeAll(() => {
    brute = bruteForce();
  });

  it('puts the best option with walls first, not one the rack hides completely', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, walls, maxRangeM, limit: 3 });
    expect(brute[0].fraction).toBeGreaterThan(0.25);
    expect(ranked[0].fraction).toBeGreaterThan(0.25);
    expect(ranked[0].mountPoint.id).toBe('north');
    expect(ranked.map((o) => o.fraction)).toEqual(brute.slice(0, 3).map((o) => o.fraction));
  });

  it('returns the same top options as the brute-force search, in the same order', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, walls, maxRangeM, limit: 8 });
    expect(ranked.map((o) => [o.item.id, o.mountPoint.id, o.fraction])).toEqual(
      brute.slice(0, 8).map((o) => [o.item, o.mount, o.fraction]),
    );
  });
});

describe('sizing search beside a wall', () => {
  // An invented corner: a wall along x = 0, mount points a hand's width out from its east face.
  // However good an aim would look, one that swings the mirror's rim into the wall is no answer.
  const walls: Wall[] = [{ aM: [0, -10], bM: [0, 10], heightM: 3 }];
  const catalogue: CatalogueItem[] = [
    { id: 'r600', mirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 }, cost: 100 },
    { id: 'r800', mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.0 }, cost: 150 },
    { id: 'rect', mirror: { shape: 'rect', widthM: 0.6, heightM: 0.4, radiusM: 1.2 }, cost: 120 },
  ];

  it('ranks only options whose mirror is clear of the wall, wherever the zone and eye are', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 8, noNaN: true }),
        fc.double({ min: -6, max: 6, noNaN: true }),
        fc.double({ min: 1, max: 8, noNaN: true }),
        fc.double({ min: -6, max: 6, noNaN: true }),
        fc.double({ min: 0.02, max: 0.5, noNaN: true }),
        (zx, zy, ex, ey, gapM) => {
          const zone: Polygon = [
            [
              [zx - 1, zy - 1],
              [zx + 1, zy - 1],
              [zx + 1, zy + 1],
              [zx - 1, zy + 1],
            ],
          ];
          const ranked = rankOptions({
            catalogue,
            mountPoints: [{ id: 'face', vertexM: [gapM, 0, 2.6] }],
            eyeM: [ex, ey, 1.6],
            zone,
            target: { sizeM: 1.7, minAngleRad: ARCMIN_RAD * 10 },
            walls,
            limit: 5,
          });
          for (const o of ranked) {
            expect(
              wallsThroughMirror({ mirror: o.item.mirror, pose: poseFromAim({ vertexM: o.mountPoint.vertexM, ...o.aim }), walls }),
            ).toEqual([]);
          }
        },
      ),
      { numRuns: 15 },
    );
  });
});
