/**
 * The vehicle screen's pure edits (components/vehicle/vehicle-part-edits.ts) and where a mirror's
 * label goes on the top view (components/vehicle/mirror-label.ts).
 */
import * as fc from 'fast-check';
import { mirrorLabelBox, shortMirrorLabel, AIM_KNOB_PX, MARKER_RING_PX } from '@/components/vehicle/mirror-label';
import {
  addBodyBox,
  addFieldCorner,
  addGroundField,
  addTarget,
  removeFieldCorner,
  switchDriveSide,
} from '@/components/vehicle/vehicle-part-edits';
import { alongAzimuth } from '@/components/plan/plan-geometry';
import { AIM_HANDLE_PX } from '@/components/plan/plan-view';
import { polygonArea } from '@/shared/geometry/polygon';
import { boxMeetsSegment, boxesOverlap } from '@/shared/label-placement';
import { vehicle as vehicleSchema, vehicleKinds, vehiclePreset } from '@/shared/schemas/vehicle';
import { vehicleFields, vehicleGeometry } from '@/shared/vehicle';
import { DEMO_SCHOOL_BUS, DEMO_TRUCK } from '../../server/seeders/demo-vehicles';
import { fitBounds, toDisplay } from '@/components/vehicle/vehicle-frame';

describe('adding parts to a vehicle', () => {
  it('keeps every preset valid after adding a body part, an own field and a test cylinder', () => {
    for (const kind of vehicleKinds) {
      for (const side of ['left', 'right'] as const) {
        const v = addTarget(addGroundField(addBodyBox(vehiclePreset(kind, side))));
        const r = vehicleSchema.safeParse(v);
        expect(r.success ? '' : `${kind} ${side}: ${r.error.issues[0].message}`).toBe('');
      }
    }
  });

  it('never leaves an own field with fewer than three corners', () => {
    const v = addGroundField(vehiclePreset('school-bus', 'left'));
    const id = v.groundFields[0].id;
    const trimmed = removeFieldCorner(removeFieldCorner(v, id, 3), id, 2);
    expect(trimmed.groundFields[0].polygonM).toHaveLength(3);
  });

  it('adds a corner halfway along an edge, so the field’s outline keeps its shape', () => {
    const v = addGroundField(vehiclePreset('school-bus', 'left'));
    const f = v.groundFields[0];
    const added = addFieldCorner(v, f.id, 0).groundFields[0].polygonM;
    expect(added).toHaveLength(f.polygonM.length + 1);
    // A corner on an edge changes no area (the shoelace area of the outline before and after).
    expect(polygonArea([added])).toBeCloseTo(polygonArea([f.polygonM]), 9);
  });
});

describe('switching the drive side of the demo truck', () => {
  const v = DEMO_TRUCK.scene.vehicle!;
  const placements = DEMO_TRUCK.placements.map((m, i) => ({
    id: i + 1,
    label: m.label,
    catalogueItemId: null,
    customMirror: m.mirror,
    positionM: m.positionM,
    heightM: m.heightM,
    azimuthRad: (m.azimuthDeg * Math.PI) / 180,
    tiltDownRad: (m.tiltDownDeg * Math.PI) / 180,
    mirrorClass: m.mirrorClass,
    servesFieldIds: m.servesFieldIds,
  }));
  const { vehicle: after, patches } = switchDriveSide(v, 'eu-retrofit', placements);

  it('leaves every served field id naming a field the switched vehicle has (footgun 36)', () => {
    const ids = new Set(vehicleFields(after, 'eu-retrofit').map((f) => f.id));
    for (const { patch } of patches) for (const id of patch.servesFieldIds ?? []) expect(ids).toContain(id);
  });

  it('moves each mirror to the other side of the centreline', () => {
    patches.forEach(({ patch }, i) => expect(patch.positionM[1]).toBe(-placements[i].positionM[1]));
  });
});

describe('a mirror’s label on the top view', () => {
  it('stays clear of the marker, its aim line and the aim handle at every aim, wherever the mirror sits', () => {
    const bounds = { x: 0, y: 0, w: 390, h: 600 };
    fc.assert(
      fc.property(
        fc.double({ min: -Math.PI, max: Math.PI, noNaN: true }),
        fc.double({ min: 90, max: 300, noNaN: true }),
        fc.double({ min: 90, max: 500, noNaN: true }),
        fc.constantFrom('V-1', 'IV-12', 'X-L cross-view, left fender'),
        (az, x, y, text) => {
          const c: [number, number] = [x, y];
          const box = mirrorLabelBox(c, az, text, true, bounds);
          const end = alongAzimuth(c, az, AIM_HANDLE_PX);
          expect(boxMeetsSegment(box, [c, end])).toBe(false);
          const knob = { x: end[0] - AIM_KNOB_PX, y: end[1] - AIM_KNOB_PX, w: 2 * AIM_KNOB_PX, h: 2 * AIM_KNOB_PX };
          expect(boxesOverlap(box, knob)).toBe(false);
          const ring = { x: x - MARKER_RING_PX, y: y - MARKER_RING_PX, w: 2 * MARKER_RING_PX, h: 2 * MARKER_RING_PX };
          expect(boxesOverlap(box, ring)).toBe(false);
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe('fitting the top view', () => {
  it('keeps every test cylinder of the demo bus inside what "fit" shows, cylinder P 1.8 m ahead of the bumper included', () => {
    const v = DEMO_SCHOOL_BUS.scene.vehicle!;
    const b = fitBounds(vehicleGeometry(v), [], v.targets)!;
    for (const t of v.targets) {
      const [dx, dy] = toDisplay(t.positionM);
      expect(dx - t.diameterM / 2).toBeGreaterThanOrEqual(b.minX);
      expect(dx + t.diameterM / 2).toBeLessThanOrEqual(b.maxX);
      expect(dy - t.diameterM / 2).toBeGreaterThanOrEqual(b.minY);
      expect(dy + t.diameterM / 2).toBeLessThanOrEqual(b.maxY);
    }
  });
});

describe('a mirror’s name on the top view', () => {
  it('keeps a short name whole and cuts a long one to its first word', () => {
    expect(shortMirrorLabel('V-1')).toBe('V-1');
    expect(shortMirrorLabel('X-L cross-view, left fender')).toBe('X-L');
  });
});
