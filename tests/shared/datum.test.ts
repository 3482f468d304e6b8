/**
 * Locating a point on site from walls (shared/datum.ts). The rooms below are small enough to work
 * by hand; each expected distance is read off the drawing in the comment beside it.
 */
import * as fc from 'fast-check';
import { describeDimension, locate, MAX_TAPE_M, wallNames, type DatumWall, type Dimension } from '../../shared/datum';

const wall = (a: [number, number], b: [number, number], kind: DatumWall['kind'] = 'wall'): DatumWall => ({ kind, aM: a, bM: b });
/** A 10 m × 8 m room with its south-west corner at the origin: W1 south, W2 east, W3 north, W4 west. */
const room: DatumWall[] = [wall([0, 0], [10, 0]), wall([10, 0], [10, 8]), wall([10, 8], [0, 8]), wall([0, 8], [0, 0])];
const metres = (m: number) => `${m.toFixed(2)} m`;
const words = (dims: readonly Dimension[]) => dims.map((d) => describeDimension(d, metres));

describe('locate', () => {
  it('measures from the nearest wall face and then from the nearest wall square to it', () => {
    // (3, 2): 2 m above the south wall W1, 3 m right of the west wall W4.
    expect(words(locate([3, 2], room))).toEqual(['2.00 m from wall W1 (north face)', '3.00 m from wall W4 (east face)']);
  });

  it('passes over a wall when racking stands across the tape', () => {
    // Racking R1 seen end-on, from (3, 0.5) to (3, 1.5), stands on the tape from (3, 2) down to W1;
    // its own face does not reach across from the point. W4 (3 m) and W3 (6 m) remain.
    const walls = [...room, wall([3, 0.5], [3, 1.5], 'racking')];
    expect(words(locate([3, 2], walls))).toEqual(['3.00 m from wall W4 (east face)', '6.00 m from wall W3 (south face)']);
    const behind = [...room, wall([1, 1.5], [6, 1.5], 'racking'), wall([2, 1.4], [2, 2.6], 'racking')];
    // From (3, 2): R1 0.5 m south, R2 1 m west (clear), so both come from racking.
    expect(words(locate([3, 2], behind))).toEqual(['0.50 m from racking R1 (north face)', '1.00 m from racking R2 (east face)']);
  });

  it('does not measure from a wall whose face does not reach across from the point', () => {
    // A 1 m wall far to the right of x = 3 (from x = 8 to 9 at y = 1.5) is nearer than W1 in a straight line only off its end.
    const walls = [...room, wall([8, 1.5], [9, 1.5])];
    expect(words(locate([3, 2], walls))[0]).toBe('2.00 m from wall W1 (north face)');
  });

  it('never measures from a doorway', () => {
    const walls = [wall([0, 0], [10, 0], 'door'), ...room.slice(1)];
    expect(words(locate([3, 2], walls))).toEqual(['3.00 m from wall W3 (east face)', '6.00 m from wall W2 (south face)']);
  });

  it('falls back to the origin grid along a lone wall', () => {
    // One north-south wall at x = 0: the second dimension runs along it, from grid line y = 0.
    expect(words(locate([2.5, -4], [wall([0, -10], [0, 10])]))).toEqual([
      '2.50 m from wall W1 (east face)',
      '4.00 m south of grid line y = 0',
    ]);
  });

  it('gives way to both grid lines beside a lone wall at 45°, whose tape no grid line crosses squarely', () => {
    expect(words(locate([1, 3], [wall([0, 0], [10, 10])]))).toEqual(['1.00 m east of grid line x = 0', '3.00 m north of grid line y = 0']);
  });

  it('uses both origin grid lines when no wall is within a tape length', () => {
    expect(words(locate([-40, 45], room))).toEqual(['40.00 m west of grid line x = 0', '45.00 m north of grid line y = 0']);
  });

  it('names walls and racking apart, in plan order, and leaves doorways unnamed', () => {
    expect(wallNames([{ kind: 'wall' }, { kind: 'racking' }, { kind: 'door' }, { kind: 'wall' }, { kind: 'racking' }])).toEqual([
      'W1',
      'R1',
      null,
      'W2',
      'R2',
    ]);
  });
});

describe('locate over every accepted scene (points within 2 km of the origin)', () => {
  const coord = fc.double({ min: -2000, max: 2000, noNaN: true });
  const near = (base: number) => fc.double({ min: base - 40, max: base + 40, noNaN: true });
  // Walls clustered near the point, as on a real plan, so the rule has walls to choose from.
  const scene = fc.tuple(coord, coord).chain(([x, y]) =>
    fc.record({
      point: fc.constant<[number, number]>([x, y]),
      walls: fc.array(
        fc.record({
          kind: fc.constantFrom<DatumWall['kind']>('wall', 'racking', 'door'),
          aM: fc.tuple(near(x), near(y)),
          bM: fc.tuple(near(x), near(y)),
        }),
        { maxLength: 25 },
      ),
    }),
  );
  /** Direction the tape runs, from the point toward the wall or grid line. */
  const tapeDirection = (d: Dimension, walls: readonly DatumWall[]): [number, number] => {
    if (d.kind === 'grid') return d.line === 'x' ? [1, 0] : [0, 1];
    const w = walls[d.wallIndex];
    const len = Math.hypot(w.bM[0] - w.aM[0], w.bM[1] - w.aM[1]);
    return [-(w.bM[1] - w.aM[1]) / len, (w.bM[0] - w.aM[0]) / len];
  };

  it('gives two tapes at least 70° apart, so the two readings fix the point', () => {
    fc.assert(
      fc.property(scene, ({ point, walls }) => {
        const [a, b] = locate(point, walls);
        const u = tapeDirection(a, walls);
        const v = tapeDirection(b, walls);
        // cos 70° = 0.342 (a 20° tolerance from square).
        expect(Math.abs(u[0] * v[0] + u[1] * v[1])).toBeLessThanOrEqual(Math.cos((70 * Math.PI) / 180) + 1e-9);
      }),
    );
  });

  it('reads every wall dimension square to a real wall or racking face, within a tape length', () => {
    fc.assert(
      fc.property(scene, ({ point, walls }) => {
        for (const d of locate(point, walls)) {
          if (d.kind !== 'wall') continue;
          const w = walls[d.wallIndex];
          expect(w.kind).not.toBe('door');
          expect(d.distanceM).toBeLessThanOrEqual(MAX_TAPE_M);
          expect(Math.hypot(point[0] - d.footM[0], point[1] - d.footM[1])).toBeCloseTo(d.distanceM, 6);
          // The foot lies on the wall: its distances to the two ends add up to the wall's length.
          const len = Math.hypot(w.bM[0] - w.aM[0], w.bM[1] - w.aM[1]);
          const ends = Math.hypot(d.footM[0] - w.aM[0], d.footM[1] - w.aM[1]) + Math.hypot(d.footM[0] - w.bM[0], d.footM[1] - w.bM[1]);
          expect(ends).toBeCloseTo(len, 6);
        }
      }),
    );
  });

  it('always says a finite distance in words, never NaN', () => {
    fc.assert(
      fc.property(scene, ({ point, walls }) => {
        for (const text of words(locate(point, walls)))
          expect(text).toMatch(
            /^\d+\.\d\d m (from (wall|racking) [WR]\d+ \([a-z-]+ face\)|(east|west|north|south) of grid line [xy] = 0)$/,
          );
      }),
    );
  });
});
