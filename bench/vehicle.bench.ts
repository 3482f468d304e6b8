/**
 * Speed of vehicle scoring. Budget (vehicle jobs' issue): a truck with six mirrors scored against
 * six fields from both eyes ≤ 50 ms median. Prints medians; the footprints alone are shown too,
 * so a miss can be traced to the engine's tracing or to the field booleans.
 */
import os from 'node:os';
import { Bench } from 'tinybench';
import { scoreVehicle, vehicleFields, vehicleGeometry, mirrorFootprint } from '../shared/vehicle';
import { demoTruck, sixMirrors } from '../tests/shared/vehicle/fixtures';

function fmt(ms: number): string {
  return ms < 1 ? `${(ms * 1000).toFixed(1)} µs` : `${ms.toFixed(2)} ms`;
}

export async function runVehicleBench(): Promise<void> {
  const truck = demoTruck();
  const mirrors = sixMirrors(truck);
  const fields = vehicleFields(truck);
  const g = vehicleGeometry(truck);
  const budgets: Record<string, number | null> = {
    'truck, 6 mirrors × 6 fields × 2 eyes': 50,
    'the 12 footprints alone (6 mirrors × 2 eyes, body as walls)': null,
  };
  let sink = 0;
  const bench = new Bench({ name: 'vehicle', time: 3000, warmupTime: 500 });
  bench
    .add('truck, 6 mirrors × 6 fields × 2 eyes', () => {
      sink += scoreVehicle({ vehicle: truck, mirrors, fields }).fields.reduce((a, f) => a + f.share, 0);
    })
    .add('the 12 footprints alone (6 mirrors × 2 eyes, body as walls)', () => {
      for (const m of mirrors) for (const e of g.ocularM) sink += mirrorFootprint(m, e, 70, g).length;
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
