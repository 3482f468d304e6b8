import { ARCMIN_RAD, fanRays, poseFromAim, type Mirror, type Vec3 } from '../../../shared/optics';
import { pointTarget, type Vehicle } from '../../../shared/schemas/vehicle';
import { angleInsideOutline, scoreVehicle, vehicleGeometry } from '../../../shared/vehicle';
import { demoTruck, sixMirrors } from './fixtures';

// Sources: docs/vehicle-sources.md. Test cylinder 0.3048 m across, 0.9144 m tall (cylinder P) [M?];
// 3′ inside the edge, 3′ × 9′ image size: FMVSS 111 S9.4 as corrected (70 FR 73383) [P];
// detect 6′ and recognise 20′ of a target's height: engineering judgement, from memory [M].

const cylinderP = (id: string, positionM: [number, number], extra: Record<string, unknown> = {}) =>
  pointTarget.parse({
    id,
    name: id,
    positionM,
    diameterM: 0.3048,
    heightM: 0.9144,
    minShortRad: 3 * ARCMIN_RAD,
    minLongRad: 9 * ARCMIN_RAD,
    ...extra,
  });

function truckWithTargets(targets: ReturnType<typeof cylinderP>[]): Vehicle {
  return { ...demoTruck(), targets };
}

describe('test cylinders seen in a vehicle’s mirrors', () => {
  it('measures how far inside the mirror’s edge a sightline lands as the rim’s angular radius for an eye on the axis', () => {
    // On-axis geometry: the rim (radius a, set back by the sagitta s = R − √(R² − a²)) is seen at
    // atan(a / (D + s)) from the axis by an eye D in front of the vertex.
    const mirror: Mirror = { shape: 'round', diameterM: 0.4, radiusM: 0.5 };
    const pose = poseFromAim({ vertexM: [0, 0, 3], azimuthRad: 0, tiltDownRad: 0.3 });
    const D = 1.5;
    const eyeM: Vec3 = [D * pose.axis[0], D * pose.axis[1], 3 + D * pose.axis[2]];
    const rim = fanRays({ mirror, pose, eyeM, maxRangeM: 1, samples: 512 }).map((r) => r.fromM);
    const a = 0.2;
    const s = 0.5 - Math.sqrt(0.25 - a * a);
    // The 512 chords of the rim sit inside the circle by at most a relative 1 − cos(π/512) ≈ 1.9e-5.
    expect(angleInsideOutline(eyeM, pose.vertexM, rim) / Math.atan(a / (D + s))).toBeCloseTo(1, 4);
  });

  it('passes a near cylinder P whose image is well inside the edge and at least 3′ × 9′', () => {
    const v = truckWithTargets([]);
    const g = vehicleGeometry(v);
    v.targets = [cylinderP('near', [g.eyeMidM[0] - 8, 4])];
    const t = scoreVehicle({ vehicle: v, mirrors: sixMirrors(v).filter((m) => m.id === 'iv-p'), fields: [] }).targets[0];
    expect(t).toMatchObject({ visible: true, whollyVisible: true, mirrorId: 'iv-p', meetsInsideEdge: true, meetsSize: true, passes: true });
    expect(t.insideEdgeRad!).toBeGreaterThan(3 * ARCMIN_RAD);
  });

  it('fails the same cylinder farther back once its image is under 3′ across, though still seen', () => {
    const v = truckWithTargets([]);
    const g = vehicleGeometry(v);
    v.targets = [cylinderP('near', [g.eyeMidM[0] - 8, 4]), cylinderP('far', [g.eyeMidM[0] - 35, 4])];
    const [near, far] = scoreVehicle({ vehicle: v, mirrors: sixMirrors(v).filter((m) => m.id === 'iv-p'), fields: [] }).targets;
    expect(far.visible).toBe(true);
    expect(far.heightAngleRad!).toBeLessThan(near.heightAngleRad!);
    expect(Math.min(far.heightAngleRad!, far.widthAngleRad!)).toBeLessThan(3 * ARCMIN_RAD);
    expect(far.meetsSize).toBe(false);
    expect(far.passes).toBe(false);
  });

  it('fails a wholly seen cylinder whose image is nearer the mirror’s edge than the required angle', () => {
    const v = truckWithTargets([]);
    const g = vehicleGeometry(v);
    const mirrors = sixMirrors(v).filter((m) => m.id === 'iv-p');
    v.targets = [cylinderP('near', [g.eyeMidM[0] - 8, 4])];
    const inside = scoreVehicle({ vehicle: v, mirrors, fields: [] }).targets[0].insideEdgeRad!;
    v.targets = [cylinderP('near', [g.eyeMidM[0] - 8, 4], { insideEdgeRad: inside * 1.01 })];
    const t = scoreVehicle({ vehicle: v, mirrors, fields: [] }).targets[0];
    expect(t.whollyVisible).toBe(true);
    expect(t.meetsInsideEdge).toBe(false);
    expect(t.passes).toBe(false);
  });

  it('does not pass a cylinder the mirror shows only in part', () => {
    // 2 m behind the eyes, 4 m out: at the near edge of the wide-angle mirror's footprint, where its top is seen and its foot is not.
    const v = truckWithTargets([]);
    const g = vehicleGeometry(v);
    v.targets = [cylinderP('edge', [g.eyeMidM[0] - 2, 4])];
    const t = scoreVehicle({ vehicle: v, mirrors: sixMirrors(v).filter((m) => m.id === 'iv-p'), fields: [] }).targets[0];
    expect(t.visible).toBe(true);
    expect(t.whollyVisible).toBe(false);
    expect(t.insideEdgeRad).toBeNull();
    expect(t.passes).toBe(false);
  });

  it('reports detection and recognition by the angle the image’s height subtends', () => {
    const v = truckWithTargets([]);
    const g = vehicleGeometry(v);
    v.targets = [10, 20, 35, 50].map((d) => cylinderP(`at-${d}`, [g.eyeMidM[0] - d, 4]));
    const ts = scoreVehicle({
      vehicle: v,
      mirrors: sixMirrors(v).filter((m) => m.id === 'iv-p'),
      fields: [],
      detectAngleRad: 6 * ARCMIN_RAD,
      recogniseAngleRad: 20 * ARCMIN_RAD,
    }).targets;
    for (const t of ts) {
      expect(t.visible).toBe(true);
      expect(t.detected).toBe(t.heightAngleRad! >= 6 * ARCMIN_RAD);
      expect(t.recognised).toBe(t.heightAngleRad! >= 20 * ARCMIN_RAD);
    }
    // Farther back, smaller: the nearest is recognised, the farthest not even detected.
    expect(ts.map((t) => t.heightAngleRad!)).toEqual([...ts.map((t) => t.heightAngleRad!)].sort((a, b) => b - a));
    expect(ts[0].recognised).toBe(true);
    expect(ts[3].detected).toBe(false);
  });

  it('leaves the criteria unanswered when no angles are given', () => {
    const v = truckWithTargets([]);
    v.targets = [cylinderP('x', [-10, 4])];
    const t = scoreVehicle({ vehicle: v, mirrors: sixMirrors(v), fields: [] }).targets[0];
    expect(t.detected).toBeNull();
    expect(t.recognised).toBeNull();
  });
});
