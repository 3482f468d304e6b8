import type { MirrorClass, MirrorSpec, Scene } from '../../shared/schemas';
import { vehiclePreset, vehicle } from '../../shared/schemas/vehicle';

/**
 * DEMO DATA — two invented vehicles (fictional fleets, no real operator), each a vehicle job of
 * the demo installer. Positions are in the vehicle's plan frame: metres from the ground under
 * the middle of the front bumper, x forward, y to the left; angles in degrees as the installer
 * types them (aim from plan x toward y, tilt down from level).
 */
export interface DemoVehicleMirror {
  label: string;
  mirror: MirrorSpec;
  positionM: [number, number];
  heightM: number;
  azimuthDeg: number;
  tiltDownDeg: number;
  mirrorClass: MirrorClass | null;
  servesFieldIds: string[] | null;
}

export interface DemoVehicleJob {
  name: string;
  customer: string;
  site: string;
  notes: string;
  scene: Scene;
  placements: DemoVehicleMirror[];
}

/** Trade-practice sizes (VEHICLE-FIELDS "Trade practice"): class II about 200 × 380 mm, r 1.8 m; IV–VI about 200–250 mm, r 300–350 mm. */
const MAIN: MirrorSpec = { shape: 'rect', widthM: 0.2, heightM: 0.38, radiusM: 1.8 };
const WIDE: MirrorSpec = { shape: 'rect', widthM: 0.2, heightM: 0.18, radiusM: 0.35 };
const CLOSE: MirrorSpec = { shape: 'rect', widthM: 0.24, heightM: 0.2, radiusM: 0.3 };
const FRONT: MirrorSpec = { shape: 'rect', widthM: 0.25, heightM: 0.2, radiusM: 0.3 };

/**
 * The demo truck's close-proximity mirror as fitted: aimed too flat (30° down), so the ground
 * beside the passenger door and front wheel is missing and the class V field is short of the
 * retrofit rule's 85 %. Tilted to 45° down it passes (tests/server/vehicle-jobs.test.ts).
 */
export const DEMO_TRUCK_CLOSE_MIRROR = { label: 'V1 close-proximity', azimuthDeg: -140, tiltDownDeg: 30 } as const;

/** A right-hand-drive rigid delivery truck (the preset's measurements), passenger side on the left. */
export const DEMO_TRUCK: DemoVehicleJob = {
  name: 'Rigid delivery truck, fleet no. 14 (demo)',
  customer: 'Larkspur Parcel Lines (demo)',
  site: 'Truck 14, right-hand drive (demo)',
  notes:
    'Demo vehicle job with invented measurements. The close-proximity mirror over the passenger door is aimed too flat: its class V field is short of 85 %, a gap worth fixing.',
  scene: { walls: [], zones: [], viewers: [], vehicle: vehiclePreset('rigid-truck', 'right'), ruleSet: 'eu-retrofit' },
  placements: [
    {
      label: 'II-D main, driver',
      mirror: MAIN,
      positionM: [-0.55, -1.475],
      heightM: 2.35,
      azimuthDeg: 152.6,
      tiltDownDeg: 1.4,
      mirrorClass: 'II',
      servesFieldIds: ['un-ii-right'],
    },
    {
      label: 'II-P main, passenger',
      mirror: MAIN,
      positionM: [-0.55, 1.475],
      heightM: 2.35,
      azimuthDeg: -143,
      tiltDownDeg: 2.2,
      mirrorClass: 'II',
      servesFieldIds: ['un-ii-left'],
    },
    {
      label: 'IV-D wide-angle, driver',
      mirror: WIDE,
      positionM: [-0.5, -1.475],
      heightM: 2.2,
      azimuthDeg: 166.8,
      tiltDownDeg: -1,
      mirrorClass: 'IV',
      servesFieldIds: ['un-iv-right'],
    },
    {
      label: 'IV-P wide-angle, passenger',
      mirror: WIDE,
      positionM: [-0.5, 1.475],
      heightM: 2.2,
      azimuthDeg: -156.3,
      tiltDownDeg: 3.2,
      mirrorClass: 'IV',
      servesFieldIds: ['un-iv-left'],
    },
    {
      label: DEMO_TRUCK_CLOSE_MIRROR.label,
      mirror: CLOSE,
      positionM: [-0.2, 1.325],
      heightM: 2.7,
      azimuthDeg: DEMO_TRUCK_CLOSE_MIRROR.azimuthDeg,
      tiltDownDeg: DEMO_TRUCK_CLOSE_MIRROR.tiltDownDeg,
      mirrorClass: 'V',
      servesFieldIds: ['un-v-left'],
    },
    {
      label: 'VI front',
      mirror: FRONT,
      positionM: [0.15, 0.5],
      heightM: 2.95,
      azimuthDeg: -126.6,
      tiltDownDeg: 59.4,
      mirrorClass: 'VI',
      servesFieldIds: ['un-vi'],
    },
  ],
};

const ARCMIN = Math.PI / 10800;
/** School-bus test cylinders [M?]: 0.3 m across and 0.3 m tall, P 0.9 m tall; images 3′ inside the edge, P at least 3′ × 9′ [P]. */
const cylinder = (id: string, name: string, positionM: [number, number], tall = false) => ({
  id,
  name,
  positionM,
  diameterM: 0.3,
  heightM: tall ? 0.9 : 0.3,
  insideEdgeRad: 3 * ARCMIN,
  minShortRad: tall ? 3 * ARCMIN : null,
  minLongRad: tall ? 9 * ARCMIN : null,
  eyes: 'one' as const,
});

/** A left-hand-drive conventional school bus (the preset) with cross-view mirrors on both front fenders. */
export const DEMO_SCHOOL_BUS: DemoVehicleJob = {
  name: 'School bus, route 7 (demo)',
  customer: 'Millbrook Valley Schools (demo)',
  site: 'Bus 7, left-hand drive (demo)',
  notes:
    'Demo vehicle job with invented measurements and test cylinders placed by the installer (the standard’s own grid is not in our sources). Cylinder D beside the right front wheel is not seen yet.',
  scene: {
    walls: [],
    zones: [],
    viewers: [],
    ruleSet: 'fmvss-111',
    vehicle: vehicle.parse({
      ...vehiclePreset('school-bus', 'left'),
      targets: [
        cylinder('cyl-a', 'A, front centre', [0.45, 0]),
        cylinder('cyl-b', 'B, front right corner', [0.6, -1.5]),
        cylinder('cyl-c', 'C, front left corner', [0.6, 1.5]),
        cylinder('cyl-d', 'D, beside the right front wheel', [-1.5, -1.6]),
        cylinder('cyl-p', 'P, child height ahead', [1.8, 0], true),
      ],
    }),
  },
  placements: [
    {
      label: 'X-L cross-view, left fender',
      mirror: { shape: 'round', diameterM: 0.25, radiusM: 0.25 },
      positionM: [0.05, 1.3],
      heightM: 2.05,
      azimuthDeg: -125,
      tiltDownDeg: 32.2,
      mirrorClass: null,
      servesFieldIds: null,
    },
    {
      label: 'X-R cross-view, right fender',
      mirror: { shape: 'round', diameterM: 0.25, radiusM: 0.25 },
      positionM: [0.05, -1.3],
      heightM: 2.05,
      azimuthDeg: 113.9,
      tiltDownDeg: 31.1,
      mirrorClass: null,
      servesFieldIds: null,
    },
  ],
};

export const DEMO_VEHICLE_JOBS: readonly DemoVehicleJob[] = [DEMO_TRUCK, DEMO_SCHOOL_BUS];
