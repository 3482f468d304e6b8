/** The plan's scene edits (components/plan/scene-edits.ts), without a renderer. */
import * as fc from 'fast-check';
import {
  addViewer,
  addWall,
  addZone,
  moveViewer,
  removeSceneItem,
  setCriteria,
  setViewerEyeHeight,
  setZoneCriterion,
  type SceneItemKind,
} from '@/components/plan/scene-edits';
import { criteriaOf } from '@/shared/project-optics';
import { DEFAULT_CRITERIA_RAD, scene as sceneSchema, SCENE_LIMITS, type Scene } from '@/shared/schemas';
import { anyCriteria, anyPointM, anyScene, anySceneId, anyViewer, anyWall, anyZone, deepCopy, deepFreeze } from './scene-arbitrary';

const listOf = (s: Scene, kind: SceneItemKind): readonly { id: string }[] =>
  kind === 'wall' ? s.walls : kind === 'zone' ? s.zones : s.viewers;
const KINDS: readonly SceneItemKind[] = ['wall', 'zone', 'viewer'];

/** A scene with at least one item, and one of its items' kind and id. */
const sceneWithItem = anyScene()
  .filter((s) => s.walls.length + s.zones.length + s.viewers.length > 0)
  .chain((s) => {
    const items = KINDS.flatMap((kind) => listOf(s, kind).map((it) => ({ kind, id: it.id })));
    return fc.tuple(fc.constant(s), fc.constantFrom(...items));
  });

describe('scene edits', () => {
  it('removing a wall, zone or viewer keeps every other item in order and leaves the other kinds the same arrays', () => {
    fc.assert(
      fc.property(sceneWithItem, ([scene, { kind, id }]) => {
        const next = removeSceneItem(scene, kind, id);
        expect(listOf(next, kind).map((x) => x.id)).toEqual(
          listOf(scene, kind)
            .map((x) => x.id)
            .filter((x) => x !== id),
        );
        for (const other of KINDS.filter((k) => k !== kind)) expect(listOf(next, other)).toBe(listOf(scene, other));
        expect(next.criteria).toBe(scene.criteria);
      }),
    );
  });

  it('never changes the scene it is given, whatever the edit', () => {
    fc.assert(
      fc.property(sceneWithItem, anyPointM, anyCriteria, ([scene, { kind, id }], pointM, criteria) => {
        const frozen = deepFreeze(deepCopy(scene));
        // A frozen object throws when written to in strict mode, so any edit in place fails here.
        removeSceneItem(frozen, kind, id);
        moveViewer(frozen, id, pointM);
        setViewerEyeHeight(frozen, id, 1.6);
        setZoneCriterion(frozen, id, 'detect');
        setCriteria(frozen, criteria);
        setCriteria(frozen, undefined);
        expect(frozen).toEqual(scene);
      }),
    );
  });

  it('gives a scene the API accepts when a new wall, zone or viewer with a fresh id joins an accepted scene under the limits', () => {
    const withNewItem = anyScene(4).chain((scene) =>
      anySceneId
        .filter((id) => !KINDS.some((k) => listOf(scene, k).some((x) => x.id === id)))
        .chain((id) =>
          fc.oneof(
            anyWall(id).map((w) => addWall(scene, w)),
            anyZone(id).map((z) => addZone(scene, z)),
            anyViewer(id).map((v) => addViewer(scene, v)),
          ),
        ),
    );
    fc.assert(
      fc.property(withNewItem, (next) => {
        const corners = next.zones.reduce((n, z) => n + z.polygonM.length, 0);
        fc.pre(corners <= SCENE_LIMITS.zoneCorners);
        expect(sceneSchema.safeParse(next).success).toBe(true);
      }),
    );
  });

  it('adds each new item at the end of its own list', () => {
    fc.assert(
      fc.property(anyScene(3), (scene) => {
        const wall = {
          id: 'new-wall',
          kind: 'door' as const,
          aM: [0, 0] as [number, number],
          bM: [1, 0] as [number, number],
          heightM: 2.1,
        };
        expect(addWall(scene, wall).walls.at(-1)).toBe(wall);
        expect(addWall(scene, wall).walls.slice(0, -1)).toEqual(scene.walls);
      }),
    );
  });

  it('moves only the named viewer, keeping its name and eye height', () => {
    fc.assert(
      fc.property(
        anyScene().filter((s) => s.viewers.length > 0),
        anyPointM,
        (scene, pointM) => {
          const target = scene.viewers[scene.viewers.length - 1];
          const next = moveViewer(scene, target.id, pointM);
          const moved = next.viewers.find((v) => v.id === target.id)!;
          expect(moved).toEqual({ ...target, positionM: pointM });
          expect(next.viewers.filter((v) => v.id !== target.id)).toEqual(scene.viewers.filter((v) => v.id !== target.id));
          expect(next.walls).toBe(scene.walls);
        },
      ),
    );
  });

  it('returns the very same scene when the id names nothing of that kind', () => {
    fc.assert(
      fc.property(anyScene(), fc.constant('no-such-item'), (scene, id) => {
        fc.pre(!KINDS.some((k) => listOf(scene, k).some((x) => x.id === id)));
        for (const kind of KINDS) expect(removeSceneItem(scene, kind, id)).toBe(scene);
        expect(moveViewer(scene, id, [1, 1])).toBe(scene);
        expect(setViewerEyeHeight(scene, id, 1.6)).toBe(scene);
        expect(setZoneCriterion(scene, id, 'detect')).toBe(scene);
      }),
    );
  });

  it('sets one zone’s criterion and no other zone’s', () => {
    fc.assert(
      fc.property(
        anyScene().filter((s) => s.zones.length > 0),
        fc.constantFrom('detect' as const, 'recognise' as const),
        (scene, criterion) => {
          const target = scene.zones[0];
          const next = setZoneCriterion(scene, target.id, criterion);
          expect(next.zones[0]).toEqual({ ...target, criterion });
          expect(next.zones.slice(1)).toEqual(scene.zones.slice(1));
        },
      ),
    );
  });

  it('going back to the default angles leaves criteria out, so the scene reads 6′ and 20′ (the defaults, from memory)', () => {
    fc.assert(
      fc.property(anyScene(), anyCriteria, (scene, criteria) => {
        const own = setCriteria(scene, criteria);
        expect(criteriaOf(own)).toEqual(criteria);
        const back = setCriteria(own, undefined);
        expect('criteria' in back).toBe(false);
        expect(criteriaOf(back)).toEqual(DEFAULT_CRITERIA_RAD);
        expect(back.walls).toBe(scene.walls);
      }),
    );
  });
});
