/**
 * "Aim at this zone" (shared/project-optics/aim-at-zone.ts) runs on the page's thread when the
 * installer taps it. This prints its median on the demo cold store and on a scene at the project
 * limits (1,000 walls, 100 zones, 5,000 zone corners, 100 viewers, 30 mirrors), so the choice to
 * keep it off a worker rests on a figure; and "compare mirrors here" (`sizeForZone`, the same search
 * once per catalogue mirror) on the same two cases. Budget: a tap answered in ≤ 300 ms on the demo, and no
 * more than 2 s at the limits (the button shows it is busy meanwhile). `BENCH_ONLY=aim` runs it alone.
 */
import { Bench } from 'tinybench';
import { aimAtZone, sizeForZone, sizeForZoneSteps } from '../shared/project-optics';
import type { CatalogueItemDto, PlacementDto, Scene } from '../shared/schemas';
import { SCENE_LIMITS } from '../shared/schemas';
import { demoCatalogueDtos } from '../server/seeders/demo-catalogue';
import { DEMO_PROJECT } from '../server/seeders/demo-project';
import { heavyPlacements, heavyScene } from './heavy-scene';

const DEG = Math.PI / 180;
const DEMO_BUDGET_MS = 300;
const LIMIT_BUDGET_MS = 2000;

function asDto(id: number, p: Omit<PlacementDto, 'id' | 'projectId' | 'version' | 'updatedAt' | 'notes' | 'customMirror'>): PlacementDto {
  return { id, projectId: 1, version: 1, updatedAt: '2026-01-01T00:00:00.000Z', notes: '', customMirror: null, ...p };
}

function demoCase(catalogue: CatalogueItemDto[]) {
  const placements = DEMO_PROJECT.placements.map((p, i) =>
    asDto(i + 1, {
      label: p.label,
      catalogueItemId: catalogue.find((c) => c.code === p.code)!.id,
      positionM: p.positionM,
      heightM: p.heightM,
      azimuthRad: p.azimuthDeg * DEG,
      tiltDownRad: p.tiltDownDeg * DEG,
      viewerId: p.viewerId,
    }),
  );
  return { scene: DEMO_PROJECT.scene as Scene, placements, zoneId: 'z-dock', placementId: 2 };
}

function limitCase(catalogue: CatalogueItemDto[]) {
  const counts = {
    walls: SCENE_LIMITS.walls,
    zones: SCENE_LIMITS.zones,
    cornersPerZone: Math.floor(SCENE_LIMITS.zoneCorners / SCENE_LIMITS.zones),
    viewers: SCENE_LIMITS.viewers,
    mirrors: SCENE_LIMITS.mirrors,
  };
  const scene = heavyScene(counts);
  const placements = heavyPlacements(counts, catalogue[0].id).map((p, i) =>
    asDto(i + 1, {
      label: p.label,
      catalogueItemId: p.catalogueItemId ?? catalogue[0].id,
      positionM: p.positionM,
      heightM: p.heightM,
      azimuthRad: p.azimuthRad,
      tiltDownRad: p.tiltDownRad,
      viewerId: p.viewerId ?? null,
    }),
  );
  return { scene, placements, zoneId: scene.zones[0].id, placementId: 1 };
}

export async function runAimBench(): Promise<void> {
  const catalogue = demoCatalogueDtos();
  const cases = [
    { name: 'demo cold store, M2 at the dock apron', budget: DEMO_BUDGET_MS, ...demoCase(catalogue) },
    { name: 'scene at the project limits, mirror 1 at zone 1', budget: LIMIT_BUDGET_MS, ...limitCase(catalogue) },
  ];
  const bench = new Bench({ time: 1500, warmupIterations: 1, iterations: 5 });
  const outcomes: string[] = [];
  for (const c of cases) {
    bench.add(c.name, () => {
      aimAtZone({ scene: c.scene, placements: c.placements, catalogue, placementId: c.placementId, zoneId: c.zoneId });
    });
    const r = aimAtZone({ scene: c.scene, placements: c.placements, catalogue, placementId: c.placementId, zoneId: c.zoneId });
    outcomes.push('problem' in r ? r.problem : `${(r.shareBefore * 100).toFixed(1)} % → ${(r.shareAfter * 100).toFixed(1)} %`);
  }
  for (const c of cases) {
    bench.add(`compare ${catalogue.length} mirrors, ${c.name}`, () => {
      sizeForZone({ scene: c.scene, placements: c.placements, catalogue, placementId: c.placementId, zoneId: c.zoneId });
    });
    // The screen runs it a mirror per turn of the page's loop: the longest turn is what a tap may wait.
    const steps = sizeForZoneSteps({ scene: c.scene, placements: c.placements, catalogue, placementId: c.placementId, zoneId: c.zoneId });
    let longest = 0;
    let t = performance.now();
    let step = steps.next();
    while (!step.done) {
      longest = Math.max(longest, performance.now() - t);
      t = performance.now();
      step = steps.next();
    }
    const r = step.value;
    const best = 'problem' in r ? r.problem : `best ${r.choices[0].item.code}: ${(r.choices[0].shareAfter * 100).toFixed(1)} %`;
    outcomes.push(`${best}; longest turn ${longest.toFixed(0)} ms`);
  }
  await bench.run();
  console.log('\nAim at a zone, on the page thread (median)');
  bench.tasks.forEach((task, i) => {
    const res = task.result;
    const median = res && 'latency' in res ? res.latency.p50 : NaN;
    // Comparing runs the aim's search once per mirror, a mirror per turn of the page's loop (the
    // longest turn is printed): its budget is five aims' worth in all.
    const budget = i < cases.length ? cases[i].budget : cases[i - cases.length].budget * 5;
    console.log(
      `  ${task.name}: ${median.toFixed(0)} ms (budget ${budget} ms) ${median <= budget ? 'ok' : 'OVER BUDGET'} · ${outcomes[i]}`,
    );
  });
}
