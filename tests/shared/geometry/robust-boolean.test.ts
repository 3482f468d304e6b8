import { coverage, poseFromAim, type Mirror, type Wall } from '../../../shared/optics';
import fs from 'node:fs';
import path from 'node:path';
import { GRID_M, robustDifference, robustIntersection, robustUnion } from '../../../shared/geometry/robust-boolean';
import type { MultiPolygon, Polygon } from '../../../shared/geometry/polygon';
import { multiPolygonArea } from '../../../shared/geometry/polygon';

// A fixture named after the case it pins: a 40 m × 25 m hall (8 m walls) with three racking
// blocks (6 m), in which polygon-clipping's plain difference threw "Unable to find segment" and
// "Unable to complete output ring" for these three poses. The mirror sits on the end face of the
// south-west rack (x = 16.21 m; at x = 16.05 m a fifth of it was inside the rack, which the
// placement rule now refuses and for which no region is meaningful).
const box = (x0: number, y0: number, x1: number, y1: number, h: number): Wall[] => [
  { aM: [x0, y0], bM: [x1, y0], heightM: h },
  { aM: [x1, y0], bM: [x1, y1], heightM: h },
  { aM: [x1, y1], bM: [x0, y1], heightM: h },
  { aM: [x0, y1], bM: [x0, y0], heightM: h },
];
const walls = [...box(0, 0, 40, 25, 8), ...box(4, 13.5, 18, 23, 6), ...box(21.5, 13.5, 36, 23, 6), ...box(4, 3, 16, 10, 6)];
const deg = Math.PI / 180;
const cases: [string, Mirror, number, number][] = [
  ['600 mm round aimed −25°, tilted 5°', { shape: 'round', diameterM: 0.6, radiusM: 1.2 }, -25, 5],
  ['600 mm round aimed −45°, tilted 15°', { shape: 'round', diameterM: 0.6, radiusM: 1.2 }, -45, 15],
  ['800 mm round aimed −25°, tilted 15°', { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, -25, 15],
];

describe('wall subtraction on nearly degenerate shadows', () => {
  it.each(cases)('gives a region for the %s that the hall walls confine', (_name, mirror, azDeg, tiltDeg) => {
    const pose = poseFromAim({ vertexM: [16.21, 10.05, 3.0], azimuthRad: azDeg * deg, tiltDownRad: tiltDeg * deg });
    const eyeM: [number, number, number] = [26, 6.5, 2.1];
    const far = coverage({ mirror, pose, eyeM, maxRangeM: 60, walls });
    // The farthest hall corner is 28 m from the mirror, so a 30 m range cuts nothing the walls leave.
    const near = coverage({ mirror, pose, eyeM, maxRangeM: 30, walls });
    expect(far.areaM2).toBeGreaterThan(1);
    expect(Math.abs(far.areaM2 - near.areaM2) / near.areaM2).toBeLessThan(1e-3);
    for (const poly of far.region)
      for (const [x, y] of poly[0]) {
        expect(x).toBeGreaterThanOrEqual(-0.01);
        expect(x).toBeLessThanOrEqual(40.01);
        expect(y).toBeGreaterThanOrEqual(-0.01);
        expect(y).toBeLessThanOrEqual(25.01);
      }
  });

  it('ends, and quickly, on the hall region and wall shadows that made polygon-clipping loop forever', () => {
    const f = JSON.parse(fs.readFileSync(path.join(__dirname, 'fixtures', 'polygon-clipping-hang.json'), 'utf8')) as {
      region: MultiPolygon;
      shadows: (Polygon | Polygon[0])[];
    };
    const shadows: Polygon[] = f.shadows.map((s) => (typeof (s as Polygon[0])[0][0] === 'number' ? [s as Polygon[0]] : (s as Polygon)));
    const t0 = Date.now();
    const out = robustDifference(f.region, ...shadows);
    // Generous for a loaded machine; the sweep takes milliseconds. Without the fix this never returns.
    expect(Date.now() - t0).toBeLessThan(5000);
    const area = multiPolygonArea(out);
    expect(area).toBeGreaterThan(0);
    expect(area).toBeLessThan(multiPolygonArea(f.region));
  });

  it('moves no vertex by more than half a grid step on each axis', () => {
    const square: MultiPolygon = [
      [
        [
          [0.12345678, 0.98765432],
          [5.00000004, 1.00000001],
          [5, 6],
          [0, 6],
          [0.12345678, 0.98765432],
        ],
      ],
    ];
    const out = robustUnion(square);
    expect(out).toHaveLength(1);
    for (const [x, y] of out[0][0]) {
      const nearest = square[0][0].reduce((best, p) => Math.min(best, Math.max(Math.abs(p[0] - x), Math.abs(p[1] - y))), Infinity);
      expect(nearest).toBeLessThanOrEqual(GRID_M / 2 + 1e-12);
    }
  });

  it('unions overlapping squares and intersects them, whatever the rings’ orientation', () => {
    const a: Polygon = [
      [
        [0, 0],
        [4, 0],
        [4, 4],
        [0, 4],
      ],
    ];
    const bCw: Polygon = [
      [
        [2, 2],
        [2, 6],
        [6, 6],
        [6, 2],
      ],
    ];
    // 16 + 16 − 4 and the 2 × 2 overlap: plain arithmetic.
    expect(multiPolygonArea(robustUnion(a, bCw))).toBeCloseTo(28, 9);
    expect(multiPolygonArea(robustIntersection(a, bCw))).toBeCloseTo(4, 9);
    // A square with a square hole, minus a bar across it: 64 − 16 − (8 × 1 − 4 × 1) = 44.
    const framed: Polygon = [
      [
        [0, 0],
        [8, 0],
        [8, 8],
        [0, 8],
      ],
      [
        [2, 2],
        [6, 2],
        [6, 6],
        [2, 6],
      ],
    ];
    expect(
      multiPolygonArea(
        robustDifference(framed, [
          [
            [0, 3.5],
            [8, 3.5],
            [8, 4.5],
            [0, 4.5],
          ],
        ]),
      ),
    ).toBeCloseTo(44, 9);
  });

  it('subtracts exactly when the input is well conditioned (10 × 10 minus 5 × 5 leaves 75 m²)', () => {
    const out = robustDifference(
      [
        [
          [0, 0],
          [10, 0],
          [10, 10],
          [0, 10],
        ],
      ],
      [
        [
          [0, 0],
          [5, 0],
          [5, 5],
          [0, 5],
        ],
      ],
    );
    expect(multiPolygonArea(out)).toBeCloseTo(75, 9);
  });
});
