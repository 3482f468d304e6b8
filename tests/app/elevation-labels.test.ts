/**
 * The side view's labels on screen (components/placement/elevation-view.tsx) follow the sheet's rule:
 * beside the symbol they name, clear of the sightline, the rays, the height ticks and the floor.
 * The geometry is the case seen in the issue: an eye low on the left looking up to a mirror on the
 * right, its label drawn on top of the dashed sightline.
 */
import { sideViewLabels } from '@/components/placement/elevation-view';
import { boxMeetsSegment, type Segment } from '@/shared/label-placement';

const eye: [number, number] = [40, 120];
const mirror: [number, number] = [220, 60];
const floorY = 196;
const rays: Segment[] = [
  [mirror, [330, floorY]],
  [mirror, [340, 20]],
];
const labels = sideViewLabels(
  { eye, mirror, floorY, rays, width: 360 },
  { eye: 'eye 2.10 m', mirror: 'mirror 2.90 m', apart: '6.78 m apart' },
);
const lines: Segment[] = [
  [eye, mirror],
  [
    [0, floorY],
    [360, floorY],
  ],
  [[eye[0], floorY], eye],
  [[mirror[0], floorY], mirror],
  ...rays,
];

describe('the side view labels on screen', () => {
  it.each(['eye', 'mirror', 'apart'])('places the %s label clear of every line of the drawing', (key) => {
    const l = labels.find((x) => x.key === key)!;
    expect(lines.filter((s) => boxMeetsSegment(l.box, s))).toEqual([]);
  });

  it('keeps each label within a few label heights of its symbol', () => {
    const anchors = { eye, mirror, apart: [(eye[0] + mirror[0]) / 2, floorY] as [number, number] };
    for (const l of labels) {
      const [ax, ay] = anchors[l.key];
      const dx = Math.max(l.box.x - ax, 0, ax - (l.box.x + l.box.w));
      const dy = Math.max(l.box.y - ay, 0, ay - (l.box.y + l.box.h));
      // Three rings of spots, 10 px plus up to two label heights (16 px) out, on both axes.
      expect(Math.hypot(dx, dy)).toBeLessThanOrEqual(Math.SQRT2 * (10 + 2 * 16));
    }
  });

  it('never lets two labels overlap', () => {
    const [a, b, c] = labels.map((l) => l.box);
    const apart = (p: typeof a, q: typeof a) => p.x + p.w <= q.x || q.x + q.w <= p.x || p.y + p.h <= q.y || q.y + q.h <= p.y;
    expect([apart(a, b), apart(a, c), apart(b, c)]).toEqual([true, true, true]);
  });
});
