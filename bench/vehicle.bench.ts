/**
 * Speed of vehicle scoring. Budget (vehicle jobs' issue): a truck with six mirrors scored against
 * six fields from both eyes ≤ 50 ms median. Prints medians; the footprints alone are shown too,
 * so a miss can be traced to the engine's tracing or to the field booleans.
 */
import os from 'node:os';
import { Bench } from 'tinybench';
import { scoreVehicle, vehicleFields, vehicleGeometry, mirrorFootprint } from '../shared/vehicle';
import { demoTruck, sixMirrors } from '../tests/shared/vehicle/fixtures';
import { DEMO_CATALOGUE } from '../server/seeders/demo-catalogue';
import { DEMO_PROJECT } from '../server/seeders/demo-project';
import { DEMO_TRUCK } from '../server/seeders/demo-vehicles';
import { evaluateVehicleJob, ProjectEvaluator } from '../shared/project-optics';
import { scene as sceneSchema, type CatalogueItemDto, type PlacementDto } from '../shared/schemas';

/** The demo cold store as the API lists it: catalogue ids in seed order, placements 1…n. */
function demoSiteJob() {
  const catalogue: CatalogueItemDto[] = DEMO_CATALOGUE.map((d, i) => ({
    ...d,
    id: i + 1,
    currency: 'EUR',
    notes: '',
    active: true,
    demo: true,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
  }));
  const placements = DEMO_PROJECT.placements.map((p, i) => ({
    id: i + 1,
    catalogueItemId: catalogue.find((c) => c.code === p.code)!.id,
    customMirror: null,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: (p.azimuthDeg * Math.PI) / 180,
    tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
    viewerId: p.viewerId,
  }));
  return { scene: sceneSchema.parse(DEMO_PROJECT.scene), placements, catalogue };
}

/** The demo truck job as the API stores it: its scene and six placements (ids 1…6). */
function demoTruckJob() {
  const scene = sceneSchema.parse(DEMO_TRUCK.scene);
  const placements: PlacementDto[] = DEMO_TRUCK.placements.map((p, i) => ({
    id: i + 1,
    projectId: 1,
    label: p.label,
    catalogueItemId: null,
    customMirror: p.mirror,
    positionM: p.positionM,
    heightM: p.heightM,
    azimuthRad: (p.azimuthDeg * Math.PI) / 180,
    tiltDownRad: (p.tiltDownDeg * Math.PI) / 180,
    viewerId: null,
    notes: '',
    mirrorClass: p.mirrorClass,
    servesFieldIds: p.servesFieldIds,
    version: 1,
    updatedAt: '2026-01-01T00:00:00.000Z',
  }));
  return { scene, placements };
}

function fmt(ms: number): string {
  return ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`;
}

export async function runVehicleBench(): Promise<void> {
  const truck = demoTruck();
  const mirrors = sixMirrors(truck);
  const fields = vehicleFields(truck);
  const g = vehicleGeometry(truck);
  const job = demoTruckJob();
  const site = demoSiteJob();
  const siteName = `site job beside it: the demo cold store, through project-optics (${site.placements.length} mirrors, ${site.scene.zones.length} zones, ${site.scene.walls.length} walls)`;
  const budgets: Record<string, number | null> = {
    'truck, 6 mirrors × 6 fields × 2 eyes': 50,
    'the 12 footprints alone (6 mirrors × 2 eyes, body as walls)': null,
    'vehicle job: the demo truck as stored, through project-optics (6 mirrors, 6 fields, 2 eyes)': 50,
    [siteName]: null,
  };
  let sink = 0;
  const bench = new Bench({ name: 'vehicle', time: 3000, warmupTime: 500 });
  bench
    .add('truck, 6 mirrors × 6 fields × 2 eyes', () => {
      sink += scoreVehicle({ vehicle: truck, mirrors, fields }).fields.reduce((a, f) => a + f.share, 0);
    })
    .add('the 12 footprints alone (6 mirrors × 2 eyes, body as walls)', () => {
      for (const m of mirrors) for (const e of g.ocularM) sink += mirrorFootprint(m, e, 70, g).length;
    })
    .add('vehicle job: the demo truck as stored, through project-optics (6 mirrors, 6 fields, 2 eyes)', () => {
      sink += evaluateVehicleJob({ ...job, catalogue: [] }).vehicle.fields.reduce((a, f) => a + f.share, 0);
    })
    .add(siteName, () => {
      // A fresh evaluator each time: no cached placement, as for the sheet.
      sink += new ProjectEvaluator().evaluate(site).zones.reduce((a, z) => a + z.fraction, 0);
    });
  await bench.run();

  // CPU time of the same work, run after the timed bench: on this shared 2-core machine the wall
  // clock also counts time other processes held the cores, CPU time does not.
  const cpuMs: number[] = [];
  for (let i = 0; i < 40; i++) {
    const t0 = process.cpuUsage();
    sink += scoreVehicle({ vehicle: truck, mirrors, fields }).fields.length;
    const d = process.cpuUsage(t0);
    cpuMs.push((d.user + d.system) / 1000);
  }
  cpuMs.sort((a, b) => a - b);
  const [load1] = os.loadavg();

  console.log(`vehicle scoring (${fields.length} fields, ${mirrors.length} mirrors; sum ${sink.toFixed(0)} keeps the work alive)`);
  let allMet = true;
  for (const task of bench.tasks) {
    const res = task.result;
    if (!res || !('latency' in res)) {
      console.log(`  ${task.name}: no result`);
      allMet = false;
      continue;
    }
    const median = res.latency.p50;
    const budget = budgets[task.name];
    if (budget === null || budget === undefined) {
      console.log(`  ${task.name}: median ${fmt(median)}`);
      continue;
    }
    const met = median <= budget;
    allMet &&= met;
    console.log(`  ${task.name}: median ${fmt(median)} (budget ${fmt(budget)}) ${met ? 'meets' : 'MISSES'}`);
  }
  console.log(
    `  truck, CPU time per scoring: median ${fmt(cpuMs[cpuMs.length >> 1])} (load average ${load1.toFixed(1)} on ${os.cpus().length} cores while measured)`,
  );
  if (!allMet) process.exitCode = 1;
}

if (require.main === module) void runVehicleBench();
