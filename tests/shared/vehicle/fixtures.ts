/** A demo right-hand-drive rigid truck (fictional) with six mirrors, shared by tests and the bench; any accepted vehicle for property tests. */
import type { Vec3 } from '../../../shared/geometry/vec3';
import type { Pose } from '../../../shared/optics';
import * as fc from 'fast-check';
import { vehicleKinds, vehiclePreset, type Vehicle, type VehicleInput } from '../../../shared/schemas/vehicle';
import { vehicleGeometry, type VehicleMirror } from '../../../shared/vehicle';

/** Aims a mirror so that a ray from the eye to its vertex reflects toward `lookAtM` (the axis bisects the two directions). */
export function aimBetween(vertexM: Vec3, eyeM: Vec3, lookAtM: Vec3): Pose {
  const unit = (a: Vec3): Vec3 => {
    const l = Math.hypot(a[0], a[1], a[2]);
    return [a[0] / l, a[1] / l, a[2] / l];
  };
  const toEye = unit([eyeM[0] - vertexM[0], eyeM[1] - vertexM[1], eyeM[2] - vertexM[2]]);
  const toLook = unit([lookAtM[0] - vertexM[0], lookAtM[1] - vertexM[1], lookAtM[2] - vertexM[2]]);
  return { vertexM, axis: unit([toEye[0] + toLook[0], toEye[1] + toLook[1], toEye[2] + toLook[2]]) };
}

export function demoTruck(): Vehicle {
  return vehiclePreset('rigid-truck', 'right');
}

/**
 * Six mirrors on the demo truck: class II and IV on both doors, class V above the passenger
 * door and class VI at the top of the windscreen, each aimed at the middle of its field
 * (trade-practice sizes: class IV/V about 180–250 mm with radius 300–400 mm).
 */
export function sixMirrors(v: Vehicle): VehicleMirror[] {
  const g = vehicleGeometry(v);
  const e = g.eyeMidM;
  const p = g.passengerSide === 'left' ? 1 : -1;
  const d = -p;
  const out = v.widthM / 2 + 0.2;
  return [
    {
      id: 'ii-d',
      label: 'Main mirror, driver',
      mirrorClass: 'II',
      mirror: { shape: 'rect', widthM: 0.2, heightM: 0.38, radiusM: 1.8 },
      pose: aimBetween([-0.55, d * out, 2.35], e, [e[0] - 30, d * 2.3, 0]),
    },
    {
      id: 'ii-p',
      label: 'Main mirror, passenger',
      mirrorClass: 'II',
      mirror: { shape: 'rect', widthM: 0.2, heightM: 0.38, radiusM: 1.8 },
      pose: aimBetween([-0.55, p * out, 2.35], e, [e[0] - 30, p * 2.3, 0]),
    },
    {
      id: 'iv-d',
      label: 'Wide-angle mirror, driver',
      mirrorClass: 'IV',
      mirror: { shape: 'rect', widthM: 0.2, heightM: 0.18, radiusM: 0.35 },
      pose: aimBetween([-0.5, d * out, 2.05], e, [e[0] - 12, d * 8, 0]),
    },
    {
      id: 'iv-p',
      label: 'Wide-angle mirror, passenger',
      mirrorClass: 'IV',
      mirror: { shape: 'rect', widthM: 0.2, heightM: 0.18, radiusM: 0.35 },
      pose: aimBetween([-0.5, p * out, 2.05], e, [e[0] - 12, p * 8, 0]),
    },
    {
      id: 'v-p',
      label: 'Close-proximity mirror',
      mirrorClass: 'V',
      mirror: { shape: 'rect', widthM: 0.24, heightM: 0.2, radiusM: 0.3 },
      pose: aimBetween([-0.2, p * (v.widthM / 2 + 0.05), 2.7], e, [e[0] - 0.3, p * 2.2, 0]),
    },
    {
      id: 'vi',
      label: 'Front mirror',
      mirrorClass: 'VI',
      mirror: { shape: 'rect', widthM: 0.25, heightM: 0.2, radiusM: 0.3 },
      pose: aimBetween([0.15, p * 0.5, 2.95], e, [0.9, p * 0.6, 0]),
    },
  ];
}

/** Any vehicle the schema should accept: dimensions drawn over the whole accepted ranges, the cab holding the driver. */
export const anyVehicle: fc.Arbitrary<VehicleInput> = fc
  .record({
    kind: fc.constantFrom(...vehicleKinds),
    driverSide: fc.constantFrom('left' as const, 'right' as const),
    lengthM: fc.double({ min: 2, max: 40, noNaN: true }),
    widthM: fc.double({ min: 1, max: 3.5, noNaN: true }),
    cabShare: fc.double({ min: 0.3, max: 1, noNaN: true }),
    cabFront: fc.double({ min: 0, max: 1, noNaN: true }),
    cabLen: fc.double({ min: 0.8, max: 3, noNaN: true }),
    seatFrac: fc.double({ min: 0.1, max: 0.9, noNaN: true }),
    acrossFrac: fc.double({ min: 0, max: 0.9, noNaN: true }),
    seatHeightM: fc.double({ min: 0.3, max: 2.5, noNaN: true }),
    rule: fc.constantFrom('un-r46' as const, 'iso-5006' as const),
    direct: fc.boolean(),
    bodyHeightM: fc.double({ min: 0.5, max: 6, noNaN: true }),
  })
  .map((r) => {
    const cabWidthM = r.widthM * r.cabShare;
    const cabFrontBehindM = Math.min(r.cabFront, r.lengthM * 0.3);
    const cabRear = Math.min(cabFrontBehindM + r.cabLen, r.lengthM);
    const behind = cabFrontBehindM + r.seatFrac * (cabRear - cabFrontBehindM);
    const across = (r.acrossFrac * cabWidthM) / 2;
    const eyeH = r.direct ? r.seatHeightM + 0.6 : r.seatHeightM + (r.rule === 'un-r46' ? 0.635 : 0.68);
    const eye = r.direct
      ? { method: 'direct' as const, eyeBehindFrontM: behind, eyeFromCentreM: across, eyeHeightM: eyeH }
      : { method: 'seat' as const, rule: r.rule, seatBehindFrontM: behind, seatFromCentreM: across, seatHeightM: r.seatHeightM };
    const bodyBoxes = [
      {
        id: 'cab',
        name: 'Cab',
        frontBehindM: cabFrontBehindM,
        rearBehindM: cabRear,
        widthM: cabWidthM,
        heightM: eyeH + 0.4,
        windowLineM: eyeH * 0.7,
      },
      ...(cabRear + 0.1 < r.lengthM
        ? [{ id: 'body', name: 'Body', frontBehindM: cabRear + 0.05, rearBehindM: r.lengthM, widthM: r.widthM, heightM: r.bodyHeightM }]
        : []),
    ];
    return { kind: r.kind, driverSide: r.driverSide, lengthM: r.lengthM, widthM: r.widthM, cabWidthM, cabFrontBehindM, eye, bodyBoxes };
  });
