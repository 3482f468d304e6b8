import * as fc from 'fast-check';
import { vehicleKinds, vehiclePreset, vehicleRuleSets, type Vehicle } from '../../../shared/schemas/vehicle';
import { mirrorAzimuthAcross, mirrorVehicleAcross, remapServedFieldIds, vehicleFields } from '../../../shared/vehicle';

// A mirror's served fields must follow the vehicle when its drive side switches (DEVELOPERS
// footgun 36): the field served after the switch is the mirror image of the one served before.

const withOwnField = (v: Vehicle): Vehicle => ({
  ...v,
  groundFields: [
    {
      id: 'kerb-left',
      name: 'Kerb strip',
      polygonM: [
        [0, 1.3],
        [0, 3],
        [-4, 3],
        [-4, 1.3],
      ],
      requiredShare: 0.9,
      eyes: 'both',
    },
  ],
});

describe('served field ids when the drive side switches', () => {
  it('names, after the switch, the mirror image of every field served before, for every kind, drive side and rule set', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...vehicleKinds),
        fc.constantFrom('left' as const, 'right' as const),
        fc.constantFrom(...vehicleRuleSets),
        fc.infiniteStream(fc.boolean()),
        (kind, side, ruleSet, picks) => {
          const before = withOwnField(vehiclePreset(kind, side));
          const after = mirrorVehicleAcross(before);
          const fieldsBefore = vehicleFields(before, ruleSet);
          const fieldsAfter = new Map(vehicleFields(after, ruleSet).map((f) => [f.id, f]));
          const served = fieldsBefore.filter(() => picks.next().value === true);
          const remapped = remapServedFieldIds(
            served.map((f) => f.id),
            fieldsBefore,
          );
          expect(remapped).toHaveLength(served.length);
          served.forEach((f, i) => {
            const g = fieldsAfter.get(remapped?.[i] ?? '');
            expect(g?.code).toBe(f.code);
            // The mirrored field's outline is the served one with y negated (negation is exact).
            const flipped = f.polygonM[0].map(([x, y]) => [x, -y === 0 ? 0 : -y]);
            const ring = (g?.polygonM[0] ?? []).map(([x, y]) => [x, y === 0 ? 0 : y]);
            expect(new Set(ring.map((p) => p.join()))).toEqual(new Set(flipped.map((p) => p.join())));
          });
        },
      ),
      { numRuns: 200 },
    );
  });

  it('keeps "every field" (null) as every field', () => {
    expect(remapServedFieldIds(null, vehicleFields(vehiclePreset('rigid-truck', 'right')))).toBeNull();
  });

  it('drops ids that named no field of the vehicle before the switch', () => {
    const fields = vehicleFields(vehiclePreset('rigid-truck', 'right'), 'eu-retrofit');
    expect(remapServedFieldIds(['un-v-left', 'gone-field'], fields)).toEqual(['un-v-right']);
  });

  it('turns the aim across the centreline: a mirror looking back-left looks back-right', () => {
    // x forward, y left: 135° points back and to the left; its mirror image points back and right.
    expect(mirrorAzimuthAcross((3 * Math.PI) / 4)).toBeCloseTo((-3 * Math.PI) / 4, 12);
  });
});
