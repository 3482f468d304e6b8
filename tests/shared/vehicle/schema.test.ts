import * as fc from 'fast-check';
import { polygonArea } from '../../../shared/geometry/polygon';
import { checkZone } from '../../../shared/optics';
import { vehicle, vehicleKinds, vehiclePreset } from '../../../shared/schemas/vehicle';
import { anyVehicle } from './fixtures';
import { mirrorVehicleAcross, vehicleFields, vehicleGeometry } from '../../../shared/vehicle';

// Preset figures are trade practice [M?] (docs/vehicle-sources.md); eye offsets UN R46 635 mm [P], ISO 5006 680 mm / 20 mm [P].

const messages = (input: unknown): Record<string, string> => {
  const r = vehicle.safeParse(input);
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
};

describe('the vehicle model', () => {
  it.each(vehicleKinds)('offers a valid %s preset for both driving sides with the driver inside it', (kind) => {
    for (const side of ['left', 'right'] as const) {
      const v = vehiclePreset(kind, side);
      expect(vehicle.safeParse(v).success).toBe(true);
      const e = vehicleGeometry(v).eyeMidM;
      expect(e[0]).toBeLessThan(0);
      expect(e[0]).toBeGreaterThan(-v.lengthM);
      expect(Math.sign(e[1]) === (side === 'left' ? 1 : -1) || e[1] === 0).toBe(true);
    }
  });

  it('places a UN R46 eye 635 mm above the seat point and an ISO 5006 eye 680 mm above and 20 mm ahead of it', () => {
    const truck = vehiclePreset('rigid-truck', 'left');
    const g = vehicleGeometry(truck);
    expect(g.eyeMidM).toEqual([-1.1, 0.65, 1.75 + 0.635]);
    const machine = vehicleGeometry(vehiclePreset('site-machine', 'left'));
    expect(machine.eyeMidM[0]).toBeCloseTo(-2.9 + 0.02, 12);
    expect(machine.eyeMidM[2]).toBeCloseTo(1.6 + 0.68, 12);
    // The two ocular points 65 mm apart across the vehicle [M].
    expect(g.ocularM[0][1] - g.ocularM[1][1]).toBeCloseTo(0.065, 12);
  });

  it('refuses impossible vehicles with a sentence on the field to change', () => {
    const base = vehiclePreset('rigid-truck', 'left');
    expect(messages({ ...base, cabWidthM: 3 })).toEqual({ cabWidthM: 'The cab cannot be wider than the vehicle.' });
    expect(messages({ ...base, lengthM: -1 })['lengthM']).toBe('The overall length must be more than zero.');
    expect(messages({ ...base, kind: 'boat' })['kind']).toMatch(/^Choose a kind of vehicle/);
    expect(messages({ ...base, eye: { ...base.eye, seatFromCentreM: 1.5 } })['eye.seatFromCentreM']).toMatch(/less than half its width\.$/);
    const closedCab = { ...base, bodyBoxes: base.bodyBoxes.map((b) => (b.id === 'cab' ? { ...b, windowLineM: null } : b)) };
    expect(messages(closedCab)['bodyBoxes.0.windowLineM']).toMatch(/^The driver’s eye is inside “Cab” below its window line/);
    expect(messages({ ...base, bodyBoxes: [...base.bodyBoxes, { ...base.bodyBoxes[1] }] })['bodyBoxes.2.id']).toBe(
      'Two body parts share an id.',
    );
  });

  it('refuses a test cylinder whose required image length is below its required width', () => {
    const base = vehiclePreset('school-bus', 'left');
    const t = { id: 'p', name: 'P', positionM: [2, 0], diameterM: 0.3, heightM: 0.9, minShortRad: 0.003, minLongRad: 0.001 };
    expect(messages({ ...base, targets: [t] })['targets.0.minLongRad']).toMatch(/cannot be less than its required width\.$/);
  });

  it('accepts every vehicle in the accepted space and builds valid fields for it under every rule set', () => {
    fc.assert(
      fc.property(anyVehicle, (input) => {
        const v = vehicle.parse(input);
        const g = vehicleGeometry(v);
        // The eye is over the vehicle and above the ground.
        expect(g.eyeMidM[0]).toBeLessThanOrEqual(0);
        expect(g.eyeMidM[0]).toBeGreaterThan(-v.lengthM);
        expect(Math.abs(g.eyeMidM[1])).toBeLessThan(v.widthM / 2);
        for (const rs of ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'] as const) {
          for (const f of vehicleFields(v, rs)) {
            expect(() => checkZone(f.polygonM)).not.toThrow();
            expect(polygonArea(f.polygonM)).toBeGreaterThan(0);
          }
        }
        // Mirroring twice gives the vehicle back exactly.
        expect(mirrorVehicleAcross(mirrorVehicleAcross(v))).toEqual(v);
      }),
      { numRuns: 300 },
    );
  });

  it('answers any input, accepted or not, with sentences only', () => {
    fc.assert(
      fc.property(
        fc.record({
          kind: fc.oneof(fc.constantFrom(...vehicleKinds), fc.string()),
          driverSide: fc.oneof(fc.constantFrom('left', 'right'), fc.string()),
          lengthM: fc.double(),
          widthM: fc.double(),
          cabWidthM: fc.double(),
          cabFrontBehindM: fc.double(),
          eye: fc.record({
            method: fc.constantFrom('seat', 'direct', 'x'),
            eyeBehindFrontM: fc.double(),
            eyeFromCentreM: fc.double(),
            eyeHeightM: fc.double(),
          }),
        }),
        (input) => {
          for (const message of Object.values(messages(input))) expect(message).toMatch(/^[A-Z].*[.]$/);
        },
      ),
      { numRuns: 300 },
    );
  });
});
