/**
 * Left- and right-hand drive are mirror images across the vehicle's centreline (y → −y). The
 * vehicle model measures the driver and the body boxes toward the driver's side, so switching
 * `driverSide` mirrors them; the installer's own fields and targets are in plan and are
 * mirrored here. Negating a coordinate is exact in floating point.
 */
import type { Pose } from '../optics';
import type { Vehicle } from '../schemas/vehicle';

export function mirrorVehicleAcross(v: Vehicle): Vehicle {
  return {
    ...v,
    driverSide: v.driverSide === 'left' ? 'right' : 'left',
    bodyBoxes: v.bodyBoxes.map((b) => ({ ...b })),
    groundFields: v.groundFields.map((f) => ({ ...f, polygonM: f.polygonM.map(([x, y]) => [x, -y] as [number, number]) })),
    targets: v.targets.map((t) => ({ ...t, positionM: [t.positionM[0], -t.positionM[1]] as [number, number] })),
  };
}

/** A mirror's pose mirrored across the centreline. */
export function mirrorPoseAcross(p: Pose): Pose {
  return { vertexM: [p.vertexM[0], -p.vertexM[1], p.vertexM[2]], axis: [p.axis[0], -p.axis[1], p.axis[2]] };
}
