import { poseFromAim } from '../../../shared/optics';
import { mirrorExtent, mountingNotes, vehicleGeometry, type VehicleMirror } from '../../../shared/vehicle';
import { demoTruck } from './fixtures';

// Figures and marks: docs/vehicle-sources.md — class V/VI no part under 2 m [M]; projection at
// most 250 mm when the lower edge is under 2 m [M]; least radius class V 300 mm [M].

describe('mounting sentences', () => {
  const v = demoTruck();
  const g = vehicleGeometry(v);
  const half = v.widthM / 2;
  const fit = (id: string, z: number, yOut: number, radiusM: number, mirrorClass: VehicleMirror['mirrorClass']): VehicleMirror => ({
    id,
    mirrorClass,
    mirror: { shape: 'round', diameterM: 0.2, radiusM },
    // Facing the cab, level: the rim's lowest point is 0.1 m under the vertex.
    pose: poseFromAim({ vertexM: [-0.5, half + yOut, z], azimuthRad: -Math.PI / 2 - 0.3, tiltDownRad: 0 }),
  });

  it('finds a level round mirror’s lowest point half a diameter under its centre', () => {
    // A level mirror's rim circle lies in a vertical plane: its lowest point is exactly d/2 down.
    expect(
      mirrorExtent({ shape: 'round', diameterM: 0.2, radiusM: 0.3 }, poseFromAim({ vertexM: [0, 2, 2.5], azimuthRad: 1, tiltDownRad: 0 }))
        .lowestZ,
    ).toBeCloseTo(2.4, 12);
  });

  it('says so when a close-proximity mirror reaches below 2 m, and not when it stays above', () => {
    const low = mountingNotes(v, g, [fit('low', 2.05, 0.1, 0.3, 'V')]);
    expect(low.map((n) => n.check)).toEqual(['low']);
    expect(low[0].sentence).toMatch(/reaches down to 1950 mm .* lower than 2 m\.$/);
    expect(mountingNotes(v, g, [fit('high', 2.15, 0.1, 0.3, 'V')])).toEqual([]);
  });

  it('says so when a mirror with its lower edge under 2 m sticks out more than 250 mm', () => {
    const out = mountingNotes(v, g, [fit('wide', 1.8, 0.3, 0.4, 'IV')]);
    expect(out.map((n) => n.check)).toEqual(['projection']);
    expect(mountingNotes(v, g, [fit('wide-high', 2.3, 0.3, 0.4, 'IV')])).toEqual([]);
    expect(mountingNotes(v, g, [fit('narrow', 1.8, 0.1, 0.4, 'IV')])).toEqual([]);
  });

  it('says so when a mirror is more strongly curved than its class allows', () => {
    const tight = mountingNotes(v, g, [fit('tight', 2.5, 0.1, 0.25, 'V')]);
    expect(tight.map((n) => n.check)).toEqual(['radius']);
    expect(tight[0].sentence).toContain('250 mm, under the 300 mm');
    expect(mountingNotes(v, g, [fit('unclassed', 2.5, 0.1, 0.25, null)])).toEqual([]);
  });
});
