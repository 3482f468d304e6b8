import { evaluateProject, mountProblem, mirrorOfSpec, zoneCriterion } from '../../../shared/project-optics';
import { visibleInMirror } from '../../../shared/optics';
import type { CatalogueItemDto, Scene } from '../../../shared/schemas';
import { DEMO_PROJECT } from '../../../server/seeders/demo-project';
import { demoCatalogueDtos } from '../../../server/seeders/demo-catalogue';

const deg = Math.PI / 180;
const scene = DEMO_PROJECT.scene as Scene;
const catalogue = demoCatalogueDtos();
const itemOf = (code: string) => catalogue.find((c) => c.code === code) as CatalogueItemDto;
const demoPlacements = DEMO_PROJECT.placements.map((p, i) => ({
  id: i + 1,
  catalogueItemId: itemOf(p.code).id,
  customMirror: null,
  positionM: p.positionM,
  heightM: p.heightM,
  azimuthRad: p.azimuthDeg * deg,
  tiltDownRad: p.tiltDownDeg * deg,
  viewerId: p.viewerId,
}));

describe('a mirror inside a wall or rack', () => {
  const dock = {
    positionM: [16.05, 10.05] as [number, number],
    heightM: 3,
    azimuthRad: -25 * deg,
    tiltDownRad: 25 * deg,
    viewerId: 'v-dock',
  };
  const mirror = mirrorOfSpec(itemOf('DEMO-R600').mirror);

  it('is refused with a sentence naming the rack and a position on its face', () => {
    const problem = mountProblem({ label: 'M2 dock corner', mirror, placement: dock, scene });
    expect(problem?.field).toBe('positionM');
    expect(problem?.message).toMatch(
      /^“M2 dock corner” reaches 0\.\d\d m into rack “rack-sw-[ne]” \(and 1 more\); a mirror cannot hang inside a wall or rack\. Move it 0\.\d\d m, to x 16\.2\d m, y 10\.05 m, where it sits on the face\.$/,
    );
  });

  it('is accepted at the position the sentence offers', () => {
    const problem = mountProblem({ label: 'M2', mirror, placement: dock, scene });
    expect(mountProblem({ label: 'M2', mirror, placement: { ...dock, positionM: problem!.snapM! }, scene })).toBeNull();
  });

  it('speaks the project’s units', () => {
    const problem = mountProblem({ label: 'M2', mirror, placement: dock, scene, units: 'imperial' });
    expect(problem?.message).toMatch(/^“M2” reaches \d+ in into rack .* to x 53 ft [\d.]+ in, y 32 ft 11\.7 in, /);
  });

  it('gets no numbers or coverage in the evaluation, only the sentence', () => {
    const ev = evaluateProject({ scene, placements: [{ ...demoPlacements[1], positionM: dock.positionM }], catalogue });
    expect(ev.placements[0].coverage).toBeNull();
    expect(ev.placements[0].problem?.message).toMatch(/cannot hang inside a wall or rack/);
  });
});

describe('the demo project', () => {
  it('hangs each mirror on the face it is mounted on, with no wall through it', () => {
    for (const p of demoPlacements) {
      const item = catalogue.find((c) => c.id === p.catalogueItemId) as CatalogueItemDto;
      expect(mountProblem({ mirror: mirrorOfSpec(item.mirror), placement: p, scene })).toBeNull();
    }
  });

  it('shows for each zone the share the exact point test finds on a 60 × 60 grid (within 1 point)', () => {
    const ev = evaluateProject({ scene, placements: demoPlacements, catalogue });
    const walls = scene.walls.map((w) => ({ aM: w.aM, bM: w.bM, heightM: w.heightM }));
    for (const z of ev.zones) {
      const zone = scene.zones.find((q) => q.id === z.zoneId)!;
      const ring = zone.polygonM;
      // Both demo zones ask for a standing adult.
      expect(zone.target).toEqual({ kind: 'adult' });
      const xs = ring.map((p) => p[0]);
      const ys = ring.map((p) => p[1]);
      const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
      let seen = 0;
      const N = 60;
      for (let i = 0; i < N; i++) {
        for (let j = 0; j < N; j++) {
          const pointM: [number, number, number] = [x0 + ((x1 - x0) * (i + 0.5)) / N, y0 + ((y1 - y0) * (j + 0.5)) / N, 0];
          const hit = ev.placements.some(
            (pl) =>
              pl.mirror &&
              pl.pose &&
              pl.eyeM &&
              pl.numbers &&
              visibleInMirror({
                mirror: pl.mirror,
                pose: pl.pose,
                eyeM: pl.eyeM,
                pointM,
                walls,
                maxRangeM: pl.numbers.rangesM[zoneCriterion(zone)].adult,
              }).visible,
          );
          if (hit) seen++;
        }
      }
      // The demo zones are rectangles, so the grid's share is the zone's share.
      expect(Math.abs(z.fraction - seen / (N * N))).toBeLessThan(0.01);
    }
  });
});
