import { polygonArea } from '../../../shared/geometry/polygon';
import { checkZone } from '../../../shared/optics';
import { vehiclePreset } from '../../../shared/schemas/vehicle';
import {
  fieldPolygon,
  HORIZON_SCORED_TO_M,
  mirrorVehicleAcross,
  ruleSetChoices,
  vehicleFields,
  vehicleGeometry,
} from '../../../shared/vehicle';

// Sources: docs/vehicle-sources.md. Marks: [P] published, [M] from memory, [M?] unsure, [D] derived.

describe('the ground-field library', () => {
  const truck = vehiclePreset('rigid-truck', 'left');
  const g = vehicleGeometry(truck);

  it('encodes the class IV field with an area of 307.875 m², the published 307.9 m² to its printed precision', () => {
    // Area 307.9 m²: recital of Directive 2007/38/EC [P]; the polygon's edges [M], taper [D].
    const area = polygonArea(fieldPolygon('un-iv', g, 'right'));
    expect(area).toBeCloseTo(307.875, 9);
    expect(Math.abs(area - 307.9)).toBeLessThan(0.05);
  });

  it('encodes the class V field with the published area of 5.5 m² when the bumper is at least 1 m ahead of the eyes', () => {
    // Area 5.5 m²: recital of Directive 2007/38/EC [P]. The preset truck's bumper is 1.1 m ahead of its eyes.
    expect(g.bumperX - g.eyeMidM[0]).toBeGreaterThanOrEqual(1);
    expect(polygonArea(fieldPolygon('un-v', g, 'right'))).toBeCloseTo(5.5, 9);
  });

  it('stops the class V field at the front bumper when the bumper is less than 1 m ahead of the eyes', () => {
    // Bumper limit [P: R46]. Eyes 0.6 m behind the bumper: 2 m × (0.6 + 1.75) m = 4.7 m² [D].
    const nearFront = vehiclePreset('rigid-truck', 'left');
    nearFront.eye = { method: 'direct', eyeBehindFrontM: 0.6, eyeFromCentreM: 0.65, eyeHeightM: 2.4 };
    nearFront.bodyBoxes = [];
    expect(polygonArea(fieldPolygon('un-v', vehicleGeometry(nearFront), 'right'))).toBeCloseTo(4.7, 9);
  });

  it('encodes the extended class V field as 4.5 m by 4.75 m', () => {
    // 4.5 m [P: UK DfT], 3.0 m ahead [P: R46 15.2.4.5.9], 1.75 m behind [M?]: 21.375 m² [D].
    expect(polygonArea(fieldPolygon('un-v-extended', g, 'right'))).toBeCloseTo(21.375, 9);
  });

  it('puts the class V field against the cab side and the class IV field against the vehicle side', () => {
    const v = fieldPolygon('un-v', g, 'right')[0];
    const iv = fieldPolygon('un-iv', g, 'right')[0];
    expect(Math.max(...v.map((p) => p[1]))).toBeCloseTo(-truck.cabWidthM / 2, 12);
    expect(Math.max(...iv.map((p) => p[1]))).toBeCloseTo(-truck.widthM / 2, 12);
  });

  it('scores a field that runs to the horizon to a stated distance and says so', () => {
    const ii = vehicleFields(truck).find((f) => f.code === 'un-ii');
    expect(ii?.scoredToNote).toContain(`${HORIZON_SCORED_TO_M} m`);
    const minX = Math.min(...ii!.polygonM[0].map((p) => p[0]));
    expect(minX).toBeCloseTo(g.eyeMidM[0] - HORIZON_SCORED_TO_M, 12);
    expect(vehicleFields(truck).find((f) => f.code === 'un-iv')?.scoredToNote).toBeNull();
  });

  it('asks the EU retrofit rule’s 95 % of class IV and 85 % of class V on the passenger side', () => {
    // Directive 2007/38/EC Art. 2(2) [P].
    const choices = ruleSetChoices('eu-retrofit', truck);
    expect(choices.find((c) => c.code === 'un-iv' && c.side === 'right')?.requiredShare).toBe(0.95);
    expect(choices.find((c) => c.code === 'un-v')).toMatchObject({ side: 'right', requiredShare: 0.85 });
    // The driver's side has no retrofit figure: 100 % less the R46 bodywork allowance of 10 % [P].
    expect(choices.find((c) => c.code === 'un-iv' && c.side === 'left')?.requiredShare).toBe(0.9);
  });

  it('asks the US passenger-car strip of cars only, leaving school buses to the installer’s test cylinders', () => {
    expect(vehicleFields(vehiclePreset('car-van', 'left'), 'fmvss-111').map((f) => f.id)).toEqual(['us-driver-strip-left']);
    expect(vehicleFields(vehiclePreset('school-bus', 'left'), 'fmvss-111')).toEqual([]);
  });

  it('gives no verdict for the machinery fields, whose pass tables are not public', () => {
    const machine = vehiclePreset('site-machine', 'left');
    const fields = vehicleFields(machine);
    expect(fields.map((f) => f.code)).toEqual(['iso-boundary-1m', 'iso-circle-12m']);
    expect(fields.every((f) => f.requiredShare === null)).toBe(true);
  });

  it('draws the 1 m boundary band as the ring between the outline and 1 m outside it', () => {
    // ISO 5006 boundary 1 m outside the outline [P]; band [D]: (L + 2)(W + 2) − L·W.
    const machine = vehiclePreset('site-machine', 'left');
    const band = fieldPolygon('iso-boundary-1m', vehicleGeometry(machine), 'left');
    expect(polygonArea(band)).toBeCloseTo((6 + 2) * (2.5 + 2) - 6 * 2.5, 9);
  });

  it('gives every library field a rule, a status mark and a one-line description', () => {
    for (const kind of ['car-van', 'bus-coach', 'rigid-truck', 'tractor-unit', 'school-bus', 'site-machine'] as const) {
      for (const rs of ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'] as const) {
        for (const f of vehicleFields(vehiclePreset(kind, 'right'), rs)) {
          expect(f.rule.length).toBeGreaterThan(0);
          expect(['P', 'M', 'M?', 'D']).toContain(f.status);
          expect(f.description).toMatch(/\.$/);
          expect(() => checkZone(f.polygonM)).not.toThrow();
        }
      }
    }
  });

  it.each(['car-van', 'bus-coach', 'rigid-truck', 'tractor-unit', 'school-bus', 'site-machine'] as const)(
    'mirrors every field of a left-hand-drive %s exactly onto the right-hand-drive one',
    (kind) => {
      const lhd = vehiclePreset(kind, 'left');
      const rhd = mirrorVehicleAcross(lhd);
      expect(rhd).toEqual(vehiclePreset(kind, 'right'));
      for (const rs of ['eu-retrofit', 'un-r46', 'fmvss-111', 'iso-5006'] as const) {
        const a = vehicleFields(lhd, rs);
        const b = vehicleFields(rhd, rs);
        expect(b.map((f) => f.name)).toEqual(a.map((f) => f.name));
        // Exact: y → −y is exact in floating point (+0 normalises −0). A mirrored ring runs the
        // other way round, so each ring is compared as a set of corners.
        const corners = (ring: [number, number][], sy: number) =>
          ring.map(([x, y]) => [x + 0, sy * y + 0]).sort((p, q) => p[0] - q[0] || p[1] - q[1]);
        const flip = a.map((f) => f.polygonM.map((ring) => corners(ring, -1)));
        expect(b.map((f) => f.polygonM.map((ring) => corners(ring, 1)))).toEqual(flip);
      }
    },
  );
});
