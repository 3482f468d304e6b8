/** What a key does over the plan on a wide screen (components/plan/plan-keys.ts), and where the view re-centres, without a renderer. */
import * as fc from 'fast-check';
import { planKeyAction, type PlanKeyEvent } from '@/components/plan/plan-keys';
import { markerStops } from '@/components/plan/marker-focus-layer';
import { centreOn, toScreen, type PlanView } from '@/components/plan/plan-view';
import type { PlanSelection } from '@/components/plan/plan-types';
import type { PlacementDto, Scene } from '@/shared/schemas';

const key = (k: string, over: Partial<PlanKeyEvent> = {}): PlanKeyEvent => ({
  key: k,
  shiftKey: false,
  altKey: false,
  ctrlKey: false,
  metaKey: false,
  targetTag: 'DIV',
  targetRole: null,
  inDialog: false,
  ...over,
});
const mirror: PlanSelection = { kind: 'placement', id: 3 };

describe('a key pressed over the plan', () => {
  it('closes the editor on Escape, even from one of its one-line fields', () => {
    expect(planKeyAction(key('Escape'), mirror, true)).toEqual({ kind: 'close' });
    expect(planKeyAction(key('Escape', { targetTag: 'INPUT' }), mirror, true)).toEqual({ kind: 'close' });
  });

  it('leaves Escape to a text area, a dialog, and does nothing with nothing selected', () => {
    expect(planKeyAction(key('Escape', { targetTag: 'TEXTAREA' }), mirror, true)).toBeNull();
    expect(planKeyAction(key('Escape', { inDialog: true }), mirror, true)).toBeNull();
    expect(planKeyAction(key('Escape'), null, true)).toBeNull();
  });

  it.each([
    ['ArrowRight', [0.1, 0]],
    ['ArrowLeft', [-0.1, 0]],
    ['ArrowUp', [0, 0.1]],
    ['ArrowDown', [0, -0.1]],
  ] as const)('nudges the selected mirror with %s, north up as the plan draws it', (k, delta) => {
    expect(planKeyAction(key(k), mirror, true)).toEqual({ kind: 'nudge', deltaM: delta });
  });

  it('nudges ten times as far with Shift', () => {
    expect(planKeyAction(key('ArrowRight', { shiftKey: true }), mirror, true)).toEqual({ kind: 'nudge', deltaM: [1, 0] });
  });

  it('leaves the arrows to fields, choice groups and tables, and to a person who may not edit', () => {
    expect(planKeyAction(key('ArrowRight', { targetTag: 'input' }), mirror, true)).toBeNull();
    expect(planKeyAction(key('ArrowRight', { targetRole: 'radiogroup' }), mirror, true)).toBeNull();
    expect(planKeyAction(key('ArrowDown', { targetRole: 'row' }), mirror, true)).toBeNull();
    expect(planKeyAction(key('ArrowRight'), mirror, false)).toBeNull();
  });

  it('moves only mirrors and viewers, not zones or walls, and ignores shortcuts with modifiers', () => {
    expect(planKeyAction(key('ArrowRight'), { kind: 'zone', id: 'z' }, true)).toBeNull();
    expect(planKeyAction(key('ArrowRight'), { kind: 'wall', id: 'w' }, true)).toBeNull();
    expect(planKeyAction(key('ArrowRight', { ctrlKey: true }), mirror, true)).toBeNull();
    expect(planKeyAction(key('ArrowRight'), { kind: 'viewer', id: 'v' }, true)).toEqual({ kind: 'nudge', deltaM: [0.1, 0] });
  });
});

describe('re-centring the plan on an item', () => {
  it('puts any plan point in the middle of any frame and keeps the scale', () => {
    fc.assert(
      fc.property(
        fc.record({
          scale: fc.double({ min: 2, max: 400, noNaN: true }),
          offsetX: fc.double({ min: -1e5, max: 1e5, noNaN: true }),
          offsetY: fc.double({ min: -1e5, max: 1e5, noNaN: true }),
        }),
        fc.record({ width: fc.integer({ min: 1, max: 4000 }), height: fc.integer({ min: 1, max: 4000 }) }),
        fc.tuple(fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true })),
        (view: PlanView, size, point) => {
          const next = centreOn(view, size, point);
          expect(next.scale).toBe(view.scale);
          const [x, y] = toScreen(next, point);
          // Tolerance: floating-point rounding of offsets up to 1e5 px plus 1000 m × 400 px/m.
          expect(Math.abs(x - size.width / 2)).toBeLessThan(1e-6);
          expect(Math.abs(y - size.height / 2)).toBeLessThan(1e-6);
        },
      ),
    );
  });
});

describe('the keyboard stops over the plan', () => {
  const scene: Scene = { walls: [], zones: [], viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 2], eyeHeightM: 2 }] };
  const placement = (id: number, label: string, positionM: [number, number]) => ({ id, label, positionM }) as unknown as PlacementDto;
  const view: PlanView = { scale: 10, offsetX: 0, offsetY: 100 };

  it('lists mirrors in label order (M2 before M10), then viewers, leaving out what is off screen', () => {
    const stops = markerStops(scene, [placement(1, 'M10', [5, 5]), placement(2, 'M2', [1, 1]), placement(3, 'M3', [500, 5])], view, {
      width: 100,
      height: 100,
    });
    expect(stops.map((s) => s.name)).toEqual(['Mirror M2', 'Mirror M10', 'Viewer Driver']);
    expect(stops[0]).toMatchObject({ x: 10, y: 90, selection: { kind: 'placement', id: 2 } });
  });
});
