/** What a tap on the plan does with each tool (components/plan/plan-tool-taps.ts), without a renderer. */
import * as fc from 'fast-check';
import { WALL_HEIGHT_M } from '@/components/plan/plan-edits';
import { finishZoneSketch, MIN_WALL_LENGTH_M, TAP_SENTENCES, tapWithTool, type TapContext } from '@/components/plan/plan-tool-taps';
import type { PairM } from '@/components/plan/plan-view';
import { LIMIT_MESSAGES, scene as sceneSchema, SCENE_LIMITS, wallKinds, type Scene } from '@/shared/schemas';
import { heavyScene } from '../../bench/heavy-scene';
import { TEST_CATALOGUE } from './fixtures';
import { anyPointM, anyScene } from './scene-arbitrary';

const empty: Scene = { walls: [], zones: [], viewers: [] };
let counter = 0;
const ctx = (over: Partial<TapContext> = {}): TapContext => ({
  tool: 'select',
  wallKind: 'wall',
  sketch: [],
  scene: empty,
  mirrorCount: 0,
  catalogue: TEST_CATALOGUE,
  newId: (prefix) => `${prefix}-${++counter}`,
  ...over,
});

describe('a tap on the plan', () => {
  it('starts a wall at the first tap and adds it, of the chosen kind, at the second; the tool stays on Wall', () => {
    for (const wallKind of wallKinds) {
      const first = tapWithTool(ctx({ tool: 'wall', wallKind }), [1, 2]);
      expect(first).toEqual({ sketch: [[1, 2]], problem: null });
      const second = tapWithTool(ctx({ tool: 'wall', wallKind, sketch: first.sketch }), [4, 6]);
      expect(second.sketch).toEqual([]);
      expect(second.scene?.backToSelect).toBe(false);
      expect(second.scene?.select).toBeUndefined();
      expect(second.scene?.next.walls).toEqual([
        expect.objectContaining({ kind: wallKind, aM: [1, 2], bM: [4, 6], heightM: WALL_HEIGHT_M[wallKind] }),
      ]);
    }
  });

  it('refuses a wall whose ends are closer than 5 cm with a sentence, and drops its first end', () => {
    const out = tapWithTool(ctx({ tool: 'wall', sketch: [[1, 1]] }), [1 + MIN_WALL_LENGTH_M * 0.9, 1]);
    expect(out).toEqual({ sketch: [], problem: TAP_SENTENCES.wallTooShort });
  });

  it('keeps every position it sends to the millimetre, anywhere on an accepted site', () => {
    fc.assert(
      fc.property(anyPointM, anyPointM, (a, b) => {
        fc.pre(Math.hypot(b[0] - a[0], b[1] - a[1]) >= 0.1);
        const start = tapWithTool(ctx({ tool: 'wall' }), a);
        const out = tapWithTool(ctx({ tool: 'wall', sketch: start.sketch }), b);
        const wall = out.scene!.next.walls[0];
        for (const [sent, tapped] of [
          [wall.aM, a],
          [wall.bM, b],
        ] as const) {
          for (const i of [0, 1]) {
            expect(Math.abs(sent[i] - tapped[i])).toBeLessThanOrEqual(0.0005 + 1e-9);
            expect(Math.abs(sent[i] * 1000 - Math.round(sent[i] * 1000))).toBeLessThan(1e-6);
          }
        }
        // What the tool sends, the API takes.
        expect(sceneSchema.safeParse(out.scene!.next).success).toBe(true);
      }),
    );
  });

  it('adds a corner to the zone sketch per tap and sends nothing until the zone is finished', () => {
    const taps: PairM[] = [
      [0, 0],
      [5, 0],
      [5, 5],
    ];
    let sketch: readonly PairM[] = [];
    for (const t of taps) {
      const out = tapWithTool(ctx({ tool: 'zone', sketch }), t);
      expect(out.scene).toBeUndefined();
      sketch = out.sketch;
    }
    expect(sketch).toEqual(taps);
  });

  it('adds a viewer named after the count, selects it and goes back to Select', () => {
    fc.assert(
      fc.property(anyScene(4), anyPointM, (scene, p) => {
        fc.pre(scene.viewers.length < SCENE_LIMITS.viewers);
        const out = tapWithTool(ctx({ tool: 'viewer', scene }), p);
        const added = out.scene!.next.viewers.at(-1)!;
        expect(added.name).toBe(`Viewer ${scene.viewers.length + 1}`);
        expect(out.scene!.select).toEqual({ kind: 'viewer', id: added.id });
        expect(out.scene!.backToSelect).toBe(true);
        expect(out.scene!.next.viewers.slice(0, -1)).toEqual(scene.viewers);
      }),
    );
  });

  it('places a mirror aimed at the nearest viewer: one due north of the tap is at 90° (0° along x, 90° along y)', () => {
    const scene: Scene = {
      ...empty,
      viewers: [
        { id: 'far', name: 'Far', positionM: [30, 0], eyeHeightM: 1.6 },
        { id: 'near', name: 'Near', positionM: [2, 12], eyeHeightM: 2.1 },
      ],
    };
    const out = tapWithTool(ctx({ tool: 'mirror', scene, mirrorCount: 2 }), [2, 2]);
    expect(out.problem).toBeNull();
    expect(out.mirror).toEqual(
      expect.objectContaining({ label: 'M3', viewerId: 'near', positionM: [2, 2], catalogueItemId: TEST_CATALOGUE[0].id }),
    );
    expect(out.mirror!.azimuthRad).toBeCloseTo(Math.PI / 2, 4);
  });

  it('says the catalogue is empty instead of placing a mirror without one', () => {
    expect(tapWithTool(ctx({ tool: 'mirror', catalogue: [] }), [0, 0])).toEqual({ sketch: [], problem: TAP_SENTENCES.noMirrors });
  });

  it('says the limit instead of adding a wall, viewer or mirror to a full project, and sends nothing', () => {
    const full = heavyScene({ walls: SCENE_LIMITS.walls, zones: 0, cornersPerZone: 3, viewers: SCENE_LIMITS.viewers, mirrors: 0 });
    expect(tapWithTool(ctx({ tool: 'wall', scene: full }), [0, 0])).toEqual({ sketch: [], problem: LIMIT_MESSAGES.walls });
    expect(tapWithTool(ctx({ tool: 'viewer', scene: full }), [0, 0])).toEqual({ sketch: [], problem: LIMIT_MESSAGES.viewers });
    expect(tapWithTool(ctx({ tool: 'mirror', mirrorCount: SCENE_LIMITS.mirrors }), [0, 0])).toEqual({
      sketch: [],
      problem: LIMIT_MESSAGES.mirrors,
    });
  });

  it('stops a zone sketch at the corner limit and keeps the corners placed so far', () => {
    const sketch: PairM[] = Array.from({ length: SCENE_LIMITS.cornersPerZone }, (_, i) => [i, i % 2]);
    expect(tapWithTool(ctx({ tool: 'zone', sketch }), [0, 9])).toEqual({ sketch, problem: LIMIT_MESSAGES.cornersPerZone });
  });
});

describe('finishing a zone sketch', () => {
  it('waits for three corners', () => {
    expect(finishZoneSketch([])).toBeNull();
    expect(
      finishZoneSketch([
        [0, 0],
        [1, 0],
      ]),
    ).toBeNull();
  });

  it('says the outline crosses itself for a bow tie', () => {
    expect(
      finishZoneSketch([
        [0, 0],
        [4, 4],
        [4, 0],
        [0, 4],
      ]),
    ).toEqual({ problem: TAP_SENTENCES.zoneCrosses });
  });

  it('hands back a simple outline, as a copy, to be named', () => {
    const sketch: PairM[] = [
      [0, 0],
      [4, 0],
      [4, 4],
      [0, 4],
    ];
    const out = finishZoneSketch(sketch);
    expect(out).toEqual({ outline: sketch });
    expect(out && 'outline' in out ? out.outline : null).not.toBe(sketch);
  });
});
