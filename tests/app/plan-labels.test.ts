/** The plan's label layout (components/plan/plan-labels.ts): clear of each other and of markers, by priority, without a renderer. */
import * as fc from 'fast-check';
import { LABEL_PRIORITY, layoutPlanLabels, markerBox, type PlanLabelRequest } from '@/components/plan/plan-labels';
import { boxesOverlap, type LabelBox } from '@/shared/label-placement';

const SCREEN: LabelBox = { x: 0, y: 0, w: 390, h: 500 };

const request = (key: string, anchor: [number, number], over: Partial<PlanLabelRequest> = {}): PlanLabelRequest => ({
  key,
  anchor,
  w: 80,
  h: 20,
  preferred: { x: anchor[0] + 18, y: anchor[1] - 10, w: 80, h: 20 },
  clearance: 14,
  priority: LABEL_PRIORITY.mirror,
  mustShow: false,
  ...over,
});

/** Any label the plan asks for: the selected item's and the zones' labels must show (they come first), mirrors' and viewers' may hide. */
const anyRequest = fc
  .record({
    x: fc.double({ min: -50, max: 440, noNaN: true }),
    y: fc.double({ min: -50, max: 550, noNaN: true }),
    w: fc.integer({ min: 8, max: 260 }),
    h: fc.integer({ min: 8, max: 60 }),
    priority: fc.constantFrom(...Object.values(LABEL_PRIORITY)),
    mustShow: fc.boolean(),
  })
  .map((r) => ({ ...r, mustShow: r.priority <= LABEL_PRIORITY.zone }));

describe('the plan’s label layout', () => {
  it('keeps the preferred spot when nothing is in the way', () => {
    const r = request('placement-1', [100, 100]);
    expect(layoutPlanLabels([r], [], SCREEN).get('placement-1')).toEqual(r.preferred);
  });

  it('moves a lower-priority label off a zone label that holds its spot', () => {
    const zone = request('zone-a', [150, 100], {
      priority: LABEL_PRIORITY.zone,
      mustShow: true,
      preferred: { x: 110, y: 80, w: 120, h: 36 },
    });
    const mirror = request('placement-1', [100, 100]);
    const placed = layoutPlanLabels([mirror, zone], [], SCREEN);
    expect(placed.get('zone-a')).toEqual(zone.preferred);
    const moved = placed.get('placement-1')!;
    expect(moved).not.toBeNull();
    expect(boxesOverlap(moved, zone.preferred)).toBe(false);
  });

  it('hides a label with no clear spot unless it must show', () => {
    // The whole screen is one obstacle: nothing can be clear.
    const wall = [SCREEN];
    const placed = layoutPlanLabels(
      [request('viewer-v', [100, 100]), request('placement-2', [200, 200], { mustShow: true })],
      wall,
      SCREEN,
    );
    expect(placed.get('viewer-v')).toBeNull();
    expect(placed.get('placement-2')).not.toBeNull();
  });

  it('keeps a label that must show on screen when a spot on screen exists, even if every spot meets something', () => {
    const zone = request('zone-t', [370, 60], {
      priority: LABEL_PRIORITY.zone,
      mustShow: true,
      w: 180,
      h: 36,
      preferred: { x: 280, y: 42, w: 180, h: 36 },
    });
    const box = layoutPlanLabels([zone], [SCREEN], SCREEN).get('zone-t')!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.w).toBeLessThanOrEqual(SCREEN.w);
  });

  it('never lets a label it shows by choice overlap another label, a marker or the screen edge, for any labels and markers', () => {
    fc.assert(
      fc.property(
        fc.array(anyRequest, { maxLength: 14 }),
        fc.array(fc.tuple(fc.double({ min: 0, max: 390, noNaN: true }), fc.double({ min: 0, max: 500, noNaN: true })), { maxLength: 8 }),
        (raw, markers) => {
          const requests = raw.map((r, i) =>
            request(`k${i}`, [r.x, r.y], {
              w: r.w,
              h: r.h,
              preferred: { x: r.x - r.w / 2, y: r.y - r.h / 2, w: r.w, h: r.h },
              priority: r.priority,
              mustShow: r.mustShow,
            }),
          );
          const obstacles = markers.map((m) => markerBox(m, 17));
          const placed = layoutPlanLabels(requests, obstacles, SCREEN);
          const shown = requests.map((r) => ({ r, box: placed.get(r.key) }));
          for (const { r, box } of shown) {
            if (r.mustShow) expect(box).not.toBeNull();
            if (!box || r.mustShow) continue;
            expect(box.x).toBeGreaterThanOrEqual(0);
            expect(box.y).toBeGreaterThanOrEqual(0);
            expect(box.x + box.w).toBeLessThanOrEqual(SCREEN.w);
            expect(box.y + box.h).toBeLessThanOrEqual(SCREEN.h);
            for (const o of obstacles) expect(boxesOverlap(box, o)).toBe(false);
            for (const other of shown) if (other.r !== r && other.box) expect(boxesOverlap(box, other.box)).toBe(false);
          }
        },
      ),
    );
  });
});
