/**
 * Quick sizing: ranking the demo catalogue (20 mirrors × the engine's default aims) for one
 * question, as the /quick screen does on every change. Target: median ≤ 150 ms. Prints medians
 * for the three kinds of spot. `BENCH_ONLY=quick npm run bench` runs it alone.
 */
import { Bench } from 'tinybench';
import { DEFAULT_QUICK_QUESTION, rankQuick, spotKinds } from '../shared/quick';
import { demoCatalogueDtos } from '../server/seeders/demo-catalogue';

const BUDGET_MS = 150;

export async function runQuickBench(): Promise<void> {
  const catalogue = demoCatalogueDtos();
  const bench = new Bench({ time: 2000, warmupIterations: 3 });
  for (const spot of spotKinds) {
    const q = { ...DEFAULT_QUICK_QUESTION, spot, who: 'child' as const, depthM: 20 };
    bench.add(`quick ranking, ${spot}, ${catalogue.length} mirrors`, () => {
      rankQuick(q, catalogue);
    });
  }
  await bench.run();
  console.log('\nQuick sizing (median, budget ' + BUDGET_MS + ' ms)');
  for (const task of bench.tasks) {
    const res = task.result;
    const median = res && 'latency' in res ? res.latency.p50 : NaN;
    console.log(`  ${task.name}: ${median.toFixed(1)} ms ${median <= BUDGET_MS ? 'ok' : 'OVER BUDGET'}`);
  }
}
