/** Editing what was drawn (components/plan/scene-edits.ts): zones, viewers and walls changed after drawing. */
import * as fc from 'fast-check';
import {
  insertZoneCorner,
  MIN_ZONE_CORNERS,
  moveWallEnd,
  moveZoneCorner,
  removeZoneCorner,
  renameViewer,
  renameZone,
  sceneProblem,
  setWallHeight,
  setWallKind,
  setZoneTarget,
} from '@/components/plan/scene-edits';
import { wallKinds, type Scene } from '@/shared/schemas';
import { anyPointM, anyScene, deepCopy, deepFreeze } from './scene-arbitrary';

const withZone = anyScene().filter((s) => s.zones.length > 0);
const withWall = anyScene().filter((s) => s.walls.length > 0);
const withViewer = anyScene().filter((s) => s.viewers.length > 0);
const anyName = fc.string({ minLength: 1, maxLength: 60 });

/** A zone of the scene and a corner index inside its outline. */
const zoneAndCorner = withZone.chain((s) =>
  fc.nat(s.zones.length - 1).chain((zi) => fc.tuple(fc.constant(s), fc.constant(zi), fc.nat(s.zones[zi].polygonM.length - 1))),
);

describe('reshaping what was drawn', () => {
  it('moves one corner of one zone and leaves every other corner, zone and kind as it was', () => {
    fc.assert(
      fc.property(zoneAndCorner, anyPointM, ([scene, zi, ci], pointM) => {
        const zone = scene.zones[zi];
        const next = moveZoneCorner(scene, zone.id, ci, pointM);
        expect(next.zones[zi].polygonM[ci]).toEqual(pointM);
        expect(next.zones[zi].polygonM.filter((_, i) => i !== ci)).toEqual(zone.polygonM.filter((_, i) => i !== ci));
        expect(next.zones.filter((_, i) => i !== zi)).toEqual(scene.zones.filter((_, i) => i !== zi));
        expect(next.walls).toBe(scene.walls);
        expect(next.viewers).toBe(scene.viewers);
      }),
    );
  });

  it('adding a corner after corner i puts it at i + 1 and removing it again gives back the same outline', () => {
    fc.assert(
      fc.property(zoneAndCorner, anyPointM, ([scene, zi, ci], pointM) => {
        const zone = scene.zones[zi];
        const added = insertZoneCorner(scene, zone.id, ci, pointM);
        expect(added.zones[zi].polygonM).toHaveLength(zone.polygonM.length + 1);
        expect(added.zones[zi].polygonM[ci + 1]).toEqual(pointM);
        expect(removeZoneCorner(added, zone.id, ci + 1).zones[zi]).toEqual(zone);
      }),
    );
  });

  it('never takes a zone below three corners, the fewest an outline has', () => {
    fc.assert(
      fc.property(zoneAndCorner, ([scene, zi, ci]) => {
        const zone = scene.zones[zi];
        const next = removeZoneCorner(scene, zone.id, ci);
        expect(next.zones[zi].polygonM.length).toBe(Math.max(MIN_ZONE_CORNERS, zone.polygonM.length - 1));
        if (zone.polygonM.length === MIN_ZONE_CORNERS) expect(next).toBe(scene);
      }),
    );
  });

  it('ignores a corner index outside the outline', () => {
    fc.assert(
      fc.property(withZone, fc.oneof(fc.integer({ max: -1 }), fc.integer({ min: 200 }), fc.constant(0.5)), (scene, index) => {
        const id = scene.zones[0].id;
        expect(moveZoneCorner(scene, id, index, [0, 0])).toBe(scene);
        expect(insertZoneCorner(scene, id, index, [0, 0])).toBe(scene);
        expect(removeZoneCorner(scene, id, index)).toBe(scene);
      }),
    );
  });

  it('renames a zone and a viewer and sets a zone’s target without touching their shapes', () => {
    fc.assert(
      fc.property(withZone, withViewer, anyName, (zs, vs, name) => {
        const z = zs.zones[0];
        expect(renameZone(zs, z.id, name).zones[0]).toEqual({ ...z, name });
        expect(setZoneTarget(zs, z.id, { kind: 'custom', heightM: 1.2 }).zones[0]).toEqual({
          ...z,
          target: { kind: 'custom', heightM: 1.2 },
        });
        const v = vs.viewers[0];
        expect(renameViewer(vs, v.id, name).viewers[0]).toEqual({ ...v, name });
      }),
    );
  });

  it('moves either end of a wall, and changes its height and kind, giving a new walls array each time (footgun 15)', () => {
    fc.assert(
      fc.property(
        withWall,
        anyPointM,
        fc.constantFrom('a' as const, 'b' as const),
        fc.constantFrom(...wallKinds),
        (scene, pointM, end, kind) => {
          const w = scene.walls[0];
          const moved = moveWallEnd(scene, w.id, end, pointM);
          expect(moved.walls[0]).toEqual(end === 'a' ? { ...w, aM: pointM } : { ...w, bM: pointM });
          expect(moved.walls).not.toBe(scene.walls);
          expect(setWallHeight(scene, w.id, 3.3).walls[0]).toEqual({ ...w, heightM: 3.3 });
          expect(setWallKind(scene, w.id, kind).walls[0]).toEqual({ ...w, kind });
          expect(moved.walls.slice(1)).toEqual(scene.walls.slice(1));
        },
      ),
    );
  });

  it('never changes the scene it is given', () => {
    fc.assert(
      fc.property(
        anyScene().filter((s) => s.zones.length > 0 && s.walls.length > 0 && s.viewers.length > 0),
        anyPointM,
        (scene, p) => {
          const frozen = deepFreeze(deepCopy(scene));
          const [z, w, v] = [scene.zones[0].id, scene.walls[0].id, scene.viewers[0].id];
          renameZone(frozen, z, 'x');
          setZoneTarget(frozen, z, { kind: 'child' });
          moveZoneCorner(frozen, z, 0, p);
          insertZoneCorner(frozen, z, 0, p);
          removeZoneCorner(frozen, z, 0);
          renameViewer(frozen, v, 'x');
          moveWallEnd(frozen, w, 'b', p);
          setWallHeight(frozen, w, 1);
          setWallKind(frozen, w, 'door');
          expect(frozen).toEqual(scene);
        },
      ),
    );
  });

  it('says in the schema’s words why a corner dragged across the outline cannot be saved, and nothing for an accepted scene', () => {
    // A unit square; moving corner 2 from (1, 1) to (0, -1) makes the outline cross itself (drawn by hand).
    const scene: Scene = {
      walls: [{ id: 'w', kind: 'wall', aM: [0, 0], bM: [3, 0], heightM: 2.5 }],
      zones: [
        {
          id: 'z',
          name: 'Bay',
          polygonM: [
            [0, 0],
            [1, 0],
            [1, 1],
            [0, 1],
          ],
          target: { kind: 'adult' },
        },
      ],
      viewers: [],
    };
    expect(sceneProblem(scene)).toBeNull();
    expect(sceneProblem(moveZoneCorner(scene, 'z', 2, [0, -1]))).toBe(
      'The zone outline crosses or touches itself; redraw it as one simple outline.',
    );
    expect(sceneProblem(moveWallEnd(scene, 'w', 'b', [0, 0.001]))).toBe('A wall needs two different ends (at least 10 mm apart).');
    expect(sceneProblem(renameZone(scene, 'z', ''))).not.toBeNull();
  });
});
