/**
 * The vehicle top view's pure parts: the quarter turn between the vehicle's plan frame and the
 * screen's, where a tap puts a mirror, the first aim of a new mirror, and keeping the preset's
 * body on the typed dimensions.
 */
import * as fc from 'fast-check';
import { alongAzimuth } from '@/components/plan/plan-geometry';
import { fromDisplay, normaliseAngle, azimuthFromDisplay, azimuthToDisplay, toDisplay } from '@/components/vehicle/vehicle-frame';
import { ARM_M, MIRROR_TEMPLATES, newVehicleMirrorBody, outsideBody } from '@/components/vehicle/vehicle-mirrors';
import { followDimensions, presetValues } from '@/components/vehicle/vehicle-setup';
import { poseFromAim, visibleInMirror } from '@/shared/optics';
import { mirrorOfSpec } from '@/shared/project-optics';
import { vehicleKinds, vehiclePreset, type VehicleKind } from '@/shared/schemas/vehicle';
import { vehicleFields, vehicleGeometry } from '@/shared/vehicle';

const coordinate = fc.double({ min: -200, max: 200, noNaN: true });
const kind = fc.constantFrom<VehicleKind>(...vehicleKinds);
const side = fc.constantFrom<'left' | 'right'>('left', 'right');

describe('the top view turns the vehicle front up', () => {
  it('puts forward at the top of the screen and the driver’s left at the screen’s left', () => {
    // Display y is up on screen (plan-view.ts), display x to the right.
    expect(toDisplay([1, 0])).toEqual([-0, 1]);
    expect(toDisplay([0, 1])).toEqual([-1, 0]);
  });

  it('brings every plan point back exactly from the display frame', () => {
    fc.assert(fc.property(coordinate, coordinate, (x, y) => expect(fromDisplay(toDisplay([x, y]))).toEqual([x, y])));
  });

  it('turns aims with the points: an aim handle drawn in the display frame points where the plan aim points', () => {
    fc.assert(
      fc.property(fc.double({ min: -4 * Math.PI, max: 4 * Math.PI, noNaN: true }), (az) => {
        // The handle's screen direction for the display aim, against the plan direction turned to the display.
        const [hx, hy] = alongAzimuth([0, 0], azimuthToDisplay(az), 1);
        const [dx, dy] = toDisplay([Math.cos(az), Math.sin(az)]);
        expect(hx).toBeCloseTo(dx, 9);
        expect(hy).toBeCloseTo(-dy, 9);
        expect(Math.cos(azimuthFromDisplay(azimuthToDisplay(az)) - az)).toBeCloseTo(1, 9);
        const n = azimuthFromDisplay(azimuthToDisplay(az));
        expect(n).toBeGreaterThan(-Math.PI - 1e-12);
        expect(n).toBeLessThanOrEqual(Math.PI);
      }),
    );
  });

  it('keeps angles in (−π, π]', () => {
    expect(normaliseAngle(Math.PI)).toBe(Math.PI);
    expect(normaliseAngle(-Math.PI)).toBe(Math.PI);
    expect(normaliseAngle(3 * Math.PI)).toBeCloseTo(Math.PI, 12);
  });
});

describe('a mirror added by a tap', () => {
  it('never lands inside a body box, wherever the tap is, on any preset', () => {
    fc.assert(
      fc.property(kind, side, fc.double({ min: -45, max: 5, noNaN: true }), fc.double({ min: -4, max: 4, noNaN: true }), (k, s, x, y) => {
        const g = vehicleGeometry(vehiclePreset(k, s));
        const p = outsideBody([x, y], g);
        for (const b of g.boxes) {
          const inside = p[0] > b.ring[0][0] && p[0] < b.ring[2][0] && p[1] > b.ring[0][1] && p[1] < b.ring[2][1];
          expect(inside).toBe(false);
        }
      }),
    );
  });

  it('stays where it was tapped when the tap is off the body', () => {
    const g = vehicleGeometry(vehiclePreset('rigid-truck', 'left'));
    expect(outsideBody([-1, -3], g)).toEqual([-1, -3]);
  });

  it('moves out through the nearest side of the cab, an arm’s length clear', () => {
    // Rigid truck preset: cab 2.35 m wide, so its right side is at y = −1.175 m.
    const g = vehicleGeometry(vehiclePreset('rigid-truck', 'left'));
    const [, y] = outsideBody([-1, -1.1], g);
    expect(y).toBeCloseTo(-1.175 - ARM_M, 9);
  });

  it('starts aimed so that the driver sees the middle of its field in the mirror’s centre, on every preset with a class V field', () => {
    for (const k of vehicleKinds) {
      for (const s of ['left', 'right'] as const) {
        const v = vehiclePreset(k, s);
        const g = vehicleGeometry(v);
        const fields = vehicleFields(v, 'eu-retrofit');
        const field = fields.find((f) => f.code === 'un-v');
        if (!field) continue;
        const tapY = (g.passengerSide === 'left' ? 1 : -1) * (v.cabWidthM / 2 + 0.2);
        const body = newVehicleMirrorBody([-0.3, tapY], 'V', g, fields, 0);
        const pose = poseFromAim({
          vertexM: [body.positionM[0], body.positionM[1], body.heightM],
          azimuthRad: body.azimuthRad,
          tiltDownRad: body.tiltDownRad,
        });
        const ring = field.polygonM[0];
        const mid = ring.reduce((a, p) => [a[0] + p[0] / ring.length, a[1] + p[1] / ring.length], [0, 0]);
        // The engine's exact point test, with the body left out: the aim alone is under test.
        const seen = visibleInMirror({
          mirror: mirrorOfSpec(MIRROR_TEMPLATES.V.spec),
          pose,
          eyeM: g.eyeMidM,
          pointM: [mid[0], mid[1], 0],
          walls: [],
        });
        expect([k, s, seen.visible]).toEqual([k, s, true]);
      }
    }
  });
});

describe('the preset’s body follows the typed dimensions', () => {
  const dims = fc.record({
    lengthM: fc.double({ min: 1, max: 40, noNaN: true }),
    widthM: fc.double({ min: 0.5, max: 3.5, noNaN: true }),
    cabWidthM: fc.double({ min: 0.5, max: 3.5, noNaN: true }),
    cabFrontBehindM: fc.double({ min: 0, max: 10, noNaN: true }),
  });

  it('never reaches past the vehicle’s length or sides, whatever is typed', () => {
    fc.assert(
      fc.property(kind, side, dims, (k, s, next) => {
        const start = presetValues(k, s);
        const boxes = followDimensions(start.bodyBoxes, start, next);
        for (const b of boxes) {
          expect(b.rearBehindM).toBeLessThanOrEqual(next.lengthM + 1e-9);
          expect(Math.abs(b.offsetM) + b.widthM / 2).toBeLessThanOrEqual(next.widthM / 2 + 1e-9);
        }
      }),
    );
  });

  it('stretches the load body to a longer truck and moves the cab with its front', () => {
    const start = presetValues('rigid-truck', 'left');
    const boxes = followDimensions(start.bodyBoxes, start, { ...start, lengthM: 12, cabFrontBehindM: 0.3 });
    expect(boxes.find((b) => b.id === 'body')!.rearBehindM).toBe(12);
    expect(boxes.find((b) => b.id === 'cab')!.frontBehindM).toBe(0.3);
  });
});
