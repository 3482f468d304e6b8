import { ProjectEvaluator as PlanEvaluator, type PlacementInput as PlanPlacement } from '@/shared/project-optics';
import { evaluateProject } from '@/shared/project-optics';
import type { Scene } from '@/shared/schemas';
import { DEMO_PROJECT } from '../../server/seeders/demo-project';
import { demoCatalogueDtos, demoPlacementDtos } from './fixtures';

/** The seeded demo catalogue, which the seeded placements name by code. */
const catalogue = demoCatalogueDtos();

/** The demo scene with one zone switched to a child target, so the re-clipped path is exercised too. */
const scene: Scene = {
  ...DEMO_PROJECT.scene,
  zones: DEMO_PROJECT.scene.zones.map((z, i) => (i === 1 ? { ...z, target: { kind: 'child' as const } } : z)),
};

const placements: PlanPlacement[] = demoPlacementDtos(1);

/** The plan joins regions in a different order than evaluateProject; the areas agree to rounding. */
function expectSameFractions(a: { zoneId: string; fraction: number }[], b: { zoneId: string; fraction: number }[]) {
  expect(a.map((z) => z.zoneId)).toEqual(b.map((z) => z.zoneId));
  a.forEach((z, i) => expect(z.fraction).toBeCloseTo(b[i].fraction, 9));
}

// evaluateProject is a fresh evaluator; comparing a fresh one with it would prove nothing. What can
// go wrong is the cache: an evaluator that has already seen other positions must answer as a fresh
// one does. (The zone shares themselves are checked against the exact point test in
// tests/shared/project-optics/criteria.test.ts.)
describe('the plan’s cached evaluation', () => {
  it('gives both demo mirrors numbers: each hangs on the face it is mounted on', () => {
    expect(evaluateProject({ scene, placements, catalogue }).placements.map((p) => p.problem)).toEqual([null, null]);
  });

  it('still agrees after one mirror moves, reusing the others', () => {
    const evaluator = new PlanEvaluator();
    const first = evaluator.evaluate({ scene, placements, catalogue });
    const moved = placements.map((p, i) => (i === 0 ? { ...p, positionM: [p.positionM[0] + 0.8, p.positionM[1]] as [number, number] } : p));
    const again = evaluator.evaluate({ scene, placements: moved, catalogue });
    expect(again.placements[1]).toBe(first.placements[1]);
    expectSameFractions(again.zones, evaluateProject({ scene, placements: moved, catalogue }).zones);
    // A second step of the same drag reuses the others' union.
    const movedAgain = moved.map((p, i) => (i === 0 ? { ...p, azimuthRad: p.azimuthRad - 0.3 } : p));
    expectSameFractions(
      evaluator.evaluate({ scene, placements: movedAgain, catalogue }).zones,
      evaluateProject({ scene, placements: movedAgain, catalogue }).zones,
    );
  });

  it('answers as a fresh evaluator after zone edits that leave the mirrors alone (reshaped, renamed, moved under the same id)', () => {
    const evaluator = new PlanEvaluator();
    evaluator.evaluate({ scene, placements, catalogue });
    const [z0, z1] = scene.zones;
    const edits: Scene[] = [
      // Renamed: the kept share is right.
      { ...scene, zones: [{ ...z0, name: `${z0.name} (renamed)` }, z1] },
      // Reshaped in place, a new outline under the same id: worked out again.
      { ...scene, zones: [{ ...z0, polygonM: z0.polygonM.map(([x, y]) => [x + 1.5, y] as [number, number]) }, z1] },
      // The two zones' outlines swapped between their ids.
      {
        ...scene,
        zones: [
          { ...z0, polygonM: z1.polygonM },
          { ...z1, polygonM: z0.polygonM },
        ],
      },
      // Back to the start: equal outlines in new arrays.
      { ...scene, zones: scene.zones.map((z) => ({ ...z, polygonM: z.polygonM.map((p) => [...p] as [number, number]) })) },
    ];
    for (const edited of edits) {
      expectSameFractions(
        evaluator.evaluate({ scene: edited, placements, catalogue }).zones,
        evaluateProject({ scene: edited, placements, catalogue }).zones,
      );
    }
  });
});
