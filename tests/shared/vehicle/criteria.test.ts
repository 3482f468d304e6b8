import { ARCMIN_RAD } from '../../../shared/optics';
import type { Vehicle } from '../../../shared/schemas/vehicle';
import { fieldCriteria, scoreVehicle, vehicleFields, vehicleGeometry } from '../../../shared/vehicle';
import { demoTruck, sixMirrors } from './fixtures';

// Detect about 6′ and recognise about 20′ of a person's height: engineering judgement from the
// usual detection/recognition cycle criteria, from memory [M] (docs/vehicle-sources.md).

function truckWithHighDoor(windowLineM: number): Vehicle {
  const v = demoTruck();
  return { ...v, bodyBoxes: v.bodyBoxes.map((b) => (b.id === 'cab' ? { ...b, windowLineM } : b)) };
}

describe('detect and recognise criteria over a field', () => {
  const v = truckWithHighDoor(2.1);
  const field = vehicleFields(v).find((f) => f.id === 'un-iv-left')!;
  const mirrors = sixMirrors(v).filter((m) => m.id === 'iv-p');
  const score = (extra: Record<string, number>) =>
    scoreVehicle({ vehicle: v, mirrors, fields: [field], mirrorsForField: { [field.id]: ['iv-p'] }, criteriaSamples: 400, ...extra })
      .fields[0];

  it('with zero angles finds the person wherever the field is seen, matching the traced share to the grid’s resolution', () => {
    const s = score({ fieldTargetHeightM: 1.7, detectAngleRad: 0, recogniseAngleRad: 0 });
    const c = s.criteria!;
    expect(c.sampled).toBeGreaterThan(300);
    expect(c.detectShare).toBe(c.seenShare);
    expect(c.recogniseShare).toBe(c.seenShare);
    // 400 cells of about 0.77 m² each over a 307.9 m² field: the traced share and the grid agree within 3 %.
    expect(Math.abs(c.seenShare - s.share)).toBeLessThan(0.03);
  });

  it('recognises no more of the field than it detects, and detects no more than it sees', () => {
    // The class II field, scored to 60 m behind the eyes, in the wide-angle mirror (radius 350 mm):
    // paraxially a 1.7 m person 50 m away subtends about 1.7 × 0.175 / (50 × 2.2) rad ≈ 9′, under 20′.
    const ii = vehicleFields(v).find((f) => f.id === 'un-ii-left')!;
    const c = scoreVehicle({
      vehicle: v,
      mirrors,
      fields: [ii],
      mirrorsForField: { [ii.id]: ['iv-p'] },
      fieldTargetHeightM: 1.7,
      detectAngleRad: 6 * ARCMIN_RAD,
      recogniseAngleRad: 20 * ARCMIN_RAD,
    }).fields[0].criteria!;
    expect(c.recogniseShare).toBeLessThanOrEqual(c.detectShare);
    expect(c.detectShare).toBeLessThanOrEqual(c.seenShare);
    expect(c.seenShare).toBeGreaterThan(0.3);
    expect(c.recogniseShare).toBeLessThan(c.seenShare - 0.1);
  });

  it('finds a child (1.0 m) recognisable over less of the field than an adult (1.7 m)', () => {
    const adult = score({ fieldTargetHeightM: 1.7, detectAngleRad: 6 * ARCMIN_RAD, recogniseAngleRad: 20 * ARCMIN_RAD }).criteria!;
    const child = score({ fieldTargetHeightM: 1.0, detectAngleRad: 6 * ARCMIN_RAD, recogniseAngleRad: 20 * ARCMIN_RAD }).criteria!;
    // Over the class IV field the adult's image reaches 20′ nearly everywhere it is seen; the child's does not.
    expect(child.recogniseShare).toBeLessThan(adult.recogniseShare);
    expect(child.seenShare).toBe(adult.seenShare);
  });

  it('is not computed unless a target height and both angles are given', () => {
    expect(score({ detectAngleRad: 0.001, recogniseAngleRad: 0.003 }).criteria).toBeNull();
  });

  it('refuses a negative angle with a sentence', () => {
    const g = vehicleGeometry(v);
    expect(() =>
      fieldCriteria({ field, mirrors, eyes: g.ocularM, walls: g.walls, targetHeightM: 1.7, detectAngleRad: -1, recogniseAngleRad: 0 }),
    ).toThrow('The detect and recognise angles must be zero or more.');
  });
});
