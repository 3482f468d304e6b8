import { difference, intersection } from 'polygon-clipping';
import { clipCurveToDisc } from '../../../shared/geometry/clip-disc';
import { intersectionAreaWithPieces, signedPieces, triangulateRing } from '../../../shared/geometry/clip-area';
import {
  circleRing,
  isSimpleRing,
  multiPolygonArea,
  pointInPolygon,
  polygonArea,
  signedRingArea,
  type Ring,
} from '../../../shared/geometry/polygon';

const square: Ring = [
  [0, 0],
  [4, 0],
  [4, 3],
  [0, 3],
];
const ell: Ring = [
  [0, 0],
  [6, 0],
  [6, 2],
  [2, 2],
  [2, 5],
  [0, 5],
];

describe('shoelace area and orientation', () => {
  it('gives a 4 × 3 rectangle an area of 12 m², positive counter-clockwise and negative clockwise', () => {
    expect(signedRingArea(square)).toBe(12);
    expect(signedRingArea([...square].reverse())).toBe(-12);
  });

  it('subtracts holes from a polygon', () => {
    expect(
      polygonArea([
        square,
        [
          [1, 1],
          [2, 1],
          [2, 2],
          [1, 2],
        ],
      ]),
    ).toBe(11);
  });

  it('ignores a repeated closing point', () => {
    expect(signedRingArea([...ell, ell[0]])).toBe(signedRingArea(ell));
    expect(signedRingArea(ell)).toBe(6 * 2 + 2 * 3);
  });
});

describe('simple polygon test', () => {
  it.each([
    ['a rectangle', square, true],
    ['an L shape', ell, true],
    [
      'a bow-tie',
      [
        [0, 0],
        [2, 2],
        [2, 0],
        [0, 2],
      ] as Ring,
      false,
    ],
    [
      'two points',
      [
        [0, 0],
        [1, 1],
      ] as Ring,
      false,
    ],
    [
      'a ring that touches itself at a vertex',
      [
        [0, 0],
        [4, 0],
        [2, 2],
        [4, 4],
        [0, 4],
        [2, 2],
      ] as Ring,
      false,
    ],
    [
      'a ring with a NaN corner',
      [
        [0, 0],
        [1, NaN],
        [1, 1],
      ] as Ring,
      false,
    ],
  ])('calls %s simple: %s', (_label, ring, expected) => {
    expect(isSimpleRing(ring)).toBe(expected);
  });
});

describe('point in polygon', () => {
  it('finds points inside an L shape and not in its notch', () => {
    expect(pointInPolygon([ell], [1, 4])).toBe(true);
    expect(pointInPolygon([ell], [4, 4])).toBe(false);
  });
  it('treats points in a hole as outside', () => {
    expect(
      pointInPolygon(
        [
          square,
          [
            [1, 1],
            [2, 1],
            [2, 2],
            [1, 2],
          ],
        ],
        [1.5, 1.5],
      ),
    ).toBe(false);
  });
});

describe('clipping a curve to a disc', () => {
  const toArrays = (ring: Ring): [Float64Array, Float64Array, number] => [
    Float64Array.from(ring.map((p) => p[0])),
    Float64Array.from(ring.map((p) => p[1])),
    ring.length,
  ];

  it('agrees with polygon-clipping on a star crossing the circle many times', () => {
    const star: Ring = [];
    for (let k = 0; k < 40; k++) {
      const a = (2 * Math.PI * k) / 40;
      const r = k % 2 ? 3 : 7;
      star.push([1 + r * Math.cos(a), r * Math.sin(a)]);
    }
    const [xs, ys, n] = toArrays(star);
    const step = (2 * Math.PI) / 2048;
    const ours = clipCurveToDisc(xs, ys, n, 0, 0, 5, step);
    const ref = intersection([star], [circleRing([0, 0], 5, 2048)]);
    expect(ours.length).toBe(ref.length);
    // Both approximate the circle by chords of 2π/2048; they differ only in where the chords start.
    expect(Math.abs(multiPolygonArea(ours) - multiPolygonArea(ref))).toBeLessThan(1e-3);
    expect(multiPolygonArea(difference(ours, ref)) + multiPolygonArea(difference(ref, ours))).toBeLessThan(1e-3);
  });

  it('returns the whole disc when the curve surrounds it, and nothing when it misses it', () => {
    const big = toArrays([
      [-10, -10],
      [10, -10],
      [10, 10],
      [-10, 10],
    ]);
    const far = toArrays([
      [20, 20],
      [21, 20],
      [21, 21],
    ]);
    const disc = clipCurveToDisc(...big, 0, 0, 1, 0.01);
    expect(multiPolygonArea(disc)).toBeCloseTo(Math.PI, 3);
    expect(clipCurveToDisc(...far, 0, 0, 1, 0.01)).toEqual([]);
  });

  it('accepts a clockwise curve', () => {
    const cw = toArrays([
      [-2, -0.5],
      [-2, 0.5],
      [2, 0.5],
      [2, -0.5],
    ]);
    const out = clipCurveToDisc(...cw, 0, 0, 1, 1e-3);
    expect(out).toHaveLength(1);
    expect(signedRingArea(out[0][0])).toBeGreaterThan(0);
  });
});

describe('area of a region inside a zone via triangles', () => {
  it('triangulates an L shape into triangles of the same total area', () => {
    const tris = triangulateRing(ell);
    expect(tris).toHaveLength(4);
    expect(tris.reduce((s, t) => s + signedRingArea(t), 0)).toBeCloseTo(18, 12);
  });

  it('matches polygon-clipping for a circle over an L shape with a hole', () => {
    const zone = [
      ell,
      [
        [0.5, 3],
        [1.5, 3],
        [1.5, 4],
        [0.5, 4],
      ] as Ring,
    ];
    const region = [[circleRing([2, 2], 2.5, 300)]];
    const ref = multiPolygonArea(intersection(zone, region));
    expect(intersectionAreaWithPieces(region, signedPieces(zone))).toBeCloseTo(ref, 9);
  });
});
