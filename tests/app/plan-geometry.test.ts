import { scaleBar, uncoveredPart } from '@/components/plan/plan-geometry';
import { multiPolygonArea, type Ring } from '@/shared/geometry/polygon';

const zone: Ring = [
  [0, 0],
  [10, 0],
  [10, 10],
  [0, 10],
];

describe('the uncovered part of a zone', () => {
  it('is the zone minus what the mirrors show', () => {
    // Left half covered: 50 m² of the 100 m² square stay uncovered (shoelace area of a 5 m × 10 m rectangle).
    const gap = uncoveredPart(
      zone,
      [
        [
          [
            [
              [-1, -1],
              [5, -1],
              [5, 11],
              [-1, 11],
            ],
          ],
        ],
      ],
      'Crossing',
    );
    expect(gap.ok && multiPolygonArea(gap.region)).toBeCloseTo(50, 9);
  });

  it('says in a sentence that the gap could not be drawn when the boolean operation fails, instead of showing no gap', () => {
    // A coverage outline with a coordinate that is not a number: the booleans refuse it rather than guess.
    const gap = uncoveredPart(
      zone,
      [
        [
          [
            [
              [0, 0],
              [Number.NaN, 0],
              [5, 10],
            ],
          ],
        ],
      ],
      'Crossing',
    );
    expect(gap).toEqual({ ok: false, problem: expect.stringContaining('“Crossing” could not be drawn') });
  });
});

describe('the plan scale bar', () => {
  it('takes the shortest round length that is at least 60 px long', () => {
    // 10 px per metre: 5 m is 50 px (too short), 10 m is 100 px.
    expect(scaleBar({ scale: 10, offsetX: 0, offsetY: 0 }, 'metric')).toEqual({ lengthPx: 100, label: '10 m' });
    // 10 px per metre in feet: 20 ft = 6.096 m = 60.96 px, the first at or above 60 px.
    expect(scaleBar({ scale: 10, offsetX: 0, offsetY: 0 }, 'imperial').label).toBe('20 ft');
  });
});
