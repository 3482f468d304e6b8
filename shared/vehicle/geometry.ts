/**
 * A parsed vehicle turned into plan geometry (x forward from the front bumper, y left, z up,
 * metres): the ocular points, the side lines the fields hang from, and the body as sightline
 * blockers for the engine.
 */
import type { Ring } from '../geometry/polygon';
import type { Vec3 } from '../geometry/vec3';
import type { Wall } from '../optics';
import type { BodyBox, Vehicle } from '../schemas/vehicle';
import { EYE_OFFSETS, eyeMidpointM, OCULAR_SEPARATION_M } from './eye';

export type Side = 'left' | 'right';

export type VehicleGeometry = {
  driverSide: Side;
  passengerSide: Side;
  /** Midpoint of the two eye points. */
  eyeMidM: Vec3;
  /** How far the eye point lies ahead of the seat point (0 when the eye is typed directly). */
  seatForwardOffsetM: number;
  /** The two ocular points, 65 mm apart across the vehicle (left one first). */
  ocularM: [Vec3, Vec3];
  /** y of the vehicle's outer side (overall width without mirrors) on each side. */
  outerY: Record<Side, number>;
  /** y of the cab's side on each side. */
  cabY: Record<Side, number>;
  /** x of the front bumper (0), of the cab front, and of the rear. */
  bumperX: number;
  cabFrontX: number;
  rearX: number;
  /** The vehicle's outline in plan, counter-clockwise. */
  outline: Ring;
  /** Each body box's footprint in plan and the height up to which it hides sightlines. */
  boxes: { box: BodyBox; ring: Ring; blockHeightM: number }[];
  /** The body as the engine's walls: four per box (see {@link bodyWalls}). */
  walls: Wall[];
};

/** +1 for the left side (y > 0), −1 for the right. */
export function sideSign(side: Side): 1 | -1 {
  return side === 'left' ? 1 : -1;
}

export function otherSide(side: Side): Side {
  return side === 'left' ? 'right' : 'left';
}

export function vehicleGeometry(v: Vehicle): VehicleGeometry {
  const eyeMidM = eyeMidpointM(v.eye, v.driverSide);
  const h = OCULAR_SEPARATION_M / 2;
  const ocularM: [Vec3, Vec3] = [
    [eyeMidM[0], eyeMidM[1] + h, eyeMidM[2]],
    [eyeMidM[0], eyeMidM[1] - h, eyeMidM[2]],
  ];
  const w = v.widthM / 2;
  const c = v.cabWidthM / 2;
  const rearX = -v.lengthM;
  const s = sideSign(v.driverSide);
  const boxes = v.bodyBoxes.map((box) => {
    const yc = s * box.offsetM;
    const x0 = -box.rearBehindM;
    const x1 = -box.frontBehindM;
    const y0 = yc - box.widthM / 2;
    const y1 = yc + box.widthM / 2;
    const ring: Ring = [
      [x0, y0],
      [x1, y0],
      [x1, y1],
      [x0, y1],
    ];
    const eyeInside = eyeMidM[0] > x0 && eyeMidM[0] < x1 && eyeMidM[1] > y0 && eyeMidM[1] < y1;
    // The driver looks out through the glass of the box they sit in: it hides only below the
    // window line. Other boxes hide up to their top.
    const blockHeightM = eyeInside && box.windowLineM !== null ? box.windowLineM : box.heightM;
    return { box, ring, blockHeightM };
  });
  return {
    driverSide: v.driverSide,
    passengerSide: otherSide(v.driverSide),
    eyeMidM,
    seatForwardOffsetM: v.eye.method === 'seat' ? EYE_OFFSETS[v.eye.rule].forwardM : 0,
    ocularM,
    outerY: { left: w, right: -w },
    cabY: { left: c, right: -c },
    bumperX: 0,
    cabFrontX: -v.cabFrontBehindM,
    rearX,
    outline: [
      [rearX, -w],
      [0, -w],
      [0, w],
      [rearX, w],
    ],
    boxes,
    walls: boxes.flatMap((b) => bodyWalls(b.ring, b.blockHeightM)),
  };
}

/**
 * A body box as the engine's blockers. The engine's walls are vertical rectangles standing on
 * the ground with no thickness, so a box becomes its four sides, each as tall as the box hides.
 * Approximations, stated: the box is solid down to the ground (the gap under a chassis is not
 * seen through), glass is clear above the window line and the body is opaque below it, and the
 * roof is not a blocker (a sightline that enters a box's footprint above its top passes).
 */
export function bodyWalls(ring: Ring, heightM: number): Wall[] {
  if (!(heightM > 0)) return [];
  return ring.map((a, i) => ({ aM: [a[0], a[1]], bM: [ring[(i + 1) % ring.length][0], ring[(i + 1) % ring.length][1]], heightM }));
}

/** The box (if any) whose footprint contains plan point (x, y) below its top `z`. */
export function boxAt(g: VehicleGeometry, p: Vec3): BodyBox | null {
  for (const b of g.boxes) {
    const [x0, y0] = b.ring[0];
    const [x1, y1] = b.ring[2];
    if (p[0] > x0 && p[0] < x1 && p[1] > y0 && p[1] < y1 && p[2] < b.box.heightM) return b.box;
  }
  return null;
}
