/**
 * Detect and recognise through a project's evaluation. The zone shares are checked against an
 * independent estimate: the exact point test `visibleInMirror` (reflection point found by solving
 * Alhazen's problem, not the traced outline) sampled on a grid over the zone, kept within the
 * criterion's range of the point under the mirror.
 */
import { ARCMIN_RAD, poseFromAim, recognisableRange, visibleInMirror, type Mirror, type Vec3 } from '../../../shared/optics';
import { criteriaOf, evaluateProject, zoneCriterion } from '../../../shared/project-optics';
import { DEFAULT_CRITERIA_RAD, type CatalogueItemDto, type Scene, type SceneZone } from '../../../shared/schemas';

const mirror: Mirror = { shape: 'round', diameterM: 0.4, radiusM: 0.6 };
const catalogue = [{ id: 1, mirror }] as unknown as CatalogueItemDto[];
const eyeM: Vec3 = [5, 1, 1.7];
// A long aisle in front of a mirror tilted only a little, so the floor seen reaches past the recognise range.
const ZONE: [number, number][] = [
  [1, -12],
  [45, -12],
  [45, 12],
  [1, 12],
];
const zone = (id: string, criterion?: 'detect' | 'recognise'): SceneZone => ({
  id,
  name: id,
  polygonM: ZONE,
  target: { kind: 'adult' },
  ...(criterion ? { criterion } : {}),
});
const scene: Scene = {
  walls: [],
  zones: [zone('recognise', 'recognise'), zone('detect', 'detect'), zone('unsaid')],
  viewers: [{ id: 'v', name: 'Driver', positionM: [eyeM[0], eyeM[1]], eyeHeightM: eyeM[2] }],
};
const placement = {
  id: 1,
  catalogueItemId: 1,
  customMirror: null,
  positionM: [0, 0] as [number, number],
  heightM: 3,
  azimuthRad: 0.05,
  tiltDownRad: 0.12,
  viewerId: 'v',
};
const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0.05, tiltDownRad: 0.12 });

/** Share of ZONE whose floor points the exact point test sees within `rangeM` of the point under the mirror. */
function sampledShare(rangeM: number): number {
  let seen = 0;
  const nx = 100;
  const ny = 60;
  for (let i = 0; i < nx; i++) {
    for (let j = 0; j < ny; j++) {
      const x = 1 + (44 * (i + 0.5)) / nx;
      const y = -12 + (24 * (j + 0.5)) / ny;
      if (Math.hypot(x, y) <= rangeM && visibleInMirror({ mirror, pose, eyeM, pointM: [x, y, 0] }).visible) seen += 1;
    }
  }
  return seen / (nx * ny);
}

const ev = evaluateProject({ scene, placements: [placement], catalogue });
const share = (id: string) => ev.zones.find((z) => z.zoneId === id)!.fraction;

describe('a zone scored by its own criterion', () => {
  it('has numbers for this scene (else the other checks prove nothing)', () => {
    expect(ev.placements[0].problem).toBeNull();
    const r = ev.placements[0].numbers!.rangesM;
    // The floor seen must reach past the recognise range for the two criteria to differ here.
    expect(ev.placements[0].numbers!.floorSeen!.farthestM).toBeGreaterThanOrEqual(r.recognise.adult - 0.01);
  });

  it('counts a "recognise" zone out to the adult recognise range, as the exact point test does', () => {
    const rangeM = ev.placements[0].numbers!.rangesM.recognise.adult;
    expect(share('recognise')).toBeCloseTo(sampledShare(rangeM), 2);
  });

  it('counts a "detect" zone out to the adult detect range, as the exact point test does, and so sees more', () => {
    const rangeM = ev.placements[0].numbers!.rangesM.detect.adult;
    expect(share('detect')).toBeCloseTo(sampledShare(rangeM), 2);
    expect(share('detect')).toBeGreaterThan(share('recognise') + 0.3);
  });

  it('treats a zone saved before criteria existed as a "recognise" zone', () => {
    expect(zoneCriterion(scene.zones[2])).toBe('recognise');
    expect(share('unsaid')).toBe(share('recognise'));
  });
});

describe('the project’s two angles', () => {
  it('default to 6′ to detect and 20′ to recognise', () => {
    expect(criteriaOf({}).detectRad / ARCMIN_RAD).toBeCloseTo(6, 12);
    expect(criteriaOf({}).recogniseRad / ARCMIN_RAD).toBeCloseTo(20, 12);
  });

  // Johnson's criteria (docs/sources.md, "Human factors"; published, read in summaries): about
  // 1.0 cycle across a target to detect it and 4.0 to recognise it at even odds; at normal acuity a
  // cycle is about 2′ (from memory), and about twice the cycles give high odds (from memory).
  it('ask at least twice the even-odds angles of Johnson’s criteria at normal acuity (2′ to detect, 8′ to recognise)', () => {
    const cycle = 2 * ARCMIN_RAD;
    expect(DEFAULT_CRITERIA_RAD.detectRad).toBeGreaterThanOrEqual(2 * 1.0 * cycle);
    expect(DEFAULT_CRITERIA_RAD.recogniseRad).toBeGreaterThanOrEqual(2 * 4.0 * cycle);
  });

  it('no longer let an ordinary 600 mm mirror "recognise" an adult beyond a 40 m hall, as the old 3′ did', () => {
    // The complaint in docs/sources.md, "Detect and recognise": R 1.2 m, eye 5 m away, adult 1.7 m.
    const at = (minAngleRad: number) => recognisableRange({ radiusM: 1.2, eyeDistanceM: 5, targetSizeM: 1.7, minAngleRad }).rangeM;
    expect(at(3 * ARCMIN_RAD)).toBeGreaterThan(100);
    expect(at(DEFAULT_CRITERIA_RAD.recogniseRad)).toBeLessThan(40);
  });

  it('reach the numbers when a project sets its own', () => {
    const own = { detectRad: 4 * ARCMIN_RAD, recogniseRad: 30 * ARCMIN_RAD };
    const mine = evaluateProject({ scene: { ...scene, criteria: own }, placements: [placement], catalogue }).placements[0].numbers!;
    const base = ev.placements[0].numbers!;
    expect(mine.criteria).toEqual(own);
    // Paraxially the range scales nearly as 1/angle: 20′ → 30′ shortens it, 6′ → 4′ lengthens it.
    expect(mine.rangesM.recognise.adult).toBeLessThan(base.rangesM.recognise.adult * 0.7);
    expect(mine.rangesM.detect.adult).toBeGreaterThan(base.rangesM.detect.adult * 1.4);
  });
});
