import {
  coverage,
  convexImage,
  fieldOfView,
  OpticsInputError,
  poseFromAim,
  recognisableRange,
  visibleInMirror,
  zoneCoverage,
  type Mirror,
} from '../../../shared/optics';

function caught(fn: () => unknown): OpticsInputError {
  try {
    fn();
  } catch (e) {
    if (e instanceof OpticsInputError) return e;
    throw e;
  }
  throw new Error('expected an OpticsInputError');
}

const pose = poseFromAim({ vertexM: [0, 0, 2.5], azimuthRad: 0, tiltDownRad: 0.3 });

describe('impossible input is refused with a sentence naming the field', () => {
  it('refuses a round mirror whose diameter is not less than twice its radius', () => {
    const e = caught(() => fieldOfView({ mirror: { shape: 'round', diameterM: 2, radiusM: 1 }, eyeDistanceM: 3 }));
    expect(e.field).toBe('mirror.diameterM');
    expect(e.message).toMatch(/less than twice the radius/);
  });

  it('refuses a dome given a radius of curvature', () => {
    const dome = { shape: 'dome', portion: 'full', diameterM: 1, radiusM: 0.5 } as unknown as Mirror;
    expect(caught(() => fieldOfView({ mirror: dome, eyeDistanceM: 3 })).field).toBe('mirror.radiusM');
  });

  it('refuses an eye behind the mirror', () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 1.2 };
    const e = caught(() => coverage({ mirror, pose, eyeM: [-3, 0, 1.6], maxRangeM: 10 }));
    expect(e.field).toBe('eyeM');
    expect(e.message).toMatch(/behind the mirror/);
  });

  it('refuses an eye inside the mirror’s sphere', () => {
    const mirror: Mirror = { shape: 'dome', portion: 'full', diameterM: 1 };
    const down = poseFromAim({ vertexM: [0, 0, 2.5], azimuthRad: 0, tiltDownRad: Math.PI / 2 });
    const e = caught(() => visibleInMirror({ mirror, pose: down, eyeM: [0.1, 0, 2.8], pointM: [3, 0, 0] }));
    expect(e.field).toBe('eyeM');
    expect(e.message).toMatch(/inside/);
  });

  it.each([
    ['a negative radius', () => convexImage({ radiusM: -1, objectDistanceM: 2 }), 'radiusM'],
    ['a non-finite object distance', () => convexImage({ radiusM: 1, objectDistanceM: Infinity }), 'objectDistanceM'],
    ['a NaN angle', () => recognisableRange({ radiusM: 1, eyeDistanceM: 2, targetSizeM: 1, minAngleRad: NaN }), 'minAngleRad'],
    [
      'a zero range',
      () => coverage({ mirror: { shape: 'round', diameterM: 0.6, radiusM: 1.2 }, pose, eyeM: [4, 0, 1.6], maxRangeM: 0 }),
      'maxRangeM',
    ],
  ])('refuses %s', (_label, fn, field) => {
    const e = caught(fn);
    expect(e.field).toBe(field);
    expect(e.message.length).toBeGreaterThan(10);
    expect(e.message).not.toMatch(/NaN|undefined/);
  });

  it('refuses a zone that crosses itself', () => {
    const bowtie: [number, number][] = [
      [0, 0],
      [2, 2],
      [2, 0],
      [0, 2],
    ];
    const e = caught(() => zoneCoverage({ zone: [bowtie], regions: [] }));
    expect(e.field).toBe('zone');
    expect(e.message).toMatch(/crosses or touches itself/);
  });

  it('refuses a plane that the mirror reaches down to', () => {
    const mirror: Mirror = { shape: 'round', diameterM: 0.6, radiusM: 1.2 };
    const e = caught(() => coverage({ mirror, pose, eyeM: [4, 0, 1.6], maxRangeM: 10, planeHeightM: 2.5 }));
    expect(e.field).toBe('planeHeightM');
  });
});
