/** "Aim at this zone" (shared/project-optics/aim-at-zone.ts): the engine's sizing search for one mirror and one zone. */
import * as fc from 'fast-check';
import { aimAtZone, mountProblem, ProjectEvaluator, sizeForZone } from '../../../shared/project-optics';
import { defaultAims, rankOrder } from '../../../shared/optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '../../../shared/schemas';

/** An invented one-item catalogue: a 600 mm round mirror cut from a 0.8 m sphere. */
const TEST_CATALOGUE: CatalogueItemDto[] = [
  {
    id: 1,
    code: 'T-600',
    name: 'Test round 600 (demo)',
    mirror: { shape: 'round', diameterM: 0.6, radiusM: 0.8 },
    material: '',
    reflectance: null,
    massKg: null,
    unitPriceMinor: 12900,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: '2025-01-01T00:00:00.000Z',
  },
];

const testPlacement = (overrides: Partial<PlacementDto> = {}): PlacementDto => ({
  id: 7,
  projectId: 3,
  label: 'Corner',
  catalogueItemId: 1,
  customMirror: null,
  positionM: [0, 0],
  heightM: 2.6,
  azimuthRad: 0,
  tiltDownRad: 0.3,
  viewerId: 'v1',
  notes: '',
  version: 4,
  updatedAt: '2025-01-01T00:00:00.000Z',
  ...overrides,
});

// An invented bay: the viewer stands 4 m west of a mirror 2.6 m up at the origin; the zone is a
// 2 m square north-east of the mirror, round the corner from the viewer.
const scene: Scene = {
  walls: [],
  zones: [
    {
      id: 'bay',
      name: 'Loading bay',
      polygonM: [
        [1, 2],
        [3, 2],
        [3, 4],
        [1, 4],
      ],
      target: { kind: 'adult' },
    },
  ],
  viewers: [{ id: 'v1', name: 'Driver', positionM: [-4, 0], eyeHeightM: 1.6 }],
};
const shareOf = (placements: PlacementDto[]) =>
  new ProjectEvaluator().evaluate({ scene, placements, catalogue: TEST_CATALOGUE }).zones[0].fraction;

describe('aim at this zone', () => {
  it('turns a mirror that faces away from the zone until the zone is seen, and reports the share before and after', () => {
    const away = testPlacement({ azimuthRad: -Math.PI / 2, tiltDownRad: 0.3 });
    const out = aimAtZone({ scene, placements: [away], catalogue: TEST_CATALOGUE, placementId: away.id, zoneId: 'bay' });
    if ('problem' in out) throw new Error(out.problem);
    expect(out.shareBefore).toBe(shareOf([away]));
    expect(out.shareAfter).toBeGreaterThan(out.shareBefore);
    expect(out.shareAfter).toBeCloseTo(shareOf([{ ...away, ...out.aim }]), 10);
  });

  it('never leaves the mirror covering less of the zone than it did where it pointed before', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 0, max: 0.8, noNaN: true }),
        (azimuthRad, tiltDownRad) => {
          const p = testPlacement({ azimuthRad, tiltDownRad });
          const out = aimAtZone({ scene, placements: [p], catalogue: TEST_CATALOGUE, placementId: p.id, zoneId: 'bay' });
          if ('problem' in out) return;
          // 0.01 of the zone: the search's own step, within which shares rank equal (rank.ts coverageStep).
          expect(out.shareAfter).toBeGreaterThanOrEqual(out.shareBefore - 0.01);
          expect(out.shareAfter).toBeLessThanOrEqual(1);
        },
      ),
      { numRuns: 8 },
    );
  });

  it('says what to choose when the mirror has no viewer, never a number', () => {
    const p = testPlacement({ viewerId: null });
    expect(aimAtZone({ scene, placements: [p], catalogue: TEST_CATALOGUE, placementId: p.id, zoneId: 'bay' })).toEqual({
      problem: 'Choose the viewer this mirror serves before aiming it: the aim depends on where they look from.',
    });
  });

  it('says so when no aim shows the zone from where the mirror hangs', () => {
    // The viewer's eye stands between the mirror and the zone, so the mirror would have to face away from them.
    const behind: Scene = { ...scene, viewers: [{ id: 'v1', name: 'Driver', positionM: [2, 3], eyeHeightM: 1.6 }] };
    const p = testPlacement({ positionM: [-30, 3], heightM: 0.3 });
    const out = aimAtZone({ scene: behind, placements: [p], catalogue: TEST_CATALOGUE, placementId: p.id, zoneId: 'bay' });
    expect(out).toHaveProperty('problem');
  });

  describe('with the mirror hung on a wall', () => {
    // An invented store: a 3 m wall runs north–south along x = 0; the mirror's back sits on its east
    // face. Turning a mirror that sits on a face swings half its rim into the wall, so most aims
    // the search could try are not mountable. The 600 mm mirror cut from a 0.8 m sphere bulges
    // 0.8 − √(0.8² − 0.3²) ≈ 58 mm (sagitta, from the sphere's geometry).
    const wallScene = (zoneAt: [number, number], viewerAt: [number, number]): Scene => ({
      walls: [{ id: 'w-east', kind: 'wall', aM: [0, -8], bM: [0, 8], heightM: 3 }],
      zones: [
        {
          id: 'bay',
          name: 'Aisle end',
          polygonM: [
            [zoneAt[0] - 1, zoneAt[1] - 1],
            [zoneAt[0] + 1, zoneAt[1] - 1],
            [zoneAt[0] + 1, zoneAt[1] + 1],
            [zoneAt[0] - 1, zoneAt[1] + 1],
          ],
          target: { kind: 'adult' },
        },
      ],
      viewers: [{ id: 'v1', name: 'Driver', positionM: viewerAt, eyeHeightM: 1.6 }],
    });

    it('only ever proposes an aim at which the mirror is clear of the wall, wherever the zone and viewer are', () => {
      fc.assert(
        fc.property(
          fc.double({ min: 1.5, max: 8, noNaN: true }),
          fc.double({ min: -6, max: 6, noNaN: true }),
          fc.double({ min: 1.5, max: 8, noNaN: true }),
          fc.double({ min: -6, max: 6, noNaN: true }),
          fc.double({ min: 0.065, max: 0.4, noNaN: true }),
          (zx, zy, vx, vy, gapM) => {
            const s = wallScene([zx, zy], [vx, vy]);
            const p = testPlacement({ positionM: [gapM, 0], heightM: 2.6, azimuthRad: 0, tiltDownRad: 0 });
            const out = aimAtZone({ scene: s, placements: [p], catalogue: TEST_CATALOGUE, placementId: p.id, zoneId: 'bay' });
            if ('problem' in out) return;
            const mirror = TEST_CATALOGUE[0].mirror;
            expect(mountProblem({ mirror, placement: { ...p, ...out.aim }, scene: s })).toBeNull();
          },
        ),
        { numRuns: 12 },
      );
    });

    it('still finds a better aim when the best unconstrained one would swing the rim into the wall', () => {
      // Zone to the north-east, viewer out east: the mirror would face half-way between them,
      // some 15° north of east, but it hangs 100 mm out from the wall, so its rim meets the wall
      // after a turn of about 5°.
      const s = wallScene([5, 4.5], [6, -1]);
      const p = testPlacement({ positionM: [0.1, 0], heightM: 2.6, azimuthRad: -0.05, tiltDownRad: 0 });
      const mirror = TEST_CATALOGUE[0].mirror;
      expect(mountProblem({ mirror, placement: p, scene: s })).toBeNull();
      const out = aimAtZone({ scene: s, placements: [p], catalogue: TEST_CATALOGUE, placementId: p.id, zoneId: 'bay' });
      if ('problem' in out) throw new Error(out.problem);
      expect(mountProblem({ mirror, placement: { ...p, ...out.aim }, scene: s })).toBeNull();
      expect(out.shareAfter).toBeGreaterThan(out.shareBefore);
    });
  });
});

describe('compare mirrors for a zone', () => {
  // Three invented catalogue items: smaller and cheaper, the test mirror, larger and dearer.
  const three: CatalogueItemDto[] = [
    {
      ...TEST_CATALOGUE[0],
      id: 1,
      code: 'T-400',
      name: 'Test round 400 (demo)',
      mirror: { shape: 'round' as const, diameterM: 0.4, radiusM: 0.6 },
      unitPriceMinor: 8900,
    },
    TEST_CATALOGUE[0],
    {
      ...TEST_CATALOGUE[0],
      id: 3,
      code: 'T-800',
      name: 'Test round 800 (demo)',
      mirror: { shape: 'round' as const, diameterM: 0.8, radiusM: 1.0 },
      unitPriceMinor: 19900,
    },
  ].map((c, i) => ({ ...c, id: i + 1 }));
  const shareWith = (p: PlacementDto) => new ProjectEvaluator().evaluate({ scene, placements: [p], catalogue: three }).zones[0].fraction;

  it('lists each mirror once, best first, with the share the plan would show once it is chosen', () => {
    const p = testPlacement({ catalogueItemId: 2, azimuthRad: -Math.PI / 2 });
    const out = sizeForZone({ scene, placements: [p], catalogue: three, placementId: p.id, zoneId: 'bay' });
    if ('problem' in out) throw new Error(out.problem);
    expect(out.choices.length).toBeGreaterThan(0);
    expect(new Set(out.choices.map((c) => c.item.id)).size).toBe(out.choices.length);
    for (const c of out.choices) {
      expect(c.shareAfter).toBeCloseTo(shareWith({ ...p, ...c.aim, catalogueItemId: c.item.id }), 10);
    }
    expect(out.shareBefore).toBe(shareWith(p));
    // Best first in the search's order: share (1 % steps), then range, then price.
    const figures = out.choices.map((c) => ({ fraction: c.shareAfter, rangeKey: c.rangeM, cost: c.item.unitPriceMinor }));
    for (let i = 1; i < figures.length; i++) expect(rankOrder(figures[i - 1], figures[i])).toBeLessThanOrEqual(0);
  });

  it('finds at least as much of the zone as a brute-force trial of every mirror at every first-pass aim', () => {
    const p = testPlacement({ catalogueItemId: 2, azimuthRad: 2, tiltDownRad: 0.1 });
    const out = sizeForZone({ scene, placements: [p], catalogue: three, placementId: p.id, zoneId: 'bay' });
    if ('problem' in out) throw new Error(out.problem);
    const vertexM: [number, number, number] = [p.positionM[0], p.positionM[1], p.heightM];
    let best = 0;
    for (const item of three) {
      for (const aim of defaultAims(vertexM, [scene.zones[0].polygonM])) {
        best = Math.max(best, shareWith({ ...p, ...aim, catalogueItemId: item.id }));
      }
    }
    // 0.01 of the zone: the search's own step, within which shares rank equal (rank.ts coverageStep).
    expect(out.choices[0].shareAfter).toBeGreaterThanOrEqual(best - 0.01);
  });

  it('never offers a mirror that would hang through the wall beside it', () => {
    // The wall runs north–south 120 mm west of the mirror's front; the viewer stands south-east,
    // in front of it. The 800 mm mirror bulges 1.0 − √(1.0² − 0.4²) ≈ 83 mm (sagitta), so only
    // small turns keep its rim out of the wall.
    const s: Scene = {
      ...scene,
      walls: [{ id: 'w', kind: 'wall', aM: [-0.12, -6], bM: [-0.12, 6], heightM: 3 }],
      viewers: [{ id: 'v1', name: 'Driver', positionM: [4, -3], eyeHeightM: 1.6 }],
    };
    const p = testPlacement({ catalogueItemId: 1, azimuthRad: 0, tiltDownRad: 0 });
    const out = sizeForZone({ scene: s, placements: [p], catalogue: three, placementId: p.id, zoneId: 'bay' });
    if ('problem' in out) throw new Error(out.problem);
    expect(out.choices.length).toBeGreaterThan(0);
    for (const c of out.choices) {
      expect(mountProblem({ mirror: c.item.mirror, placement: { ...p, ...c.aim }, scene: s })).toBeNull();
    }
  });

  it('says so when the catalogue has no active mirror, never an empty list', () => {
    const p = testPlacement();
    const out = sizeForZone({
      scene,
      placements: [p],
      catalogue: three.map((c) => ({ ...c, active: false })),
      placementId: p.id,
      zoneId: 'bay',
    });
    expect(out).toEqual({ problem: expect.stringMatching(/no mirrors/) });
  });
});
