import { endGesture, moveGesture, startGesture, TAP_SLOP_PX, type GestureContext } from '@/components/plan/plan-gesture';
import { hitTest, PICK_PX } from '@/components/plan/plan-hit-test';
import { AIM_HANDLE_PX, toScreen, type PairM, type PlanView } from '@/components/plan/plan-view';
import type { PlacementDto, Scene } from '@/shared/schemas';

// 20 px per metre, plan origin at (100, 500) on screen.
const view: PlanView = { scale: 20, offsetX: 100, offsetY: 500 };

const placement = (id: number, positionM: PairM, azimuthRad = 0): PlacementDto => ({
  id,
  projectId: 1,
  label: `M${id}`,
  catalogueItemId: 1,
  customMirror: null,
  positionM,
  heightM: 3,
  azimuthRad,
  tiltDownRad: 0.3,
  viewerId: null,
  notes: '',
  version: 1,
  updatedAt: '2026-01-01T00:00:00.000Z',
});

const scene: Scene = {
  walls: [{ id: 'w1', kind: 'wall', aM: [0, 10], bM: [10, 10], heightM: 3 }],
  zones: [
    {
      id: 'z-low',
      name: 'Lower',
      polygonM: [
        [0, 0],
        [8, 0],
        [8, 8],
        [0, 8],
      ],
      target: { kind: 'adult' },
    },
    {
      id: 'z-top',
      name: 'Upper',
      polygonM: [
        [4, 4],
        [8, 4],
        [8, 8],
        [4, 8],
      ],
      target: { kind: 'adult' },
    },
  ],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 2], eyeHeightM: 1.7 }],
};

const ctx = (over: Partial<GestureContext> = {}): GestureContext => ({
  view,
  scene,
  placements: [placement(7, [5, 2])],
  selection: null,
  canEdit: true,
  tool: 'select',
  ...over,
});
const at = (p: PairM): PairM => toScreen(view, p);

describe('hit-testing the plan', () => {
  it('picks a mirror within a finger of its marker, before the zone under it', () => {
    const [x, y] = at([5, 2]);
    expect(hitTest(ctx(), view, [x + PICK_PX - 1, y]).hit).toEqual({ kind: 'placement', id: 7 });
  });

  it('picks the nearer of a mirror and a viewer that are both within reach', () => {
    const near = ctx({ placements: [placement(7, [2.5, 2])] });
    const [x, y] = at([2, 2]);
    expect(hitTest(near, view, [x + 2, y]).hit).toEqual({ kind: 'viewer', id: 'v1' });
  });

  it('picks a wall close to its line and the topmost of two overlapping zones elsewhere', () => {
    const [wx, wy] = at([6, 10]);
    expect(hitTest(ctx(), view, [wx, wy + 8]).hit).toEqual({ kind: 'wall', id: 'w1' });
    expect(hitTest(ctx(), view, at([6, 6])).hit).toEqual({ kind: 'zone', id: 'z-top' });
    expect(hitTest(ctx(), view, at([1, 6])).hit).toEqual({ kind: 'zone', id: 'z-low' });
    expect(hitTest(ctx(), view, at([20, 20])).hit).toBeNull();
  });

  it('finds the aim handle of the selected mirror only when the plan can be edited', () => {
    const [x, y] = at([5, 2]);
    const handle: PairM = [x + AIM_HANDLE_PX, y];
    const selected = ctx({ selection: { kind: 'placement', id: 7 } });
    expect(hitTest(selected, view, handle)).toEqual({ hit: { kind: 'placement', id: 7 }, aim: true });
    expect(hitTest({ ...selected, canEdit: false }, view, handle).aim).toBeUndefined();
  });
});

describe('the plan gesture machine', () => {
  it('treats a press that moves less than the tap slop as a tap that places with a placing tool', () => {
    const c = ctx({ tool: 'mirror' });
    const start = startGesture(c, [[300, 300]]);
    const moved = moveGesture(c, start.gesture!, [[300 + TAP_SLOP_PX - 1, 300]]);
    expect(moved.effects).toEqual([]);
    expect(endGesture(c, moved.gesture!, [300, 300])).toEqual([{ kind: 'tap', pointM: [10, 10] }]);
  });

  it('selects what a tap lands on with the select tool, and nothing is placed', () => {
    const c = ctx();
    const start = startGesture(c, [at([1, 6])]);
    expect(endGesture(c, start.gesture!, at([1, 6]))).toEqual([{ kind: 'select', selection: { kind: 'zone', id: 'z-low' } }]);
  });

  it('pans the view by the finger travel and applies the final position on release', () => {
    const c = ctx();
    const start = startGesture(c, [[300, 300]]);
    const moved = moveGesture(c, start.gesture!, [[340, 290]]);
    expect(moved.effects).toEqual([{ kind: 'view', view: { scale: 20, offsetX: 140, offsetY: 490 } }]);
    expect(endGesture(c, moved.gesture!, [350, 300])).toEqual([{ kind: 'view', view: { scale: 20, offsetX: 150, offsetY: 500 } }]);
  });

  it('drags a mirror by where it was grabbed, selecting it at the press', () => {
    const c = ctx();
    const [x, y] = at([5, 2]);
    const start = startGesture(c, [[x + 4, y]]);
    expect(start.effects).toEqual([{ kind: 'select', selection: { kind: 'placement', id: 7 } }]);
    const moved = moveGesture(c, start.gesture!, [[x + 4 + 40, y]]);
    expect(moved.effects).toEqual([{ kind: 'drag', drag: { kind: 'placement-move', id: 7, positionM: [7, 2], done: false } }]);
    expect(endGesture(c, moved.gesture!, [x + 4 + 60, y])).toEqual([
      { kind: 'drag', drag: { kind: 'placement-move', id: 7, positionM: [8, 2], done: true } },
    ]);
  });

  it('turns the selected mirror with its aim handle toward the finger', () => {
    const c = ctx({ selection: { kind: 'placement', id: 7 } });
    const [x, y] = at([5, 2]);
    const start = startGesture(c, [[x + AIM_HANDLE_PX, y]]);
    const moved = moveGesture(c, start.gesture!, [[x, y - 50]]);
    const drag = moved.effects[0];
    expect(drag.kind).toBe('drag');
    // Straight up the screen is north, +y in plan metres: azimuth 90°.
    expect(drag.kind === 'drag' && drag.drag.kind === 'placement-aim' ? drag.drag.azimuthRad : NaN).toBeCloseTo(Math.PI / 2, 9);
  });

  it('never drags or places on a plan that is read only, though it still pans and selects', () => {
    const c = ctx({ canEdit: false, tool: 'mirror' });
    const [x, y] = at([5, 2]);
    const start = startGesture(c, [[x, y]]);
    const moved = moveGesture(c, start.gesture!, [[x + 50, y]]);
    expect(moved.effects).toEqual([]);
    expect(endGesture(c, moved.gesture!, [x + 50, y])).toEqual([]);
    const empty = startGesture(c, [[900, 50]]);
    expect(endGesture(c, empty.gesture!, [900, 50])).toEqual([{ kind: 'select', selection: null }]);
  });

  it('zooms about the two fingers’ centre as they spread, and a second finger turns a pan into a pinch', () => {
    const c = ctx();
    const start = startGesture(c, [[300, 300]]);
    const pinch = moveGesture(c, start.gesture!, [
      [200, 300],
      [400, 300],
    ]);
    expect(pinch.gesture?.mode).toBe('pinch');
    const spread = moveGesture(c, pinch.gesture!, [
      [100, 300],
      [500, 300],
    ]);
    const fx = spread.effects[0];
    expect(fx.kind === 'view' ? fx.view.scale : NaN).toBeCloseTo(40, 9);
    // The point under the centre stays put: (300 − 100)/20 = 10 m before, (300 − x)/40 after.
    expect(fx.kind === 'view' ? (300 - fx.view.offsetX) / fx.view.scale : NaN).toBeCloseTo(10, 9);
  });
});

describe('choosing a point for a review comment', () => {
  it('gives a reader (who cannot edit) the tapped point in plan metres, even on a mirror, and moves nothing', () => {
    const c = ctx({ canEdit: false, pinning: true });
    const onMirror = toScreen(view, [5, 2]);
    const start = startGesture(c, [onMirror]);
    expect(start.effects).toEqual([]);
    expect(endGesture(c, start.gesture!, onMirror)).toEqual([{ kind: 'tap', pointM: [5, 2] }]);
  });

  it('without the pinning mode a reader’s tap on empty floor gives no point', () => {
    const c = ctx({ canEdit: false });
    const empty = toScreen(view, [20, 20]);
    const start = startGesture(c, [empty]);
    expect(endGesture(c, start.gesture!, empty)).toEqual([{ kind: 'select', selection: null }]);
  });

  it('a drag while pinning still pans the plan instead of giving a point', () => {
    const c = ctx({ canEdit: false, pinning: true });
    const a = toScreen(view, [20, 20]);
    const b: PairM = [a[0] + TAP_SLOP_PX * 4, a[1]];
    const start = startGesture(c, [a]);
    const moved = moveGesture(c, start.gesture!, [b]);
    expect(endGesture(c, moved.gesture!, b).map((e) => e.kind)).toEqual(['view']);
  });
});
