import { criteriaSettings, scene, type Scene } from '../../../shared/schemas';

const ARCMIN = Math.PI / 10800;
const base: Scene = { walls: [], zones: [], viewers: [] };
const issues = (value: unknown) => {
  const r = scene.safeParse(value);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

describe('a project’s detect and recognise angles', () => {
  it('accepts 6′ and 20′, stored in radians', () => {
    expect(criteriaSettings.safeParse({ detectRad: 6 * ARCMIN, recogniseRad: 20 * ARCMIN }).success).toBe(true);
  });

  it('may be left out, which means the defaults', () => {
    expect(scene.safeParse(base).success).toBe(true);
  });

  it.each([
    ['below 1′', { detectRad: 0.5 * ARCMIN, recogniseRad: 20 * ARCMIN }, 'criteria.detectRad', /at least 1 minute of arc/],
    ['above 2°', { detectRad: 6 * ARCMIN, recogniseRad: 150 * ARCMIN }, 'criteria.recogniseRad', /at most 2°/],
    ['not a number', { detectRad: 'six', recogniseRad: 20 * ARCMIN }, 'criteria.detectRad', /Enter the detect angle/],
    ['missing', { detectRad: 6 * ARCMIN }, 'criteria.recogniseRad', /Enter the recognise angle/],
  ])('refuses an angle %s with a sentence for that field', (_what, criteria, path, message) => {
    const found = issues({ ...base, criteria });
    expect(found).toHaveLength(1);
    expect(found[0].path).toBe(path);
    expect(found[0].message).toMatch(message);
  });

  it('refuses a recognise angle no larger than the detect angle, on the recognise field', () => {
    const found = issues({ ...base, criteria: { detectRad: 20 * ARCMIN, recogniseRad: 20 * ARCMIN } });
    expect(found).toEqual([{ path: 'criteria.recogniseRad', message: expect.stringMatching(/larger than the detect angle/) }]);
  });
});

describe('a zone’s criterion', () => {
  const zone = {
    id: 'z',
    name: 'Crossing',
    polygonM: [
      [0, 0],
      [4, 0],
      [4, 3],
    ],
    target: { kind: 'adult' },
  };
  it.each(['detect', 'recognise'])('accepts "%s"', (criterion) => {
    expect(issues({ ...base, zones: [{ ...zone, criterion }] })).toEqual([]);
  });

  it('refuses any other word with a sentence', () => {
    expect(issues({ ...base, zones: [{ ...zone, criterion: 'notice' }] })).toEqual([
      { path: 'zones.0.criterion', message: 'Choose detect or recognise.' },
    ]);
  });
});
