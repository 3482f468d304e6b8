import { coverage, OpticsInputError, poseFromAim, rankOptions, zoneCoverage, ARCMIN_RAD, type CatalogueItem, type Polygon, type Vec3 } from '../../../shared/optics';
import { circleRing } from '../../../shared/geometry/polygon';

describe('zone coverage', () => {
  const zone: Polygon = [[[0, 0], [4, 0], [4, 2], [0, 2]]];

  it('counts overlapping regions once (union)', () => {
    const left = [[[[-1, -1], [3, -1], [3, 3], [-1, 3]]]] as Polygon[];
    const right = [[[[1, -1], [5, -1], [5, 3], [1, 3]]]] as Polygon[];
    const both = zoneCoverage({ zone, regions: [left, right] });
    expect(both.fraction).toBeCloseTo(1, 12);
    expect(both.coveredM2).toBeCloseTo(8, 12);
    expect(zoneCoverage({ zone, regions: [left] }).coveredM2).toBeCloseTo(6, 12);
  });

  it('gives zero for no regions', () => {
    expect(zoneCoverage({ zone, regions: [] })).toEqual({ fraction: 0, coveredM2: 0 });
  });

  it('scores a traced mirror region against a zone', () => {
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.35 });
    const { region, areaM2 } = coverage({ mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, pose, eyeM: [5, 3, 1.6], maxRangeM: 12 });
    const huge: Polygon = [circleRing([0, 0], 13, 512)];
    expect(zoneCoverage({ zone: huge, regions: [region] }).coveredM2).toBeCloseTo(areaM2, 6);
  });
});

describe('ranking mirror options for a zone', () => {
  const zone: Polygon = [[[3, -6], [9, -6], [9, -2], [3, -2]]];
  const eyeM: Vec3 = [6, 2, 1.6];
  const mountPoints = [
    { id: 'corner', vertexM: [0, 0, 3] as Vec3 },
    { id: 'column', vertexM: [10, 0, 3] as Vec3 },
  ];
  const catalogue: CatalogueItem[] = [
    { id: 'r400', mirror: { shape: 'round', diameterM: 0.4, radiusM: 0.8 }, cost: 80 },
    { id: 'r800', mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, cost: 210 },
    { id: 'r800-twin', mirror: { shape: 'round', diameterM: 0.8, radiusM: 1.6 }, cost: 190 },
  ];
  // Target: a person, 1.7 m, at the Snellen-letter angle of 5′ (common practice; docs/sources.md, "Human factors").
  const target = { sizeM: 1.7, minAngleRad: 5 * ARCMIN_RAD };

  it('returns options best first with exact, consistent numbers', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, limit: 5 });
    expect(ranked.length).toBe(5);
    for (let k = 1; k < ranked.length; k++) {
      expect(Math.floor(ranked[k].fraction / 0.01 + 1e-9)).toBeLessThanOrEqual(Math.floor(ranked[k - 1].fraction / 0.01 + 1e-9));
    }
    const best = ranked[0];
    const check = coverage({ mirror: best.item.mirror, pose: best.pose, eyeM, maxRangeM: best.rangeM });
    expect(zoneCoverage({ zone, regions: [check.region] }).fraction).toBeCloseTo(best.fraction, 9);
    expect(best.fraction).toBeGreaterThan(0.3);
  });

  it('prefers the cheaper of two identical mirrors', () => {
    const ranked = rankOptions({ catalogue, mountPoints, eyeM, zone, target, limit: 20 });
    const twin = ranked.findIndex((o) => o.item.id === 'r800-twin');
    const dear = ranked.findIndex((o) => o.item.id === 'r800' && o.mountPoint.id === ranked[twin].mountPoint.id && o.aim.azimuthRad === ranked[twin].aim.azimuthRad && o.aim.tiltDownRad === ranked[twin].aim.tiltDownRad);
    expect(twin).toBeGreaterThanOrEqual(0);
    if (dear >= 0) expect(twin).toBeLessThan(dear);
  });

  it('refuses an empty catalogue with a sentence', () => {
    expect(() => rankOptions({ catalogue: [], mountPoints, eyeM, zone, target })).toThrow(OpticsInputError);
  });
});
